// The site behind nginx with the sample configuration deploy/nginx.conf, and
// the kiosk in Chromium against it: a copy of the built site with a current,
// an expired and an invalid supplier price file and a kiosk.json, served by
// nginx in the foreground on a free loopback port (temporary prefix, pid and
// logs); the response headers (CSP, types, caching, isolation); the kiosk
// showing the file's supplier and dates with its prices locked, a verdict
// equal to the CLI's, the idle reset, the expired banner, the refusal of an
// invalid file, blocked navigation; and a Monte Carlo stopped by its flag.
import assert from 'node:assert/strict';
import { spawn } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, connect } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { TOUCH, launchTablet, watchPage } from '../browser/chromium-page.js';
import { cliJson, siteDir } from '../node/helpers.js';
import { cliEvaluate, close, money } from '../browser/scenario-fixture.js';

const TIMEOUT = 30_000;
const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');
const NGINX = process.env.FUELWRIGHT_NGINX ?? '/usr/sbin/nginx';
const ARTIFACTS = resolve(process.env.FUELWRIGHT_ARTIFACTS ?? join(siteDir, '..', 'test-artifacts'));
const sleep = (ms) => new Promise((done) => setTimeout(done, ms));

/** YYYY-MM-DD of today plus `days`, in local time as the page reads it. */
function day(days = 0) {
  const d = new Date();
  d.setDate(d.getDate() + days);
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

const sample = JSON.parse(readFileSync(join(root, 'data/examples/supplier-prices.json'), 'utf8'));
const current = { ...structuredClone(sample), effective: day(-30), expires: day(150) };
const expired = { ...structuredClone(sample), effective: day(-400), expires: day(-1) };
const invalidText = readFileSync(join(root, 'tests/fixtures/prices/bad-05-tiers-overlap.json'), 'utf8');
const invalidMessage = JSON.parse(readFileSync(join(root, 'tests/fixtures/prices/expected.json'), 'utf8'))
  .cases.find((c) => c.file === 'bad-05-tiers-overlap.json').message;

let work;
let served;
let nginx;
let nginxLog = '';
let base;
let profile;
let context;
let page;
const consoleErrors = [];

function freePort() {
  return new Promise((done, fail) => {
    const probe = createServer();
    probe.once('error', fail);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address();
      probe.close(() => done(port));
    });
  });
}

function listening(port, deadline) {
  return new Promise((done, fail) => {
    const attempt = () => {
      const socket = connect(port, '127.0.0.1');
      socket.once('connect', () => { socket.destroy(); done(); });
      socket.once('error', () => {
        socket.destroy();
        if (Date.now() > deadline) fail(new Error(`nginx did not listen on ${port}: ${nginxLog}`));
        else setTimeout(attempt, 100);
      });
    };
    attempt();
  });
}

/** The sample configuration with this test's port, folder and temporary paths, as a whole nginx.conf. */
function configFor(port) {
  const site = readFileSync(join(root, 'deploy/nginx.conf'), 'utf8');
  const server = site
    .replace(/^(\s*)listen\s+[^;]+;/m, `$1listen 127.0.0.1:${port};`)
    .replace(/^(\s*)root\s+[^;]+;/m, `$1root ${served};`)
    .replace(/^(\s*)server_name\s+[^;]+;/m, '$1server_name localhost;');
  assert.ok(server.includes(`listen 127.0.0.1:${port};`) && server.includes(`root ${served};`), 'deploy/nginx.conf has listen and root lines');
  const t = (name) => join(work, name);
  return [
    'daemon off;',
    'worker_processes 1;',
    `pid ${t('nginx.pid')};`,
    `error_log ${t('error.log')} warn;`,
    ...(process.getuid?.() === 0 ? ['user root;'] : []),
    'events { worker_connections 64; }',
    'http {',
    `  access_log ${t('access.log')};`,
    ...['client_body', 'proxy', 'fastcgi', 'uwsgi', 'scgi'].map((k) => `  ${k}_temp_path ${t(`${k}-temp`)};`),
    server,
    '}',
    '',
  ].join('\n');
}

