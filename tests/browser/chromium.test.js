// The assembled site in headless Chromium (playwright-core driving the
// system's /usr/bin/chromium) with touch at tablet viewports, portrait
// 820x1180 and landscape 1180x820: the demo verdict, a scenario typed in and
// checked against the native CLI, unit / currency / locale switches, saved
// quotes, export and import, inline core errors, the print layout, user text
// shown literally, and an offline reload from the service worker.
import assert from 'node:assert/strict';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { TOUCH, importAndWait, launchTablet, verdictSettled, watchPage } from './chromium-page.js';
import { cliJson, siteDir } from '../node/helpers.js';
import { serve } from './server.js';
import { TYPED, cliEvaluate, close, money, typedScenario } from './scenario-fixture.js';

const TIMEOUT = 30_000;
const ARTIFACTS = resolve(process.env.FUELWRIGHT_ARTIFACTS ?? join(siteDir, '..', 'test-artifacts'));
const MMBTU_KWH = 293.07107017222222;
const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');
const LB_KG = 0.45359237;

let server;
let profile;
let context;
let page;
const consoleErrors = [];
const dialogs = [];

before(async () => {
  mkdirSync(ARTIFACTS, { recursive: true });
  server = await serve(siteDir);
  profile = mkdtempSync(join(tmpdir(), 'fuelwright-chromium-'));
  ({ context, page } = await launchTablet(profile, { ...TOUCH, acceptDownloads: true }));
  watchPage(page, { consoleErrors, dialogs });
}, { timeout: TIMEOUT });

after(async () => {
  await context?.close();
  await server?.close();
  if (profile) rmSync(profile, { recursive: true, force: true });
}, { timeout: TIMEOUT });

/** Waits until the verdict shows the result of the latest edit. */
const settled = (state = 'done') => verdictSettled(page, state);

async function tab(name) {
  await page.tap(`#tab-${name}`);
}

/** The verdict row of an option: annual cost, cost per useful unit, fuel and CO2e (data-value, text). */
async function row(id) {
  return page.evaluate((optionId) => {
    const tr = document.querySelector(`#verdict-table tr[data-option="${optionId}"]`);
    if (!tr) return null;
    const cell = (key) => {
      const b = tr.querySelector(`button.num[data-key="${key}"]`);
      return { value: Number(b?.dataset.value), text: b?.textContent };
    };
    return { annual: cell('annual_cost'), perUseful: cell('cost_per_useful'), fuel: cell('fuel_quantity'), co2e: cell('co2e'),
      header: [...document.querySelectorAll('#verdict-table thead th')].map((th) => th.textContent) };
  }, id);
}

let cliDemo = null;

/** The demo as the page builds it. */
function demoScenario() {
  return page.evaluate(async () => (await import('./scenario.js')).toScenario((await import('./demo.js')).demoWorkspace()));
}

/** Waits until the charts (sweep, break-even, tornado) show the latest verdict. */
async function analysed() {
  await page.waitForFunction(() => {
    const body = document.querySelector('#verdict-body');
    return body.dataset.state === 'done' && body.dataset.analysis === body.dataset.generation && document.querySelector('#progress').hidden;
  });
}

/** The tornado list against the core's tornado answer. */
async function checkTornado(tornado) {
  const rows = await page.$$eval('#tornado-list li', (items) => items.map((li) => li.textContent));
  assert.equal(rows.length, Math.min(8, tornado.inputs.length));
  for (const [i, input] of tornado.inputs.slice(0, 8).entries()) {
    assert.ok(rows[i].startsWith(input.input), rows[i]);
    const low = Number(await page.getAttribute(`#tornado-list li:nth-child(${i + 1}) button[data-side="low"]`, 'data-value'));
    const high = Number(await page.getAttribute(`#tornado-list li:nth-child(${i + 1}) button[data-side="high"]`, 'data-value'));
    assert.ok(close(low, input.margin_low) && close(high, input.margin_high), `${input.input}: ${low} to ${high}`);
  }
  assert.equal(await page.locator('#chart-tornado svg rect.tornado-low').count(), Math.min(8, tornado.inputs.length));
  await page.tap('#tornado-list li:first-child button[data-side="high"]');
  await page.waitForSelector('#trace-dialog[open] #trace-steps li');
  await page.tap('#trace-close');
}

/** The economics table: {id: {key: {value, text}}} in row order. */
function economicsRows() {
  return page.evaluate(() => Object.fromEntries([...document.querySelectorAll('#economics-table tbody tr')].map((tr) => [tr.dataset.option,
    Object.fromEntries([...tr.querySelectorAll('button.num')].map((b) => [b.dataset.key, { value: Number(b.dataset.value), text: b.textContent }]))])));
}

async function typeInto(selector, text) {
  await page.tap(selector);
  await page.fill(selector, '');
  await page.type(selector, text);
}

