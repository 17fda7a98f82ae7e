// Saved quotes across versions and a full storage, in headless Chromium
// (playwright-core): records of version 1 (tests/fixtures/saved-quotes/) put
// into IndexedDB before the page starts are listed, written back once as
// version 2 and open with their verdict; a record of a newer version is listed
// as one this version cannot open and is left exactly as it was; saved-quote
// and scenario files of a newer version are refused on import; a save overtaken
// by another window on the same quote keeps both versions and says so; and a
// write refused for lack of quota is reported until a save succeeds.
import assert from 'node:assert/strict';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { importAndWait, launchTablet, verdictSettled, watchPage } from './chromium-page.js';
import { siteDir } from '../node/helpers.js';
import { serve } from './server.js';
import { cliEvaluate, close, money } from './scenario-fixture.js';

const TIMEOUT = 60_000;
const ARTIFACTS = resolve(process.env.FUELWRIGHT_ARTIFACTS ?? join(siteDir, '..', 'test-artifacts'));
const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');
const fixturesDir = join(root, 'tests/fixtures/saved-quotes');

const NEWER = 'it was saved by a newer version of Fuelwright (fuelwright.saved-quote/3); this version reads saved quotes up to fuelwright.saved-quote/2';
const FORKED = 'This quote had been changed in another window or tab since this one opened it. '
  + 'So that neither version is lost, the changes made here were saved as a separate quote, which is the one open now; '
  + 'the other version is kept as it was, under Saved quotes.';
const NOT_SAVED_FULL = 'This quote was NOT saved on this device: the storage for this page on this device is full. '
  + 'Your work is still here while this page stays open. Export the quote file to keep it, and delete old saved quotes to make room.';

const fixtures = readdirSync(fixturesDir).filter((n) => n.endsWith('.json')).sort()
  .map((name) => ({ name, text: readFileSync(join(fixturesDir, name), 'utf8') }))
  .map((f) => ({ ...f, record: JSON.parse(f.text) }));
const ofSchema = (schema) => fixtures.filter((f) => f.record.record_schema === schema);
const v1 = ofSchema('fuelwright.saved-quote/1');
const v2 = ofSchema('fuelwright.saved-quote/2');
const [newer] = ofSchema('fuelwright.saved-quote/3');

let server;
let profile;
let context;
let page;
const consoleErrors = [];

before(async () => {
  assert.ok(v1.length >= 2 && v2.length >= 1 && newer, 'the fixtures are there');
  mkdirSync(ARTIFACTS, { recursive: true });
  server = await serve(siteDir);
  profile = mkdtempSync(join(tmpdir(), 'fuelwright-storage-'));
  ({ context, page } = await launchTablet(profile, { acceptDownloads: true, timeout: TIMEOUT }));
  watchPage(page, { consoleErrors });
}, { timeout: TIMEOUT });

after(async () => {
  await context?.close();
  await server?.close();
  if (profile) rmSync(profile, { recursive: true, force: true });
}, { timeout: TIMEOUT });

/** Waits until the verdict shows the result of the latest edit. */
const settled = (state = 'done') => verdictSettled(page, state);

/** Every record in the page's store (IndexedDB "fuelwright", store "quotes"), by id. */
function storedRecords() {
  return page.evaluate(() => new Promise((resolve, reject) => {
    const open = indexedDB.open('fuelwright', 1);
    open.onerror = () => reject(open.error);
    open.onsuccess = () => {
      const db = open.result;
      const all = db.transaction('quotes', 'readonly').objectStore('quotes').getAll();
      all.onsuccess = () => { db.close(); resolve(Object.fromEntries(all.result.map((r) => [r.id, r]))); };
      all.onerror = () => reject(all.error);
    };
  }));
}

/** Writes records straight into the page's store, as an earlier or later version of the page would have. */
function seed(records) {
  return page.evaluate((list) => new Promise((resolve, reject) => {
    const open = indexedDB.open('fuelwright', 1);
    open.onerror = () => reject(open.error);
    open.onsuccess = () => {
      const db = open.result;
      const tx = db.transaction('quotes', 'readwrite');
      for (const record of list) tx.objectStore('quotes').put(record);
      tx.oncomplete = () => { db.close(); resolve(); };
      tx.onabort = () => reject(tx.error);
    };
  }), records);
}

/** Polls the page's store until `check(records)` gives a value, and returns it. */
async function untilStored(check, what, timeout = 20_000) {
  const end = Date.now() + timeout;
  let records;
  while (Date.now() < end) {
    records = await storedRecords();
    const value = check(records);
    if (value) return value;
    await page.waitForTimeout(200);
  }
  throw new Error(`timed out waiting for ${what}`);
}