before(async () => {
  mkdirSync(ARTIFACTS, { recursive: true });
  work = mkdtempSync(join(tmpdir(), 'fuelwright-nginx-'));
  served = join(work, 'site');
  cpSync(siteDir, served, { recursive: true, verbatimSymlinks: true });
  mkdirSync(join(served, 'prices'), { recursive: true });
  writeFileSync(join(served, 'prices/current.json'), JSON.stringify(current, null, 2));
  writeFileSync(join(served, 'prices/expired.json'), JSON.stringify(expired, null, 2));
  writeFileSync(join(served, 'prices/invalid.json'), invalidText);
  writeFileSync(join(served, 'kiosk.json'), JSON.stringify({ prices: 'prices/current.json', idle_seconds: 90 }));
  const port = await freePort();
  writeFileSync(join(work, 'nginx.conf'), configFor(port));
  nginx = spawn(NGINX, ['-p', `${work}/`, '-c', join(work, 'nginx.conf'), '-e', join(work, 'error.log')], { stdio: ['ignore', 'pipe', 'pipe'] });
  nginx.stdout.on('data', (chunk) => { nginxLog += chunk; });
  nginx.stderr.on('data', (chunk) => { nginxLog += chunk; });
  const exited = new Promise((done) => nginx.once('exit', (code) => done(code)));
  await Promise.race([listening(port, Date.now() + 10_000),
    exited.then((code) => { throw new Error(`nginx exited with ${code}: ${nginxLog}`); })]);
  base = `http://127.0.0.1:${port}/`;

  profile = mkdtempSync(join(tmpdir(), 'fuelwright-kiosk-'));
  ({ context, page } = await launchTablet(profile, TOUCH));
  watchPage(page, { consoleErrors });
  // a request that fails (net::ERR_FAILED for the price file while the kiosk starts was reported once) is an error too
  page.on('requestfailed', (request) => consoleErrors.push(`request failed: ${request.url()} ${request.failure()?.errorText ?? ''}`));
}, { timeout: TIMEOUT });

after(async () => {
  await context?.close().catch(() => {});
  if (nginx && nginx.exitCode === null) {
    const gone = new Promise((done) => nginx.once('exit', done));
    nginx.kill('SIGQUIT');
    await Promise.race([gone, sleep(5000)]);
    if (nginx.exitCode === null) {
      nginx.kill('SIGKILL');
      await Promise.race([gone, sleep(5000)]);
    }
  }
  if (profile) rmSync(profile, { recursive: true, force: true });
  if (work) rmSync(work, { recursive: true, force: true });
}, { timeout: TIMEOUT });

async function kiosk(query, state = 'ready') {
  await page.goto(`${base}index.html?kiosk=1${query}`);
  await page.waitForFunction(() => document.body.dataset.kiosk);
  assert.equal(await page.evaluate(() => document.body.dataset.kiosk), state, await page.textContent('#kiosk'));
}

async function chooseSize(size = 'medium') {
  await page.tap(`[data-action="kiosk-size"][data-value="${size}"]`);
  await page.waitForSelector('#kiosk-results li');
}

