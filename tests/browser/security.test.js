// Text typed in, imported from a quote file or read from a kiosk price file is shown as text and never runs, and the page asks nothing of any origin but its own — and nothing at all once it has loaded and gone offline.
import assert from 'node:assert/strict';
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { after, before, beforeEach, describe, test } from 'node:test';

import { TOUCH, importAndWait, launchTablet, verdictSettled, watchPage } from './chromium-page.js';
import { cliJson, siteDir } from '../node/helpers.js';
import { cliEvaluate } from './scenario-fixture.js';
import { serve } from './server.js';

const TIMEOUT = 90_000;
const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');

// Markup and script that would run, or leave an element behind, if text were parsed as HTML or used as a URL.
const ATTACKS = [
  '<img src=x onerror="window.__fwPwned=(window.__fwPwned||0)+1">',
  '<script>window.__fwPwned=1</script>',
  '"><svg onload=window.__fwPwned=1>',
  'javascript:window.__fwPwned=1//',
  'Tom &amp; Jerry &lt;b&gt;bold&lt;/b&gt; &#60;i&#62;',
  "'><iframe src=\"javascript:parent.__fwPwned=1\"></iframe>",
];
// What the inputs that take text accept (everything else on the page takes numbers, dates or choices).
const TEXT_LIKE = 'input:not([type]), input[type="text"], input[type="search"], textarea';

/** Attack number `n` tagged "[n]" (no tag a prefix of another), the first from `n` on that fits `maxLength` (so the field keeps all of it). */
function attack(n, maxLength = -1) {
  for (let k = 0; k < ATTACKS.length; k++) {
    const text = `${ATTACKS[(n + k) % ATTACKS.length]} [${n}]`;
    if (maxLength < 0 || text.length <= maxLength) return text;
  }
  return '<b>'.slice(0, maxLength);
}

/** Today plus `days` as YYYY-MM-DD in local time, as the page reads dates. */
function day(days = 0) {
  const d = new Date();
  d.setDate(d.getDate() + days);
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

let work;
let server;
let origin;
let profile;
let context;
let page;
const consoleErrors = [];
const dialogs = [];
// Every request the browser made, heard by the context (pages, their workers, the service worker) and by the page.
const requests = [];
const pageRequests = [];
// What the init script saw in every document: CSP violations, elements that came from text, blob: URLs the page made.
const seen = { violation: [], injected: [], blob: [] };

/** Runs in every document before the page's own scripts: reports what text must never cause. */
function watchDocument() {
  const note = (kind, detail) => window.__fwNote?.(kind, detail);
  document.addEventListener('securitypolicyviolation', (e) => note('violation',
    { directive: e.violatedDirective, blocked: e.blockedURI, sample: e.sample, page: location.href }), true);
  const SUSPECT = new Set(['script', 'iframe', 'frame', 'object', 'embed', 'img', 'image', 'base', 'meta', 'link', 'style']);
  // the elements of index.html itself, as the parser left them (before the page's scripts run)
  const parsed = new WeakSet();
  document.addEventListener('readystatechange', () => {
    if (document.readyState === 'interactive') for (const el of document.querySelectorAll('*')) parsed.add(el);
  });
  const jsUrl = (el) => ['href', 'src', 'action', 'formaction', 'xlink:href'].some((a) => /^\s*javascript:/i.test(el.getAttribute(a) ?? ''));
  const describe = (el) => `<${el.localName}${[...el.attributes].map((a) => ` ${a.name}="${a.value}"`).join('')}>`;
  const check = (el) => {
    if (!(el instanceof Element) || parsed.has(el)) return;
    const handler = [...el.attributes].some((a) => /^on/i.test(a.name));
    if (handler || jsUrl(el) || SUSPECT.has(el.localName)) note('injected', { element: describe(el), page: location.href });
    for (const child of el.children) check(child);
  };
  new MutationObserver((records) => {
    if (document.readyState === 'loading') return;  // the parser building index.html; snapshotted above
    for (const r of records) {
      if (r.type === 'attributes') check(r.target);
      else for (const n of r.addedNodes) check(n);
    }
  }).observe(document, { childList: true, subtree: true, attributes: true });
  const createObjectURL = URL.createObjectURL;
  URL.createObjectURL = function created(object) {
    const url = createObjectURL.call(URL, object);
    note('blob', url);
    return url;
  };
}

// ---------------------------------------------------------------------------
// Price files for the kiosk, written into the served copy of the site

const sample = JSON.parse(readFileSync(join(root, 'data/examples/supplier-prices.json'), 'utf8'));
const current = { ...structuredClone(sample), effective: day(-30), expires: day(150) };
/** A valid price file whose every text carries an attack. */
const hostile = {
  ...structuredClone(current),
  supplier: { name: attack(0), contact: attack(2), quote_text: attack(4), phone: attack(6), help_text: attack(8) },
  notes: attack(1),
  prices: current.prices.map((p, i) => ({
    ...p,
    note: attack(10 + i),
    ...(p.fixed_charges ? { fixed_charges: p.fixed_charges.map((c, j) => ({ ...c, label: attack(20 + i + j) })) } : {}),
  })),
};
/** A price file with problems whose messages quote the attacks back (an unknown fuel, unit and currency). */
const hostileInvalid = {
  ...structuredClone(current),
  supplier: { name: attack(3) },
  currency: attack(5),
  prices: [{ fuel: attack(0), unit: 'gal', amount: 2.5 }, { fuel: 'propane', unit: attack(2), amount: 2.9 }],
};

/** Writes the price files the kiosk tests open into `dir` (prices/ of the served site). */
function writePriceFiles(dir) {
  mkdirSync(dir, { recursive: true });
  writeFileSync(join(dir, 'current.json'), JSON.stringify(current, null, 2));
  writeFileSync(join(dir, 'hostile.json'), JSON.stringify(hostile, null, 2));
  writeFileSync(join(dir, 'hostile-invalid.json'), JSON.stringify(hostileInvalid, null, 2));
}

/** A listener that notes each request's address and whether the service worker made it. */
function recordRequest(list) {
  return (request) => list.push({ url: request.url(), byServiceWorker: Boolean(request.serviceWorker()) });
}

before(async () => {
  work = mkdtempSync(join(tmpdir(), 'fuelwright-security-'));
  const served = join(work, 'site');
  cpSync(siteDir, served, { recursive: true, verbatimSymlinks: true });
  writePriceFiles(join(served, 'prices'));
  server = await serve(served);
  origin = new URL(server.url).origin;
  profile = join(work, 'profile');
  ({ context, page } = await launchTablet(profile, { ...TOUCH, acceptDownloads: true, timeout: TIMEOUT }));
  await context.exposeFunction('__fwNote', (kind, detail) => { seen[kind].push(detail); });
  await context.addInitScript(watchDocument);
  context.on('request', recordRequest(requests));
  page.on('request', recordRequest(pageRequests));
  watchPage(page, { consoleErrors, dialogs });
}, { timeout: TIMEOUT });

after(async () => {
  await context?.close().catch(() => {});
  await server?.close();
  if (work) rmSync(work, { recursive: true, force: true });
}, { timeout: TIMEOUT });

// ---------------------------------------------------------------------------
// Waiting for the page

/** Waits until the verdict shows the result of the latest edit. */
const settled = (state = 'done') => verdictSettled(page, state);

/** Waits until the charts (sweep, break-even, tornado) show the latest verdict. */
async function analysed() {
  await page.waitForFunction(() => {
    const body = document.querySelector('#verdict-body');
    return body.dataset.state === 'done' && body.dataset.analysis === body.dataset.generation && document.querySelector('#progress').hidden;
  });
}

/** Waits until the service worker controls the page. */
async function controlled() {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
    if (!navigator.serviceWorker.controller) {
      await new Promise((done) => navigator.serviceWorker.addEventListener('controllerchange', done, { once: true }));
    }
  });
}

