// The WebAssembly module of the site, called as the page's worker calls it,
// must give exactly what the native CLI prints for the same inputs.
import assert from 'node:assert/strict';
import { before, describe, test } from 'node:test';

import { cli, cliJson, loadCore } from './helpers.js';

let core;
before(async () => {
  core = await loadCore();
});

const call = (fn, request) => JSON.parse(core[fn](JSON.stringify(request)));

describe('heatingValue matches the CLI', () => {
  const cases = [
    { request: { formula: 'CH4' }, args: ['--formula', 'CH4'] },
    { request: { formula: 'C3H8' }, args: ['--formula', 'C3H8'] },
    { request: { formula: 'n-C4H10' }, args: ['--formula', 'n-C4H10'] },
    { request: { formula: 'H2' }, args: ['--formula', 'H2'] },
    { request: { formula: 'C2H5OH' }, args: ['--formula', 'C2H5OH'] },
    { request: { mixture: 'CH4:0.95,C2H6:0.03,N2:0.02' }, args: ['--mixture', 'CH4:0.95,C2H6:0.03,N2:0.02'] },
  ];
  for (const { request, args } of cases) {
    test(JSON.stringify(request), async () => {
      const wasm = call('heatingValue', request);
      assert.deepEqual(wasm.errors, [], `unexpected errors: ${JSON.stringify(wasm.errors)}`);
      for (const key of ['hhv_kj_per_mol', 'lhv_kj_per_mol', 'hhv_mj_per_kg', 'lhv_mj_per_kg',
        'hhv_mj_per_m3', 'lhv_mj_per_m3']) {
        assert.equal(typeof wasm[key], 'number', `${key} is a number`);
      }
      assert.ok(wasm.hhv_kj_per_mol >= wasm.lhv_kj_per_mol, 'HHV >= LHV');
      const { code, json } = await cliJson('heating-value', ...args);
      assert.equal(code, 0);
      assert.deepEqual(wasm, json);
    });
  }
});

describe('convert matches the CLI', () => {
  const cases = [
    [1, 'therm', 'kWh'],
    [1, 'MMBtu', 'GJ'],
    [100, 'gal', 'L'],
    [1, 'imp_gal', 'L'],
    [1000, 'ft3', 'm3'],
    [1, 'cord', 'm3'],
    [2.5, 'short_ton', 'kg'],
    [60000, 'Btu/h', 'kW'],
    [68, 'degF', 'degC'],
    [-40, 'degC', 'degF'],
    [300, 'K', 'degC'],
    [1, 'kcal_th', 'kJ'],
  ];
  for (const [value, from, to] of cases) {
    test(`${value} ${from} -> ${to}`, async () => {
      const wasm = call('convert', { value, from, to });
      assert.equal(wasm.unit, to);
      assert.equal(typeof wasm.value, 'number');
      assert.ok(!wasm.errors?.length, `unexpected errors: ${JSON.stringify(wasm.errors)}`);
      const { code, json } = await cliJson('convert', String(value), from, to);
      assert.equal(code, 0);
      assert.deepEqual(wasm, json);
    });
  }
});

describe('errors come back as data', () => {
  test('an unknown element gives errors[], not an exception', () => {
    const wasm = call('heatingValue', { formula: 'Xq2' });
    assert.ok(Array.isArray(wasm.errors) && wasm.errors.length > 0, JSON.stringify(wasm));
    for (const error of wasm.errors) {
      assert.equal(typeof error.path, 'string');
      assert.equal(typeof error.message, 'string');
      assert.ok(error.message.length > 0);
    }
  });

  test('the CLI exits 2 and prints the same errors', async () => {
    const { code, json } = await cliJson('heating-value', '--formula', 'Xq2');
    assert.equal(code, 2);
    assert.deepEqual(call('heatingValue', { formula: 'Xq2' }), json);
  });

  test('an unknown unit gives errors[]', () => {
    const wasm = call('convert', { value: 1, from: 'therm', to: 'furlong' });
    assert.ok(Array.isArray(wasm.errors) && wasm.errors.length > 0, JSON.stringify(wasm));
  });

  test('malformed JSON gives errors[]', () => {
    const wasm = JSON.parse(core.heatingValue('{"formula": '));
    assert.ok(Array.isArray(wasm.errors) && wasm.errors.length > 0, JSON.stringify(wasm));
  });
});

describe('units', () => {
  test('lists every accepted unit spelling, as the CLI does', async () => {
    const units = JSON.parse(core.units());
    const names = Object.values(units).flat().map((unit) => (typeof unit === 'string' ? unit : unit.name));
    for (const unit of ['J', 'kJ', 'MJ', 'GJ', 'kWh', 'Btu', 'MMBtu', 'therm', 'kcal', 'cal', 'kcal_th', 'cal_th',
      'm3', 'L', 'gal', 'imp_gal', 'ft3', 'ccf', 'Mcf', 'cord', 'kg', 'g', 'lb', 'short_ton', 'tonne',
      'W', 'kW', 'Btu/h', 'degC', 'degF', 'K']) {
      assert.ok(names.includes(unit), `${unit} in ${names.join(' ')}`);
    }
    const { code, json } = await cliJson('units');
    assert.equal(code, 0);
    assert.deepEqual(units, json);
  });
});
