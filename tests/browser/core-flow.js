// The core flow every engine runs (WebKit and Firefox through small drivers,
// Chromium has its own fuller test): load and show the demo verdict, its costs
// over the years and a price Monte Carlo against the native CLI, enter a
// scenario, check the verdict numbers against the CLI, save and reload, and
// reload offline from the service worker.
//
// A driver offers: go(url), js(expression) -> JSON-able value (the expression
// may be async), click(css), type(css, text), select(css, value), screenshot(path).
import assert from 'node:assert/strict';

import { TYPED, cliEvaluate, close, money, typedScenario } from './scenario-fixture.js';

const sleep = (ms) => new Promise((done) => setTimeout(done, ms));

/** Polls `expression` in the page until it is truthy. */
export async function waitFor(driver, expression, { timeout = 15_000, what = expression } = {}) {
  const end = Date.now() + timeout;
  let last;
  while (Date.now() < end) {
    try {
      last = await driver.js(expression);
      if (last) return last;
    } catch (error) {
      last = error.message;
    }
    await sleep(100);
  }
  throw new Error(`timed out waiting for ${what} (last: ${JSON.stringify(last)})`);
}

/** Waits until the verdict shows the result of the latest edit. */
export async function settled(driver, state = 'done') {
  const expr = `(() => { const b = document.querySelector('#verdict-body'); return !!b && b.dataset.state === ${JSON.stringify(state)} && document.querySelector('#progress').hidden; })()`;
  await waitFor(driver, expr, { what: `verdict ${state}` });
  await sleep(300);
  await waitFor(driver, expr, { what: `verdict ${state}` });
}

const ROWS = `(() => Object.fromEntries([...document.querySelectorAll('#verdict-table tbody tr')].map((tr) => [tr.dataset.option, {
  annual: Number(tr.querySelector('[data-key="annual_cost"]').dataset.value),
  annualText: tr.querySelector('[data-key="annual_cost"]').textContent,
  perUseful: Number(tr.querySelector('[data-key="cost_per_useful"]').dataset.value),
  fuel: Number(tr.querySelector('[data-key="fuel_quantity"]').dataset.value) }])))()`;

const ECONOMICS = `(() => Object.fromEntries([...document.querySelectorAll('#economics-table tbody tr')].map((tr) => [tr.dataset.option,
  Object.fromEntries([...tr.querySelectorAll('button.num')].map((b) => [b.dataset.key, { value: Number(b.dataset.value), text: b.textContent }]))])))()`;

export async function checkAgainstCli(driver, scenario) {
  const cli = await cliEvaluate(scenario);
  assert.deepEqual(cli.errors, []);
  const rows = await driver.js(ROWS);
  for (const option of cli.options) {
    const shown = rows[option.id];
    assert.ok(shown, `row for ${option.id}`);
    assert.ok(close(shown.annual, option.annual_cost), `${option.id}: ${shown.annual} vs ${option.annual_cost}`);
    assert.equal(shown.annualText, money(option.annual_cost));
    assert.ok(close(shown.perUseful, option.cost_per_useful_mmbtu), `${option.id} per MMBtu`);
    assert.ok(close(shown.fuel, option.fuel_quantity.value), `${option.id} fuel`);
  }
  return cli;
}