/** Waits until the browser has made no request for `quietMs`. */
async function quiet(quietMs = 1500, limitMs = 20_000) {
  const end = Date.now() + limitMs;
  let count = -1;
  while (count !== requests.length) {
    assert.ok(Date.now() < end, `requests did not stop: ${requests.slice(-5).map((r) => r.url).join(', ')}`);
    count = requests.length;
    await page.waitForTimeout(quietMs);
  }
}

async function tab(name) {
  await page.tap(`#tab-${name}`);
}

/** Waits for the price draws to finish. */
async function drawn() {
  await page.waitForFunction(() => document.querySelector('#uncertainty')?.dataset.state === 'done', null, { timeout: 45_000 });
}

/** Turns the price draws on (Fuels tab) and waits for their answer. */
async function runDraws() {
  await tab('fuels');
  if (!await page.isChecked('#f-uncertainty-enabled')) await page.tap('label[for="f-uncertainty-enabled"]');
  await page.waitForSelector('#f-uncertainty-draws');
  await tab('verdict');
  await drawn();
}

/** Works out a composition in the heating-value lab; resolves to the lab's state. */
async function runLab(text) {
  await tab('fuels');
  await page.fill('#lab-input', text);
  await page.tap('#lab-submit');
  await page.waitForFunction(() => ['done', 'error'].includes(document.querySelector('#lab-result')?.dataset.state));
  return page.getAttribute('#lab-result', 'data-state');
}

/** The scenario the page exports for the open quote (its own toScenario). */
async function exported() {
  await tab('saved');
  const [download] = await Promise.all([page.waitForEvent('download'), page.tap('[data-action="export-json"]')]);
  return JSON.parse(readFileSync(await download.path(), 'utf8'));
}

// ---------------------------------------------------------------------------
// What text must never do

/** Lets the init script's reports arrive (they travel through a binding). */
async function flushReports() {
  await page.evaluate(() => new Promise((done) => setTimeout(done, 100)));
}

const reported = new Map();

// each test answers for what happened during it
beforeEach(() => {
  for (const list of [seen.injected, seen.violation, dialogs, consoleErrors]) reported.set(list, list.length);
});

/** The entries of `list` added since the last check (in this document or any before it since then). */
function newlyAdded(list) {
  const fresh = list.slice(reported.get(list) ?? 0);
  reported.set(list, list.length);
  return fresh;
}

