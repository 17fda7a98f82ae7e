// The page's pure modules in Node: the unit factors of web/units.js against
// the core's convert(), and web/scenario.js turning every example into the
// page's workspace and back into a scenario the core evaluates identically.
import assert from 'node:assert/strict';
import { readdir, readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { loadCore, siteDir } from './helpers.js';

const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');
const web = (name) => import(pathToFileURL(join(siteDir, name)).href);
const examplesDir = join(root, 'data/examples');

let core;
let units;
let scenario;
let format;
before(async () => {
  core = await loadCore();
  units = await web('units.js');
  scenario = await web('scenario.js');
  format = await web('format.js');
});

const convertInCore = (value, from, to) => JSON.parse(core.convert(JSON.stringify({ value, from, to })));

describe('web/units.js factors equal the core\'s convert()', () => {
  test('energy, power, mass, volume and temperature', () => {
    const tables = [[units.ENERGY_KWH, 'kWh'], [units.POWER_W, 'W'], [units.MASS_KG, 'kg'], [units.VOLUME_M3, 'm3']];
    for (const [table, base] of tables) {
      for (const unit of Object.keys(table)) {
        const expected = convertInCore(1, unit, base);
        assert.deepEqual(expected.errors ?? [], [], `${unit}`);
        const actual = units.convert(1, unit, base);
        assert.ok(Math.abs(actual - expected.value) <= 1e-12 * Math.abs(expected.value), `1 ${unit} = ${actual} ${base}, core ${expected.value}`);
      }
    }
    for (const [value, from, to] of [[68, 'degF', 'degC'], [-40, 'degC', 'degF'], [300, 'K', 'degF']]) {
      const expected = convertInCore(value, from, to).value;
      assert.ok(Math.abs(units.convert(value, from, to) - expected) < 1e-9, `${value} ${from} -> ${to}`);
    }
    // UA: 1 Btu/h/degF = (1 Btu/h in W) x 1.8 W/K
    assert.ok(Math.abs(units.UA_W_PER_K['Btu/h/degF'] - convertInCore(1, 'Btu/h', 'W').value * 1.8) < 1e-12);
  });

  test('switching unit system moves a quantity to its counterpart unit', () => {
    assert.deepEqual(units.convertQuantity({ value: 20, unit: 'degC' }, 'us'), { value: 68, unit: 'degF' });
    const q = units.convertQuantity({ value: 60, unit: 'MMBtu' }, 'metric');
    assert.equal(q.unit, 'kWh');
    assert.ok(Math.abs(q.value - convertInCore(60, 'MMBtu', 'kWh').value) < 1e-9);
    assert.deepEqual(units.convertQuantity({ value: 5, unit: 'GJ' }, 'metric'), { value: 5, unit: 'GJ' });
  });
});

describe('web/format.js reads numbers in the locale', () => {
  test('decimal comma and point', () => {
    assert.equal(format.parseNumber('1,40', 'de-DE'), 1.4);
    assert.equal(format.parseNumber('1.400', 'de-DE'), 1400);
    assert.equal(format.parseNumber('1.4', 'de-DE'), 1.4);
    assert.equal(format.parseNumber('1 234,5', 'fr-FR'), 1234.5);
    assert.equal(format.parseNumber('1,234.5', 'en-US'), 1234.5);
    assert.ok(Number.isNaN(format.parseNumber('1,4', 'en-US')));
    assert.ok(Number.isNaN(format.parseNumber('abc', 'en-US')));
    assert.equal(format.parseNumber('', 'en-US'), null);
    assert.equal(format.formatInput(1.25, 'de-DE'), '1,25');
  });
  test('dates read long in the locale, the calendar date unchanged by the time zone', () => {
    // expected texts: the CLDR long date patterns as Node's ICU formats them (from memory of CLDR)
    assert.equal(format.createFormat({ locale: 'en-US', currency: 'USD' }).date('2026-12-01'), 'December 1, 2026');
    assert.equal(format.createFormat({ locale: 'de-DE', currency: 'EUR' }).date('2026-01-31'), '31. Januar 2026');
    assert.equal(format.createFormat({ locale: 'en-GB', currency: 'GBP' }).date('2026-12-01'), '1 December 2026');
    assert.equal(format.createFormat({ locale: 'en-US', currency: 'USD' }).date('2026-12-01'), 'December 1, 2026', 'the same again, from the kept format');
    assert.equal(format.createFormat({ locale: 'en-US', currency: 'USD' }).date('not a date'), 'not a date');
    assert.equal(format.createFormat({ locale: 'en-US', currency: 'USD' }).date(''), '');
  });
  test('a reason from the core reads as a sentence', async () => {
    const scenario = JSON.parse(await readFile(join(root, 'data/examples/maple-hollow-gas-vs-heat-pump.json'), 'utf8'));
    scenario.options.push({ ...scenario.options[4], id: 'baseboard-2', label: 'Second baseboard', fixed_charges: [] });
    scenario.options[4].fixed_charges = [];
    const answer = JSON.parse(core.breakEven(JSON.stringify({ scenario, a: 'baseboard', b: 'baseboard-2', vary: 'price', of: 'electricity' })));
    assert.equal(answer.break_even, null);
    assert.equal(format.asSentence(answer.reason), `${answer.reason[0].toUpperCase()}${answer.reason.slice(1)}.`);
    assert.equal(format.asSentence('Done.'), 'Done.');
    assert.equal(format.asSentence(''), '');
  });
});

describe('web/scenario.js keeps every example', () => {
  const names = [];
  before(async () => {
    names.push(...(await readdir(examplesDir)).filter((n) => n.endsWith('.json') && !n.startsWith('supplier-')).sort());
  });
  test('workspace round trip evaluates as the example does', async () => {
    assert.ok(names.length >= 5);
    for (const name of names) {
      const doc = JSON.parse(await readFile(join(examplesDir, name), 'utf8'));
      const ws = scenario.fromScenario(doc);
      const back = scenario.toScenario(ws);
      assert.deepEqual(scenario.toScenario(scenario.fromScenario(back)), back, `${name}: stable`);
      const a = JSON.parse(core.evaluate(JSON.stringify(doc)));
      const b = JSON.parse(core.evaluate(JSON.stringify(back)));
      assert.deepEqual(b.options.map((o) => o.annual_cost), a.options.map((o) => o.annual_cost), `${name}: annual costs`);
      assert.deepEqual(b.errors, a.errors, `${name}: errors`);
    }
  });

  test('the demo evaluates without errors', async () => {
    const { demoWorkspace } = await web('demo.js');
    const result = JSON.parse(core.evaluate(JSON.stringify(scenario.toScenario(demoWorkspace()))));
    assert.deepEqual(result.errors, []);
    assert.equal(result.options.length, 5);
  });

  test('error paths point at the workspace field', () => {
    const ws = scenario.fromScenario(JSON.parse(JSON.stringify({
      schema: 'fuelwright.scenario/1', demand: { method: 'direct' },
      options: [
        { id: 'a', fuel: 'natural-gas', price: { amount: 1, per: 'therm' }, system: { kind: 'furnace' } },
        { id: 'b', fuel: 'electricity', price: { amount: 0.1, per: 'kWh' }, system: { kind: 'electric-resistance' } },
      ],
    })));
    assert.equal(scenario.workspacePath('/options/1/price/amount', ws), '/fuels/1/price/amount');
    assert.equal(scenario.workspacePath('/options/1/system/efficiency/value', ws), '/systems/1/system/efficiency/value');
    assert.equal(scenario.workspacePath('/demand/annual_useful_heat', ws), '/demand/annual_useful_heat');
  });
});
