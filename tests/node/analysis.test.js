// The WebAssembly module's analysis and price-file entry points, called as the
// page's worker calls them, against the native CLI on the same inputs: sweep,
// breakEven, tornado, checkPrices (every bad fixture with its expected first
// message), evaluateWithProgress (progress calls, the same result as
// evaluate, cancellation by answering false); and the kiosk's pure module
// (web/kiosk-scenario.js) building a scenario from the sample price file.
import assert from 'node:assert/strict';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { after, before, describe, test } from 'node:test';

import { cliJson, loadCore, siteDir } from './helpers.js';

const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');
const binsExample = join(root, 'data/examples/maple-hollow-heat-pump-bins.json');
const fixtures = join(root, 'tests/fixtures/prices');

let core;
let dir;
let plainFile;
let plain;
before(async () => {
  core = await loadCore();
  dir = await mkdtemp(join(tmpdir(), 'fuelwright-analysis-'));
  plain = JSON.parse(await readFile(binsExample, 'utf8'));
  delete plain.uncertainty;
  plainFile = join(dir, 'bins.json');
  await writeFile(plainFile, JSON.stringify(plain));
});
after(async () => {
  if (dir) await rm(dir, { recursive: true, force: true });
});

const call = (fn, request) => JSON.parse(core[fn](JSON.stringify(request)));

describe('analyses match the CLI', () => {
  test('sweep of a fuel price, annual and life-cycle', async () => {
    for (const basis of ['annual', 'life-cycle']) {
      const wasm = call('sweep', { scenario: plain, vary: 'price', of: 'natural-gas', from: 0, to: 2.9, points: 41, basis });
      assert.deepEqual(wasm.errors, []);
      assert.equal(wasm.x.length, 41);
      const { code, json } = await cliJson('sweep', plainFile, '--vary', 'price', '--of', 'natural-gas', '--from', '0', '--to', '2.9', '--points', '41', '--basis', basis);
      assert.equal(code, 0);
      assert.deepEqual(wasm, json);
    }
  });

  test('breakEven of two options, with its statement', async () => {
    const wasm = call('breakEven', { scenario: plain, a: 'gas-furnace', b: 'cold-climate-hp', vary: 'price', of: 'electricity', basis: 'annual' });
    assert.deepEqual(wasm.errors, []);
    assert.ok(wasm.break_even.value > 0);
    assert.match(wasm.statement, /cheaper per year while the price of Electricity is above/);
    const { code, json } = await cliJson('break-even', plainFile, '--a', 'gas-furnace', '--b', 'cold-climate-hp', '--vary', 'price', '--of', 'electricity', '--basis', 'annual');
    assert.equal(code, 0);
    assert.deepEqual(wasm, json);
  });

  test('tornado of every input', async () => {
    const wasm = call('tornado', { scenario: plain, basis: 'annual', change: 0.2 });
    assert.deepEqual(wasm.errors, []);
    assert.ok(wasm.inputs.length >= 3);
    const { code, json } = await cliJson('tornado', plainFile, '--basis', 'annual', '--change', '0.2');
    assert.equal(code, 0);
    assert.deepEqual(wasm, json);
  });
});

describe('checkPrices matches the CLI', () => {
  test('the sample price file is clean on its effective date', async () => {
    const text = await readFile(join(root, 'data/examples/supplier-prices.json'), 'utf8');
    const today = JSON.parse(text).effective;
    const wasm = JSON.parse(core.checkPrices(text, today));
    assert.equal(wasm.valid, true);
    assert.deepEqual(wasm.errors, []);
    const { code, json } = await cliJson('check-prices', join(root, 'data/examples/supplier-prices.json'), '--today', today);
    assert.equal(code, 0);
    assert.deepEqual(wasm, json);
  });

  test('every bad fixture gives its expected first message, as the CLI does', async () => {
    const expected = JSON.parse(await readFile(join(fixtures, 'expected.json'), 'utf8'));
    for (const c of expected.cases) {
      const text = await readFile(join(fixtures, c.file), 'utf8');
      const wasm = JSON.parse(core.checkPrices(text, expected.today));
      assert.equal(wasm.valid, false, c.file);
      assert.equal(wasm.errors[0]?.path, c.path, `${c.file}: ${JSON.stringify(wasm.errors)}`);
      assert.equal(wasm.errors[0]?.message, c.message, c.file);
      const { code, json } = await cliJson('check-prices', join(fixtures, c.file), '--today', expected.today);
      assert.equal(code, 2, c.file);
      assert.deepEqual(wasm, json, c.file);
    }
  });
});