/** Asserts that no attack ran or left an element behind. */
async function assertNothingRan(where) {
  await flushReports();
  const [injected, violations, opened, errors] = [seen.injected, seen.violation, dialogs, consoleErrors].map(newlyAdded);
  const state = await page.evaluate(() => ({
    pwned: typeof window.__fwPwned,
    imgX: document.querySelectorAll('img[src="x"]').length,
    handlers: [...document.querySelectorAll('*')].filter((el) => [...el.attributes].some((a) => /^on/i.test(a.name))).map((el) => el.localName),
    scripts: [...document.scripts].map((s) => s.getAttribute('src')),
    frames: document.querySelectorAll('iframe, frame, object, embed').length,
    jsUrls: [...document.querySelectorAll('[href], [src], [action], [formaction]')]
      .filter((el) => ['href', 'src', 'action', 'formaction'].some((a) => /^\s*javascript:/i.test(el.getAttribute(a) ?? ''))).length,
  }));
  // a payload that ran would have set the flag
  assert.equal(state.pwned, 'undefined', `${where}: a payload ran`);
  // text parsed as markup would leave these elements and attributes
  assert.equal(state.imgX, 0, `${where}: an <img src=x> was made from text`);
  assert.deepEqual(state.handlers, [], `${where}: elements with inline event handlers`);
  assert.deepEqual(state.scripts, ['app.js'], `${where}: the page's one script and no other`);
  assert.equal(state.frames, 0, `${where}: no frame or object was made from text`);
  assert.equal(state.jsUrls, 0, `${where}: no javascript: URL in an attribute`);
  // even an element made and removed again, or one the CSP stopped, is reported by the init script
  assert.deepEqual(injected, [], `${where}: elements made after load that text could have made`);
  assert.deepEqual(violations, [], `${where}: the CSP had to stop something`);
  assert.deepEqual(opened, [], `${where}: a dialog was opened`);
  const injectionLike = errors.filter((e) => /Content Security Policy|Refused to|__fwPwned|inline|SyntaxError/i.test(e));
  assert.deepEqual(injectionLike, [], `${where}: console errors that point at injected code`);
}

/** Texts of the elements matching `selector`. */
const textsOf = (selector) => page.$$eval(selector, (els) => els.map((e) => e.textContent));

/** Asserts that `selector` shows exactly `text` (textContent equals it: not parsed, not escaped twice). */
async function assertShows(selector, text, why) {
  assert.equal(await page.textContent(selector), text, `${why} (${selector})`);
}

/** Asserts that some element matching `selector` contains `text` literally. */
async function assertAmong(selector, text, why) {
  const texts = await textsOf(selector);
  assert.ok(texts.some((t) => t.includes(text)), `${why}: ${JSON.stringify(text)} not in ${selector}: ${JSON.stringify(texts)}`);
}

/** The messages the page shows next to fields and above the verdict. */
const shownMessages = () => textsOf('.field-msg:not([hidden]), #verdict-errors li, #verdict-warnings li');

/** Asserts that every message of the core for `scenario` is shown literally on the page. */
async function assertCoreMessagesShown(scenario, why) {
  const cli = await cliEvaluate(scenario);
  assert.ok(cli.errors.length > 0, `${why}: the core finds problems in this scenario`);
  const shown = await shownMessages();
  for (const error of cli.errors) {
    assert.ok(shown.some((m) => m.includes(error.message)), `${why}: ${JSON.stringify(error.message)} is not shown in ${JSON.stringify(shown)}`);
  }
  return cli.errors;
}

// ---------------------------------------------------------------------------
// Filling every text-like input

/** The text-like inputs visible in `scope` that take text (`numeric` false) or numbers (`numeric` true). */
function visibleInputs(scope, numeric) {
  return page.$$eval(`${scope} :is(${TEXT_LIKE})`, (els, wantNumeric) => els
    .filter((el) => el.getClientRects().length > 0 && !el.readOnly && !el.disabled)
    .filter((el) => (el.inputMode === 'decimal' || el.dataset.kind === 'number') === wantNumeric)
    .map((el) => ({ id: el.id, maxLength: el.maxLength })), numeric);
}

/** Opens every collapsed section of a panel so that its fields can be typed into. */
async function openDetails(scope) {
  await page.$$eval(`${scope} details`, (all) => { for (const d of all) d.open = true; });
}

/**
 * Types a tagged attack into every visible text-like input of each panel (and the top bar);
 * `filled` (id -> text) collects what went where. Returns the inputs filled this time.
 */
async function fillAll(filled, { numeric, panels = ['house', 'fuels', 'systems', 'saved', 'verdict'] }) {
  const ids = [];
  for (const name of [...panels, null]) {
    const scope = name ? `#panel-${name}` : '.topbar';
    if (name) await tab(name);
    await openDetails(scope);
    for (const { id, maxLength } of await visibleInputs(scope, numeric)) {
      assert.ok(id, `every text-like input in ${scope} has an id`);
      const text = attack(filled.size, maxLength);
      await page.fill(`[id="${id}"]`, text);
      // the field holds the whole text: the attack is not cut short before it reaches the page
      assert.equal(await page.inputValue(`[id="${id}"]`), text, `${id} keeps what was typed`);
      filled.set(id, text);
      ids.push(id);
    }
  }
  return ids;
}

// ---------------------------------------------------------------------------
// Requests

/**
 * Whether a request may be made. Allowed: this server's origin; a blob: URL the page made itself with
 * URL.createObjectURL (the quote or CSV file it offers for download). No data: URL is allowed: the page makes none.
 */
function allowed(url) {
  if (url.startsWith('blob:')) return seen.blob.includes(url);
  return new URL(url).origin === origin;
}

function assertOwnOrigin(list, where) {
  const foreign = list.filter((r) => !allowed(r.url)).map((r) => `${r.byServiceWorker ? 'service worker' : 'page'}: ${r.url}`);
  assert.deepEqual(foreign, [], `${where}: requests to another origin (or a data:/blob: URL the page did not make)`);
}

// ---------------------------------------------------------------------------

