// Scenario evaluation and the catalog: for every example in data/examples/ the
// WebAssembly module's evaluate() must give exactly what `fuelwright evaluate
// FILE` prints, and catalog() exactly what `fuelwright catalog` prints.
import assert from 'node:assert/strict';
import { mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { cliJson, loadCore } from './helpers.js';

const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');
const examplesDir = join(root, 'data/examples');
// Scenario examples only: supplier-*.json are price files (fuelwright.prices/1).
const examples = (await readdir(examplesDir)).filter((name) => name.endsWith('.json') && !name.startsWith('supplier-')).sort();

let core;
before(async () => {
  core = await loadCore();
});

describe('evaluate matches the CLI on every example', () => {
  test('there are examples to compare', () => {
    assert.ok(examples.length >= 5, `examples in data/examples: ${examples.join(' ')}`);
  });

  for (const name of examples) {
    test(name, async () => {
      const path = join(examplesDir, name);
      const text = await readFile(path, 'utf8');
      const scenario = JSON.parse(text);

      const wasm = JSON.parse(core.evaluate(text));
      assert.deepEqual(wasm.errors, [], `unexpected errors: ${JSON.stringify(wasm.errors)}`);
      assert.equal(wasm.schema, 'fuelwright.result/1');
      assert.deepEqual(wasm.options.map((option) => option.id), scenario.options.map((option) => option.id));
      assert.equal(wasm.ranking.length, scenario.options.length);
      for (const option of wasm.options) {
        for (const key of ['useful_heat_kwh', 'fuel_energy_hhv_kwh', 'energy_cost', 'fixed_cost', 'annual_cost',
          'cost_per_useful_kwh', 'co2e_kg']) {
          assert.ok(Number.isFinite(option[key]), `${option.id}.${key} = ${option[key]}`);
        }
        assert.ok(Number.isFinite(option.fuel_quantity?.value), `${option.id}.fuel_quantity`);
      }

      const { code, json } = await cliJson('evaluate', path);
      assert.equal(code, 0, `CLI exit code for ${name}`);
      assert.deepEqual(wasm, json);
    });
  }
});

describe('evaluate reports bad scenarios as data, as the CLI does', () => {
  let dir;
  before(async () => {
    dir = await mkdtemp(join(tmpdir(), 'fuelwright-node-'));
  });
  after(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  const cases = {
    'missing options': {
      schema: 'fuelwright.scenario/1',
      demand: { method: 'direct', annual_useful_heat: { value: 60, unit: 'MMBtu' } },
    },
    'negative price': {
      schema: 'fuelwright.scenario/1',
      demand: { method: 'direct', annual_useful_heat: { value: 60, unit: 'MMBtu' } },
      options: [{
        id: 'gas',
        fuel: 'natural-gas',
        price: { amount: -1, per: 'therm' },
        system: { kind: 'furnace', efficiency: { value: 95, rating: 'AFUE' } },
      }],
    },
  };
  for (const [name, scenario] of Object.entries(cases)) {
    test(name, async () => {
      const text = JSON.stringify(scenario);
      const wasm = JSON.parse(core.evaluate(text));
      assert.ok(Array.isArray(wasm.errors) && wasm.errors.length > 0, JSON.stringify(wasm));
      for (const error of wasm.errors) {
        assert.equal(typeof error.path, 'string');
        assert.ok(typeof error.message === 'string' && error.message.length > 0);
      }
      const path = join(dir, `${name.replaceAll(' ', '-')}.json`);
      await writeFile(path, text);
      const { code, json } = await cliJson('evaluate', path);
      assert.equal(code, 2);
      assert.deepEqual(wasm, json);
    });
  }

  test('malformed JSON gives errors[], not an exception', () => {
    const wasm = JSON.parse(core.evaluate('{"schema": '));
    assert.ok(Array.isArray(wasm.errors) && wasm.errors.length > 0, JSON.stringify(wasm));
  });
});

describe('catalog', () => {
  test('matches the CLI and lists every catalog fuel and system', async () => {
    const wasm = JSON.parse(core.catalog());
    assert.ok(!wasm.errors?.length, `unexpected errors: ${JSON.stringify(wasm.errors)}`);
    const fuels = JSON.parse(await readFile(join(root, 'data/fuels.json'), 'utf8')).fuels.map((fuel) => fuel.id);
    const systems = JSON.parse(await readFile(join(root, 'data/systems.json'), 'utf8')).systems.map((s) => s.id);
    assert.deepEqual(wasm.fuels.map((fuel) => fuel.id).sort(), [...fuels].sort());
    assert.deepEqual(wasm.systems.map((system) => system.id).sort(), [...systems].sort());
    const { code, json } = await cliJson('catalog');
    assert.equal(code, 0);
    assert.deepEqual(wasm, json);
  });
});