describe('Chromium, tablet portrait 820x1180 with touch', () => {
  test('shows the demo verdict on first start, equal to the CLI', { timeout: TIMEOUT }, async () => {
    await page.goto(server.url);
    await settled();
    const scenario = await page.evaluate(async () => {
      const { toScenario } = await import('./scenario.js');
      const { demoWorkspace } = await import('./demo.js');
      return toScenario(demoWorkspace());
    });
    const cli = await cliEvaluate(scenario);
    assert.deepEqual(cli.errors, []);
    const best = cli.options.find((o) => o.id === cli.ranking[0].id);
    assert.equal(await page.textContent('#best-option'), best.label);
    for (const option of cli.options) {
      const shown = await row(option.id);
      assert.ok(close(shown.annual.value, option.annual_cost), `${option.id} annual cost`);
      assert.equal(shown.annual.text, money(option.annual_cost));
    }
    const cautions = await page.$$eval('#verdict-cautions li', (items) => items.map((li) => li.textContent));
    assert.deepEqual(cautions, cli.cautions);
    assert.equal(await page.locator('#chart-cost svg').count(), 1);
    await page.waitForSelector('#chart-sweep svg');
    assert.ok(await page.locator('#chart-sweep circle.break-even').count() >= 1, 'break-even points are marked');
    await page.screenshot({ path: join(ARTIFACTS, 'chromium-portrait-verdict.png'), fullPage: true });
    assert.deepEqual(consoleErrors, []);
  });

  test('a tap on a number shows its trace and sources', { timeout: TIMEOUT }, async () => {
    await page.tap('#verdict-table tbody tr:first-child button.num[data-key="annual_cost"]');
    await page.waitForSelector('#trace-dialog[open] #trace-steps li');
    assert.ok(await page.locator('#trace-sources li').count() > 0);
    await page.tap('#trace-close');
    await page.waitForSelector('#trace-dialog:not([open])', { state: 'attached' });
  });

  test('the demo\'s costs over the years equal the CLI\'s economics', { timeout: TIMEOUT }, async () => {
    const cli = await cliEvaluate(await demoScenario());
    assert.deepEqual(cli.errors, []);
    assert.ok(cli.economics?.baseline, 'the demo has an existing system');
    const shown = await economicsRows();
    assert.deepEqual(Object.keys(shown), cli.ranking_life_cycle.map((r) => r.id), 'economics rows in the core\'s life-cycle order');
    for (const o of cli.options) {
      const row = shown[o.id];
      const expect = {
        net_installed_cost: o.net_installed_cost, annual_saving: o.annual_saving, simple_payback_years: o.simple_payback_years,
        discounted_payback_years: o.discounted_payback_years, npv: o.npv, life_cycle_cost: o.life_cycle_cost,
        lcoh: o.lcoh_per_mmbtu, co2e_saved_t: o.co2e_saved_kg_life === null ? null : o.co2e_saved_kg_life / 1000,
        cost_per_tonne_co2e_avoided: o.cost_per_tonne_co2e_avoided,
      };
      for (const [key, value] of Object.entries(expect)) {
        if (value === null || value === undefined) assert.equal(row[key].text, '—', `${o.id}.${key} is shown as a dash`);
        else assert.ok(close(row[key].value, value), `${o.id}.${key}: ${row[key].value} vs the CLI's ${value}`);
      }
    }
    // a payback the core cannot give: its reason, in the core's words, in the trace
    const noPayback = cli.options.find((o) => o.simple_payback_years === null && o.id !== cli.economics.baseline);
    if (noPayback) {
      await page.tap(`#economics-table tr[data-option="${noPayback.id}"] button.num[data-key="simple_payback_years"]`);
      await page.waitForSelector('#trace-dialog[open] #trace-reason');
      assert.ok((await page.textContent('#trace-reason')).includes(noPayback.simple_payback_reason));
      await page.tap('#trace-close');
    }
    // ranking by life-cycle cost follows the core's ranking_life_cycle
    await page.tap('[data-action="rank-by"][data-by="life"]');
    let order = await page.$$eval('#verdict-table tbody tr', (rows) => rows.map((r) => r.dataset.option));
    assert.deepEqual(order, cli.ranking_life_cycle.map((r) => r.id));
    await page.tap('[data-action="rank-by"][data-by="annual"]');
    order = await page.$$eval('#verdict-table tbody tr', (rows) => rows.map((r) => r.dataset.option));
    assert.deepEqual(order, cli.ranking.map((r) => r.id));
    await page.waitForTimeout(500);
    await analysed();
    await page.locator('#economics').screenshot({ path: join(ARTIFACTS, 'chromium-economics.png') });
    assert.deepEqual(consoleErrors, []);
  });

  test('the price chart is the core\'s sweep with its exact break-even points and statement', { timeout: TIMEOUT }, async () => {
    await analysed();
    const scenario = await demoScenario();
    const file = join(ARTIFACTS, 'demo-scenario.json');
    writeFileSync(file, JSON.stringify(scenario));
    const fuelIndex = Number(await page.inputValue('#sweep-fuel'));
    cliDemo ??= await cliEvaluate(scenario);
    const fuel = scenario.options.find((o) => o.id === cliDemo.ranking[0].id).fuel;
    const entryFuel = await page.evaluate(async (i) => (await import('./demo.js')).demoWorkspace().fuels[i].fuel, fuelIndex);
    assert.equal(entryFuel, fuel, 'the chart starts with the fuel of the cheapest option');
    const price = scenario.options.find((o) => o.fuel === fuel).price.amount;
    const { json: sweep } = await cliJson('sweep', file, '--vary', 'price', '--of', fuel, '--from', '0', '--to', String(2 * price), '--points', '41', '--basis', 'annual');
    assert.deepEqual(sweep.errors, []);
    const marks = await page.$$eval('#chart-sweep circle.break-even', (cs) => cs.map((c) => ({ value: Number(c.dataset.value), with: c.dataset.with })));
    assert.equal(marks.length, sweep.break_even.length, JSON.stringify(marks));
    for (const [i, b] of sweep.break_even.entries()) {
      assert.equal(marks[i].with, b.with);
      assert.ok(close(marks[i].value, b.value), `break-even with ${b.with}: ${marks[i].value} vs ${b.value}`);
    }
    assert.equal(await page.locator('#chart-sweep svg path').count(), sweep.series.length);
    const statement = await page.$eval('#break-even-statement', (p) => ({ text: p.textContent, a: p.dataset.a, b: p.dataset.b }));
    const { json: be } = await cliJson('break-even', file, '--a', statement.a, '--b', statement.b, '--vary', 'price', '--of', fuel, '--basis', 'annual');
    assert.equal(statement.text, be.break_even ? `${be.statement}.` : be.reason);
    // the tornado: the core's answer (at present the core refuses to vary a resistance heater's COP of 1)
    const { json: tornado } = await cliJson('tornado', file, '--basis', 'annual', '--change', '0.2');
    if (tornado.errors?.length) {
      assert.equal(await page.textContent('#tornado-unavailable'), `Not available for these entries: ${tornado.errors.map((e) => e.message).join('; ')}.`);
    } else {
      await checkTornado(tornado);
    }
    await page.locator('#sweep').screenshot({ path: join(ARTIFACTS, 'chromium-sweep.png') });
    assert.deepEqual(consoleErrors, []);
  });

  test('the what-if slider, dragged, ranks the options as the CLI\'s what-if does at that value', { timeout: TIMEOUT }, async () => {
    const scenario = await demoScenario();
    const file = join(ARTIFACTS, 'demo-scenario.json');
    writeFileSync(file, JSON.stringify(scenario));
    await page.locator('#what-if').scrollIntoViewIfNeeded();
    await page.selectOption('#what-if-input', 'price:electricity');
    const box = await page.locator('#what-if-range').boundingBox();
    const before = Number(await page.getAttribute('#what-if', 'data-paints'));
    // a finger's drag from a tenth to seven tenths of the way
    await page.mouse.move(box.x + box.width * 0.1, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.7, box.y + box.height / 2, { steps: 12 });
    await page.mouse.up();
    const value = await page.evaluate(async () => {
      const { valueAt, whatIfInputs } = await import('./what-if.js');
      const { toScenario } = await import('./scenario.js');
      const { demoWorkspace } = await import('./demo.js');
      const input = whatIfInputs(toScenario(demoWorkspace())).find((i) => i.key === 'price:electricity');
      return valueAt(input, Number(document.querySelector('#what-if-range').value));
    });
    const { json: cli } = await cliJson('what-if', file, '--vary', 'price', '--of', 'electricity', '--value', String(value));
    assert.deepEqual(cli.errors, []);
    await page.waitForFunction((want) => [...document.querySelectorAll('#what-if-ranking li')].map((li) => li.dataset.option).join() === want,
      cli.ranking.map((r) => r.id).join());
    assert.ok(Number(await page.getAttribute('#what-if', 'data-paints')) > before + 1, 'the card repainted during the drag');
    const costs = await page.$$eval('#what-if-ranking li .cost', (cells) => cells.map((c) => c.textContent));
    for (const [i, r] of cli.ranking.entries()) assert.ok(costs[i].startsWith(`${money(r.cost)} a year`), `${costs[i]} vs ${money(r.cost)}`);
    // the quote is unchanged: the verdict's table still shows today's ranking
    const cliToday = cliDemo ?? await cliEvaluate(scenario);
    assert.equal(await page.textContent('#best-option'), cliToday.options.find((o) => o.id === cliToday.ranking[0].id).label);
    await page.tap('#what-if-reset');
    await page.locator('#what-if').screenshot({ path: join(ARTIFACTS, 'chromium-what-if.png') });
  });

  test('the heat pump\'s bins show load, capacity, COP and the backup', { timeout: TIMEOUT }, async () => {
    const cli = cliDemo ?? await cliEvaluate(await demoScenario());
    const hp = cli.options.find((o) => Array.isArray(o.bins));
    assert.ok(hp, 'the demo has a heat pump on bins');
    // the verdict is lean: the chart is drawn from the option's account when its disclosure opens
    assert.equal(await page.locator(`#bins-${hp.id} svg`).count(), 0);
    await page.tap(`#bins-chart-${hp.id} summary`);
    await page.waitForSelector(`#bins-${hp.id} svg path.capacity`);
    const backupBins = hp.bins.filter((b) => b.hours >= 1 && b.load_kw > 0 && b.backup_heat_kwh > 0).length;
    assert.equal(await page.locator(`#bins-${hp.id} svg rect.backup`).count(), backupBins);
    const cop = Number(await page.getAttribute(`#bins-${hp.id} button[data-trace="bins"][data-value]`, 'data-value'));
    assert.ok(close(cop, hp.seasonal_cop));
    await page.tap(`#bins-${hp.id} button.quiet[data-trace="bins"]`);
    await page.waitForSelector('#trace-dialog[open] #bins-table tbody tr');
    assert.equal(await page.locator('#bins-table tbody tr').count(), hp.bins.filter((b) => b.hours >= 1 && b.load_kw > 0).length);
    await page.tap('#trace-close');
    await page.locator(`#bins-${hp.id}`).screenshot({ path: join(ARTIFACTS, 'chromium-bins.png') });
  });

  test('the price draws show their progress, can be cancelled, and match the CLI for the same seed', { timeout: 60_000 }, async () => {
    await tab('fuels');
    await page.tap('label[for="f-uncertainty-enabled"]');
    await page.waitForSelector('#f-uncertainty-draws');
    await typeInto('#f-uncertainty-draws', '200000');
    await typeInto('#f-uncertainty-seed', '42');
    await typeInto('#f-fuels-0-spread', '25');
    await tab('verdict');
    // a long run: progress moves, then Cancel stops it (the worker is replaced: this server does not isolate the page)
    // 200,000 draws of the demo take about a second: the progress is read and Cancel pressed in the
    // page itself, in the frame where the progress first moves, so the run cannot end in between.
    const running = await page.evaluate(() => new Promise((resolve, reject) => {
      const until = performance.now() + 20_000;
      const look = () => {
        const bar = document.querySelector('#mc-progress');
        if (document.querySelector('#uncertainty')?.dataset.state === 'running' && Number(bar?.getAttribute('aria-valuenow')) > 0) {
          const seen = { visible: bar.getClientRects().length > 0 && !bar.closest('[hidden]'), status: document.querySelector('#mc-status').textContent };
          document.querySelector('#mc-cancel').click();
          resolve(seen);
        } else if (performance.now() > until) {
          reject(new Error('the draws never showed progress'));
        } else {
          requestAnimationFrame(look);
        }
      };
      look();
    }));
    const startedCancel = Date.now();
    assert.ok(running.visible, 'the progress bar shows while the draws run');
    assert.match(running.status, /Drawing prices… \d+%/);
    await page.waitForFunction(() => document.querySelector('#uncertainty')?.dataset.state === 'cancelled', null, { timeout: 3000 });
    assert.ok(Date.now() - startedCancel < 3000);
    assert.equal(await page.textContent('#mc-status'), 'Cancelled.');
    assert.ok(await page.isHidden('#mc-progress'));
    assert.ok(await page.isVisible('#mc-run'));
    // the verdict is not held up by the draws, and keeps working after the cancel
    await tab('fuels');
    await typeInto('#f-fuels-0-price-amount', '3.9');
    await tab('verdict');
    await settled();
    await tab('fuels');
    await typeInto('#f-fuels-0-price-amount', '3.8');
    // a run that ends: the same seed gives the CLI's probabilities exactly
    await typeInto('#f-uncertainty-draws', '3000');
    await tab('verdict');
    await settled();
    await page.waitForFunction(() => document.querySelector('#uncertainty')?.dataset.state === 'done', null, { timeout: 30_000 });
    assert.ok(Number(await page.getAttribute('#verdict-body', 'data-draw-progress')) > 0.5, 'progress was reported');
    const expected = await page.evaluate(async () => {
      const { toScenario } = await import('./scenario.js');
      const ws = (await import('./demo.js')).demoWorkspace();
      ws.uncertainty = { ...ws.uncertainty, enabled: true, draws: 3000, seed: 42 };
      ws.fuels[0].spread = 0.25;
      return toScenario(ws);
    });
    assert.deepEqual(expected.uncertainty, { draws: 3000, seed: 42, form: 'lognormal', spread: { 'heating-oil-2': 0.25 } });
    const cli = await cliEvaluate(expected);
    assert.deepEqual(cli.errors, []);
    const shown = await page.$$eval('#uncertainty-table button[data-key="p_cheapest"]', (bs) => Object.fromEntries(bs.map((b) => [b.dataset.option, Number(b.dataset.value)])));
    for (const o of cli.uncertainty.options) {
      assert.equal(shown[o.id], o.p_cheapest, `${o.id}: P(cheapest) ${shown[o.id]} vs the CLI's ${o.p_cheapest}`);
    }
    const p90 = Number(await page.getAttribute(`#uncertainty-table button[data-key="annual_cost_p90"][data-option="${cli.uncertainty.options[0].id}"]`, 'data-value'));
    assert.ok(close(p90, cli.uncertainty.options[0].annual_cost_p90));
    assert.match(await page.textContent('#mc-status'), /^3,000 draws, seed 42/);
    await page.tap(`#uncertainty-table button[data-key="p_cheapest"][data-option="${cli.uncertainty.options[0].id}"]`);
    await page.waitForSelector('#trace-dialog[open] #trace-steps li');
    assert.ok((await page.textContent('#trace-steps')).includes(cli.uncertainty.notes[0]));
    await page.tap('#trace-close');
    await page.locator('#uncertainty').screenshot({ path: join(ARTIFACTS, 'chromium-draws.png') });
    // a bad number of draws is shown next to its field
    await tab('fuels');
    await typeInto('#f-uncertainty-draws', '5');
    await page.waitForFunction(() => !document.querySelector('[data-field="/uncertainty/draws"] .field-msg').hidden, null, { timeout: 10_000 });
    await typeInto('#f-uncertainty-draws', '3000');
    await page.tap('label[for="f-uncertainty-enabled"]');
    await tab('verdict');
    await settled();
    assert.equal(await page.locator('#uncertainty').count(), 0);
    assert.deepEqual(consoleErrors, []);
  });

  test('a scenario typed in gives the CLI\'s numbers', { timeout: TIMEOUT }, async () => {
    await tab('saved');
    await page.tap('[data-action="new-quote"]');
    await page.waitForSelector('#f-quote-customer');
    await typeInto('#f-quote-customer', TYPED.customer);
    await typeInto('#f-quote-site', TYPED.site);
    await typeInto('#f-demand-annual-useful-heat-value', TYPED.heat);
    await tab('fuels');
    await page.selectOption('#add-fuel-choice', 'natural-gas');
    await page.tap('[data-action="add-fuel"]');
    await typeInto('#f-fuels-0-price-amount', TYPED.gasPrice);
    await page.tap('[data-action="add-charge"]');
    await typeInto('#f-fuels-0-fixed-charges-0-label', 'Customer charge');
    await typeInto('#f-fuels-0-fixed-charges-0-amount-per-month', TYPED.gasCharge);
    await page.selectOption('#add-fuel-choice', 'electricity');
    await page.tap('[data-action="add-fuel"]');
    await typeInto('#f-fuels-1-price-amount', TYPED.electricityPrice);
    await tab('systems');
    await page.selectOption('#add-system-kind', 'furnace');
    await page.tap('[data-action="add-system"]');
    await page.selectOption('#f-systems-0-system-catalog', 'gas-furnace-condensing');
    await typeInto('#f-systems-0-system-efficiency-value', TYPED.furnaceAfue);
    await page.selectOption('#add-system-kind', 'air-source-heat-pump');
    await page.tap('[data-action="add-system"]');
    await typeInto('#f-systems-1-system-efficiency-value', TYPED.heatPumpHspf2);
    await tab('verdict');
    await settled();

    const expected = typedScenario();
    const cli = await cliEvaluate(expected);
    assert.deepEqual(cli.errors, []);
    for (const option of cli.options) {
      const shown = await row(option.id);
      assert.ok(shown, `row for ${option.id}`);
      assert.ok(close(shown.annual.value, option.annual_cost), `${option.id} annual ${shown.annual.value} vs ${option.annual_cost}`);
      assert.equal(shown.annual.text, money(option.annual_cost));
      assert.ok(close(shown.perUseful.value, option.cost_per_useful_mmbtu), `${option.id} per MMBtu`);
      assert.ok(close(shown.fuel.value, option.fuel_quantity.value), `${option.id} fuel quantity`);
      assert.ok(close(shown.co2e.value, option.co2e_kg / LB_KG), `${option.id} CO2e in lb`);
    }
    const order = await page.$$eval('#verdict-table tbody tr', (rows) => rows.map((r) => r.dataset.option));
    assert.deepEqual(order, cli.ranking.map((r) => r.id));
    assert.equal(await page.textContent('#useful-heat'), '80 MMBtu a year');
    assert.deepEqual(consoleErrors, []);
  });

  test('switching units converts the numbers; currency and locale reformat them', { timeout: TIMEOUT }, async () => {
    const cli = await cliEvaluate(typedScenario());
    const gas = cli.options[0];
    await page.tap('label[for="units-metric"]');
    await settled();
    let shown = await row(gas.id);
    assert.ok(shown.header.includes('Energy per kWh of heat'), shown.header.join('|'));
    assert.ok(close(shown.perUseful.value, gas.cost_per_useful_kwh), 'cost per useful kWh');
    assert.ok(close(shown.co2e.value, gas.co2e_kg), 'CO2e in kg');
    assert.ok(close(shown.annual.value, gas.annual_cost), 'annual cost unchanged');
    assert.equal(await page.textContent('#useful-heat'), `${new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 }).format(80 * MMBTU_KWH)} kWh a year`);
    await tab('house');
    assert.equal(await page.inputValue('#f-demand-annual-useful-heat-value'), '23445.7');
    assert.equal(await page.inputValue('#f-demand-annual-useful-heat-unit'), 'kWh');

    await page.selectOption('#energy-unit', 'GJ');
    await settled();
    shown = await row(gas.id);
    assert.ok(close(shown.perUseful.value, gas.cost_per_useful_gj), 'cost per useful GJ');

    await typeInto('#currency', 'EUR');
    await settled();
    shown = await row(gas.id);
    assert.equal(shown.annual.text, money(gas.annual_cost, 'EUR'));
    assert.ok(close(shown.annual.value, gas.annual_cost), 'no exchange rate is applied');

    await page.selectOption('#locale', 'de-DE');
    await settled();
    shown = await row(gas.id);
    assert.equal(shown.annual.text, money(gas.annual_cost, 'EUR', 'de-DE'));
    await tab('fuels');
    assert.equal(await page.inputValue('#f-fuels-0-price-amount'), '1,25');
    await typeInto('#f-fuels-0-price-amount', '1,30');
    await tab('verdict');
    await settled();
    const dearer = await cliEvaluate(typedScenario({ gasPrice: 1.3, units: 'metric', currency: 'EUR' }));
    shown = await row(gas.id);
    assert.ok(close(shown.annual.value, dearer.options[0].annual_cost), `typed with a decimal comma: ${shown.annual.value}`);

    // back to the first settings: US units restore the entered 80 MMBtu
    await tab('fuels');
    await typeInto('#f-fuels-0-price-amount', '1,25');
    await page.selectOption('#locale', 'en-US');
    await typeInto('#currency', 'USD');
    await page.tap('label[for="units-us"]');
    await settled();
    await tab('house');
    assert.equal(await page.inputValue('#f-demand-annual-useful-heat-value'), '80');
    assert.equal(await page.inputValue('#f-demand-annual-useful-heat-unit'), 'MMBtu');
    assert.deepEqual(consoleErrors, []);
  });

  test('export then import gives the same scenario and verdict', { timeout: TIMEOUT }, async () => {
    await tab('saved');
    const [download] = await Promise.all([page.waitForEvent('download'), page.tap('[data-action="export-json"]')]);
    const file = join(ARTIFACTS, 'exported-quote.json');
    await download.saveAs(file);
    const exported = JSON.parse(readFileSync(file, 'utf8'));
    // the scenario as typed, and the verdict it answers as a summary for other programs
    const { results, ...scenario } = exported;
    assert.deepEqual(scenario, typedScenario());
    const answer = await cliEvaluate(scenario);
    assert.deepEqual(results.ranking.map((r) => r.id), answer.ranking.map((r) => r.id));
    assert.ok(close(results.ranking[0].annual_cost, answer.options.find((o) => o.id === answer.ranking[0].id).annual_cost));
    assert.deepEqual(await importAndWait(page, file), { ok: true, text: 'Imported “exported-quote.json”.' });
    await settled();
    const [again] = await Promise.all([page.waitForEvent('download'), page.tap('[data-action="export-json"]')]);
    const file2 = join(ARTIFACTS, 'reexported-quote.json');
    await again.saveAs(file2);
    assert.deepEqual(JSON.parse(readFileSync(file2, 'utf8')), exported);
    const cli = await cliEvaluate(scenario);
    const shown = await row(cli.options[0].id);
    assert.ok(close(shown.annual.value, cli.options[0].annual_cost));
    const [csv] = await Promise.all([page.waitForEvent('download'), (async () => { await tab('verdict'); await page.tap('[data-action="export-csv"]'); })()]);
    const csvFile = join(ARTIFACTS, 'results.csv');
    await csv.saveAs(csvFile);
    // the quote's rows, a blank line, the table; money in whole units as the verdict shows it
    const lines = readFileSync(csvFile, 'utf8').trim().split(/\r\n/);
    const head = lines.indexOf('');
    assert.equal(lines[head + 1].split(',')[0], 'rank');
    assert.ok(lines.slice(0, head).some((l) => l.startsWith('customer,')), lines.slice(0, head).join(' | '));
    assert.equal(lines.length, head + 2 + cli.options.length);
    assert.ok(lines[head + 2].includes(`,${Math.round(cli.ranking[0].annual_cost)},`), lines[head + 2]);
    // a file that is not a scenario is refused with a message
    const bad = join(ARTIFACTS, 'not-a-scenario.json');
    writeFileSync(bad, JSON.stringify({ schema: 'something-else' }));
    await tab('saved');
    const refused = await importAndWait(page, bad);
    assert.equal(refused.ok, false);
    assert.match(refused.text, /^Could not import “not-a-scenario\.json”: .*not a Fuelwright scenario/);
  });

  test('saved quotes survive a reload and can be found, duplicated, deleted and restored', { timeout: TIMEOUT }, async () => {
    await page.reload();
    await settled();
    await tab('house');
    assert.equal(await page.inputValue('#f-quote-customer'), TYPED.customer);
    await tab('saved');
    const customers = await page.$$eval('#quote-list .q-customer', (items) => items.map((i) => i.textContent));
    assert.ok(customers.includes(TYPED.customer), customers.join(' | '));
    assert.ok(customers.length >= 3, 'demo, typed and imported quotes are listed');
    await typeInto('#quote-search', 'juniper');
    await page.waitForFunction(() => document.querySelectorAll('#quote-list li').length === 2);
    await typeInto('#quote-search', 'no such customer');
    await page.waitForSelector('#quote-empty');
    await typeInto('#quote-search', new Date().getFullYear().toString());
    assert.ok(await page.locator('#quote-list li').count() >= 2);
    await page.fill('#quote-search', '');
    await page.locator('#quote-search').dispatchEvent('input');
    const before = await page.locator('#quote-list li').count();
    await page.tap('#quote-list li:not(.current) [data-action="duplicate-quote"]');
    await page.waitForFunction((n) => document.querySelectorAll('#quote-list li').length === n + 1, before);
    await page.tap('#quote-list li.current [data-action="delete-quote"]');
    await page.waitForSelector('#undo-toast');
    assert.equal(await page.locator('#quote-list li').count(), before);
    await page.tap('[data-action="undo-delete"]');
    await page.waitForFunction((n) => document.querySelectorAll('#quote-list li').length === n + 1, before);
    assert.deepEqual(consoleErrors, []);
  });

  test('user text is shown literally and never runs', { timeout: TIMEOUT }, async () => {
    const literal = await page.$$eval('#quote-list .q-customer', (items, text) => items.some((i) => i.textContent === text), TYPED.customer);
    assert.ok(literal);
    assert.equal(await page.locator('#quote-list img, #quote-sheet img, main img').count(), 0);
    assert.deepEqual(dialogs, []);
  });

  test('errors of the core appear next to the fields they point at', { timeout: TIMEOUT }, async () => {
    await tab('saved');
    await page.tap('[data-action="load-demo"]');
    await settled();
    await tab('fuels');
    await typeInto('#f-fuels-0-price-amount', '-3');
    await settled('errors');
    const message = await page.textContent('[data-field="/fuels/0/price/amount"] .field-msg');
    assert.ok(message.length > 0, 'a message next to the price');
    assert.equal(await page.getAttribute('#f-fuels-0-price-amount', 'aria-invalid'), 'true');
    assert.ok(await page.locator('#tab-fuels .count').count() === 1, 'the tab shows a count');
    await typeInto('#f-fuels-0-price-amount', 'abc');
    await page.waitForFunction(() => document.querySelector('[data-field="/fuels/0/price/amount"] .field-msg').textContent.includes('Not a number'));
    await typeInto('#f-fuels-0-price-amount', '3.80');
    await settled();

    await tab('house');
    await page.tap('label[for="f-demand-method-heat-loss"]');
    await typeInto('#f-demand-ua-value', '250');
    await typeInto('#f-demand-balance-point-value', '60');
    await page.waitForFunction(() => ['done', 'errors'].includes(document.querySelector('#verdict-body').dataset.state)
      && document.querySelector('#progress').hidden);
    await page.waitForTimeout(300);
    const state = await page.getAttribute('#verdict-body', 'data-state');
    if (state === 'errors') {
      const messages = await page.$$eval('#panel-house .field-msg:not([hidden])', (items) => items.map((i) => i.textContent));
      assert.ok(messages.length > 0, 'heat-loss errors are shown next to the house fields');
    }
    await page.tap('label[for="f-demand-method-direct"]');
    await settled();
    assert.deepEqual(consoleErrors, []);
  });

  test('the print layout shows the quote sheet with the cautions', { timeout: TIMEOUT }, async () => {
    await page.emulateMedia({ media: 'print' });
    try {
      const shot = join(ARTIFACTS, 'chromium-print-portrait.png');
      await page.screenshot({ path: shot, fullPage: true });
      assert.ok(await page.isVisible('#quote-sheet'));
      assert.ok(await page.isHidden('#panel-verdict'));
      const cautions = await page.$$eval('#sheet-cautions li', (items) => items.map((li) => li.textContent));
      const cli = await cliEvaluate(await page.evaluate(async () => (await import('./scenario.js')).toScenario(
        (await import('./demo.js')).demoWorkspace())));
      assert.deepEqual(cautions, cli.cautions);
      assert.ok(cautions.every((c) => c.length > 0));
      assert.equal(await page.textContent('#sheet-customer'), 'Pat and Robin Example (invented)');
      // The sheet repeats the verdict's break-even statement once the charts' analyses are in.
      await page.waitForSelector('#break-even-statement', { state: 'attached' });
      const statement = await page.textContent('#break-even-statement');
      const sheetLines = await page.$$eval('#sheet-sensitivity li', (items) => items.map((li) => li.textContent));
      assert.ok(statement.length > 20);
      assert.equal(sheetLines[0], statement);
      assert.equal(await page.locator('#quote-sheet .sheet-chart svg').count(), 1);
    } finally {
      await page.emulateMedia({ media: 'screen' });
    }
  });

  test('reloads offline from the service worker', { timeout: TIMEOUT }, async () => {
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
      if (!navigator.serviceWorker.controller) {
        await new Promise((done) => navigator.serviceWorker.addEventListener('controllerchange', done, { once: true }));
      }
    });
    await context.setOffline(true);
    try {
      const response = await page.reload();
      assert.equal(response.fromServiceWorker(), true);
      await settled();
      assert.ok(await page.locator('#verdict-table tbody tr').count() > 0);
    } finally {
      await context.setOffline(false);
    }
    assert.deepEqual(consoleErrors, []);
  });
  test('a file picked while the saved list repaints is still imported', { timeout: TIMEOUT }, async () => {
    const file = join(root, 'data/examples/maple-hollow-heat-pump-bins.json');
    await tab('saved');
    // the input that opened the picker; a search typed meanwhile repaints the list around it
    const picker = await page.$('#import-file');
    await page.fill('#quote-search', 'no such customer');
    await page.waitForSelector('#quote-empty');
    await page.fill('#quote-search', '');
    await page.waitForSelector('#quote-list');
    assert.deepEqual(await importAndWait(page, file, picker), { ok: true, text: 'Imported “maple-hollow-heat-pump-bins.json”.' });
    await settled();
    const { json: cli } = await cliJson('evaluate', file);
    const shown = await page.$$eval('#verdict-table tbody tr', (rows) => rows.map((r) => r.dataset.option));
    assert.deepEqual(shown.sort(), cli.options.map((o) => o.id).sort(), 'the verdict is the imported file\'s');
    assert.deepEqual(consoleErrors, []);
  });

  test('bills are drawn against degree-days with the fitted line', { timeout: TIMEOUT }, async () => {
    const file = join(root, 'data/examples/fjordvik-oil-bills.json');
    const { json: cli } = await cliJson('evaluate', file);
    await tab('saved');
    assert.equal((await importAndWait(page, file)).ok, true);
    await tab('verdict');
    await settled();
    await page.waitForSelector('#chart-bills svg line.fit');
    assert.equal(await page.locator('#chart-bills circle.bill').count(), cli.demand.fit.points.length);
    const values = await page.$$eval('#chart-bills button[data-trace="bills"]', (bs) => bs.map((b) => Number(b.dataset.value)));
    assert.ok(close(values[0], cli.demand.fit.base_per_day) && close(values[1], cli.demand.fit.slope), values.join(' '));
    await page.tap('#chart-bills button[data-trace="bills"]');
    await page.waitForSelector('#trace-dialog[open] #trace-steps li');
    assert.ok((await page.textContent('#trace-steps')).includes('PRISM'));
    await page.tap('#trace-close');
    await page.locator('#chart-bills').screenshot({ path: join(ARTIFACTS, 'chromium-bills.png') });
    assert.deepEqual(consoleErrors, []);
  });

  test('the tornado of the bins example is the core\'s', { timeout: TIMEOUT }, async () => {
    const file = join(root, 'data/examples/maple-hollow-heat-pump-bins.json');
    await tab('saved');
    assert.equal((await importAndWait(page, file)).ok, true);
    await tab('verdict');
    await settled();
    await analysed();
    const doc = JSON.parse(readFileSync(file, 'utf8'));
    delete doc.uncertainty;
    const plain = join(ARTIFACTS, 'bins-without-draws.json');
    writeFileSync(plain, JSON.stringify(doc));
    const { json: tornado } = await cliJson('tornado', plain, '--basis', 'annual', '--change', '0.2');
    assert.deepEqual(tornado.errors, []);
    await checkTornado(tornado);
    await page.locator('#chart-tornado').screenshot({ path: join(ARTIFACTS, 'chromium-tornado.png') });
    assert.deepEqual(consoleErrors, []);
  });

  test('an edit is kept when the page is left before the autosave would have run', { timeout: TIMEOUT }, async () => {
    await tab('house');
    await typeInto('#f-quote-customer', 'Left in a hurry (invented)');
    await page.reload();  // at once: well inside the autosave's wait after the last key
    await settled();
    await tab('house');
    assert.equal(await page.inputValue('#f-quote-customer'), 'Left in a hurry (invented)');
    // written to the quote storage on the way back in: the copy kept on leaving is gone
    await page.waitForFunction(() => localStorage.getItem('fuelwright.unsaved-quote') === null);
    await tab('saved');
    assert.equal(await page.textContent('#quote-list li.current .q-customer'), 'Left in a hurry (invented)');
    assert.deepEqual(consoleErrors, []);
  });
});

describe('Chromium, tablet landscape 1180x820', () => {
  test('shows the inputs and the verdict side by side', { timeout: TIMEOUT }, async () => {
    await page.setViewportSize({ width: 1180, height: 820 });
    await tab('fuels');
    assert.ok(await page.isVisible('#panel-fuels'));
    assert.ok(await page.isVisible('#panel-verdict'));
    assert.ok(await page.isHidden('#tab-verdict'));
    await page.screenshot({ path: join(ARTIFACTS, 'chromium-landscape.png') });
    const small = await page.$$eval('button, [role="tab"], input[type="text"], select',
      (nodes) => nodes.filter((n) => n.offsetParent !== null).map((n) => [n.id || n.textContent.trim().slice(0, 20), n.getBoundingClientRect().height])
        .filter(([, height]) => height < 43.5));
    assert.deepEqual(small, [], 'touch targets are at least 44 px high');
    assert.deepEqual(consoleErrors, []);
  });
});