describe('the page asks only its own server', () => {
  test('loading, the demo verdict, the price draws, the lab, export, print and the kiosk', { timeout: TIMEOUT }, async () => {
    await page.goto(server.url);
    await settled();
    await analysed();
    await controlled();
    await runDraws();
    assert.equal(await runLab('C3H8'), 'done');
    await exported();
    await page.emulateMedia({ media: 'print' });
    assert.ok(await page.isVisible('#quote-sheet'), 'the quote sheet is what prints');
    await page.emulateMedia({ media: 'screen' });
    await page.goto(`${server.url}index.html?kiosk=1&prices=prices/current.json`);
    await page.waitForFunction(() => document.body.dataset.kiosk === 'ready');
    await page.tap('[data-action="kiosk-size"][data-value="medium"]');
    await page.waitForSelector('#kiosk-results li');
    await flushReports();

    // the recorder hears workers and the service worker: without that, an empty list of strangers would prove nothing
    const urls = requests.map((r) => r.url);
    assert.ok(urls.some((u) => /fuelwright_core\.[0-9a-f]{16}\.wasm$/.test(u)), 'the module fetched by a worker was heard');
    assert.ok(requests.some((r) => r.byServiceWorker), 'the service worker\'s own requests (its precache) were heard');
    assert.ok(urls.some((u) => u.endsWith('/prices/current.json')), 'the kiosk\'s price file was heard');
    assert.ok(pageRequests.length > 0 && pageRequests.every((p) => urls.includes(p.url)), 'the page\'s requests are among the context\'s');
    assert.ok(seen.blob.length > 0, 'the export made its file as a blob: URL');
    assertOwnOrigin(requests, 'context');
    assertOwnOrigin(pageRequests, 'page');
    // an attempt the page's CSP stopped before it became a request is still an attempt
    assert.deepEqual(newlyAdded(seen.violation), [], 'blocked attempts to load from elsewhere');
    // the service worker and every worker the page started are this site's scripts
    for (const worker of [...context.serviceWorkers(), ...page.workers()]) {
      assert.equal(new URL(worker.url()).origin, origin, `worker ${worker.url()}`);
    }
    assert.ok(context.serviceWorkers().length >= 1, 'the service worker is running');
    assert.deepEqual(consoleErrors, []);
  });
});

