// The printed quote sheet in headless Chromium with touch at 768x1024, driven as a person would:
// the demo quote (an invented contractor with a licence number and phone, quote number, prices
// holding until a date, a loan offered) with its heat pump made dual fuel with the gas furnace as
// backup by tapping the menu; then the sheet printed to PDF (Chromium's page.pdf) on US Letter and
// A4, read back with pdftotext: the company block, quote number, valid-until date, each option's
// net price and monthly payment, both fuels of the dual-fuel option, the acceptance lines. Page
// images (pdftoppm) go to build/test-artifacts. Everything in the demo is invented.
import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { tabletSession, verdictSettled } from './chromium-page.js';
import { siteDir } from '../node/helpers.js';
import { serve } from './server.js';

const TIMEOUT = 90_000;
const ARTIFACTS = resolve(process.env.FUELWRIGHT_ARTIFACTS ?? join(siteDir, '..', 'test-artifacts'));
const id = (path) => `#f${path.replace(/[^A-Za-z0-9]+/g, '-')}`;

let server;
let session;
let page;

before(async () => {
  mkdirSync(ARTIFACTS, { recursive: true });
  server = await serve(siteDir);
  session = await tabletSession('sheet');
  ({ page } = session);
}, { timeout: TIMEOUT });

after(async () => {
  await session?.close();
  await server?.close();
}, { timeout: TIMEOUT });

/** The sheet printed on `paper` ('letter' or 'a4'): {text, pages}; page images written as PNGs. */
async function printed(paper) {
  await page.tap('#tab-verdict');
  await page.selectOption('#paper', paper);
  await page.emulateMedia({ media: 'print' });
  const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
  await page.emulateMedia({ media: 'screen' });
  const file = join(ARTIFACTS, `sheet-${paper}.pdf`);
  writeFileSync(file, pdf);
  // in reading order, each run of white space one space (a cell's text may wrap)
  const text = execFileSync('pdftotext', ['-raw', file, '-'], { encoding: 'utf8' }).replace(/[ \t\n]+/g, ' ');
  execFileSync('pdftoppm', ['-png', '-r', '60', file, join(ARTIFACTS, `sheet-${paper}`)]);
  return { text, pages: text.split('\f').filter((p) => p.trim()) };
}

describe('The quote sheet on paper (Chromium, 768x1024 with touch)', () => {
  test("the demo's sheet carries the company, the quote's number and dates, net prices and both fuels of dual fuel", { timeout: TIMEOUT }, async () => {
    await page.goto(server.url);
    await verdictSettled(page);
    await page.tap('#tab-systems');
    const backup = id('/systems/2/system/backup');
    await page.selectOption(backup, 'gas-furnace');
    await page.waitForSelector(id('/systems/2/system/changeover/value'));
    await page.tap(id('/systems/2/system/changeover/value'));
    await page.type(id('/systems/2/system/changeover/value'), '25');
    await verdictSettled(page);
    for (const paper of ['letter', 'a4']) {
      const { text, pages } = await printed(paper);
      const first = pages[0];
      // the company block, the quote's number and its dates (all invented) on the first page
      assert.match(first, /^ ?Hollow Creek Heating & Cooling \(invented contractor\)/, 'the company heads the sheet');
      assert.match(first, /555-0142/);
      assert.match(first, /Licence MH-M-00417 \(invented\)/);
      assert.match(first, /Quote HC-0117/);
      assert.match(first, /Prices hold until\s+December 16, 2026/);
      // the heat pump: 14,000 installed less 2,000 incentives; 12,000 over 10 years at 7.9 % is 144.96 a month
      assert.match(text, /\$14,000\s+−\$2,000\s+\$12,000\s+\$144\.96 a month/);
      assert.match(text, /Invented Co\. model AH-36 \(invented\)/);
      // dual fuel: the heat pump's electricity and the furnace's gas, both
      assert.match(text, /Air-source heat pump, HSPF2 8\.5 \$[\d,]+ \$[\d.]+ [\d,.]+ kWh \+ [\d,.]+ therm/);
      assert.match(text, /Customer signature/);
      assert.doesNotMatch(text, /air-source-heat-pump|gas-furnace|degF|undefined|NaN/);
      assert.ok(pages.length <= 3, `${paper}: ${pages.length} pages`);
    }
    assert.deepEqual(session.consoleErrors, []);
  });
});