describe('the site behind nginx (deploy/nginx.conf)', () => {
  test('answers with the page\'s CSP, the right types and caching', { timeout: TIMEOUT }, async () => {
    const index = await fetch(`${base}index.html`);
    assert.equal(index.status, 200);
    const meta = /http-equiv="Content-Security-Policy" content="([^"]+)"/.exec(await index.text())[1];
    const header = index.headers.get('content-security-policy');
    const directives = (text) => text.split(';').map((d) => d.trim()).filter(Boolean);
    for (const directive of directives(meta)) assert.ok(directives(header).includes(directive), `header has ${directive}: ${header}`);
    assert.ok(directives(header).includes("script-src 'self' 'wasm-unsafe-eval'"), header);
    assert.ok(!header.includes('unsafe-inline') && !header.includes("'unsafe-eval'"), `no inline script or eval in the page: ${header}`);
    assert.match(index.headers.get('content-type'), /^text\/html/);
    assert.equal(index.headers.get('cache-control'), 'no-cache');
    assert.equal(index.headers.get('cross-origin-embedder-policy'), 'require-corp');

    const workerResponse = await fetch(`${base}worker.js`);
    const worker = await workerResponse.text();
    // the worker's own policy is the page's strict one: the module is linked without eval
    const glue = await (await fetch(`${base}fuelwright_core.mjs`)).text();
    assert.ok(!glue.includes('new Function'), 'the module glue builds no code at run time (-sDYNAMIC_EXECUTION=0)');
    const workerPolicy = directives(workerResponse.headers.get('content-security-policy'));
    const strict = "script-src 'self' 'wasm-unsafe-eval'";
    assert.ok(workerPolicy.includes(strict) && !workerPolicy.join(';').includes("'unsafe-eval'"), workerPolicy.join('; '));
    for (const directive of directives(meta).filter((d) => !d.startsWith('script-src'))) assert.ok(workerPolicy.includes(directive), directive);
    const wasmName = /const WASM_FILE = '([^']+)';/.exec(worker)[1];
    const mjsName = /from '\.\/([^']+\.mjs)';/.exec(worker)[1];
    assert.match(wasmName, /^fuelwright_core\.[0-9a-f]{16}\.wasm$/);
    const wasm = await fetch(`${base}${wasmName}`);
    assert.equal(wasm.headers.get('content-type'), 'application/wasm');
    assert.match(wasm.headers.get('cache-control'), /max-age=31536000.*immutable/);
    assert.ok(wasm.headers.get('content-security-policy'), 'every response carries the CSP');
    const mjs = await fetch(`${base}${mjsName}`);
    assert.match(mjs.headers.get('content-type'), /^text\/javascript/);
    const sw = await fetch(`${base}sw.js`);
    assert.match(sw.headers.get('content-type'), /^text\/javascript/);
    assert.equal(sw.headers.get('cache-control'), 'no-cache');
    const prices = await fetch(`${base}prices/current.json`);
    assert.match(prices.headers.get('content-type'), /^application\/json/);
    assert.equal((await fetch(`${base}.hidden`)).status, 403);
  });
});