describe('text typed into the page stays text', () => {
  const filled = new Map();

  test('an attack in every text field of every panel runs nowhere and shows literally', { timeout: TIMEOUT }, async () => {
    await page.goto(server.url);
    await settled();
    await buildQuote();
    const typed = await fillAll(filled, { numeric: false });
    // every kind of text the quote holds got an attack (the list is derived from the page, this only checks it is complete)
    for (const id of ['f-quote-customer', 'f-quote-site', 'f-quote-prepared-by', 'f-quote-notes', 'f-title', 'f-fuels-0-fixed-charges-0-label',
      'f-fuels-1-fuel-name', 'f-fuels-1-fuel-id', 'f-fuels-1-fuel-formula', 'f-systems-0-label', 'f-systems-1-label', 'lab-input', 'quote-search', 'currency']) {
      assert.ok(typed.includes(id), `${id} was among the text fields found: ${typed.join(', ')}`);
    }
    await labQuotesTheFormula(filled.get('lab-input'));
    // the mixture and ultimate-analysis fields of a custom fuel appear with their kind
    for (const kind of ['mixture', 'ultimate']) {
      await tab('fuels');
      await page.tap(`label[for="f-fuels-1-fuel-kind-${kind}"]`);
      const id = `f-fuels-1-fuel-${kind}`;
      const text = attack(filled.size);
      await page.fill(`[id="${id}"]`, text);
      filled.set(id, text);
    }
    await page.tap('label[for="f-fuels-1-fuel-kind-formula"]');
    await page.fill('#f-fuels-1-fuel-formula', filled.get('f-fuels-1-fuel-formula'));
    await tab('verdict');
    await settled('errors');
    const doc = await exported();
    // the exported file carries the text exactly as typed
    assert.equal(doc.quote.customer, filled.get('f-quote-customer'));
    assert.equal(doc.quote.notes, filled.get('f-quote-notes'));
    assert.equal(doc.options[0].label, filled.get('f-systems-0-label'));
    assert.equal(doc.options[0].fixed_charges[0].label, filled.get('f-fuels-0-fixed-charges-0-label'));
    await tab('fuels');
    await assertCoreMessagesShown(doc, 'a custom fuel whose formula is an attack');
    await assertNothingRan('attacks in every text field');
  });

  test('with a valid formula the verdict, print sheet and saved quotes show every text literally', { timeout: TIMEOUT }, async () => {
    await tab('fuels');
    await page.fill('#f-fuels-1-fuel-id', 'test-fuel');
    await page.fill('#f-fuels-1-fuel-formula', 'C2H5OH');
    filled.set('f-fuels-1-fuel-id', 'test-fuel');
    filled.set('f-fuels-1-fuel-formula', 'C2H5OH');
    await tab('verdict');
    await settled();
    await drawn();
    const doc = await exported();
    const cli = await cliEvaluate(doc);
    assert.deepEqual(cli.errors, []);
    await assertVerdictShows(cli, [filled.get('f-systems-0-label'), filled.get('f-systems-1-label')], filled.get('f-fuels-1-fuel-name'),
      { draws: true, economics: true });
    await assertSheetShows({ customer: filled.get('f-quote-customer'), site: filled.get('f-quote-site'), notes: filled.get('f-quote-notes'),
      prepared_by: filled.get('f-quote-prepared-by'), title: filled.get('f-title') }, [filled.get('f-fuels-1-fuel-name')]);
    await assertTraceShows(cli.options[0].id, filled.get('f-fuels-0-fixed-charges-0-label'));
    await tab('systems');
    assert.deepEqual(await textsOf('.system-card h3'), [filled.get('f-systems-0-label'), filled.get('f-systems-1-label')], 'system headings');
    await tab('saved');
    await page.fill('#quote-search', filled.get('f-quote-customer'));
    await page.waitForFunction(() => document.querySelectorAll('#quote-list li').length === 1);
    // the search itself is text: the quote whose customer is exactly the attack is found
    await assertShows('#quote-list .q-customer', filled.get('f-quote-customer'), 'the saved quote\'s customer');
    await assertShows('#quote-list .q-site', filled.get('f-quote-site'), 'the saved quote\'s site');
    await assertNothingRan('the verdict of a quote full of attacks');
  });

  test('after a reload the saved text comes back literally into the fields and headings', { timeout: TIMEOUT }, async () => {
    await page.waitForTimeout(600);  // past the autosave debounce
    await page.reload();
    await settled();
    for (const [id, text] of filled) {
      // not part of the quote (the lab, the saved-quote search, the names a climate or a price list is about to be kept under), or kept only for their kind
      if (['lab-input', 'quote-search', 'currency', 'climate-keep-name', 'price-list-name'].includes(id) || id.endsWith('-mixture') || id.endsWith('-ultimate')) continue;
      assert.equal(await page.inputValue(`[id="${id}"]`), text, `${id} after a reload`);
    }
    await tab('fuels');
    assert.equal((await textsOf('.fuel-card h3'))[1], filled.get('f-fuels-1-fuel-name'), 'the custom fuel\'s heading');
    // a price list kept under a name full of markup lists that name as text
    await page.fill('#price-list-name', attack(40, 80));
    await page.tap('[data-action="price-list-keep"]');
    await page.waitForSelector('#price-list-items');
    await assertAmong('#price-list-items strong', attack(40, 80), 'the kept price list\'s name');
    await tab('systems');
    const fuelChoices = await textsOf('#f-systems-1-fuel-key option');
    assert.ok(fuelChoices.includes(filled.get('f-fuels-1-fuel-name')), `the fuel choices: ${JSON.stringify(fuelChoices)}`);
    await assertNothingRan('the reloaded quote');
  });

  test('an attack in every number field (every demand method and climate form) runs nowhere', { timeout: TIMEOUT }, async () => {
    const numbers = new Map();
    await tab('fuels');
    await page.selectOption('#lab-kind', 'ultimate');  // shows the lab's moisture field
    await fillAll(numbers, { numeric: true });
    await tab('house');
    await page.selectOption('#f-climate-mode', 'monthly_mean');
    await page.tap('label[for="f-demand-method-heat-loss"]');
    await page.tap('label[for="f-demand-gains-mode-internal_gains"]');
    await fillAll(numbers, { numeric: true, panels: ['house'] });
    await page.tap('label[for="f-demand-ua-mode-design"]');
    await fillAll(numbers, { numeric: true, panels: ['house'] });
    await page.tap('label[for="f-demand-method-bills"]');
    await page.tap('[data-action="add-bill"]');
    await fillAll(numbers, { numeric: true, panels: ['house'] });
    // the bills are matched to a system by its label, shown as a choice
    const billChoices = await textsOf('#f-demand-bills-option option');
    assert.ok(billChoices.includes(filled.get('f-systems-0-label')), `the bill's system choices: ${JSON.stringify(billChoices)}`);
    for (const id of ['f-demand-annual-useful-heat-value', 'f-fuels-0-price-amount', 'f-systems-0-system-efficiency-value', 'f-uncertainty-draws',
      'f-systems-0-installed-cost', 'f-climate-monthly-mean-0', 'f-demand-ua-value', 'f-demand-design-heat-loss-value', 'f-demand-bills-0-quantity', 'lab-moisture']) {
      assert.ok(numbers.has(id), `${id} was among the number fields found`);
    }
    await page.waitForTimeout(500);
    await assertNothingRan('attacks in every number field');
  });
});

/** A new quote with a catalog fuel (with a fixed charge), a custom fuel, two systems, and costs and price draws switched on. */
async function buildQuote() {
  await tab('saved');
  await page.tap('[data-action="new-quote"]');
  await page.waitForFunction(() => document.querySelector('#verdict-body').dataset.state === 'empty');
  await tab('fuels');
  await page.selectOption('#add-fuel-choice', 'natural-gas');
  await page.tap('[data-action="add-fuel"]');
  await page.fill('#f-fuels-0-price-amount', '1.25');
  await page.tap('[data-action="add-charge"]');
  await page.fill('#f-fuels-0-fixed-charges-0-amount-per-month', '12');
  await page.selectOption('#add-fuel-choice', 'custom');
  await page.tap('[data-action="add-fuel"]');
  await page.fill('#f-fuels-1-price-amount', '2');
  await page.tap('label[for="f-uncertainty-enabled"]');
  await page.waitForSelector('#f-uncertainty-draws');
  await tab('systems');
  await page.selectOption('#add-system-kind', 'furnace');
  await page.tap('[data-action="add-system"]');
  await page.selectOption('#add-system-kind', 'boiler');
  await page.tap('[data-action="add-system"]');
  await page.selectOption('#f-systems-1-fuel-key', { label: 'Custom fuel' });
  await page.tap('label[for="f-economics-enabled"]');
  await page.waitForSelector('#f-systems-0-installed-cost');
  await tab('house');
  await page.fill('#f-demand-annual-useful-heat-value', '60');
}

