// The quote of issue 14 entered end to end in headless Chromium with touch (quote-walk.js), as a
// person does it (taps and typing, no state put into the page) at 768x1024 and 390x844: the verdict
// equals the CLI's for the scenario the page saved; the taps and typed characters are counted and
// printed (target: at most 70 taps for the quote); the cut-off and changeover are kept through a
// reload, the JSON export and its import as a new quote; the sheet printed with page.pdf carries the
// company, the quote number, the valid-until date, the net prices and both fuels of dual fuel.
// Everything typed is invented.
import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { importAndWait, tabletSession, verdictSettled } from './chromium-page.js';
import { siteDir } from '../node/helpers.js';
import { QUOTE, reuseTemplates, savedScenario, walk } from './quote-walk.js';
import { serve } from './server.js';

const TIMEOUT = 240_000;
const ARTIFACTS = resolve(process.env.FUELWRIGHT_ARTIFACTS ?? join(siteDir, '..', 'test-artifacts'));
/** The most taps the quote may take (issue 14). */
const TAP_BUDGET = 70;

let server;
before(async () => {
  mkdirSync(ARTIFACTS, { recursive: true });
  server = await serve(siteDir);
}, { timeout: TIMEOUT });
after(async () => { await server?.close(); }, { timeout: TIMEOUT });

/** A driver on a playwright-core page that taps and types as a finger and a keyboard do. */
function tapDriver(page) {
  return {
    go: (url) => page.goto(url),
    js: (expression) => page.evaluate(`(async () => JSON.stringify(await (${expression}) ?? null))()`).then((v) => JSON.parse(v)),
    click: (css) => page.tap(css),
    type: async (css, text) => {
      await page.tap(css);
      await page.fill(css, '');
      await page.type(css, text);
    },
    select: (css, value) => page.selectOption(css, value),
    screenshot: (path) => page.screenshot({ path }),
  };
}

/** The sheet printed to PDF on US Letter: its text, each run of white space one space. */
async function printedText(page, name) {
  await page.tap('#tab-verdict');
  await page.emulateMedia({ media: 'print' });
  const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
  await page.emulateMedia({ media: 'screen' });
  const file = join(ARTIFACTS, `${name}.pdf`);
  writeFileSync(file, pdf);
  execFileSync('pdftoppm', ['-png', '-r', '60', file, join(ARTIFACTS, name)]);
  return execFileSync('pdftotext', ['-raw', file, '-'], { encoding: 'utf8' }).replace(/[ \t\n]+/g, ' ');
}

const cutoffs = (scenario) => scenario.options.filter((o) => o.system.cutoff || o.system.changeover)
  .map((o) => [o.id, o.system.cutoff, o.system.changeover ?? null]);

for (const viewport of [{ width: 768, height: 1024 }, { width: 390, height: 844 }]) {
  const size = `${viewport.width}x${viewport.height}`;
  describe(`The issue's quote entered by hand (Chromium, ${size} with touch)`, () => {
    test('entered in at most 70 taps, equal to the CLI, kept through reload, export and import, and printed', { timeout: TIMEOUT }, async () => {
      const session = await tabletSession(`walk-${viewport.width}`, { viewport, acceptDownloads: true });
      const { page } = session;
      try {
        const driver = tapDriver(page);
        const { setup, quote, scenario } = await walk(driver, server.url);
        console.log(`# ${size}: device set-up ${setup.taps} taps, ${setup.chars} characters; the quote ${quote.taps} taps, ${quote.chars} characters`);
        assert.ok(quote.taps <= TAP_BUDGET, `${quote.taps} taps`);
        // the bills name their system, one tap from its card
        await page.tap('#tab-house');
        assert.equal(await page.textContent('#bills-system-link'), 'Show Existing furnace, Natural gas (Systems tab)');
        await page.tap('#bills-system-link');
        await page.waitForFunction(() => document.activeElement?.id === 'f-systems-0-label');
        assert.equal(await page.getAttribute('#tab-systems', 'aria-selected'), 'true');
        await page.screenshot({ path: join(ARTIFACTS, `walk-${size}-verdict.png`) });

        // reload: the same scenario, cut-off and changeover included
        await page.reload();
        await verdictSettled(page);
        assert.deepEqual(await savedScenario(driver), scenario);

        // the JSON export carries them, and its import as a new quote gives them back
        await page.tap('#tab-saved');
        const [download] = await Promise.all([page.waitForEvent('download'), page.tap('[data-action="export-json"]')]);
        const exported = JSON.parse(readFileSync(await download.path(), 'utf8'));
        assert.deepEqual(cutoffs(exported), cutoffs(scenario));
        const file = { name: 'walk.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(exported)) };
        const imported = await importAndWait(page, file);
        assert.equal(imported.ok, true, imported.text);
        await verdictSettled(page);
        assert.deepEqual(cutoffs(await savedScenario(driver)), cutoffs(scenario));

        // the printed sheet
        const text = await printedText(page, `walk-${size}-sheet`);
        assert.match(text, new RegExp(QUOTE.company.replace(/[()]/g, '\\$&')));
        assert.match(text, /555-0177/);
        assert.match(text, /Quote Q-0001/);
        assert.match(text, /Prices hold until \w+ \d+, \d{4}/);
        assert.match(text, /\$14,500 −\$2,000 \$12,500/, 'the heat pump\'s net price');
        assert.match(text, /Dual fuel: air-source heat pump \+ furnace \(Natural gas\) \$[\d,]+ \$[\d.]+ [\d,.]+ kWh \+ [\d,.]+ therm/);
        assert.doesNotMatch(text, /air-source-heat-pump|furnace-natural-gas|degF|undefined|NaN/);

        // the prices and the heat pump kept on the device, and a second quote built from them
        const { keep, reuse } = await reuseTemplates(driver, scenario);
        console.log(`# ${size}: keeping the price list and the heat pump ${keep.taps} taps, ${keep.chars} characters; a new quote from them ${reuse.taps} taps`);
        // exported as a file and imported again (on this device: the names come back numbered)
        await page.tap('#tab-saved');
        const [shelfDownload] = await Promise.all([page.waitForEvent('download'), page.tap('[data-action="templates-export"]')]);
        const shelf = JSON.parse(readFileSync(await shelfDownload.path(), 'utf8'));
        assert.equal(shelf.schema, 'fuelwright.templates/1');
        assert.deepEqual(shelf.price_lists.map((l) => l.name), ['Winter 2026 prices']);
        assert.deepEqual(shelf.equipment.map((e) => e.name), [QUOTE.heatPump.equipment]);
        await page.setInputFiles('#templates-file', { name: 'shelf.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(shelf)) });
        await page.waitForFunction(() => document.querySelector('#templates-msg')?.textContent.startsWith('Imported 2'));
        assert.equal(await page.textContent('#templates-msg'),
          `Imported 2 from “shelf.json”: “Winter 2026 prices (2)”, “${QUOTE.heatPump.equipment} (2)”.`);
        await page.screenshot({ path: join(ARTIFACTS, `walk-${size}-saved.png`), fullPage: true });
        await page.tap('#tab-systems');
        await page.screenshot({ path: join(ARTIFACTS, `walk-${size}-systems.png`), fullPage: true });
        assert.deepEqual(session.consoleErrors, []);
      } finally {
        await session.close();
      }
    });
  });
}