describe('evaluateWithProgress', () => {
  test('reports progress and gives what evaluate gives', async () => {
    const text = await readFile(binsExample, 'utf8');
    const fractions = [];
    const wasm = JSON.parse(core.evaluateWithProgress(text, (f) => { fractions.push(f); return true; }));
    assert.ok(fractions.length >= 50, `${fractions.length} progress calls`);
    assert.ok(fractions.every((f, i) => f >= 0 && f <= 1 && (i === 0 || f >= fractions[i - 1])), 'fractions rise from 0 to 1');
    assert.deepEqual(wasm, JSON.parse(core.evaluate(text)));
    const { json } = await cliJson('evaluate', binsExample);
    assert.deepEqual(wasm.uncertainty, json.uncertainty);
  });

  test('stops when the callback answers false', () => {
    const doc = JSON.parse(JSON.stringify({ ...plain, uncertainty: { draws: 100000, seed: 3 } }));
    let calls = 0;
    const wasm = JSON.parse(core.evaluateWithProgress(JSON.stringify(doc), () => { calls += 1; return calls < 5; }));
    assert.deepEqual(wasm.errors, []);
    assert.equal(wasm.uncertainty.cancelled, true);
    assert.ok(wasm.uncertainty.draws < 100000, `${wasm.uncertainty.draws} draws`);
    assert.equal(calls, 5);
  });
});

