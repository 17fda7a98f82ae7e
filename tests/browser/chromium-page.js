// Shared by the tests that drive Debian's Chromium with playwright-core: where it is, how it is
// started on a machine with no network, what a page reports, and waiting for the verdict.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

import { chromium } from 'playwright-core';

/** The browser (FUELWRIGHT_CHROMIUM, default Debian's /usr/bin/chromium). */
export const CHROMIUM = process.env.FUELWRIGHT_CHROMIUM ?? '/usr/bin/chromium';

/** Headless, no GPU, and none of the browser's own network traffic (updates, sync, QUIC). */
export const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/** Collects the page's console errors and uncaught errors, and dismisses (and collects) its dialogs. */
export function watchPage(page, { consoleErrors, dialogs }) {
  page.on('console', (message) => { if (message.type() === 'error') consoleErrors.push(message.text()); });
  page.on('pageerror', (error) => consoleErrors.push(String(error)));
  if (dialogs) page.on('dialog', (dialog) => { dialogs.push(dialog.message()); dialog.dismiss(); });
}

/** Waits until the verdict shows `state` with no progress bar, twice 250 ms apart (a later edit restarts it). */
export async function verdictSettled(page, state = 'done') {
  const ready = (want) => {
    const body = document.querySelector('#verdict-body');
    return body && body.dataset.state === want && document.querySelector('#progress').hidden;
  };
  await page.waitForFunction(ready, state);
  await page.waitForTimeout(250);
  await page.waitForFunction(ready, state);
}

/** Waits until the verdict is done and its charts are drawn for the same entries (they repaint the verdict once more). */
export async function chartsSettled(page) {
  await verdictSettled(page);
  await page.waitForFunction(() => {
    const body = document.querySelector('#verdict-body');
    return body.dataset.state === 'done' && body.dataset.analysis === body.dataset.generation && document.querySelector('#progress').hidden;
  });
}

/**
 * [px] How far the page is wider than `width`, the viewport set (0 when it fits). A phone's browser widens
 * its layout viewport to what the page lays out, so scrollWidth - clientWidth stays 0 there; the page's
 * width is compared with the one asked for instead.
 */
export async function sidewaysOverflow(page, width) {
  return page.evaluate((w) => Math.max(document.documentElement.scrollWidth, window.innerWidth) - w, width);
}

/** A phone-or-tablet touch screen at one device pixel per CSS pixel, as the tablet tests use. */
export const TOUCH = { hasTouch: true, isMobile: true, deviceScaleFactor: 1 };

/**
 * Chromium on its own profile folder with a tablet's portrait viewport (820x1180): {context, page}, with
 * 30 s for every wait; `options` add to or override playwright-core's launch options.
 */
export async function launchTablet(profileDir, options = {}) {
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS, viewport: { width: 820, height: 1180 }, timeout: 30_000, ...options,
  });
  context.setDefaultTimeout(30_000);
  const page = context.pages()[0] ?? await context.newPage();
  return { context, page };
}

/**
 * Gives `file` (a path or playwright-core's {name, mimeType, buffer}) to the import input `input`, or to
 * the saved panel's, and waits for that import's own message (the panel numbers them): {ok, text}.
 */
export async function importAndWait(page, file, input = '#import-file') {
  const before = await page.getAttribute('#import-msg', 'data-seq');
  await (typeof input === 'string' ? page.setInputFiles(input, file) : input.setInputFiles(file));
  await page.waitForFunction((seq) => {
    const msg = document.querySelector('#import-msg');
    return msg && !msg.hidden && msg.dataset.seq !== seq;
  }, before);
  return page.$eval('#import-msg', (msg) => ({ ok: msg.classList.contains('ok'), text: msg.textContent }));
}

/**
 * A tablet session on its own profile folder at `viewport` (768x1024 by default, touch), watched for
 * console errors: {context, page, consoleErrors, close()}; close() ends the browser and removes the
 * profile. `options` add to the launch options (acceptDownloads, …).
 */
export async function tabletSession(name, { viewport = { width: 768, height: 1024 }, ...options } = {}) {
  const profile = mkdtempSync(join(tmpdir(), `fuelwright-${name}-`));
  const { context, page } = await launchTablet(profile, { ...TOUCH, viewport, ...options });
  const consoleErrors = [];
  watchPage(page, { consoleErrors });
  return {
    context, page, consoleErrors,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
