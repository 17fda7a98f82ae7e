// The core flow (core-flow.js) in Firefox ESR through its built-in WebDriver
// BiDi (there is no geckodriver package): firefox-esr --headless
// --remote-debugging-port=0 prints the socket's address; the `ws` package
// speaks to it. Input goes through the page's DOM (value + input/change events).
import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { createInterface } from 'node:readline';
import { after, before, describe, test } from 'node:test';

import WebSocket from 'ws';

import { siteDir } from '../node/helpers.js';
import { CORE_FLOW } from './core-flow.js';
import { walk } from './quote-walk.js';
import { serve } from './server.js';

const TIMEOUT = 30_000;
const FIREFOX = process.env.FUELWRIGHT_FIREFOX ?? '/usr/bin/firefox-esr';
const ARTIFACTS = resolve(process.env.FUELWRIGHT_ARTIFACTS ?? join(siteDir, '..', 'test-artifacts'));

let server;
let firefox;
let profile;
let socket;
let contextId;
let nextId = 1;
const pending = new Map();
const env = { shots: true, shot: (name) => join(ARTIFACTS, `firefox-${name}.png`) };

function send(method, params = {}) {
  const id = nextId++;
  return new Promise((done, fail) => {
    pending.set(id, { done, fail });
    socket.send(JSON.stringify({ id, method, params }));
  });
}

function launch() {
  profile = mkdtempSync(join(tmpdir(), 'fuelwright-firefox-'));
  writeFileSync(join(profile, 'user.js'), [
    'user_pref("browser.shell.checkDefaultBrowser", false);',
    'user_pref("datareporting.policy.dataSubmissionEnabled", false);',
    'user_pref("app.update.enabled", false);',
    'user_pref("network.captive-portal-service.enabled", false);',
    'user_pref("browser.safebrowsing.update.enabled", false);',
  ].join('\n'));
  firefox = spawn(FIREFOX, ['--headless', '--remote-debugging-port=0', '--profile', profile, '--no-remote', 'about:blank'],
    { stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, MOZ_HEADLESS_WIDTH: '820', MOZ_HEADLESS_HEIGHT: '1180' } });
  return new Promise((done, fail) => {
    const timer = setTimeout(() => fail(new Error('Firefox did not announce WebDriver BiDi')), 20_000);
    const onLine = (line) => {
      const match = /WebDriver BiDi listening on (ws:\/\/\S+)/.exec(line);
      if (match) {
        clearTimeout(timer);
        done(match[1]);
      }
    };
    createInterface({ input: firefox.stderr }).on('line', onLine);
    createInterface({ input: firefox.stdout }).on('line', onLine);
    firefox.once('exit', (code) => fail(new Error(`Firefox exited with ${code}`)));
  });
}

async function evaluate(expression) {
  const reply = await send('script.evaluate', {
    expression: `Promise.resolve().then(() => (${expression})).then((v) => JSON.stringify(v ?? null))`,
    target: { context: contextId }, awaitPromise: true, resultOwnership: 'none',
  });
  if (reply.type === 'exception') throw new Error(reply.exceptionDetails?.text ?? 'script exception');
  return JSON.parse(reply.result.value);
}

const driver = {
  go: (url) => send('browsingContext.navigate', { context: contextId, url, wait: 'complete' }),
  js: evaluate,
  click: (css) => evaluate(`(() => { const e = document.querySelector(${JSON.stringify(css)}); e.scrollIntoView({ block: 'center' }); e.focus(); e.click(); return true; })()`),
  type: (css, text) => evaluate(`(() => { const e = document.querySelector(${JSON.stringify(css)}); e.focus(); e.value = ${JSON.stringify(text)};
    e.dispatchEvent(new Event('input', { bubbles: true })); e.dispatchEvent(new Event('change', { bubbles: true })); return true; })()`),
  select: (css, value) => evaluate(`(() => { const e = document.querySelector(${JSON.stringify(css)}); e.value = ${JSON.stringify(value)};
    e.dispatchEvent(new Event('change', { bubbles: true })); return true; })()`),
  screenshot: async (path) => {
    const { data } = await send('browsingContext.captureScreenshot', { context: contextId });
    writeFileSync(path, Buffer.from(data, 'base64'));
  },
};

before(async () => {
  mkdirSync(ARTIFACTS, { recursive: true });
  server = await serve(siteDir);
  env.url = server.url;
  env.goOffline = () => server.close();
  const address = await launch();
  socket = new WebSocket(`${address.replace(/\/$/, '')}/session`);
  await new Promise((done, fail) => { socket.once('open', done); socket.once('error', fail); });
  socket.on('message', (data) => {
    const message = JSON.parse(String(data));
    const entry = message.id !== undefined && pending.get(message.id);
    if (!entry) return;
    pending.delete(message.id);
    if (message.type === 'error') entry.fail(new Error(`${message.error}: ${message.message}`));
    else entry.done(message.result);
  });
  await send('session.new', { capabilities: {} });
  const tree = await send('browsingContext.getTree', {});
  contextId = tree.contexts[0].context;
  await send('browsingContext.setViewport', { context: contextId, viewport: { width: 820, height: 1180 } }).catch(() => {});
}, { timeout: TIMEOUT });

after(async () => {
  try { await send('session.end', {}); } catch { /* closing anyway */ }
  socket?.close();
  if (firefox && firefox.exitCode === null) {
    await new Promise((done) => { firefox.once('exit', done); firefox.kill(); setTimeout(done, 5000); });
  }
  await server?.close();
  if (profile) rmSync(profile, { recursive: true, force: true });
}, { timeout: TIMEOUT });

describe('Firefox ESR (WebDriver BiDi)', () => {
  for (const [name, step] of CORE_FLOW) test(name, { timeout: TIMEOUT }, () => step(driver, env));
});

describe('Firefox ESR: the issue-14 quote entered end to end', () => {
  test('the quote typed tab by tab is saved with every entry and gives the CLI\'s numbers', { timeout: 180_000 }, async () => {
    // its own server, so its own origin: a device with nothing saved yet, whatever the core flow left
    const own = await serve(siteDir);
    try {
      const { setup, quote } = await walk(driver, own.url);
      console.log(`# firefox: device set-up ${setup.taps} taps, ${setup.chars} characters; the quote ${quote.taps} taps, ${quote.chars} characters`);
      await driver.screenshot(join(ARTIFACTS, 'firefox-walk-verdict.png'));
    } finally {
      await own.close();
    }
  });
});