/** The list item of a record: its text lines and whether its buttons are enabled. */
function listed(id) {
  return page.evaluate((recordId) => {
    const li = document.querySelector(`#quote-list li[data-id="${recordId}"]`);
    if (!li) return null;
    const text = (css) => li.querySelector(css)?.textContent ?? null;
    const disabled = (action) => li.querySelector(`[data-action="${action}"]`).disabled;
    return { customer: text('.q-customer'), summary: text('.q-summary'), problem: text('.q-problem'), unreadable: li.classList.contains('unreadable'),
      open: !disabled('open-quote'), duplicate: !disabled('duplicate-quote'), remove: !disabled('delete-quote') };
  }, id);
}

/** What the list must say for a summary (the page's words, money as the page formats it). */
function summaryLine(summary) {
  const of = summary.option_count === 1 ? 'the only option' : `best of ${summary.option_count} options`;
  return `Lowest yearly cost: ${summary.best_label}, ${money(summary.annual_cost, summary.currency)}/yr (${of})`;
}

/** The verdict on screen against the CLI's answer for a scenario. */
async function checkVerdict(scenario) {
  const cli = await cliEvaluate(scenario);
  assert.deepEqual(cli.errors, []);
  const best = cli.options.find((o) => o.id === cli.ranking[0].id);
  assert.equal(await page.textContent('#best-option'), best.label);
  const shown = await page.$$eval('#verdict-table tbody tr', (rows) => rows.map((tr) => ({
    id: tr.dataset.option, annual: Number(tr.querySelector('[data-key="annual_cost"]').dataset.value) })));
  assert.deepEqual(shown.map((r) => r.id), cli.ranking.map((r) => r.id), 'ranked as the CLI ranks them');
  for (const row of shown) assert.ok(close(row.annual, cli.options.find((o) => o.id === row.id).annual_cost), `${row.id} annual cost`);
  return { cli, best };
}

/**
 * Reloads the page so that Chromium applies the quota override to IndexedDB:
 * it reads an origin's quota when it opens the origin's database files, and
 * closes them a few seconds after the last page using them has gone. An edit
 * to the quote's notes then makes the page save, which fails once it applies.
 */
async function reopenUnderQuota() {
  for (const pause of [3000, 6000, 12000]) {
    await page.goto('about:blank');
    await page.waitForTimeout(pause);
    await page.goto(server.url);
    await settled();
    await page.click('#tab-house');
    await typeInto('#f-quote-notes', `Reopened after ${pause} ms (invented)`);
    try {
      await page.waitForSelector('#storage-alert:not([hidden])', { timeout: 5000 });
      return;
    } catch {
      // the database files were still open: leave for longer
    }
  }
  throw new Error('Chromium never applied the quota override');
}

/** Types `customer` into the open quote and waits until it is stored: the quote's id. */
async function storeCustomer(customer) {
  await page.click('#tab-house');
  await typeInto('#f-quote-customer', customer);
  const id = await page.evaluate(() => localStorage.getItem('fuelwright.current-quote'));
  await untilStored((records) => records[id]?.customer === customer, `the quote saved with ${customer}`);
  return id;
}

async function typeInto(selector, text) {
  await page.click(selector);
  await page.fill(selector, '');
  await page.type(selector, text);
}

