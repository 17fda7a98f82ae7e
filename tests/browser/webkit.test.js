// The core flow (core-flow.js) in WebKit: Debian's WebKitGTK WebDriver
// driving MiniBrowser, run under xvfb-run (WebKitGTK has no headless mode),
// through selenium-webdriver's plain W3C client (it downloads nothing when
// given the server's URL).
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { Builder, By, Key } from 'selenium-webdriver';
import remote from 'selenium-webdriver/remote/index.js';
import { findFreePort } from 'selenium-webdriver/net/portprober.js';

import { siteDir } from '../node/helpers.js';
import { CORE_FLOW } from './core-flow.js';
import { walk } from './quote-walk.js';
import { serve } from './server.js';

const TIMEOUT = 30_000;
const DRIVER = process.env.FUELWRIGHT_WEBKIT_DRIVER ?? '/usr/bin/WebKitWebDriver';
const ARTIFACTS = resolve(process.env.FUELWRIGHT_ARTIFACTS ?? join(siteDir, '..', 'test-artifacts'));

let server;
let service;
let webdriver;
const env = { shots: true, shot: (name) => join(ARTIFACTS, `webkit-${name}.png`) };

const driver = {
  go: (url) => webdriver.get(url),
  js: (expression) => webdriver.executeAsyncScript(
    `const done = arguments[arguments.length - 1];
     Promise.resolve().then(() => (${expression})).then((v) => done({ ok: true, v: JSON.stringify(v ?? null) }), (e) => done({ ok: false, e: String(e) }));`)
    .then((r) => { if (!r.ok) throw new Error(r.e); return JSON.parse(r.v); }),
  // a control brought to the middle of the screen and clicked through the DOM, as the Firefox driver does:
  // WebKitGTK's WebDriver clicks by position and lost a tap in about a third of the walk's runs while the page
  // repainted (a data-sheet point not added, a radio not chosen), which a person would simply tap again
  click: (css) => webdriver.executeScript(`const e = document.querySelector(arguments[0]); e.scrollIntoView({ block: 'center' });
    e.focus(); e.click();`, css),
  type: async (css, text) => {
    const element = await webdriver.findElement(By.css(css));
    await element.clear();
    // WebKitWebDriver drops a plain "\n": a line break is typed as the Enter key
    await element.sendKeys(text.replace(/\n/g, Key.ENTER));
  },
  select: (css, value) => webdriver.executeScript(
    'const s = document.querySelector(arguments[0]); s.value = arguments[1]; s.dispatchEvent(new Event("change", { bubbles: true }));', css, value),
  screenshot: async (path) => {
    await webdriver.executeAsyncScript('const d = arguments[0]; requestAnimationFrame(() => requestAnimationFrame(() => d()));');
    writeFileSync(path, Buffer.from(await webdriver.takeScreenshot(), 'base64'));
  },
};

before(async () => {
  mkdirSync(ARTIFACTS, { recursive: true });
  server = await serve(siteDir);
  env.url = server.url;
  env.goOffline = () => server.close();
  const port = await findFreePort();
  service = new remote.DriverService(DRIVER, { hostname: '127.0.0.1', port, args: [`--port=${port}`] });
  webdriver = await new Builder().usingServer(await service.start(10_000)).withCapabilities({ browserName: 'MiniBrowser' }).build();
  await webdriver.manage().setTimeouts({ script: TIMEOUT, pageLoad: TIMEOUT });
  await webdriver.manage().window().setRect({ width: 820, height: 1180 }).catch(() => {});
}, { timeout: TIMEOUT });

after(async () => {
  await webdriver?.quit().catch(() => {});
  await service?.kill();
  await server?.close();
}, { timeout: TIMEOUT });

describe('WebKit (WebKitGTK MiniBrowser)', () => {
  for (const [name, step] of CORE_FLOW) test(name, { timeout: TIMEOUT }, () => step(driver, env));
});

describe('WebKit: the issue-14 quote entered end to end', () => {
  test('the quote typed tab by tab is saved with every entry and gives the CLI\'s numbers', { timeout: 180_000 }, async () => {
    // its own server, so its own origin: a device with nothing saved yet, whatever the core flow left
    const own = await serve(siteDir);
    try {
      const { setup, quote } = await walk(driver, own.url);
      console.log(`# webkit: device set-up ${setup.taps} taps, ${setup.chars} characters; the quote ${quote.taps} taps, ${quote.chars} characters`);
      await driver.screenshot(join(ARTIFACTS, 'webkit-walk-verdict.png'));
    } finally {
      await own.close();
    }
  });
});