/** The lab's message for a formula that is an attack is the core's, shown as text. */
async function labQuotesTheFormula(text) {
  await tab('fuels');
  await page.tap('#lab-submit');
  await page.waitForFunction(() => document.querySelector('#lab-result')?.dataset.state === 'error');
  const { json } = await cliJson('heating-value', '--formula', text);
  assert.ok(json.errors.length > 0, 'the core refuses the formula');
  await assertShows('#lab-error', json.errors.map((e) => e.message).join('\n'), 'the lab shows the core\'s message');
}

/** The verdict's rows, headline and price draws show the options' labels and fuel names as the core returned them. */
async function assertVerdictShows(cli, labels, fuelName, { draws = false, economics = false } = {}) {
  await tab('verdict');
  assert.deepEqual(cli.options.map((o) => o.label).sort(), [...labels].sort(), 'the core returns the labels unchanged');
  for (const o of cli.options) {
    await assertShows(`#verdict-table tr[data-option="${o.id}"] .name`, o.label, 'an option\'s label in the ranked table');
    await assertShows(`#verdict-table tr[data-option="${o.id}"] th .sub`, o.fuel_name, 'an option\'s fuel in the ranked table');
    if (draws) await assertShows(`#uncertainty-table tr[data-option="${o.id}"] th`, o.label, 'an option\'s label among the price draws');
    if (economics) await assertShows(`#economics-table tr[data-option="${o.id}"] .name`, o.label, 'an option\'s label in the costs over the years');
  }
  if (fuelName) assert.ok(cli.options.some((o) => o.fuel_name === fuelName), 'the custom fuel\'s name comes back from the core');
  const best = cli.options.find((o) => o.id === cli.ranking[0].id);
  await assertShows('#best-option', best.label, 'the headline');
  await assertAmong('#summary-text', best.label, 'the summary bar');
  await assertAmong('#sweep-fuel option', fuelName ?? cli.options[0].fuel_name, 'the fuel chooser of the price chart');
}

/** The quote sheet (what prints) shows the quote's texts and the fuels' and systems' names. */
async function assertSheetShows(quote, fuelNames) {
  await page.emulateMedia({ media: 'print' });
  try {
    assert.ok(await page.isVisible('#quote-sheet'), 'the quote sheet prints');
    await assertShows('#sheet-customer', quote.customer, 'the customer on the sheet');
    await assertShows('#sheet-site', quote.site, 'the site on the sheet');
    await assertShows('#quote-sheet .notes', quote.notes, 'the notes on the sheet');
    await assertShows('#quote-sheet h1', quote.title, 'the title on the sheet');
    await assertAmong('#quote-sheet .who dd', quote.prepared_by, 'who prepared the sheet');
    for (const name of fuelNames) await assertAmong('#quote-sheet .assumptions dt', name, 'a fuel among the sheet\'s assumptions');
    for (const label of await textsOf('#verdict-table .name')) await assertAmong('#quote-sheet .print-table td', label, 'an option on the sheet');
  } finally {
    await page.emulateMedia({ media: 'screen' });
  }
}

/** The trace of an option's annual cost names its fixed charge as text. */
async function assertTraceShows(optionId, chargeLabel) {
  await tab('verdict');
  await page.tap(`#verdict-table tr[data-option="${optionId}"] button.num[data-key="annual_cost"]`);
  await page.waitForSelector('#trace-dialog[open] #trace-steps li');
  await assertAmong('#trace-steps li', chargeLabel, 'the fixed charge in the trace');
  await page.tap('#trace-close');
}

// ---------------------------------------------------------------------------