/** The steps, as [name, fn(driver, env)] for the engine's test file to register. */
export const CORE_FLOW = [
  ['loads and shows the demo verdict equal to the CLI', async (driver, env) => {
    await driver.go(env.url);
    await settled(driver);
    const scenario = await driver.js(`(async () => (await import('./scenario.js')).toScenario((await import('./demo.js')).demoWorkspace()))()`);
    await checkAgainstCli(driver, scenario);
    const cautions = await driver.js(`[...document.querySelectorAll('#verdict-cautions li')].map((li) => li.textContent)`);
    assert.ok(cautions.length > 0, 'cautions are shown with the verdict');
    if (env.shots) await driver.screenshot(env.shot('demo'));
  }],
  ['the demo\'s costs over the years and its price draws equal the CLI', async (driver, env) => {
    const scenario = await driver.js(`(async () => (await import('./scenario.js')).toScenario((await import('./demo.js')).demoWorkspace()))()`);
    const cli = await cliEvaluate(scenario);
    const rows = await driver.js(ECONOMICS);
    assert.deepEqual(Object.keys(rows), cli.ranking_life_cycle.map((r) => r.id), 'rows in the core\'s life-cycle order');
    for (const o of cli.options) {
      for (const key of ['npv', 'life_cycle_cost', 'simple_payback_years', 'annual_saving']) {
        const shown = rows[o.id][key];
        if (o[key] === null) assert.equal(shown.text, '—', `${o.id}.${key}`);
        else assert.ok(close(shown.value, o[key]), `${o.id}.${key}: ${shown.value} vs ${o[key]}`);
      }
    }
    await driver.click('#tab-fuels');
    // (centred first: at the foot of the window the summary bar would cover it)
    await driver.js(`document.querySelector('#f-uncertainty-enabled').scrollIntoView({ block: 'center' })`);
    await driver.click('#f-uncertainty-enabled');
    await waitFor(driver, `!!document.querySelector('#f-uncertainty-draws')`);
    await driver.type('#f-uncertainty-draws', '2000');
    await driver.type('#f-uncertainty-seed', '7');
    await driver.click('#tab-verdict');
    await waitFor(driver, `document.querySelector('#uncertainty')?.dataset.state === 'done'`, { timeout: 25_000, what: 'the price draws' });
    assert.ok(await driver.js(`Number(document.querySelector('#verdict-body').dataset.drawProgress) > 0`), 'progress was reported');
    const expected = await driver.js(`(async () => { const ws = (await import('./demo.js')).demoWorkspace();
      ws.uncertainty = { ...ws.uncertainty, enabled: true, draws: 2000, seed: 7 };
      return (await import('./scenario.js')).toScenario(ws); })()`);
    const drawn = await cliEvaluate(expected);
    assert.deepEqual(drawn.errors, []);
    const shown = await driver.js(`Object.fromEntries([...document.querySelectorAll('#uncertainty-table button[data-key="p_cheapest"]')].map((b) => [b.dataset.option, Number(b.dataset.value)]))`);
    for (const o of drawn.uncertainty.options) assert.equal(shown[o.id], o.p_cheapest, `${o.id}: P(cheapest)`);
    if (env.shots) await driver.screenshot(env.shot('draws'));
    await driver.click('#tab-fuels');
    await driver.js(`document.querySelector('#f-uncertainty-enabled').scrollIntoView({ block: 'center' })`);
    await driver.click('#f-uncertainty-enabled');
    await waitFor(driver, `!document.querySelector('#f-uncertainty-draws')`);
    await driver.click('#tab-verdict');
    await settled(driver);
  }],
  ['a scenario entered in the page gives the CLI\'s numbers', async (driver) => {
    await driver.click('#tab-saved');
    await driver.click('[data-action="new-quote"]');
    await waitFor(driver, `document.querySelector('#panel-house').classList.contains('active') && document.querySelector('#verdict-body').dataset.state === 'empty'`);
    await driver.type('#f-quote-customer', TYPED.customer);
    await driver.type('#f-quote-site', TYPED.site);
    await driver.type('#f-demand-annual-useful-heat-value', TYPED.heat);
    await driver.click('#tab-fuels');
    await driver.select('#add-fuel-choice', 'natural-gas');
    await driver.click('[data-action="add-fuel"]');
    await driver.type('#f-fuels-0-price-amount', TYPED.gasPrice);
    await driver.click('[data-action="add-charge"]');
    await driver.type('#f-fuels-0-fixed-charges-0-label', 'Customer charge');
    await driver.type('#f-fuels-0-fixed-charges-0-amount-per-month', TYPED.gasCharge);
    await driver.select('#add-fuel-choice', 'electricity');
    await driver.click('[data-action="add-fuel"]');
    await driver.type('#f-fuels-1-price-amount', TYPED.electricityPrice);
    await driver.click('#tab-systems');
    await driver.select('#add-system-kind', 'furnace');
    await driver.click('[data-action="add-system"]');
    await driver.select('#f-systems-0-system-catalog', 'gas-furnace-condensing');
    await driver.type('#f-systems-0-system-efficiency-value', TYPED.furnaceAfue);
    await driver.select('#add-system-kind', 'air-source-heat-pump');
    await driver.click('[data-action="add-system"]');
    await driver.type('#f-systems-1-system-efficiency-value', TYPED.heatPumpHspf2);
    await driver.click('#tab-verdict');
    await settled(driver);
    assert.equal(await driver.js(`document.querySelector('#f-quote-customer').value`), TYPED.customer);
    await checkAgainstCli(driver, typedScenario());
  }],
  ['the quote is saved and found again after a reload', async (driver, env) => {
    await waitFor(driver, `!!document.body.dataset.saved`);
    await sleep(600);  // past the autosave debounce
    await driver.go(env.url);
    await settled(driver);
    assert.equal(await driver.js(`document.querySelector('#f-quote-customer').value`), TYPED.customer);
    await driver.click('#tab-saved');
    const customers = await driver.js(`[...document.querySelectorAll('#quote-list .q-customer')].map((n) => n.textContent)`);
    assert.ok(customers.includes(TYPED.customer), customers.join(' | '));
    assert.equal(await driver.js(`document.querySelectorAll('main img').length`), 0, 'user text is not parsed as HTML');
    await checkAgainstCli(driver, typedScenario());
  }],
  ['reloads offline from the service worker', async (driver, env) => {
    await waitFor(driver, `(async () => { const r = await navigator.serviceWorker.ready; return !!r.active && !!navigator.serviceWorker.controller; })()`,
      { what: 'an active, controlling service worker' });
    await env.goOffline();
    await driver.go(env.url);
    await settled(driver);
    await checkAgainstCli(driver, typedScenario());
    if (env.shots) await driver.screenshot(env.shot('offline'));
  }],
];
