// Entries that need attention, in headless Chromium with touch, driven as a person would (taps
// and typing): a price typed as "1..45" (a doubled point) marks the verdict out of date at once and names the field
// until it reads again; an AFUE typed as 0.95 is asked about with a one-tap fix to 95 %; the
// verdict's list of fields to fix jumps to the field (its tab, in view, focused, nothing covering
// it), at 768x1024 and 390x844. Screenshots go to build/test-artifacts. The demo is invented.
import assert from 'node:assert/strict';
import { mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { sidewaysOverflow, tabletSession, verdictSettled } from './chromium-page.js';
import { siteDir } from '../node/helpers.js';
import { serve } from './server.js';

const TIMEOUT = 90_000;
const ARTIFACTS = resolve(process.env.FUELWRIGHT_ARTIFACTS ?? join(siteDir, '..', 'test-artifacts'));
const id = (path) => `#f${path.replace(/[^A-Za-z0-9]+/g, '-')}`;
const GAS_PRICE = id('/fuels/1/price/amount');
const GAS_AFUE = id('/systems/1/system/efficiency/value');

let server;
before(async () => {
  mkdirSync(ARTIFACTS, { recursive: true });
  server = await serve(siteDir);
}, { timeout: TIMEOUT });
after(async () => { await server?.close(); }, { timeout: TIMEOUT });

/** Opens the demo on a fresh profile at `viewport`: a tabletSession. */
async function open(viewport) {
  const session = await tabletSession('attention', { viewport });
  await session.page.goto(server.url);
  await verdictSettled(session.page);
  return session;
}

/** Taps a field and types into it as a person does (what was there first is cleared). */
async function typeInto(page, selector, text) {
  await page.tap(selector);
  await page.fill(selector, '');
  await page.type(selector, text);
}

describe('The demo on a phone (Chromium, 390x844 with touch)', () => {
  test('no tab is wider than the phone, with hot water and a time-of-use tariff open', { timeout: TIMEOUT }, async () => {
    const session = await open({ width: 390, height: 844 });
    const { page } = session;
    try {
      await page.tap('#tab-house');
      // the bar at the foot of an input tab: the cheapest option's cost a year is never cut
      const cost = await page.$eval('#summary-text .cost', (span) => ({ text: span.textContent, cut: span.scrollWidth > span.clientWidth }));
      assert.match(cost.text, /^cheapest at \$[\d,]+ a year$/);
      assert.equal(cost.cut, false, 'the cost a year shows whole');
      await page.tap(id('/demand/water_heating/enabled'));
      await page.tap('#tab-fuels');
      await page.tap('[data-path$="/price/time_of_use"]');
      await page.waitForSelector('[data-action="add-period"]');
      for (const tab of ['house', 'fuels', 'systems', 'verdict', 'saved']) {
        await page.tap(`#tab-${tab}`);
        const overflow = await sidewaysOverflow(page, 390);
        assert.ok(overflow <= 0, `the ${tab} tab is ${overflow} px wider than the phone`);
      }
      assert.deepEqual(session.consoleErrors, []);
    } finally {
      await session.close();
    }
  });
});

describe('A missing heat loss (Chromium, 768x1024 with touch)', () => {
  test('is said at the UA field, or at the design heat loss when that is how it is known', { timeout: TIMEOUT }, async () => {
    const session = await open({ width: 768, height: 1024 });
    const { page } = session;
    const expected = "is required: the house's heat-loss coefficient (UA), or its design heat loss with the indoor temperature";
    try {
      await page.tap('#tab-house');
      await page.tap('label[for="f-demand-method-heat-loss"]');
      const uaMsg = `${id('/demand/ua/value')}-msg`;
      await page.waitForFunction((sel) => document.querySelector(sel)?.hidden === false, uaMsg);
      assert.equal(await page.textContent(uaMsg), expected);
      assert.equal(await page.getAttribute(id('/demand/ua/value'), 'aria-invalid'), 'true');
      await page.tap('label[for="f-demand-ua-mode-design"]');
      const designMsg = `${id('/demand/design_heat_loss/value')}-msg`;
      await page.waitForFunction((sel) => document.querySelector(sel)?.hidden === false, designMsg);
      assert.equal(await page.textContent(designMsg), expected);
      // listed with the fields to fix, not as a path the page could not place
      assert.equal(await page.textContent('#verdict-field-errors button[data-action="jump-to-field"]'), 'Design heat loss (House)');
      assert.doesNotMatch(await page.textContent('#verdict-body'), /\/demand\/ua/);
      await typeInto(page, id('/demand/design_heat_loss/value'), '36000');
      await verdictSettled(page);
      assert.equal(await page.isHidden(designMsg), true);
      assert.deepEqual(session.consoleErrors, []);
    } finally {
      await session.close();
    }
  });
});

for (const viewport of [{ width: 768, height: 1024 }, { width: 390, height: 844 }]) {
  const size = `${viewport.width}x${viewport.height}`;
  describe(`Entries that need attention (Chromium, ${size} with touch)`, () => {
    test('an unreadable price marks the verdict out of date at once, naming the field, until it reads', { timeout: TIMEOUT }, async () => {
      const session = await open(viewport);
      const { page } = session;
      try {
        await page.tap('#tab-fuels');
        await typeInto(page, GAS_PRICE, '1..45');
        await page.waitForSelector('#verdict-stale', { state: 'attached' });
        assert.equal(await page.textContent(`${id('/fuels/1/price/amount')}-msg`), 'Not a number');
        assert.match(await page.textContent('#verdict-stale'),
          /^Out of date: Natural gas: Price \(USD\) cannot be read, so the figures below are for the earlier entries\.$/);
        assert.equal(await page.$eval('#verdict-body', (b) => b.classList.contains('stale')), true);
        assert.match(await page.textContent('#summary-text'), /^Out of date: Natural gas: Price \(USD\) cannot be read\.$/);
        // the card drawn anew (a fixed charge added) shows what was typed, not the last price read
        await page.tap('[data-action="add-charge"][data-fuel="/fuels/1"]');
        await page.waitForSelector(id('/fuels/1/fixed_charges/1/label'));
        assert.equal(await page.inputValue(GAS_PRICE), '1..45');
        assert.equal(await page.textContent(`${id('/fuels/1/price/amount')}-msg`), 'Not a number');
        await typeInto(page, GAS_PRICE, '1.45');
        await page.waitForSelector('#verdict-stale', { state: 'detached' });
        await verdictSettled(page);
        assert.equal(await page.$eval('#verdict-body', (b) => b.classList.contains('stale')), false);
        assert.deepEqual(session.consoleErrors, []);
      } finally {
        await session.close();
      }
    });

    test('an AFUE typed as 0.95 is asked about and fixed to 95 % in one tap', { timeout: TIMEOUT }, async () => {
      const session = await open(viewport);
      const { page } = session;
      try {
        await page.tap('#tab-systems');
        await typeInto(page, GAS_AFUE, '0.95');
        const question = `${GAS_AFUE}-msg`;
        await page.waitForFunction((sel) => document.querySelector(sel)?.textContent.includes('did you mean 95 %?'), question);
        assert.equal(await page.textContent(`${question} button.fix`), 'Use 95 %');
        await page.screenshot({ path: join(ARTIFACTS, `attention-afue-question-${size}.png`) });
        await page.tap(`${question} button.fix`);
        await verdictSettled(page);
        assert.equal(await page.inputValue(GAS_AFUE), '95');
        assert.equal(await page.isHidden(question), true);
        assert.equal(await page.$('#verdict-field-errors'), null);
        assert.deepEqual(session.consoleErrors, []);
      } finally {
        await session.close();
      }
    });

    test('bills pasted as a block become bill rows, and a line that is not a bill stays with its reason', { timeout: TIMEOUT }, async () => {
      const session = await open(viewport);
      const { page } = session;
      try {
        await page.tap('#tab-house');
        await page.tap('label[for="f-demand-method-bills"]');
        await page.waitForSelector('#bills-paste', { state: 'attached' });
        await page.tap('details:has(#bills-paste) > summary');
        // as a US gas statement prints them: each period starts on the day the last one ended (invented amounts)
        await page.fill('#bills-paste', '11/12/2025\t12/11/2025\t84\n12/11/2025\t1/13/2026\t131 therms\n1/13/2026 2/11/2026 abc');
        await page.tap('[data-action="paste-bills"]');
        await page.waitForFunction(() => document.querySelector('#bills-paste-msg')?.textContent.startsWith('Added 2 bills.'));
        assert.equal(await page.textContent('#bills-paste-msg'),
          'Added 2 bills.\nLine 3 (1/13/2026 2/11/2026 abc) was not added: "abc" is not a quantity.');
        assert.equal(await page.inputValue('#bills-paste'), '1/13/2026 2/11/2026 abc', 'the line not read stays to be corrected');
        assert.equal(await page.inputValue('#f-demand-bills-0-start'), '2025-11-12');
        assert.equal(await page.inputValue('#f-demand-bills-1-end'), '2026-01-13');
        assert.equal(await page.inputValue('#f-demand-bills-1-quantity'), '131');
        await page.screenshot({ path: join(ARTIFACTS, `attention-bills-pasted-${size}.png`) });
        assert.deepEqual(session.consoleErrors, []);
      } finally {
        await session.close();
      }
    });

    test("the verdict's list of fields to fix jumps to the field, in view and focused", { timeout: TIMEOUT }, async () => {
      const session = await open(viewport);
      const { page } = session;
      try {
        await page.tap('#tab-fuels');
        await typeInto(page, GAS_PRICE, 'abc');
        await page.waitForSelector('#verdict-field-errors', { state: 'attached' });
        // Away from the field: the verdict's tab (beside the inputs on a wide screen, its own tab here).
        await page.tap('#tab-verdict');
        const link = '#verdict-field-errors button[data-action="jump-to-field"]';
        assert.equal(await page.textContent(link), 'Natural gas: Price (USD) (Fuels)');
        await page.screenshot({ path: join(ARTIFACTS, `attention-list-${size}.png`) });
        await page.tap(link);
        assert.equal(await page.getAttribute('#tab-fuels', 'aria-selected'), 'true');
        assert.equal(await page.evaluate(() => document.activeElement?.dataset.path), '/fuels/1/price/amount');
        const box = await page.$eval(GAS_PRICE, (input) => {
          const r = input.getBoundingClientRect();
          const covering = [...document.querySelectorAll('.summary-bar, .tabs, .topbar')]
            .filter((bar) => getComputedStyle(bar).position.match(/fixed|sticky/) && bar.offsetParent !== null || getComputedStyle(bar).position === 'fixed' && getComputedStyle(bar).display !== 'none')
            .map((bar) => bar.getBoundingClientRect())
            .filter((b) => b.height > 0 && b.bottom > r.top && b.top < r.bottom);
          return { top: r.top, bottom: r.bottom, covered: covering.length };
        });
        assert.ok(box.top >= 0 && box.bottom <= viewport.height, `in view: ${JSON.stringify(box)}`);
        assert.equal(box.covered, 0, 'no sticky bar covers the focused field');
        await page.screenshot({ path: join(ARTIFACTS, `attention-jumped-${size}.png`) });
        assert.deepEqual(session.consoleErrors, []);
      } finally {
        await session.close();
      }
    });
  });
}