describe('saved quotes of earlier and later versions', () => {
  test('version 1 records are written back as version 2 once; the newer one is listed, not openable, unchanged', { timeout: TIMEOUT }, async () => {
    await page.goto(server.url);
    await settled();
    await seed([...v1, ...v2, newer].map((f) => f.record));
    await page.reload();
    await settled();
    const stored = await storedRecords();
    for (const { name, record } of v1) {
      const now = stored[record.id];
      assert.ok(now, `${name} is still stored`);
      assert.equal(now.record_schema, 'fuelwright.saved-quote/2', `${name} was written back as version 2`);
      assert.equal(now.summary, null, `${name}: no summary yet`);
      assert.deepEqual({ ...now, record_schema: record.record_schema, summary: undefined }, { ...record, summary: undefined }, `${name}: every other field kept`);
    }
    for (const { name, record } of v2) assert.deepEqual(stored[record.id], record, `${name} untouched`);
    assert.equal(JSON.stringify(stored[newer.record.id]), JSON.stringify(newer.record), 'the newer record is byte for byte what was stored');

    await page.click('#tab-saved');
    for (const { record } of v1) {
      assert.deepEqual(await listed(record.id), { customer: record.customer, summary: 'No verdict saved yet: open the quote to work it out.', problem: null,
        unreadable: false, open: true, duplicate: true, remove: true });
    }
    for (const { record } of v2) assert.equal((await listed(record.id)).summary, summaryLine(record.summary));
    assert.deepEqual(await listed(newer.record.id), { customer: newer.record.customer, summary: null,
      problem: `Cannot be opened by this version: ${NEWER}. It is kept unchanged on this device.`, unreadable: true, open: false, duplicate: false, remove: true });
    await page.screenshot({ path: join(ARTIFACTS, 'storage-saved-quotes.png'), fullPage: true });
    assert.deepEqual(consoleErrors, []);
  });

  test('each version 1 quote opens with its verdict and is then saved with its summary', { timeout: 120_000 }, async () => {
    for (const { name, record } of v1) {
      await page.click('#tab-saved');
      await page.click(`#quote-list li[data-id="${record.id}"] [data-action="open-quote"]`);
      await settled();
      const { cli, best } = await checkVerdict(record.scenario);
      const saved = await untilStored((records) => (records[record.id]?.summary ? records[record.id] : null), `${name} saved with its summary`);
      assert.equal(saved.record_schema, 'fuelwright.saved-quote/2');
      assert.equal(saved.created_at, record.created_at, `${name}: created_at kept`);
      assert.equal(saved.summary.best_id, best.id);
      assert.equal(saved.summary.best_label, best.label);
      assert.ok(close(saved.summary.annual_cost, best.annual_cost), `${name}: summary cost`);
      assert.equal(saved.summary.currency, cli.settings.currency);
      assert.equal(saved.summary.option_count, cli.options.length);
      await page.click('#tab-saved');
      await page.waitForFunction(([id, line]) => document.querySelector(`#quote-list li[data-id="${id}"] .q-summary`)?.textContent === line,
        [record.id, summaryLine(saved.summary)]);
    }
    const stored = await storedRecords();
    assert.equal(JSON.stringify(stored[newer.record.id]), JSON.stringify(newer.record), 'the newer record is still unchanged');
    assert.deepEqual(consoleErrors, []);
  });

  test('a newer record that was the open quote is not opened and not saved over', { timeout: TIMEOUT }, async () => {
    await page.evaluate((id) => localStorage.setItem('fuelwright.current-quote', id), newer.record.id);
    await page.reload();
    await settled();
    assert.notEqual(await page.evaluate(() => localStorage.getItem('fuelwright.current-quote')), newer.record.id);
    await page.click('#tab-house');
    await typeInto('#f-quote-customer', 'Edited after the newer record (invented)');
    await page.waitForFunction(() => document.body.dataset.saved);
    await page.waitForTimeout(800);
    const stored = await storedRecords();
    assert.equal(JSON.stringify(stored[newer.record.id]), JSON.stringify(newer.record));
    assert.deepEqual(consoleErrors, []);
  });
});

describe('importing files of other versions', () => {
  test('a saved-quote record file opens; newer records and scenarios are refused with their message', { timeout: TIMEOUT }, async () => {
    const [first] = v1;
    await page.click('#tab-saved');
    assert.deepEqual(await importAndWait(page, join(fixturesDir, first.name)), { ok: true, text: `Imported “${first.name}”.` });
    await settled();
    await checkVerdict(first.record.scenario);

    assert.deepEqual(await importAndWait(page, join(fixturesDir, newer.name)), { ok: false, text: `Could not import “${newer.name}”: ${NEWER}` });

    const scenarioFile = join(ARTIFACTS, 'scenario-version-2.json');
    writeFileSync(scenarioFile, JSON.stringify({ ...first.record.scenario, schema: 'fuelwright.scenario/2' }));
    assert.deepEqual(await importAndWait(page, scenarioFile), { ok: false, text: 'Could not import “scenario-version-2.json”: it was saved by a newer version of Fuelwright '
      + '(fuelwright.scenario/2); this version reads scenarios up to fuelwright.scenario/1' });
    assert.deepEqual(consoleErrors, []);
  });
});