describe('an imported quote file stays text', () => {
  /** custom-fuels.json with an attack in every text a scenario holds. */
  function hostileScenario() {
    const doc = JSON.parse(readFileSync(join(root, 'data/examples/custom-fuels.json'), 'utf8'));
    doc.title = attack(0);
    doc.description = attack(1);
    doc.quote = { ...doc.quote, customer: attack(2), site: attack(3), prepared_by: attack(4), notes: attack(5) };
    doc.options.forEach((o, i) => {
      o.label = attack(10 + i);
      o.fuel.name = attack(20 + i);
      o.fixed_charges = [{ label: attack(30 + i), amount_per_month: 5 + i }];
    });
    return doc;
  }

  /** Imports a file of that name and text from the saved panel: that import's {ok, text}. */
  async function importFile(name, text) {
    await tab('saved');
    return importAndWait(page, { name, mimeType: 'application/json', buffer: Buffer.from(text) });
  }

  test('customer, site, notes, option labels, fuel names and charges of an imported file show literally', { timeout: TIMEOUT }, async () => {
    const doc = hostileScenario();
    const cli = await cliEvaluate(doc);
    assert.deepEqual(cli.errors, []);
    const name = `${attack(40, 60)}.json`;
    assert.equal((await importFile(name, JSON.stringify(doc))).ok, true);
    await assertAmong('#import-msg', name, 'the imported file\'s name');
    await settled();
    await assertVerdictShows(cli, doc.options.map((o) => o.label), doc.options[0].fuel.name);
    for (const o of doc.options) assert.ok(cli.options.some((r) => r.fuel_name === o.fuel.name), `${o.id}: the fuel name comes back unchanged`);
    await assertSheetShows({ ...doc.quote, title: doc.title }, doc.options.map((o) => o.fuel.name));
    await assertTraceShows(doc.options[0].id, doc.options[0].fixed_charges[0].label);
    await tab('fuels');
    assert.deepEqual(await textsOf('.fuel-card h3'), doc.options.map((o) => o.fuel.name), 'fuel headings');
    assert.equal(await page.inputValue('#f-fuels-0-fixed-charges-0-label'), doc.options[0].fixed_charges[0].label);
    await tab('systems');
    assert.deepEqual(await textsOf('.system-card h3'), doc.options.map((o) => o.label), 'system headings');
    await tab('house');
    for (const key of ['customer', 'site', 'notes']) assert.equal(await page.inputValue(`#f-quote-${key}`), doc.quote[key], `${key} field`);
    await tab('saved');
    await page.fill('#quote-search', '');
    await assertAmong('#quote-list .q-customer', doc.quote.customer, 'the saved quote\'s customer');
    await assertNothingRan('an imported file full of attacks');
  });

  test('a file the core refuses shows the core\'s messages, quoting the file, as text', { timeout: TIMEOUT }, async () => {
    const doc = hostileScenario();
    doc.options[1].fuel = attack(50, 60);  // not a catalog fuel: the core names it in its message
    doc.options[2].price.per = attack(51, 60);  // not a unit: named too
    assert.equal((await importFile('refused-by-the-core.json', JSON.stringify(doc))).ok, true);
    await tab('verdict');
    await settled('errors');
    const errors = await assertCoreMessagesShown(doc, 'a scenario with an unknown fuel and unit');
    assert.ok(errors.some((e) => e.message.includes(doc.options[1].fuel)), 'the core quotes the unknown fuel back');
    await assertNothingRan('the core\'s messages about a file full of attacks');
  });

  test('a file that is not JSON, or not a scenario, is refused with its name shown literally', { timeout: TIMEOUT }, async () => {
    for (const [name, text] of [[`${attack(0, 80)}.json`, 'this is { not JSON'], [`${attack(2, 80)}.json`, JSON.stringify({ schema: 'fuelwright.other/1', options: [] })],
      [`${attack(4, 80)}.json`, JSON.stringify({ schema: 'fuelwright.scenario/1', options: attack(5) })]]) {
      const refused = await importFile(name, text);
      assert.equal(refused.ok, false);
      assert.ok(refused.text.startsWith(`Could not import “${name}”: `), 'the name is shown exactly');
      // the name is shown exactly, with nothing before it that made markup of it
      assert.equal(await page.locator('#import-msg *').count(), 0, 'the message is plain text');
    }
    await assertNothingRan('refused files with attacks in their names');
  });
});

// ---------------------------------------------------------------------------

describe('a kiosk price file stays text', () => {
  async function kiosk(query, state) {
    await page.goto(`${server.url}index.html?kiosk=1${query}`);
    await page.waitForFunction(() => document.body.dataset.kiosk);
    assert.equal(await page.evaluate(() => document.body.dataset.kiosk), state, await page.textContent('#kiosk'));
  }

  test('the supplier, its contact and quote text, price notes and charge labels show literally', { timeout: TIMEOUT }, async () => {
    const { json: check } = await cliJson('check-prices', join(work, 'site/prices/hostile.json'), '--today', day());
    assert.deepEqual(check.errors, [], 'the file is valid: only its text is hostile');
    await kiosk('&prices=prices/hostile.json', 'ready');
    await assertShows('#kiosk-supplier-name', hostile.supplier.name, 'the supplier');
    await assertShows('#kiosk-contact', hostile.supplier.contact, 'the contact');
    await assertShows('#kiosk-quote-text', hostile.supplier.quote_text, 'the supplier\'s line');
    await assertShows('#kiosk-brand-name', hostile.supplier.name, 'the supplier in the header');
    await assertShows('#kiosk-brand-contact', hostile.supplier.contact, 'the contact line in the header');
    await assertAmong('#kiosk-help span', `Call us: ${hostile.supplier.phone}`, 'the phone in the header');
    await assertAmong('#kiosk-help span', hostile.supplier.help_text, 'the help line in the header');
    for (const p of hostile.prices) {
      await assertAmong('#kiosk-prices td.hint', p.note, `${p.fuel} per ${p.unit}: its note`);
      for (const c of p.fixed_charges ?? []) await assertAmong('#kiosk-prices td.hint', c.label, `${p.fuel}: its fixed charge`);
    }
    const staffNotes = await page.evaluate((text) => document.body.textContent.includes(text), hostile.notes);
    assert.equal(staffNotes, false, 'the notes for the supplier\'s staff are not shown to visitors');
    await page.tap('[data-action="kiosk-size"][data-value="medium"]');
    const id = 'gas-furnace-condensing-propane';
    await page.waitForSelector(`#kiosk-results li[data-option="${id}"]`);
    await page.tap(`#kiosk-results li[data-option="${id}"] button.num`);
    await page.waitForSelector('#trace-dialog[open] #trace-steps li');
    await assertAmong('#trace-steps li', hostile.prices.find((p) => p.fuel === 'propane').fixed_charges[0].label, 'the tank rental in the trace');
    await page.tap('#trace-close');
    await assertNothingRan('a price file full of attacks');
  });

  test('an invalid price file is refused with the validator\'s messages, quoting it, as text', { timeout: TIMEOUT }, async () => {
    const { json: check } = await cliJson('check-prices', join(work, 'site/prices/hostile-invalid.json'), '--today', day());
    assert.ok(check.errors.some((e) => e.message.includes(hostileInvalid.prices[0].fuel)), 'the validator quotes the unknown fuel');
    assert.ok(check.errors.some((e) => e.message.includes(hostileInvalid.currency)), 'the validator quotes the currency');
    await kiosk('&prices=prices/hostile-invalid.json', 'refused');
    const problems = await textsOf('#kiosk-refused li');
    for (const e of check.errors) {
      assert.ok(problems.includes(e.path ? `${e.path}: ${e.message}` : e.message), `${JSON.stringify(e.message)} in ${JSON.stringify(problems)}`);
    }
    await assertNothingRan('the refusal of an invalid price file');
  });

  test('a price file on another origin is refused, its address shown literally and never fetched', { timeout: TIMEOUT }, async () => {
    const elsewhere = `https://example.invalid/${attack(1, 80)}`;
    await kiosk(`&prices=${encodeURIComponent(elsewhere)}`, 'refused');
    await assertShows('#kiosk-refused .hint', elsewhere, 'the refused address');
    await assertNothingRan('a refused address with an attack in it');
    assert.ok(!requests.some((r) => new URL(r.url).hostname === 'example.invalid'), 'the other origin was not asked');
  });
});

