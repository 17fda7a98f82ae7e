// The House tab's bills as printed, weather file and climate library (issue 12)
// in headless Chromium with touch, driven as a person would (taps, typing,
// files picked with setInputFiles): the bill-dates choice and a bill's average
// outdoor temperature kept through save, reload and export; a small invented
// daily weather file read by the core in the worker, what was read shown, and
// its climate and its days put into the quote; problems beside the control;
// climates kept on the device, used in one tap, renamed, deleted with undo,
// exported and imported. Screenshots of the House tab at 768x1024 and 390x844.
// Every weather value, station and place here is invented.
import assert from 'node:assert/strict';
import { mkdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { sidewaysOverflow, tabletSession, verdictSettled } from './chromium-page.js';
import { siteDir } from '../node/helpers.js';
import { serve } from './server.js';

const TIMEOUT = 60_000;
const ARTIFACTS = resolve(process.env.FUELWRIGHT_ARTIFACTS ?? join(siteDir, '..', 'test-artifacts'));

let server;
let session;
let page;
let consoleErrors = [];

before(async () => {
  mkdirSync(ARTIFACTS, { recursive: true });
  server = await serve(siteDir);
  session = await tabletSession('climates', { acceptDownloads: true });
  ({ page, consoleErrors } = session);
}, { timeout: TIMEOUT });

after(async () => {
  await session?.close();
  await server?.close();
}, { timeout: TIMEOUT });

async function typeInto(selector, text) {
  await page.tap(selector);
  await page.fill(selector, '');
  await page.type(selector, text);
}

/** Gives `file` to a file input and waits for the message numbered after the one shown before: {ok, text}. */
async function pickAndWait(input, msg, file) {
  const before = await page.getAttribute(msg, 'data-seq');
  await page.setInputFiles(input, file);
  await page.waitForFunction(([selector, seq]) => {
    const node = document.querySelector(selector);
    return node && !node.hidden && node.dataset.seq !== seq;
  }, [msg, before]);
  return page.$eval(msg, (node) => ({ ok: node.classList.contains('ok'), text: node.textContent }));
}

/** The quote as exported (the scenario file the page offers). */
async function exported() {
  await page.tap('#tab-saved');
  const [download] = await Promise.all([page.waitForEvent('download'), page.tap('[data-action="export-json"]')]);
  const doc = JSON.parse(readFileSync(await download.path(), 'utf8'));
  await page.tap('#tab-house');
  return doc;
}

/** Waits until the verdict shows an answer (a result or the entries to fix) with no progress bar. */
async function answered() {
  await page.waitForFunction(() => ['done', 'errors'].includes(document.querySelector('#verdict-body')?.dataset.state)
    && document.querySelector('#progress').hidden);
}

/** Waits until the quote's latest edit is saved on the device (body data-saved changes). */
async function saved(beforeStamp) {
  await page.waitForFunction((stamp) => document.body.dataset.saved && document.body.dataset.saved !== stamp, beforeStamp);
}

/**
 * An invented daily weather file: two whole years (2024, a leap year, and 2025) at the invented station
 * "INVENTED RIDGE 2", a smooth seasonal swing with a small made-up wobble, in °F (the header does not say so).
 */
function inventedDailyCsv() {
  const lines = ['STATION,DATE,TAVG'];
  const day = new Date(Date.UTC(2024, 0, 1));
  let i = 0;
  while (day.getUTCFullYear() < 2026) {
    const t = 47 - 24 * Math.cos((2 * Math.PI * (i - 20)) / 365.25) + 6 * Math.sin(i * 1.7);
    lines.push(`INVENTED RIDGE 2,${day.toISOString().slice(0, 10)},${t.toFixed(1)}`);
    day.setUTCDate(day.getUTCDate() + 1);
    i++;
  }
  return `${lines.join('\n')}\n`;
}

const csvFile = (name, text) => ({ name, mimeType: 'text/csv', buffer: Buffer.from(text) });

describe('House tab: bills as printed, weather file, climate library (Chromium, 768x1024 with touch)', () => {
  test('bill dates and a bill\'s average temperature are kept through save, reload and export', { timeout: TIMEOUT }, async () => {
    await page.goto(server.url);
    await verdictSettled(page);
    await page.tap('#tab-house');
    await page.tap('label[for="f-demand-method-bills"]');
    await page.waitForSelector('#f-demand-bill-dates-meter-reads');
    assert.equal(await page.isChecked('#f-demand-bill-dates-meter-reads'), true, 'meter reads by default');
    await page.selectOption('#f-demand-bills-option', 'oil-boiler');
    await page.tap('[data-action="add-bill"]');
    await page.fill('#f-demand-bills-0-start', '2025-11-12');
    await page.fill('#f-demand-bills-0-end', '2025-12-11');
    await typeInto('#f-demand-bills-0-quantity', '118');
    await page.selectOption('#f-demand-bills-0-unit', 'gal');
    await typeInto('#f-demand-bills-0-mean-temperature-value', '31.5');
    await page.tap('[data-action="add-bill"]');
    assert.equal(await page.inputValue('#f-demand-bills-1-start'), '2025-12-11', 'a meter-read bill starts where the last one ended');
    const stamp = await page.evaluate(() => document.body.dataset.saved);
    await page.tap('label[for="f-demand-bill-dates-inclusive"]');
    await saved(stamp);
    await page.reload();
    await answered();
    await page.tap('#tab-house');
    assert.equal(await page.isChecked('#f-demand-bill-dates-inclusive'), true);
    assert.equal(await page.inputValue('#f-demand-bills-0-mean-temperature-value'), '31.5');
    const doc = await exported();
    assert.equal(doc.demand.bill_dates, 'inclusive');
    assert.deepEqual(doc.demand.bills[0].mean_temperature, { value: 31.5, unit: 'degF' });
    await page.tap('label[for="f-demand-bill-dates-meter-reads"]');
  });

  test('twelve gas bills typed as the utility prints them give a verdict, heat pump included', { timeout: TIMEOUT }, async () => {
    // Issue 12: each bill starts on the day the previous one ended (11/12-12/11, then 12/11-1/13...).
    // This used to end in "internal error: a result came out as NaN" under the heat pump.
    await page.tap('#tab-house');
    await page.tap('label[for="f-demand-method-bills"]');
    await page.waitForSelector('#f-demand-bill-dates-meter-reads');
    await page.tap('label[for="f-demand-bill-dates-meter-reads"]');
    await page.selectOption('#f-demand-bills-option', 'gas-furnace');
    // Remove the bills earlier tests left, so the twelve typed here are the quote's bills.
    while (await page.$('[data-action="remove-bill"]')) await page.tap('[data-action="remove-bill"]');
    const reads = ['2024-11-12', '2024-12-11', '2025-01-13', '2025-02-11', '2025-03-12', '2025-04-10', '2025-05-12',
      '2025-06-10', '2025-07-11', '2025-08-11', '2025-09-10', '2025-10-10', '2025-11-10'];
    const therms = [95, 160, 180, 150, 110, 60, 30, 22, 21, 25, 50, 90];
    for (let i = 0; i < 12; i += 1) {
      await page.tap('[data-action="add-bill"]');
      if (i === 0) await page.fill('#f-demand-bills-0-start', reads[0]);
      else assert.equal(await page.inputValue(`#f-demand-bills-${i}-start`), reads[i], `bill ${i + 1} starts where bill ${i} ended`);
      await page.fill(`#f-demand-bills-${i}-end`, reads[i + 1]);
      await typeInto(`#f-demand-bills-${i}-quantity`, String(therms[i]));
      await page.selectOption(`#f-demand-bills-${i}-unit`, 'therm');
    }
    await page.tap('#tab-verdict');
    await answered();
    assert.equal(await page.$eval('#verdict-body', (node) => node.dataset.state), 'done', 'a verdict, not a list of problems');
    const text = await page.$eval('#verdict-body', (node) => node.textContent);
    assert.doesNotMatch(text, /internal error|NaN/);
    assert.ok(await page.$('#verdict-body tr[data-option="heat-pump"]'), 'the heat pump is in the ranking');
    const doc = await exported();
    assert.equal(doc.demand.bills.length, 12);
    assert.equal(doc.demand.bills[1].start, '2024-12-11');
  });

  test('a weather file: what was read, its climate and its days put into the quote, kept through export', { timeout: TIMEOUT }, async () => {
    // the file does not say its unit: the core's message beside the control, then the unit chosen reads it again
    const first = await pickAndWait('#weather-file', '#weather-msg', csvFile('invented-ridge.csv', inventedDailyCsv()));
    assert.equal(first.ok, false);
    assert.match(await page.textContent('#weather-errors'), /does not say whether its temperatures are in °C or °F; choose the unit/);
    const seq = await page.getAttribute('#weather-msg', 'data-seq');
    await page.selectOption('#weather-unit', 'degF');
    await page.waitForFunction((before) => {
      const node = document.querySelector('#weather-msg');
      return !node.hidden && node.dataset.seq !== before;
    }, seq);
    const msg = await page.$eval('#weather-msg', (node) => ({ ok: node.classList.contains('ok'), text: node.textContent }));
    assert.equal(msg.ok, true, msg.text);
    const facts = await page.$$eval('#weather-read dt, #weather-read dd', (nodes) => nodes.map((n) => n.textContent));
    assert.deepEqual(facts.slice(0, 6), ['Weather station', 'INVENTED RIDGE 2', 'Period', 'January 1, 2024 to December 31, 2025',
      'Readings', '731 days of daily temperatures']);
    assert.match(facts[7], /°F·d$/);
    await page.tap('#weather-use-climate');
    await page.waitForSelector('#climate-label');
    assert.match(await page.textContent('#climate-label'), /invented-ridge\.csv/);
    assert.equal(await page.inputValue('#f-climate-mode'), 'monthly_mean');
    await page.tap('#weather-use-observed');
    await page.waitForFunction(() => /731 days/.test(document.querySelector('#bill-weather-text')?.textContent ?? ''));
    await page.screenshot({ path: join(ARTIFACTS, 'chromium-house-weather-768.png'), fullPage: true });
    const doc = await exported();
    assert.equal(doc.demand.observed.daily_mean.length, 731);
    assert.ok(Array.isArray(doc.climate.monthly_mean) && doc.climate.monthly_mean.length === 12);
    assert.ok(Array.isArray(doc.climate.monthly_sd), 'the day-to-day spread travels with the climate');
  });

  test('a file the core cannot read: its problems beside the control', { timeout: TIMEOUT }, async () => {
    const msg = await pickAndWait('#weather-file', '#weather-msg', csvFile('notes.csv', 'this is not,weather\nat all,\n'));
    assert.equal(msg.ok, false);
    assert.match(msg.text, /“notes\.csv” was not read/);
    assert.ok(await page.locator('#weather-errors li').count() >= 1);
    const empty = await pickAndWait('#weather-file', '#weather-msg', csvFile('empty.csv', ''));
    assert.equal(empty.text, '“empty.csv” is empty.');
  });

  test('climates kept on the device: keep, use in one tap, rename, delete with undo, export and import', { timeout: TIMEOUT }, async () => {
    await page.waitForSelector('#climate-storage-kind');
    assert.match(await page.textContent('#climate-storage-kind'), /IndexedDB/);
    // an empty name is refused at the field
    await page.fill('#climate-keep-name', '');
    await page.tap('[data-action="library-keep"]');
    await page.waitForSelector('#climate-keep-msg:not([hidden])');
    assert.match(await page.textContent('#climate-keep-msg'), /Give the climate a name/);
    await typeInto('#climate-keep-name', 'Ashby ridge (invented)');
    await page.tap('[data-action="library-keep"]');
    await page.waitForSelector('#climate-list li .c-name');
    assert.deepEqual(await page.$$eval('#climate-list .c-name', (n) => n.map((x) => x.textContent)), ['Ashby ridge (invented)']);
    // the same name again is refused
    await typeInto('#climate-keep-name', 'ashby RIDGE (invented)');
    await page.tap('[data-action="library-keep"]');
    await page.waitForFunction(() => /already kept/.test(document.querySelector('#climate-keep-msg')?.textContent ?? ''));

    // the quote's climate typed over, then the kept one used in one tap
    await page.selectOption('#f-climate-mode', 'none');
    await page.waitForFunction(() => !document.querySelector('#f-climate-monthly-mean-0'));
    await page.tap('#climate-list [data-action="library-use"]');
    await page.waitForSelector('#f-climate-monthly-mean-0');
    assert.equal(await page.textContent('#climate-label'), 'Climate: Ashby ridge (invented)');

    // rename
    await page.tap('#climate-list [data-action="library-rename"]');
    await typeInto('#climate-rename', 'Ashby upper ridge (invented)');
    await page.tap('[data-action="library-rename-save"]');
    await page.waitForFunction(() => document.querySelector('#climate-list .c-name')?.textContent === 'Ashby upper ridge (invented)');

    // export
    const [download] = await Promise.all([page.waitForEvent('download'), page.tap('[data-action="library-export"]')]);
    const file = JSON.parse(readFileSync(await download.path(), 'utf8'));
    assert.equal(file.schema, 'fuelwright.climates/1');
    assert.deepEqual(file.climates.map((c) => c.name), ['Ashby upper ridge (invented)']);

    // delete, undo
    await page.tap('#climate-list [data-action="library-delete"]');
    await page.waitForSelector('#climate-empty');
    await page.tap('#climate-undo button');
    await page.waitForSelector('#climate-list li');

    // import: the exported one comes back under a new name; a climate the core refuses is named
    const bad = { name: 'Too warm (invented)', climate: { monthly_mean: Array(12).fill(300), unit: 'degF' } };
    const text = JSON.stringify({ ...file, climates: [...file.climates, bad] });
    const msg = await pickAndWait('#climate-library-file', '#library-msg', { name: 'climates.json', mimeType: 'application/json', buffer: Buffer.from(text) });
    assert.equal(msg.ok, false);
    assert.match(msg.text, /Imported 1 climate from “climates\.json”: “Ashby upper ridge \(invented\)” \(kept as “Ashby upper ridge \(invented\) \(2\)”/);
    assert.match(msg.text, /Climate “Too warm \(invented\)” was not kept: 300 °F is not a plausible monthly mean/);
    const notJson = await pickAndWait('#climate-library-file', '#library-msg', { name: 'x.json', mimeType: 'application/json', buffer: Buffer.from('{') });
    assert.equal(notJson.text, 'Could not import “x.json”: it is not a JSON file.');

    // kept after a reload
    await page.reload();
    await answered();
    await page.tap('#tab-house');
    await page.waitForFunction(() => document.querySelectorAll('#climate-list li').length === 2);
  });

  test('the House tab at 768x1024 and 390x844', { timeout: TIMEOUT }, async () => {
    await page.setViewportSize({ width: 768, height: 1024 });
    await page.tap('#tab-house');
    await page.screenshot({ path: join(ARTIFACTS, 'chromium-house-768.png'), fullPage: true });
    await page.setViewportSize({ width: 390, height: 844 });
    await page.screenshot({ path: join(ARTIFACTS, 'chromium-house-390.png'), fullPage: true });
    assert.doesNotMatch(await page.textContent('#panel-house'), /\bnull\b|undefined|NaN/);
    const overflow = await sidewaysOverflow(page, 390);
    assert.ok(overflow <= 0, `the page is ${overflow} px wider than 390 px`);
    assert.deepEqual(consoleErrors, []);
  });
});
