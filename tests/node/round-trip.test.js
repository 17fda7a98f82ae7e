// Nothing typed is lost or changed (issue 14): scenarios holding every field the page edits, each
// quantity in a unit other than the unit system's default (°C under US units, kW, GJ, ccf, L…),
// go through the three ways a quote leaves and comes back — the workspace (what the page edits),
// the saved-quote record on the device (written as JSON, read back through migrateRecord) and the
// exported file (other fuels and the results summary included) imported again — and come back
// identical, field by field, for every demand method and climate form; every example in
// data/examples/ does the same. The core accepts each of them. Every house and price is invented.
import assert from 'node:assert/strict';
import { readdir, readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { loadCore, siteDir } from './helpers.js';

const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');
const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

let scenario;
let storage;
let core;
before(async () => {
  scenario = await web('scenario.js');
  storage = await web('storage.js');
  core = await loadCore();
});

const q = (value, unit) => ({ value, unit });

/** Every option field the page edits: a furnace with its capacity and own electricity, a two-stage heat pump from its data sheet, a dual-fuel one, a boiler with block rates. */
function everyOption() {
  return [
    { id: 'old-furnace', label: 'Existing furnace (invented)', existing: true, equipment: 'Invented Co. GF-80 (invented)', fuel: 'natural-gas',
      price: { amount: 1.45, per: 'ccf' }, fixed_charges: [{ label: 'Customer charge', amount_per_month: 18 }, { label: 'Meter rent', amount_per_year: 24 }],
      system: { kind: 'furnace', catalog: 'gas-furnace-standard', efficiency: { value: 80, rating: 'AFUE' }, distribution_loss: 0.12, age_derating: 0.05,
        capacity: q(26.4, 'kW'), auxiliary_electricity: q(180, 'W'), altitude_rated: true },
      annual_maintenance: 150, life_years: 22 },
    { id: 'cold-climate-hp', label: 'Cold-climate heat pump (invented)', equipment: 'Invented Co. CX-36 (invented)', fuel: 'electricity',
      price: { amount: 0.16, per: 'kWh' },
      system: { kind: 'air-source-heat-pump', catalog: 'air-source-heat-pump', efficiency: { value: 9.5, rating: 'HSPF2' }, distribution_loss: 0.08,
        stages: 'two', ratings: [
          { outdoor: q(8.3, 'degC'), capacity: q(10.5, 'kW'), cop: 3.9, min_capacity: q(4.2, 'kW'), min_cop: 4.4 },
          { outdoor: q(-8.3, 'degC'), capacity: q(8.8, 'kW'), cop: 2.6, min_capacity: q(3.6, 'kW'), min_cop: 2.9 },
          { outdoor: q(-15, 'degC'), capacity: q(7.9, 'kW'), cop: 2.1 }],
        cutoff: q(-25, 'degC'), cd: 0.2, backup: 'electric-resistance' },
      installed_cost: 14500, incentives: 2000, annual_maintenance: 120, life_years: 16 },
    { id: 'dual-fuel', label: 'Dual fuel (invented)', fuel: 'electricity', price: { amount: 0.16, per: 'kWh' },
      system: { kind: 'air-source-heat-pump', efficiency: { value: 8.8, rating: 'HSPF' }, capacity: q(36000, 'Btu/h'), backup: 'old-furnace', changeover: q(-3.9, 'degC') },
      installed_cost: 15800 },
    { id: 'optimal-dual', label: 'Dual fuel, cheapest changeover (invented)', fuel: 'electricity', price: { amount: 0.16, per: 'kWh' },
      system: { kind: 'air-source-heat-pump', efficiency: { value: 3.4, rating: 'SCOP' }, backup: 'old-furnace', changeover: 'optimal' } },
    { id: 'oil-boiler', label: 'Oil boiler (invented)', fuel: 'heating-oil-2',
      price: { amount: 1.05, per: 'L', tiers: [{ from: 0, to: 2000, amount: 1.05 }, { from: 2000, amount: 0.98 }] },
      system: { kind: 'boiler', efficiency: { value: 88, rating: 'seasonal-gcv' }, capacity: q(80000, 'Btu/h'), auxiliary_electricity: q(250, 'kWh') },
      installed_cost: 9000, annual_maintenance: 220 },
  ];
}

/** A whole quote: the paperwork, the settings, the economics and the price draws, with `demand` and `climate`. */
function everyField(demand, climate) {
  return {
    schema: 'fuelwright.scenario/1',
    title: 'Every field (invented)',
    description: 'A quote with every field the page edits, for the round-trip test (invented).',
    quote: { customer: 'Dana Okafor (invented)', site: '18 Larch Lane, Elm Fork (invented)', date: '2026-12-04', prepared_by: 'Larchmere Comfort Heating (invented)',
      notes: 'Measured on site (invented).', number: 'LC-0042', valid_until: '2027-01-03', terms: 'Half on signing (invented).',
      company: { name: 'Larchmere Comfort Heating (invented)', address: '2 Mill Road, Elm Fork (invented)', phone: '555-0177', email: 'office@larchmere.invalid', licence: 'LC-22-0419 (invented)' },
      financing: { rate: 0.069, years: 12 } },
    settings: { units: 'us', currency: 'USD', gwp: 'AR6', electricity_co2e_kg_per_kwh: 0.31, elevation: q(1890, 'm'), gas_pressure_base: 'site' },
    demand,
    climate,
    options: everyOption(),
    economics: { analysis_years: 20, discount_rate: 0.035, escalation: { default: 0.015, 'natural-gas': 0.03 }, maintenance_escalation: 0.02, basis: 'nominal' },
    uncertainty: { draws: 500, seed: 7, form: 'triangular', spread: { default: 0.2, 'natural-gas': 0.3 } },
  };
}

const MONTHLY_C = [-6.5, -5, 0.5, 7.5, 13.5, 18.5, 21.5, 20.5, 16, 9.5, 3.5, -3];
const DEMANDS = {
  'bills in ccf with their average temperatures in °C, meter reads': [{
    method: 'bills', option: 'old-furnace', bill_dates: 'meter-reads', balance_point: q(15.5, 'degC'),
    bills: [['2025-01-13', '2025-02-11', 175, -5.5], ['2025-02-11', '2025-03-12', 146, -2], ['2025-03-12', '2025-04-10', 107, 3.5],
      ['2025-04-10', '2025-05-12', 58, 9.5], ['2025-05-12', '2025-06-10', 29, 15.5], ['2025-06-10', '2025-07-11', 21, 20.5]]
      .map(([start, end, quantity, t]) => ({ start, end, quantity, unit: 'ccf', mean_temperature: q(t, 'degC') })),
  }, { monthly_mean: MONTHLY_C, unit: 'degC', base: q(18, 'degC'), design_temperature: q(-17, 'degC'), daily_range: 9 }],
  'a design heat loss in kW with a design temperature and internal gains': [{
    method: 'heat-loss', design_heat_loss: q(11.2, 'kW'), indoor: q(21, 'degC'), design_outdoor: q(-17, 'degC'), internal_gains: q(0.7, 'kW'),
    degree_day_correction: 0.8, hot_water: q(12, 'GJ'),
  }, { monthly_hdd: [520, 450, 400, 260, 140, 40, 10, 15, 80, 230, 370, 480], unit: 'degC', base: q(18, 'degC'), design_temperature: q(-17, 'degC') }],
  'a UA with a balance point': [{
    method: 'heat-loss', ua: q(180, 'W/K'), indoor: q(68, 'degF'), balance_point: q(58, 'degF'),
  }, { annual_hdd: 6100, unit: 'degF', design_temperature: q(2, 'degF'), base: q(65, 'degF') }],
  'a known yearly heat need in GJ': [{ method: 'direct', annual_useful_heat: q(63.3, 'GJ'), balance_point: q(16, 'degC') },
    { monthly_mean: MONTHLY_C, unit: 'degC', base: q(18, 'degC') }],
};

/** The differences between two documents, one line a field ("/options/1/system/cutoff: … -> …"). */
function differences(a, b, path = '') {
  if (JSON.stringify(a) === JSON.stringify(b)) return [];
  if (a && b && typeof a === 'object' && typeof b === 'object') {
    return [...new Set([...Object.keys(a), ...Object.keys(b)])].flatMap((k) => differences(a[k], b[k], `${path}/${k}`));
  }
  return [`${path}: ${JSON.stringify(a)} -> ${JSON.stringify(b)}`];
}

/** The scenario after each of the three trips: {workspace, record, file}. */
function trips(doc) {
  const ws = scenario.fromScenario(structuredClone(doc));
  const workspace = scenario.toScenario(ws);
  const record = storage.makeRecord({ workspace: ws, scenario: workspace });
  const stored = storage.migrateRecord(JSON.parse(JSON.stringify(record)));
  const fromRecord = scenario.toScenario(storage.workspaceOf(stored));
  const result = JSON.parse(core.evaluate(JSON.stringify(workspace)));
  const file = JSON.parse(JSON.stringify(scenario.exportDocument(ws, result)));
  const fromFile = scenario.toScenario(scenario.fromScenario(file));
  return { workspace, record: fromRecord, file: fromFile, result };
}

describe('every field through the workspace, the device and the file', () => {
  for (const [name, [demand, climate]] of Object.entries(DEMANDS)) {
    test(name, () => {
      const doc = everyField(demand, climate);
      const { result, ...back } = trips(doc);
      assert.deepEqual(result.errors, [], 'the core accepts the quote');
      assert.deepEqual((result.warnings ?? []).filter((w) => /unknown field/.test(w.message)), [], 'every field is one the core reads');
      for (const [trip, scenarioBack] of Object.entries(back)) {
        assert.deepEqual(differences(doc, scenarioBack), [], `${trip}: every field kept, in the unit it was typed in`);
      }
    });
  }

  test('a fuel priced but used by no option is kept through the file', () => {
    const doc = everyField(...DEMANDS['a known yearly heat need in GJ']);
    const ws = scenario.fromScenario(structuredClone(doc));
    ws.fuels.push({ key: scenario.newFuelKey(ws), fuel: 'propane', price: { amount: 2.89, per: 'gal' }, fixed_charges: [{ label: 'Tank rental', amount_per_year: 85 }] });
    const file = JSON.parse(JSON.stringify(scenario.exportDocument(ws, null)));
    assert.deepEqual(file.other_fuels, [{ fuel: 'propane', price: { amount: 2.89, per: 'gal' }, fixed_charges: [{ label: 'Tank rental', amount_per_year: 85 }] }]);
    const again = scenario.fromScenario(file);
    const propane = again.fuels.find((f) => f.fuel === 'propane');
    assert.deepEqual([propane.price, propane.fixed_charges], [{ amount: 2.89, per: 'gal' }, [{ label: 'Tank rental', amount_per_year: 85 }]]);
  });
});

describe('settings the page does not show as fields', () => {
  test('a pressure base given as a pressure, and a setting of a later version, travel on unchanged', () => {
    const doc = everyField(...DEMANDS['a known yearly heat need in GJ']);
    doc.settings.gas_pressure_base = q(14.73, 'psia');
    doc.settings.later_setting = { kept: true };
    const ws = scenario.fromScenario(structuredClone(doc));
    assert.equal(ws.settings.gas_pressure_base_mode, 'given');
    const back = scenario.toScenario(ws);
    assert.deepEqual(back.settings.gas_pressure_base, q(14.73, 'psia'));
    assert.deepEqual(back.settings.later_setting, { kept: true });
  });
});

describe('every example in data/examples/', () => {
  test('comes back identical through the three trips', async () => {
    const dir = join(root, 'data/examples');
    const names = (await readdir(dir)).filter((n) => n.endsWith('.json') && !n.startsWith('supplier-'));
    assert.ok(names.length >= 5);
    for (const name of names) {
      const doc = JSON.parse(await readFile(join(dir, name), 'utf8'));
      const { result, ...back } = trips(doc);
      assert.deepEqual(result.errors, [], name);
      for (const [trip, scenarioBack] of Object.entries(back)) assert.deepEqual(differences(doc, scenarioBack), [], `${name}: ${trip}`);
    }
  });
});
