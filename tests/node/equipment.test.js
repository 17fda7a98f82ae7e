// Equipment as rated and sold (issue 13), the page's pure parts against the module:
// a heat pump's compressor and its minimum capacities, a furnace's or boiler's
// output and its own electricity, the gas service kept for other appliances and
// the electricity price for the equipment through the workspace and back; the
// defaults the cards show (the cut-out by compressor, the catalog's own
// electricity) equal to what the core assumes; the verdict's sentences in words.
// Every house, price and data sheet here is invented.
import assert from 'node:assert/strict';
import { readdir, readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { loadCore, siteDir } from './helpers.js';

const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');
const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

let core;
let scenario;
let equipment;
let format;
let storage;
let catalog;
before(async () => {
  core = await loadCore();
  scenario = await web('scenario.js');
  equipment = await web('equipment.js');
  format = await web('format.js');
  storage = await web('storage.js');
  catalog = JSON.parse(core.catalog());
});

const evaluate = (doc) => JSON.parse(core.evaluate(JSON.stringify(doc)));
const roundTrip = (doc) => scenario.toScenario(scenario.fromScenario(structuredClone(doc)));
const CLIMATE = { monthly_mean: [24, 27, 36, 47, 58, 67, 72, 70, 62, 50, 39, 28], unit: 'degF', design_temperature: { value: 5, unit: 'degF' },
  base: { value: 65, unit: 'degF' } };
const GAS_CHARGES = [{ label: 'Gas customer charge', amount_per_month: 18 }];

/** An invented house with a variable-speed heat pump (min and max at two points), a gas furnace and an oil boiler. */
function withHeatPump() {
  return {
    schema: 'fuelwright.scenario/1',
    settings: { units: 'us', currency: 'USD', kept_services: [{ fuel: 'natural-gas', fixed_charges: GAS_CHARGES }] },
    demand: { method: 'direct', annual_useful_heat: { value: 60, unit: 'MMBtu' }, balance_point: { value: 62, unit: 'degF' } },
    climate: CLIMATE,
    options: [
      { id: 'furnace', label: 'Gas furnace', fuel: 'natural-gas', price: { amount: 1.4, per: 'therm' }, fixed_charges: GAS_CHARGES,
        system: { kind: 'furnace', catalog: 'gas-furnace-condensing', efficiency: { value: 95, rating: 'AFUE' },
          capacity: { value: 60000, unit: 'Btu/h' }, auxiliary_electricity: { value: 350, unit: 'kWh' } } },
      { id: 'oil', label: 'Oil boiler', fuel: 'heating-oil-2', price: { amount: 3.9, per: 'gal' },
        system: { kind: 'boiler', catalog: 'oil-boiler', efficiency: { value: 86, rating: 'AFUE' }, auxiliary_electricity: { value: 180, unit: 'W' } } },
      { id: 'hp', label: 'Variable-speed heat pump', fuel: 'electricity', price: { amount: 0.16, per: 'kWh' },
        system: { kind: 'air-source-heat-pump', stages: 'variable', cutoff: { value: -15, unit: 'degF' },
          ratings: [
            { outdoor: { value: 47, unit: 'degF' }, capacity: { value: 36000, unit: 'Btu/h' }, cop: 3.9, min_capacity: { value: 9000, unit: 'Btu/h' }, min_cop: 4.6 },
            { outdoor: { value: 5, unit: 'degF' }, capacity: { value: 26000, unit: 'Btu/h' }, cop: 2.1, min_capacity: { value: 8000, unit: 'Btu/h' }, min_cop: 2.4 },
          ] } },
    ],
  };
}

/** An invented house with no electricity option: the equipment's electricity priced in the settings, the gas service kept alone. */
function withoutElectricity() {
  return {
    schema: 'fuelwright.scenario/1',
    settings: { units: 'us', currency: 'USD', electricity: { price: { amount: 0.15, per: 'kWh' } },
      kept_services: [{ fuel: 'natural-gas', label: 'range', fixed_charges: [{ label: 'Gas meter', amount_per_year: 216 }] }] },
    demand: { method: 'direct', annual_useful_heat: { value: 55, unit: 'MMBtu' } },
    options: [
      { id: 'oil', label: 'Oil boiler', fuel: 'heating-oil-2', price: { amount: 3.9, per: 'gal' },
        system: { kind: 'boiler', catalog: 'oil-boiler', efficiency: { value: 86, rating: 'AFUE' }, capacity: { value: 30, unit: 'kW' } } },
      { id: 'propane', label: 'Propane furnace', fuel: 'propane', price: { amount: 2.6, per: 'gal' },
        system: { kind: 'furnace', catalog: 'gas-furnace-condensing', efficiency: { value: 95, rating: 'AFUE' } } },
    ],
  };
}

describe('the workspace keeps the equipment fields', () => {
  test('a variable-speed heat pump, a furnace\'s output and own electricity and the kept gas service: sent as they came', () => {
    for (const doc of [withHeatPump(), withoutElectricity()]) {
      const back = roundTrip(doc);
      assert.deepEqual(back, doc);
      assert.deepEqual(roundTrip(back), back, 'stable');
      const a = evaluate(doc);
      const b = evaluate(back);
      assert.deepEqual(a.errors, []);
      assert.deepEqual(b.options.map((o) => o.annual_cost), a.options.map((o) => o.annual_cost));
    }
  });

  test('a kept service matching a fuel\'s charges ticks that fuel; one no fuel has gets a fuel card of its own', () => {
    const ws = scenario.fromScenario(withHeatPump());
    const gas = ws.fuels.filter((f) => f.fuel === 'natural-gas');
    assert.equal(gas.length, 1);
    assert.equal(gas[0].keep_service, true);
    const alone = scenario.fromScenario(withoutElectricity());
    const kept = alone.fuels.find((f) => f.fuel === 'natural-gas');
    assert.equal(kept.keep_service, true);
    assert.equal(kept.keep_service_label, 'range');
    assert.equal(alone.systems.some((s) => s.fuel_key === kept.key), false, 'no system burns it');
    assert.deepEqual(alone.settings.electricity, { price: { amount: 0.15, per: 'kWh' } });
  });

  test('the gas service ticked adds the gas fuel\'s charges to every option that does not burn gas', () => {
    const doc = withHeatPump();
    const ws = scenario.fromScenario(doc);
    ws.fuels.find((f) => f.fuel === 'natural-gas').keep_service = false;
    const without = scenario.toScenario(ws);
    assert.equal(without.settings.kept_services, undefined);
    ws.fuels.find((f) => f.fuel === 'natural-gas').keep_service = true;
    const withKept = scenario.toScenario(ws);
    assert.deepEqual(withKept.settings.kept_services, [{ fuel: 'natural-gas', fixed_charges: GAS_CHARGES }]);
    const a = evaluate(without);
    const b = evaluate(withKept);
    const cost = (r, id) => r.options.find((o) => o.id === id);
    assert.equal(cost(b, 'hp').kept_services_cost, 12 * 18);
    assert.ok(Math.abs(cost(b, 'hp').annual_cost - cost(a, 'hp').annual_cost - 216) < 1e-9);
    assert.equal(cost(b, 'furnace').kept_services_cost, 0, 'the gas furnace pays them already');
  });

  test('the equipment\'s electricity price is sent only when no option runs on electricity; the typed price is kept', () => {
    const ws = scenario.fromScenario(withoutElectricity());
    assert.deepEqual(scenario.toScenario(ws).settings.electricity, { price: { amount: 0.15, per: 'kWh' } });
    assert.equal(equipment.equipmentElectricityPrice(ws).from, 'typed');
    const hp = scenario.fromScenario(withHeatPump());
    ws.climate = hp.climate;
    ws.fuels.push({ ...hp.fuels.find((f) => f.fuel === 'electricity') });
    ws.systems.push({ ...hp.systems.find((s) => s.id === 'hp') });
    const doc = scenario.toScenario(ws);
    assert.equal(doc.settings.electricity, undefined, 'the electricity option\'s price is used');
    assert.equal(ws.settings.electricity.price.amount, 0.15, 'the typed price stays in the workspace');
    const used = equipment.equipmentElectricityPrice(ws);
    assert.equal(used.from, 'option');
    assert.equal(used.system.id, 'hp');
    const result = evaluate(doc);
    assert.deepEqual(result.errors, []);
    const oil = result.options.find((o) => o.id === 'oil');
    assert.ok(oil.auxiliary_kwh > 0);
    assert.ok(Math.abs(oil.auxiliary_cost - oil.auxiliary_kwh * 0.16) < 1e-9, 'at the heat pump\'s electricity price');
  });

  test('a single-stage heat pump keeps the minimum capacities typed but does not send them; one of the pair alone is sent', () => {
    const ws = scenario.fromScenario(withHeatPump());
    const hp = ws.systems.find((s) => s.id === 'hp');
    hp.system.stages = 'single';
    const single = scenario.toScenario(ws).options.find((o) => o.id === 'hp').system;
    assert.equal(single.stages, 'single');
    assert.equal(single.ratings.some((p) => 'min_capacity' in p || 'min_cop' in p), false);
    assert.equal(hp.system.ratings[0].min_cop, 4.6, 'kept in the workspace');
    hp.system.stages = 'two';
    delete hp.system.ratings[1].min_cop;
    const doc = scenario.toScenario(ws);
    const result = evaluate(doc);
    assert.equal(result.errors[0].path, '/options/2/system/ratings/1/min_cop');
    assert.equal(scenario.workspacePath(result.errors[0].path, ws), '/systems/2/system/ratings/1/min_cop', 'shown at its field');
  });

  test('an old saved quote without the new fields opens unchanged', async () => {
    const dir = join(root, 'tests/fixtures/saved-quotes');
    const names = (await readdir(dir)).filter((n) => /^v[12]-.*\.json$/.test(n));
    assert.ok(names.length >= 4);
    for (const name of names) {
      const record = JSON.parse(await readFile(join(dir, name), 'utf8'));
      const doc = scenario.toScenario(storage.workspaceOf(storage.migrateRecord(record)));
      assert.deepEqual(doc, record.scenario, name);
    }
  });
});

describe('the defaults the cards show are the core\'s', () => {
  test('every catalog record with its own electricity lists it', async () => {
    const data = JSON.parse(await readFile(join(root, 'data/systems.json'), 'utf8'));
    for (const record of data.systems) {
      const shown = catalog.systems.find((s) => s.id === record.id);
      if (!record.auxiliary_electricity) assert.equal(shown.auxiliary_electricity, undefined, record.id);
      else assert.deepEqual({ value: shown.auxiliary_electricity.value, unit: shown.auxiliary_electricity.unit },
        { value: record.auxiliary_electricity.value, unit: record.auxiliary_electricity.unit }, record.id);
    }
  });

  test('a fuel-burning system\'s own electricity, with and without a catalog type, is the default the core counts', () => {
    let checked = 0;
    for (const record of catalog.systems.filter((s) => equipment.FUEL_BURNING_KINDS.includes(s.kind))) {
      for (const fuel of record.fuels) {
        const sale = catalog.fuels.find((f) => f.id === fuel).sale_units[0].unit;
        for (const system of [
          { kind: record.kind, catalog: record.id },
          { kind: record.kind, efficiency: { value: record.typical.value, rating: record.typical.rating } },
        ]) {
          const doc = { schema: 'fuelwright.scenario/1', settings: { units: 'metric', currency: 'EUR', electricity: { price: { amount: 0.3 } } },
            demand: { method: 'direct', annual_useful_heat: { value: 15000, unit: 'kWh' } },
            options: [{ id: 'x', fuel, price: { amount: 1, per: sale }, system: { ...system, capacity: { value: 12, unit: 'kW' } } }] };
          const option = evaluate(doc).options[0];
          const shown = equipment.auxiliaryDefault(system, fuel, catalog);
          const label = `${record.id} burning ${fuel}, ${system.catalog ? 'catalog type' : 'typical efficiency'}`;
          if (!shown) assert.equal(option.auxiliary_kwh, 0, label);
          else if (shown.unit === 'kWh') assert.ok(Math.abs(option.auxiliary_kwh - shown.value) < 1e-9, label);
          else assert.ok(Math.abs(option.auxiliary_kwh - (shown.value / 1000) * (option.useful_heat_kwh / 12)) < 1e-6, label);
          checked++;
        }
      }
    }
    assert.ok(checked >= 20, `${checked} cases`);
  });

  test('the cut-out shown when none is typed is the one the core assumes for the compressor', () => {
    for (const stages of [undefined, 'single', 'two', 'variable']) {
      const doc = withHeatPump();
      const hp = doc.options[2].system;
      delete hp.cutoff;
      if (stages) hp.stages = stages;
      else delete hp.stages;
      if (stages !== 'two' && stages !== 'variable') for (const p of hp.ratings) { delete p.min_capacity; delete p.min_cop; }
      const warning = evaluate(doc).warnings.find((w) => /low-temperature cut-out/.test(w.message));
      const said = Number(/stop below (-?[\d.]+) degF/.exec(warning.message)[1]);
      assert.equal(said, Math.round(equipment.defaultCutoff(stages, 'degF') * 10) / 10 + 0, `${stages}`);
    }
    assert.ok(Math.abs(equipment.defaultCutoff('variable', 'degC') + 25) < 1e-12);
    assert.ok(Math.abs(equipment.defaultCutoff('single', 'degF')) < 1e-12);
  });
});

describe('the verdict says it in words', () => {
  const us = () => scenario.fromScenario(withHeatPump());

  test('the sizing sentence, in the quote\'s units', () => {
    const fmt = format.createFormat({ locale: 'en-US', currency: 'USD' });
    const option = { design_load: { value: 38012, unit: 'Btu/h' }, capacity_at_design: { value: 23968, unit: 'Btu/h' },
      balance_point: { value: 21.2, unit: 'degF' } };
    const text = equipment.sizingSentence(option, { ws: us(), result: {}, format: fmt, system: { stages: 'variable' },
      backupName: 'the backup (electric resistance strips)' });
    assert.equal(text, 'At 5 °F the heat pump gives 24,000 of the 38,000 Btu/h the house needs; below 21 °F the backup '
      + '(electric resistance strips) helps. Below -13 °F the compressor stops and the backup (electric resistance strips) heats alone '
      + '(a usual cut-out for this compressor: the data sheet\'s own figure is better).');
    const metric = scenario.fromScenario({ ...withHeatPump(), settings: { units: 'metric', currency: 'EUR' },
      climate: { ...CLIMATE, design_temperature: { value: -15, unit: 'degC' } } });
    const de = format.createFormat({ locale: 'de-DE', currency: 'EUR' });
    const kw = equipment.sizingSentence({ design_load: { value: 11.14, unit: 'kW' }, capacity_at_design: { value: 12.3, unit: 'kW' }, balance_point: null },
      { ws: metric, result: {}, format: de, system: { stages: 'two', cutoff: { value: -20, unit: 'degC' } }, backupName: 'the backup' });
    assert.equal(kw, 'At -15 °C the heat pump gives 12,3 kW, enough for the 11,1 kW the house needs. Below -20 °C the compressor stops and the backup heats alone.');
  });

  test('a design temperature below the cut-out: the compressor has stopped, as the core says', () => {
    // -14 °F design against a -13 °F cut-out: the core gives no capacity at design, and the sentence says why
    const doc = withHeatPump();
    doc.climate = { ...doc.climate, design_temperature: { value: -14, unit: 'degF' } };
    doc.options.find((o) => o.id === 'hp').system.cutoff = { value: -13, unit: 'degF' };
    const result = evaluate(doc);
    const hp = result.options.find((o) => o.id === 'hp');
    assert.equal(hp.capacity_at_design.value, 0);
    const ws = scenario.fromScenario(doc);
    const fmt = format.createFormat({ locale: 'en-US', currency: 'USD' });
    const text = equipment.sizingSentence(hp, { ws, result, format: fmt, system: ws.systems[2].system, backupName: 'the backup' });
    assert.match(text, /^At -14 °F, below the heat pump's cut-out of -13 °F, the compressor has stopped: the backup carries all [\d,]+ Btu\/h the house needs\.$/);
  });

  test('the module\'s own answer for the variable-speed heat pump reads as a sentence with its numbers', () => {
    const doc = withHeatPump();
    const result = evaluate(doc);
    const hp = result.options.find((o) => o.id === 'hp');
    assert.equal(hp.design_load.unit, 'Btu/h');
    const fmt = format.createFormat({ locale: 'en-US', currency: 'USD' });
    const ws = scenario.fromScenario(doc);
    const text = equipment.sizingSentence(hp, { ws, result, format: fmt, system: ws.systems[2].system, backupName: 'the backup' });
    const n = (v) => fmt.number(Math.round(v / 100) * 100, 8);
    const head = hp.capacity_at_design.value < hp.design_load.value
      ? `At 5 °F the heat pump gives ${n(hp.capacity_at_design.value)} of the ${n(hp.design_load.value)} Btu/h the house needs; below ${fmt.number(Math.round(hp.balance_point.value), 4)} °F the backup helps.`
      : `At 5 °F the heat pump gives ${n(hp.capacity_at_design.value)} Btu/h, enough for the ${n(hp.design_load.value)} Btu/h the house needs.`;
    assert.equal(text, `${head} Below -15 °F the compressor stops and the backup heats alone.`);
    assert.doesNotMatch(text, /degF|_|undefined|NaN/);
  });

  test('the blower and pump electricity and the kept gas service, in the quote\'s currency', () => {
    const result = evaluate(withHeatPump());
    const fmt = format.createFormat({ locale: 'de-DE', currency: 'EUR' });
    const furnace = result.options.find((o) => o.id === 'furnace');
    assert.equal(furnace.auxiliary_kwh, 350);
    const lines = equipment.siteCostLines(furnace, { format: fmt });
    assert.deepEqual(lines.map((l) => `${l.label}: ${l.text}`), [`Blower and pump electricity: 350 kWh a year, ${fmt.money(furnace.auxiliary_cost)} a year`]);
    const hp = equipment.siteCostLines(result.options.find((o) => o.id === 'hp'), { format: fmt });
    assert.deepEqual(hp.map((l) => `${l.label}: ${l.text}`), [`Gas service kept for other appliances: ${fmt.money(216)} a year`]);
  });
});

describe('Editing rules for a quote typed in any order (issue 14)', () => {
  const furnace = { id: 'furnace-natural-gas', existing: true, fuel_key: 'f1', system: { kind: 'furnace' } };
  const heatPump = { id: 'air-source-heat-pump-electricity', equipment: 'Invented Co. CX-36 (invented)', fuel_key: 'f2',
    system: { kind: 'air-source-heat-pump', stages: 'variable', cutoff: { value: -13, unit: 'degF' },
      ratings: [{ outdoor: { value: 5, unit: 'degF' }, capacity: { value: 27000, unit: 'Btu/h' }, cop: 2.1 }] } };

  test('bills typed before the system is marked are linked to the one system in the house now', () => {
    const ws = { demand: { bills_option: '' }, systems: [{ ...furnace, existing: false }, heatPump] };
    assert.equal(equipment.billedSystemId(ws), '', 'no system in the house now: the House tab asks');
    ws.systems[0].existing = true;
    assert.equal(equipment.billedSystemId(ws), 'furnace-natural-gas');
  });

  test('bills naming a system that is no longer the one in the house now follow the one that is', () => {
    const ws = { demand: { bills_option: 'air-source-heat-pump-electricity' }, systems: [furnace, heatPump] };
    assert.equal(equipment.billedSystemId(ws), 'furnace-natural-gas');
    ws.demand.bills_option = 'furnace-natural-gas';
    assert.equal(equipment.billedSystemId(ws), 'furnace-natural-gas');
  });

  test('a dual-fuel option copies the heat pump already typed from its data sheet, backed by the furnace', () => {
    const ws = { systems: [furnace, heatPump] };
    const dual = equipment.dualFuelSystem(ws, 'furnace-natural-gas');
    assert.equal(dual.fuel_key, 'f2');
    assert.equal(dual.equipment, heatPump.equipment);
    assert.deepEqual(dual.system, { ...heatPump.system, backup: 'furnace-natural-gas', changeover_mode: 'temperature' });
    assert.notEqual(dual.system.ratings, heatPump.system.ratings, 'a copy, not shared with the heat pump alone');
    assert.equal(equipment.dualFuelSystem({ systems: [furnace] }, 'furnace-natural-gas'), null, 'no heat pump typed yet');
  });
});

describe('No value appears as entered that the user did not type (issue 14)', () => {
  const hp = { ratings: ['HSPF2', 'HSPF', 'SCOP', 'COP'], typical: { value: 8.5, rating: 'HSPF2' } };
  test('a new card gets the catalog type\'s rating and no value: the typical is the placeholder', () => {
    assert.deepEqual(equipment.efficiencyFor({ rating: '' }, hp), { rating: 'HSPF2' });
    assert.deepEqual(equipment.efficiencyFor(undefined, hp), { rating: 'HSPF2' });
  });
  test('a typed value in a rating the type accepts stays as typed', () => {
    assert.deepEqual(equipment.efficiencyFor({ value: 9.5, rating: 'HSPF2' }, hp), { value: 9.5, rating: 'HSPF2' });
    assert.deepEqual(equipment.efficiencyFor({ value: 3.4, rating: 'SCOP' }, hp), { value: 3.4, rating: 'SCOP' });
  });
  test('an AFUE left from a furnace is not carried onto a heat pump', () => {
    assert.deepEqual(equipment.efficiencyFor({ value: 95, rating: 'AFUE' }, hp), { rating: 'HSPF2' });
  });
});
