// The assembled site in headless Chromium (playwright-core driving the
// system's /usr/bin/chromium) at a touch tablet viewport: the example result,
// the formula form against the native CLI's numbers, errors as text, offline.
import assert from 'node:assert/strict';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { chromium } from 'playwright-core';

import { cli, cliJson, siteDir } from '../node/helpers.js';
import { serve } from './server.js';

const TIMEOUT = 30_000;
const CHROMIUM = process.env.FUELWRIGHT_CHROMIUM ?? '/usr/bin/chromium';
const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/** The page's number format (web/view.js): six significant digits. */
const formatNumber = (value) => String(Number(value.toPrecision(6)));

let server;
let profile;
let context;
let page;
const consoleErrors = [];

before(async () => {
  server = await serve(siteDir);
  profile = mkdtempSync(join(tmpdir(), 'fuelwright-chromium-'));
  context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: { width: 820, height: 1180 },
    hasTouch: true,
    isMobile: true,
    deviceScaleFactor: 2,
    timeout: TIMEOUT,
  });
  context.setDefaultTimeout(TIMEOUT);
  page = context.pages()[0] ?? await context.newPage();
  page.on('console', (message) => {
    if (message.type() === 'error') consoleErrors.push(message.text());
  });
  page.on('pageerror', (error) => consoleErrors.push(String(error)));
}, { timeout: TIMEOUT });

after(async () => {
  await context?.close();
  await server?.close();
  if (profile) rmSync(profile, { recursive: true, force: true });
}, { timeout: TIMEOUT });

async function hhvCell(container) {
  const cell = page.locator(`${container} tr[data-row="hhv"] td[data-key="hhv_kj_per_mol"]`);
  return { text: (await cell.textContent()).trim(), value: Number(await cell.getAttribute('data-value')) };
}

describe('page', () => {
  test('shows the propane example computed by the core', { timeout: TIMEOUT }, async () => {
    await page.goto(server.url);
    await page.waitForSelector('#example-result[data-state="done"]');
    const { json } = await cliJson('heating-value', '--formula', 'C3H8');
    const shown = await hhvCell('#example-result');
    assert.equal(shown.value, json.hhv_kj_per_mol);
    assert.equal(shown.text, formatNumber(json.hhv_kj_per_mol));
    const equation = await page.locator('#example-result [data-key="equation"]').textContent();
    assert.equal(equation, json.equation);
    assert.deepEqual(consoleErrors, []);
  });

  test('computes a typed formula (touch input)', { timeout: TIMEOUT }, async () => {
    await page.tap('#formula-input');
    await page.fill('#formula-input', 'CH4');
    await page.tap('#hv-submit');
    await page.waitForSelector('#hv-result[data-state="done"]');
    const { json } = await cliJson('heating-value', '--formula', 'CH4');
    const shown = await hhvCell('#hv-result');
    assert.equal(shown.value, json.hhv_kj_per_mol);
    assert.equal(shown.text, formatNumber(json.hhv_kj_per_mol));
    for (const key of ['lhv_kj_per_mol', 'hhv_mj_per_kg', 'lhv_mj_per_kg', 'hhv_mj_per_m3', 'lhv_mj_per_m3']) {
      const value = await page.locator(`#hv-result td[data-key="${key}"]`).getAttribute('data-value');
      assert.equal(Number(value), json[key], key);
    }
    assert.equal(await page.isHidden('#hv-error'), true);
    assert.deepEqual(consoleErrors, []);
  });

  test('shows an invalid formula\'s error as text', { timeout: TIMEOUT }, async () => {
    const formula = 'Xq2<img src=x>';
    await page.fill('#formula-input', formula);
    await page.press('#formula-input', 'Enter');
    await page.waitForSelector('#hv-error:not([hidden])');
    const shown = await page.locator('#hv-error').textContent();
    const { code, stdout } = await cli('heating-value', '--formula', formula);
    assert.equal(code, 2);
    let expected;
    try {
      expected = JSON.parse(stdout).errors.map((e) => e.message);
    } catch {
      expected = [];
    }
    assert.ok(shown.length > 0, 'an error message is shown');
    for (const message of expected) assert.ok(shown.includes(message), `"${shown}" includes "${message}"`);
    assert.equal(await page.locator('#hv-result').getAttribute('data-state'), 'empty');
    assert.equal(await page.locator('main img').count(), 0, 'user text is never parsed as HTML');
    assert.deepEqual(consoleErrors, []);
  });

  test('reloads offline from the service worker', { timeout: TIMEOUT }, async () => {
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
      if (!navigator.serviceWorker.controller) {
        await new Promise((resolve) => navigator.serviceWorker.addEventListener('controllerchange', resolve, { once: true }));
      }
    });
    await context.setOffline(true);
    try {
      const response = await page.reload();
      assert.equal(response.fromServiceWorker(), true);
      await page.waitForSelector('#example-result[data-state="done"]');
    } finally {
      await context.setOffline(false);
    }
    assert.deepEqual(consoleErrors, []);
  });
});
