// The page's editing rules in Node (web/editing.js): labels in words, a system fitted to the catalog
// when its fuel changes, the add menus' new fuels and systems (dual fuel paired with the burner in the
// house now), and switching units there and back. The workspaces are the page's invented demo.
import assert from 'node:assert/strict';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { loadCore, siteDir } from './helpers.js';

const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

let editing;
let demo;
let catalog;
let scenario;
let core;
before(async () => {
  core = await loadCore();
  editing = await web('editing.js');
  demo = await web('demo.js');
  scenario = await web('scenario.js');
  catalog = JSON.parse(core.catalog());
  catalog.fuelsById = new Map(catalog.fuels.map((f) => [f.id, f]));
  catalog.systemsById = new Map(catalog.systems.map((s) => [s.id, s]));
});

describe('web/editing.js', () => {
  test('labels say which system is in the house now and what a dual-fuel option pairs', () => {
    const ws = demo.demoWorkspace();
    const gas = ws.fuels.find((f) => f.fuel === 'natural-gas');
    const furnace = { id: 'f', existing: true, fuel_key: gas.key, system: { kind: 'furnace' } };
    assert.equal(editing.autoLabel(ws, furnace, catalog), 'Existing furnace, Natural gas');
    ws.systems.push(furnace);
    const dual = { id: 'd', fuel_key: gas.key, system: { kind: 'air-source-heat-pump', backup: 'f' } };
    assert.equal(editing.autoLabel(ws, dual, catalog), 'Dual fuel: air-source heat pump + furnace (Natural gas)');
  });

  test('a fuel changed on its card keeps a price unit it is sold in, and its systems follow to a catalog type that burns it', () => {
    const ws = demo.demoWorkspace();
    const entry = ws.fuels.find((f) => f.fuel === 'natural-gas');
    const furnace = ws.systems.find((s) => s.fuel_key === entry.key && s.system.kind === 'furnace');
    assert.ok(furnace, 'the demo has a gas furnace');
    editing.setFuel(ws, entry, 'propane', catalog);
    assert.ok(catalog.fuelsById.get('propane').sale_units.some((u) => u.unit === entry.price.per), entry.price.per);
    const record = catalog.systemsById.get(furnace.system.catalog);
    assert.equal(record.kind, 'furnace');
    assert.ok(record.fuels.includes('propane'), record.id);
  });

  test('a new fuel is priced per its first sale unit; a new heat pump goes on electricity', () => {
    const ws = demo.demoWorkspace();
    const pellets = editing.newFuelEntry(ws, 'wood-pellets', catalog);
    assert.equal(pellets.price.per, catalog.fuelsById.get('wood-pellets').sale_units[0].unit);
    assert.ok(!ws.fuels.some((f) => f.key === pellets.key), 'a key of its own');
    const hp = editing.newSystem(ws, 'air-source-heat-pump', catalog);
    assert.equal(ws.fuels.find((f) => f.key === hp.fuel_key).fuel, 'electricity');
    assert.ok(!ws.systems.some((s) => s.id === hp.id), 'an id of its own');
    assert.equal(hp.label, 'Air-source heat pump, Electricity');
  });

  test('dual fuel from the add menu takes the burner in the house now as backup, by temperature', () => {
    const ws = demo.demoWorkspace();
    const burner = ws.systems.find((s) => ['furnace', 'boiler'].includes(s.system.kind));
    for (const s of ws.systems) s.existing = s === burner;
    const dual = editing.newSystem(ws, 'air-source-heat-pump+existing-backup', catalog);
    assert.equal(dual.system.backup, burner.id);
    assert.equal(dual.system.changeover_mode, 'temperature');
    assert.ok(dual.id.startsWith('dual-fuel-'), dual.id);
    assert.ok(dual.label.startsWith('Dual fuel: air-source heat pump + '), dual.label);
  });

  test('switching to metric and back gives the same verdict; in metric the same heat, costs within the bins\' width', () => {
    const ws = demo.demoWorkspace();
    const before = JSON.parse(core.evaluate(JSON.stringify(scenario.toScenario(ws))));
    const start = ws.settings.units;
    const other = start === 'us' ? 'metric' : 'us';
    editing.switchUnits(ws, other);
    assert.equal(ws.settings.units, other);
    const switched = JSON.parse(core.evaluate(JSON.stringify(scenario.toScenario(ws))));
    editing.switchUnits(ws, start);
    const back = JSON.parse(core.evaluate(JSON.stringify(scenario.toScenario(ws))));
    for (const [i, option] of before.options.entries()) {
      const close = (answer, tolerance) => Math.abs(answer.options[i].annual_cost - option.annual_cost) <= tolerance * option.annual_cost;
      assert.ok(close(back, 1e-9), `${option.id} back: ${back.options[i].annual_cost} vs ${option.annual_cost}`);
      // in metric the climate's bins are 1 K wide, not 1 degF: a heat pump's bins (and a boiler's pump hours) move a little
      assert.ok(close(switched, 0.005), `${option.id} metric: ${switched.options[i].annual_cost} vs ${option.annual_cost}`);
      assert.equal(switched.options[i].useful_heat_kwh.toFixed(6), option.useful_heat_kwh.toFixed(6));
    }
  });
  test('a duplicated system, a data-sheet point and bills added as typed or pasted', () => {
    const ws = demo.demoWorkspace();
    const first = ws.systems[0];
    editing.duplicateSystem(ws, 0);
    const copy = ws.systems[1];
    assert.notEqual(copy.id, first.id);
    assert.equal(copy.label, `${first.label || first.id} (copy)`);
    assert.equal(copy.existing, false);
    editing.addRating(ws, 1);
    assert.deepEqual(copy.system.ratings.at(-1), ws.settings.units === 'us'
      ? { outdoor: { unit: 'degF' }, capacity: { unit: 'Btu/h' } } : { outdoor: { unit: 'degC' }, capacity: { unit: 'kW' } });
    ws.demand.bills = [{ start: '2025-01-14', end: '2025-02-12', quantity: 120, unit: 'ccf', mean_temperature: { unit: 'degF' } }];
    ws.demand.bill_dates = 'meter-reads';
    editing.addBill(ws);
    assert.deepEqual(ws.demand.bills[1], { start: '2025-02-12', end: '', unit: 'ccf', mean_temperature: { unit: 'degF' } });
    ws.demand.bill_dates = 'inclusive';
    editing.addBill(ws);
    assert.equal(ws.demand.bills[2].start, '');
    editing.appendBills(ws, [{ start: '2025-03-14', end: '2025-04-11', quantity: 80 }, { start: '2025-04-11', end: '2025-05-12', quantity: 41, unit: 'therm' }]);
    assert.deepEqual(ws.demand.bills.slice(3).map((b) => [b.quantity, b.unit]), [[80, 'ccf'], [41, 'therm']]);
    // into an empty list, a first line without a unit takes the unit the next lines name, not the quote's therm
    ws.demand.bills = [];
    editing.appendBills(ws, [{ start: '2025-01-14', end: '2025-02-12', quantity: 120 }, { start: '2025-02-12', end: '2025-03-13', quantity: 98, unit: 'ccf' }]);
    assert.deepEqual(ws.demand.bills.map((b) => b.unit), ['ccf', 'ccf']);
  });
});