describe('web/kiosk-scenario.js', () => {
  let kiosk;
  let catalog;
  before(async () => {
    kiosk = await import(pathToFileURL(join(siteDir, 'kiosk-scenario.js')).href);
    catalog = JSON.parse(core.catalog());
  });

  test('settings from the query over kiosk.json', () => {
    const q = (text) => new URLSearchParams(text);
    assert.deepEqual(kiosk.kioskSettings(q('kiosk=1&prices=p.json&idle=2'), { prices: 'other.json', idle_seconds: 60 }),
      { prices: 'p.json', idleSeconds: 2, units: '', locale: '' });
    assert.equal(kiosk.kioskSettings(q('kiosk=1'), { prices: 'other.json' }).idleSeconds, kiosk.DEFAULT_IDLE_SECONDS);
    assert.equal(kiosk.kioskSettings(q('kiosk=1&idle=abc'), {}).idleSeconds, 120);
    assert.equal(kiosk.sameOriginUrl('prices/a.json', 'http://127.0.0.1:8080/index.html?kiosk=1').pathname, '/prices/a.json');
    assert.equal(kiosk.sameOriginUrl('http://example.invalid/a.json', 'http://127.0.0.1:8080/'), null);
    assert.equal(kiosk.sameOriginUrl('//example.invalid/a.json', 'http://127.0.0.1:8080/'), null);
  });

  test('a clean file is shown, an expired one with a warning, any other problem refuses it', async () => {
    const text = await readFile(join(root, 'data/examples/supplier-prices.json'), 'utf8');
    assert.deepEqual(kiosk.priceFileVerdict(JSON.parse(core.checkPrices(text, '2026-12-01'))), { ok: true, expired: false, problems: [] });
    const expired = kiosk.priceFileVerdict(JSON.parse(core.checkPrices(await readFile(join(fixtures, 'bad-11-expired.json'), 'utf8'), '2026-12-01')));
    assert.equal(expired.ok, true);
    assert.equal(expired.expired, true);
    const bad = kiosk.priceFileVerdict(JSON.parse(core.checkPrices(await readFile(join(fixtures, 'bad-05-tiers-overlap.json'), 'utf8'), '2026-12-01')));
    assert.equal(bad.ok, false);
    assert.equal(bad.problems[0].path, '/prices/0/tiers/1/from');
    assert.equal(kiosk.priceFileVerdict(JSON.parse(core.checkPrices('{', '2026-12-01'))).ok, false);
  });

  test('the sample file makes a scenario the core evaluates without errors', async () => {
    const fileText = await readFile(join(root, 'data/examples/supplier-prices.json'), 'utf8');
    const file = JSON.parse(fileText);
    const check = JSON.parse(core.checkPrices(fileText, file.effective));
    const offer = kiosk.kioskOffer(check, file, catalog);
    assert.deepEqual(offer.fuels.map((f) => f.fuel), file.offer.fuels);
    assert.equal(offer.fuels.find((f) => f.fuel === 'electricity').locked, false, 'electricity is not priced in the file');
    assert.equal(offer.fuels.find((f) => f.fuel === 'wood-pellets').price.unit, 'short_ton', 'the compared pellet price is not per bag');
    assert.ok(offer.options.every((o) => file.offer.systems.includes(o.model.id)));
    assert.equal(kiosk.unitsOf(check.prices), 'us');

    const none = kiosk.kioskScenario(offer, { size: '', prices: {} }, { units: 'us', currency: 'USD' });
    assert.equal(none.scenario, null);
    const { scenario, missing } = kiosk.kioskScenario(offer, { size: 'medium', current: 'oil-boiler-heating-oil-2', prices: {} }, { units: 'us', currency: 'USD' });
    assert.deepEqual(missing.map((o) => o.fuel), ['electricity']);
    const propane = scenario.options.find((o) => o.fuel === 'propane');
    assert.deepEqual(propane.price, { per: 'gal', tiers: file.prices[0].tiers });
    assert.deepEqual(propane.fixed_charges, file.prices[0].fixed_charges);
    assert.equal(scenario.options.filter((o) => o.existing).length, 1);
    const result = JSON.parse(core.evaluate(JSON.stringify(scenario)));
    assert.deepEqual(result.errors, []);
    assert.equal(result.economics.baseline, 'oil-boiler-heating-oil-2');
    const withPower = kiosk.kioskScenario(offer, { size: 'small', prices: { electricity: 0.16 } }, { units: 'us', currency: 'USD' });
    assert.deepEqual(withPower.missing, []);
    assert.deepEqual(withPower.scenario.options.find((o) => o.fuel === 'electricity').price, { amount: 0.16, per: 'kWh' });
    assert.deepEqual(JSON.parse(core.evaluate(JSON.stringify(withPower.scenario))).errors, []);
  });

  test('a utility\'s time-of-use tariff reaches the scenario as its schedule, and every kWh lands in a period', async () => {
    const fileText = await readFile(join(root, 'data/examples/supplier-prices-time-of-use.json'), 'utf8');
    const file = JSON.parse(fileText);
    const check = JSON.parse(core.checkPrices(fileText, file.effective));
    assert.deepEqual(check.errors, []);
    assert.equal(check.prices[0].scheduled, true);
    const offer = kiosk.kioskOffer(check, file, catalog);
    assert.equal(offer.fuels.find((f) => f.fuel === 'electricity').locked, true);
    const { scenario } = kiosk.kioskScenario(offer, { size: 'medium', prices: {} }, { units: 'us', currency: 'USD' });
    const hp = scenario.options.find((o) => o.fuel === 'electricity');
    assert.deepEqual(hp.price, { per: 'kWh', schedule: file.prices[0].schedule });
    const result = JSON.parse(core.evaluate(JSON.stringify(scenario)));
    assert.deepEqual(result.errors, []);
    const option = result.options.find((o) => o.id === hp.id);
    const kwh = option.electricity_periods.reduce((sum, p) => sum + p.kwh, 0);
    assert.deepEqual(option.electricity_periods.map((p) => p.name), ['peak', 'off-peak', 'mid-peak']);
    assert.ok(Math.abs(kwh - option.electricity_kwh) <= 1e-9 * kwh);
  });
});