// ---------------------------------------------------------------------------

describe('offline after load, nothing is fetched at all', () => {
  test('editing a price, switching tabs, the price draws, the lab and printing fetch nothing', { timeout: TIMEOUT }, async () => {
    await page.goto(server.url);
    await page.waitForSelector('[data-action="load-demo"]', { state: 'attached' });
    await tab('saved');
    await page.tap('[data-action="load-demo"]');
    await settled();
    await page.waitForTimeout(600);  // past the autosave debounce
    await page.reload();
    await settled();
    await analysed();
    await controlled();
    await quiet();
    const mark = { context: requests.length, page: pageRequests.length, server: server.requests.length };
    await context.setOffline(true);
    try {
      await useThePage();
      await page.waitForTimeout(1000);  // anything the page would fetch late
      // the strict reading: after load the page fetches nothing at all, not even from its service worker's cache
      assert.deepEqual(requests.slice(mark.context).map((r) => r.url), [], 'requests after load (context: pages, workers, service worker)');
      assert.deepEqual(pageRequests.slice(mark.page).map((r) => r.url), [], 'requests after load (page)');
      // The browser itself re-checks sw.js for an update after a navigation (the Service Workers spec's
      // soft update), outside the page and its workers, and the emulated offline state does not stop it; on a
      // real offline tablet it fails quietly. It is the only server hit allowed here, and only as that GET.
      const browserUpdateCheck = (line) => line === 'GET /sw.js';
      assert.deepEqual(server.requests.slice(mark.server).filter((line) => !browserUpdateCheck(line)), [],
        'requests that reached the server after load');
      await probeIsHeard(mark);
    } finally {
      await context.setOffline(false);
    }
  });
});

/** What a contractor does once the page is up: a price, the tabs, the price draws, the lab, the print sheet on A4. */
async function useThePage() {
  await tab('fuels');
  const price = await page.inputValue('#f-fuels-0-price-amount');
  await page.fill('#f-fuels-0-price-amount', String(Number(price) * 1.1));
  await tab('verdict');
  await settled();
  await analysed();
  for (const name of ['house', 'fuels', 'systems', 'saved', 'verdict']) await tab(name);
  await runDraws();
  assert.ok(await page.locator('#uncertainty-table button[data-key="p_cheapest"]').count() > 0, 'the price draws answered offline');
  assert.equal(await runLab('CH4'), 'done', 'the lab answered offline');
  await tab('verdict');
  await page.selectOption('#paper', 'a4');
  await page.emulateMedia({ media: 'print' });
  try {
    assert.ok(await page.isVisible('#quote-sheet'), 'the quote sheet prints offline');
    const a4 = await page.evaluate(() => [...document.styleSheets].some((s) => s.href?.endsWith('/paper-a4.css') && !s.disabled && s.cssRules.length > 0));
    assert.ok(a4, 'the A4 sheet\'s stylesheet is in force');
  } finally {
    await page.emulateMedia({ media: 'screen' });
  }
  await page.selectOption('#paper', 'letter');
}

/** A fetch made on purpose while offline is heard from the page and from the service worker: the empty lists above are not deafness. */
async function probeIsHeard(mark) {
  const failed = await page.evaluate(() => fetch('offline-probe.txt').then(() => false, () => true));
  assert.equal(failed, true, 'offline, a file the site does not ship cannot be fetched');
  await page.waitForTimeout(300);
  const heard = requests.slice(mark.context).filter((r) => r.url.endsWith('/offline-probe.txt'));
  assert.ok(heard.some((r) => !r.byServiceWorker), 'the page\'s probe was heard');
  assert.ok(heard.some((r) => r.byServiceWorker), 'the service worker\'s attempt to fetch the probe was heard');
}

describe('the whole run', () => {
  test('every request of every step above went to this server', { timeout: TIMEOUT }, async () => {
    await flushReports();
    assertOwnOrigin(requests, 'context');
    assertOwnOrigin(pageRequests, 'page');
    assert.deepEqual(seen.violation, [], 'blocked attempts to load from elsewhere, over the whole run');
  });
});