describe('two windows on one quote', () => {
  test('a save overtaken by another window keeps both versions and says so', { timeout: TIMEOUT }, async () => {
    const id = await storeCustomer('Opened in two windows (invented)');
    const second = await context.newPage();
    watchPage(second, { consoleErrors });
    try {
      await second.goto(server.url);
      await verdictSettled(second);
      await second.waitForTimeout(800);  // past the autosave's wait: the second window has read the quote and saved nothing
      const count = Object.keys(await storedRecords()).length;
      // the first window saves; the second, which read the quote before that, saves a change of its own after
      await typeInto('#f-quote-site', '1 First Window Way (invented)');
      await untilStored((records) => records[id]?.site === '1 First Window Way (invented)', 'the first window\'s save');
      await second.click('#tab-house');
      await second.fill('#f-quote-notes', 'Typed in the second window (invented)');
      const copy = await untilStored((records) => Object.values(records)
        .find((r) => r.id !== id && r.workspace?.quote?.notes === 'Typed in the second window (invented)'), 'the second window\'s work as a quote of its own');
      const first = (await storedRecords())[id];
      assert.equal(first.site, '1 First Window Way (invented)', 'the first window\'s version is kept');
      assert.notEqual(first.workspace.quote.notes, 'Typed in the second window (invented)');
      assert.equal(copy.customer, 'Opened in two windows (invented)');
      assert.notEqual(copy.site, '1 First Window Way (invented)', 'the copy is the second window\'s version');
      assert.equal(Object.keys(await storedRecords()).length, count + 1);
      await second.waitForSelector('#storage-alert:not([hidden])');
      assert.equal(await second.textContent('#storage-alert-text'), FORKED);
      await second.screenshot({ path: join(ARTIFACTS, 'storage-two-windows.png') });
      // from then on each window saves its own quote, with no more copies and nothing to report in the first
      await second.fill('#f-quote-notes', 'More in the second window (invented)');
      await untilStored((records) => records[copy.id]?.workspace?.quote?.notes === 'More in the second window (invented)', 'the second window\'s next save');
      await typeInto('#f-quote-site', '2 First Window Way (invented)');
      await untilStored((records) => records[id]?.site === '2 First Window Way (invented)', 'the first window\'s next save');
      assert.equal(Object.keys(await storedRecords()).length, count + 1);
      assert.ok(await page.isHidden('#storage-alert'), 'the first window was not overtaken');
    } finally {
      await second.close();
    }
    assert.deepEqual(consoleErrors, []);
  });
});

describe('a full storage', () => {
  test('a save refused for lack of quota is reported, the work kept, and the next save clears it', { timeout: TIMEOUT }, async () => {
    const id = await storeCustomer('Before the storage filled up (invented)');
    assert.ok(await page.isHidden('#storage-alert'));

    // Chromium's own quota, made smaller than what this origin already stores
    const cdp = await context.newCDPSession(page);
    const origin = new URL(server.url).origin;
    await cdp.send('Storage.overrideQuotaForOrigin', { origin, quotaSize: 1024 });
    try {
      await reopenUnderQuota();
      await page.click('#tab-house');
      assert.equal(await page.inputValue('#f-quote-customer'), 'Before the storage filled up (invented)', 'the saved quote is read back');
      await typeInto('#f-quote-customer', 'After the storage filled up (invented)');
      await page.waitForTimeout(1000);
      await page.waitForSelector('#storage-alert:not([hidden])');
      assert.equal(await page.textContent('#storage-alert-text'), NOT_SAVED_FULL);
      assert.equal(await page.getAttribute('#storage-alert', 'role'), 'alert');
      await page.screenshot({ path: join(ARTIFACTS, 'storage-full.png') });
      // the work is kept on the page, the stored record is the one before
      assert.equal(await page.inputValue('#f-quote-customer'), 'After the storage filled up (invented)');
      assert.equal((await storedRecords())[id].customer, 'Before the storage filled up (invented)');
      await page.click('#tab-house');
      await typeInto('#f-quote-site', '9 Full Disk Lane (invented)');
      await page.waitForTimeout(1000);
      assert.ok(await page.isVisible('#storage-alert'), 'the message stays while saves fail');
      assert.equal(await page.textContent('#storage-alert-text'), NOT_SAVED_FULL);
    } finally {
      await cdp.send('Storage.overrideQuotaForOrigin', { origin });
    }
    await typeInto('#f-quote-site', '9 Roomy Lane (invented)');
    await page.waitForSelector('#storage-alert', { state: 'hidden' });
    const saved = (await storedRecords())[id];
    assert.equal(saved.customer, 'After the storage filled up (invented)');
    assert.equal(saved.site, '9 Roomy Lane (invented)');
    assert.deepEqual(consoleErrors, []);
  });
});