describe('the kiosk in Chromium behind nginx', () => {
  test('shows the price file\'s supplier and dates, locks its prices and gives the CLI\'s numbers', { timeout: TIMEOUT }, async () => {
    await kiosk('&prices=prices/current.json');
    assert.equal(await page.evaluate(() => crossOriginIsolated), true, 'the headers make the page cross-origin isolated');
    assert.equal(await page.getAttribute('#kiosk-effective', 'data-date'), current.effective);
    const [y, m, d] = current.effective.split('-').map(Number);
    assert.equal(await page.textContent('#kiosk-effective'),
      new Intl.DateTimeFormat('en-US', { dateStyle: 'long', timeZone: 'UTC' }).format(Date.UTC(y, m - 1, d)));
    assert.equal(await page.getAttribute('#kiosk-expires', 'data-date'), current.expires);
    assert.equal(await page.textContent('#kiosk-supplier-name'), current.supplier.name);
    assert.equal(await page.textContent('#kiosk-contact'), current.supplier.contact);
    // the header is the supplier's: its name and contact line, "Call us" and where to ask, from the file
    assert.equal(await page.textContent('#kiosk-brand-name'), current.supplier.name);
    assert.equal(await page.textContent('#kiosk-brand-contact'), current.supplier.contact);
    assert.equal(await page.textContent('#kiosk-help'), `Call us: ${current.supplier.phone}${current.supplier.help_text}`);
    assert.equal(await page.isVisible('.save-line'), false, 'nothing is saved at the kiosk');
    assert.equal(await page.locator('#kiosk-expired').count(), 0);

    // prices locked: read-only fields holding the file's amounts
    const locked = await page.$$eval('#kiosk-prices input.locked', (inputs) => inputs.map((i) => ({ readOnly: i.readOnly, fuel: i.dataset.fuel,
      unit: i.dataset.unit, amount: i.dataset.amount === undefined ? null : Number(i.dataset.amount) })));
    assert.equal(locked.length, current.prices.length);
    for (const [i, p] of current.prices.entries()) {
      assert.equal(locked[i].readOnly, true, `${p.fuel} per ${p.unit} is read-only`);
      assert.equal(locked[i].fuel, p.fuel);
      assert.equal(locked[i].unit, p.unit);
      if (p.amount !== undefined) assert.equal(locked[i].amount, p.amount);
    }
    const before = await page.inputValue('#kiosk-prices input.locked >> nth=1');
    await page.tap('#kiosk-prices input.locked >> nth=1');
    await page.keyboard.type('9');
    assert.equal(await page.inputValue('#kiosk-prices input.locked >> nth=1'), before, 'typing does not change a locked price');

    await chooseSize('medium');
    // one tap, and the answer is in view (it used to land below the screen)
    await page.waitForFunction(() => {
      const box = document.querySelector('#kiosk-answer').getBoundingClientRect();
      return box.top >= 0 && box.top < innerHeight * 0.6;
    }, null, { timeout: 5000 });
    // the propane furnace: block-rate tiers and the tank rental come from the file
    const id = 'gas-furnace-condensing-propane';
    const shown = await page.$eval(`#kiosk-results li[data-option="${id}"] button.num`, (b) => ({ value: Number(b.dataset.value), text: b.textContent }));
    const catalog = (await cliJson('catalog')).json;
    const model = catalog.systems.find((s) => s.id === 'gas-furnace-condensing');
    const propane = current.prices.find((p) => p.fuel === 'propane');
    const cli = await cliEvaluate({
      schema: 'fuelwright.scenario/1',
      settings: { units: 'us', currency: current.currency },
      demand: { method: 'direct', annual_useful_heat: { value: 60, unit: 'MMBtu' } },
      options: [{ id, fuel: 'propane', price: { per: propane.unit, tiers: propane.tiers }, fixed_charges: propane.fixed_charges,
        system: { kind: model.kind, catalog: model.id, efficiency: model.typical } }],
    });
    assert.deepEqual(cli.errors, []);
    assert.ok(close(shown.value, cli.options[0].annual_cost), `${shown.value} vs the CLI's ${cli.options[0].annual_cost}`);
    assert.equal(shown.text, money(cli.options[0].annual_cost));

    // an option's trace opens from its number
    await page.tap(`#kiosk-results li[data-option="${id}"] button.num`);
    await page.waitForSelector('#trace-dialog[open] #trace-steps li');
    await page.tap('#trace-close');
    await page.screenshot({ path: join(ARTIFACTS, 'kiosk-nginx-current.png'), fullPage: true });

    // big touch targets, and nothing of the workspace: no tabs, no saved quotes, no export
    const small = await page.$$eval('#kiosk button, #kiosk input', (nodes) => nodes.filter((n) => n.offsetParent !== null)
      .map((n) => [n.id || n.textContent.trim().slice(0, 24), n.getBoundingClientRect().height]).filter(([, height]) => height < 55.5));
    assert.deepEqual(small, [], 'touch targets are at least 56 px high');
    assert.ok(await page.isHidden('.tabs'));
    assert.ok(await page.isHidden('#panel-saved'));
    assert.equal(await page.locator('[data-action="export-json"]:visible, [data-action="export-csv"]:visible, #import-file:visible').count(), 0);
    assert.deepEqual(consoleErrors, []);
  });

  test('links do not lead away from the kiosk', { timeout: TIMEOUT }, async () => {
    const start = page.url();
    await page.evaluate(() => {
      for (const [id, href] of [['away', 'https://example.invalid/'], ['file', 'data/fuels.json']]) {
        const a = document.createElement('a');
        a.id = id;
        a.href = href;
        a.textContent = id;
        document.querySelector('#kiosk').prepend(a);
      }
    });
    await page.tap('#away');
    await page.tap('#file');
    await sleep(300);
    assert.equal(page.url(), start);
    assert.ok(await page.locator('#kiosk-results li').count() > 0, 'the visitor\'s answer is still there');
  });

  test('starts over after the idle time, forgetting the visitor\'s entries', { timeout: TIMEOUT }, async () => {
    await kiosk('&prices=prices/current.json&idle=2');
    assert.match(await page.textContent('#kiosk-idle-note'), /after 2 seconds/);
    await chooseSize('large');
    await page.tap('[data-action="kiosk-current"][data-value="oil-boiler-heating-oil-2"]');
    await page.tap('#kiosk-price-electricity');
    await page.keyboard.type('0.16');
    await page.waitForSelector('#kiosk-results li[data-option="air-source-heat-pump-electricity"]');
    assert.equal(await page.inputValue('#kiosk-price-electricity'), '0.16');
    await page.waitForFunction(() => document.body.dataset.kioskReset === '1', null, { timeout: 6000 });
    assert.equal(await page.locator('#kiosk-results li').count(), 0);
    assert.equal(await page.locator('#kiosk [aria-pressed="true"]').count(), 1, 'only "not sure" stays pressed');
    assert.equal(await page.getAttribute('#kiosk [aria-pressed="true"]', 'data-value'), '');
    assert.equal(await page.inputValue('#kiosk-price-electricity'), '');
    await page.screenshot({ path: join(ARTIFACTS, 'kiosk-nginx-after-idle.png') });
  });

  test('an expired price file is shown with a warning banner', { timeout: TIMEOUT }, async () => {
    await kiosk('&prices=prices/expired.json', 'expired');
    assert.ok(await page.isVisible('#kiosk-expired'));
    const [y, m, d] = expired.expires.split('-').map(Number);
    assert.ok((await page.textContent('#kiosk-expired')).includes(
      new Intl.DateTimeFormat('en-US', { dateStyle: 'long', timeZone: 'UTC' }).format(Date.UTC(y, m - 1, d))));
    await chooseSize('small');
    await page.screenshot({ path: join(ARTIFACTS, 'kiosk-nginx-expired.png') });
  });

  test('an invalid price file is refused with the validator\'s message', { timeout: TIMEOUT }, async () => {
    await kiosk('&prices=prices/invalid.json', 'refused');
    const text = await page.textContent('#kiosk-refused');
    assert.match(text, /cannot be shown/);
    assert.ok(text.includes(invalidMessage), text);
    assert.equal(await page.locator('#kiosk-size').count(), 0);
    await page.screenshot({ path: join(ARTIFACTS, 'kiosk-nginx-refused.png') });
    await kiosk('&prices=https://example.invalid/prices.json', 'refused');
    assert.match(await page.textContent('#kiosk-refused'), /must come from this site/);
  });

  test('kiosk.json beside the site names the price file', { timeout: TIMEOUT }, async () => {
    await kiosk('');
    assert.equal(await page.getAttribute('#kiosk-effective', 'data-date'), current.effective);
    assert.match(await page.textContent('#kiosk-idle-note'), /after 90 seconds/);
  });

  // What is tested here is the flag crossing threads: set in the page, read by the worker's progress
  // callback in shared memory. It is set as the run is started, on a worker that has loaded the core. Setting it at the third progress message
  // raced the end of the run: on a loaded machine all 200,000 draws ended before the page handled that
  // message. A run stopped part way by its callback is tested in tests/node/analysis.test.js and
  // tests/core/economics_test.cpp.
  test('a Monte Carlo stops when its shared flag is set (cross-origin isolated)', { timeout: TIMEOUT }, async () => {
    await page.goto(`${base}index.html`);
    // Seen in two full runs of about eight: the page came up not cross-origin isolated (cause not found;
    // the headers are on every response and kept in the service worker's cache). It is said, and the
    // page loaded once more, so that what this test is about - the flag stopping the draws - is tested.
    if (!(await page.evaluate(() => globalThis.crossOriginIsolated))) {
      const controlled = await page.evaluate(() => Boolean(navigator.serviceWorker?.controller));
      console.log(`# the page was not cross-origin isolated (from the service worker: ${controlled}); loading it again`);
      await page.reload();
    }
    await page.waitForFunction(() => document.querySelector('#verdict-body')?.dataset.state === 'done');
    const run = await page.evaluate(async () => {
      const { CoreClient } = await import('./core-client.js');
      const client = new CoreClient();
      const doc = await (await fetch('data/examples/maple-hollow-heat-pump-bins.json')).json();
      doc.uncertainty.draws = 200000;
      // the worker is warmed first: a cancelled run has 1.5 s to answer, which must not be spent loading the core
      await client.units();
      const started = client.evaluateWithProgress(doc);
      started.cancel();
      const result = await started.promise;
      client.terminate();
      return { signalled: started.signalled, cancelled: result.uncertainty?.cancelled, draws: result.uncertainty?.draws, errors: result.errors,
        isolated: globalThis.crossOriginIsolated, controlled: Boolean(navigator.serviceWorker?.controller) };
    });
    assert.equal(run.signalled, true, `cross-origin isolated ${run.isolated}, page from the service worker ${run.controlled}`);
    assert.deepEqual(run.errors, []);
    assert.equal(run.cancelled, true);
    assert.ok(run.draws < 200000, `stopped after ${run.draws} draws`);
    assert.deepEqual(consoleErrors, []);
  });
});
