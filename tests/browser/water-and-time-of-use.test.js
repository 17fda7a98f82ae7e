// Hot water and time-of-use electricity (issue 16) in headless Chromium with touch, driven as a person
// would: on the House tab hot water ticked for three people with the gas storage water heater in the house
// now; on the Fuels tab electricity priced by three periods, a gap first said at the tariff and then closed;
// on the Systems tab the heat pump given a heat-pump water heater of its own. The verdict's services table
// against the CLI's answer for the exported quote (space and hot water adding up to each option's cost, the
// periods' kWh to its electricity), the taps counted, and the sheet printed (Chromium's PDF read back with
// pdftotext) with both services. Screenshots at 768x1024 and 390x844. The demo is invented.
import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { chartsSettled, tabletSession, verdictSettled } from './chromium-page.js';
import { siteDir } from '../node/helpers.js';
import { cliEvaluate } from './scenario-fixture.js';
import { serve } from './server.js';

const TIMEOUT = 120_000;
const ARTIFACTS = resolve(process.env.FUELWRIGHT_ARTIFACTS ?? join(siteDir, '..', 'test-artifacts'));

let server;
let session;
let page;
let consoleErrors = [];
let taps = 0;

before(async () => {
  mkdirSync(ARTIFACTS, { recursive: true });
  server = await serve(siteDir);
  session = await tabletSession('water', { acceptDownloads: true });
  ({ page, consoleErrors } = session);
}, { timeout: TIMEOUT });

after(async () => {
  await session?.close();
  await server?.close();
}, { timeout: TIMEOUT });

const id = (path) => `#f${path.replace(/[^A-Za-z0-9]+/g, '-')}`;
async function tap(selector) { taps += 1; await page.tap(selector); }
async function typeInto(selector, text) {
  taps += 1;
  await page.tap(selector);
  await page.fill(selector, '');
  await page.type(selector, text);
  await page.press(selector, 'Tab');
}
async function choose(selector, value) { taps += 2; await page.selectOption(selector, value); }

describe('Hot water and time-of-use electricity (Chromium, touch)', () => {
  test('entered by taps, checked against the CLI, printed', { timeout: TIMEOUT }, async () => {
    await page.goto(server.url);
    await verdictSettled(page);

    await tap('#tab-house');
    await tap(id('/demand/water_heating/enabled'));
    await typeInto(id('/demand/water_heating/people'), '3');
    await choose(id('/demand/water_heating/heater/kind'), 'storage');
    await choose(id('/demand/water_heating/heater/fuel'), 'natural-gas');
    await typeInto(id('/demand/water_heating/heater/uef'), '0.62');
    const houseTaps = taps;

    await tap('#tab-fuels');
    const tou = await page.getAttribute('[data-path$="/price/time_of_use"]', 'data-path');
    const base = tou.replace('/price/time_of_use', '');
    await tap(`[data-path="${tou}"]`);
    await page.waitForSelector(id(`${base}/price/schedule/0/name`));
    await typeInto(id(`${base}/price/schedule/0/name`), 'off-peak');
    await typeInto(id(`${base}/price/schedule/0/amount`), '0.12');
    await typeInto(id(`${base}/price/schedule/0/from`), '21');
    await typeInto(id(`${base}/price/schedule/0/to`), '16');
    await tap('[data-action="add-period"]');
    await typeInto(id(`${base}/price/schedule/1/name`), 'peak');
    await typeInto(id(`${base}/price/schedule/1/amount`), '$0.34/kWh');
    await choose(id(`${base}/price/schedule/1/days`), 'weekdays');
    // times as a tariff sheet prints them
    await typeInto(id(`${base}/price/schedule/1/from`), '4 pm');
    await typeInto(id(`${base}/price/schedule/1/to`), '9:00 p.m.');
    // weekends 16-21 are in no period yet: said once at the tariff, with the hour
    const gap = page.locator(`[data-field="${base}/price/schedule"] > .field-msg`);
    await gap.waitFor({ state: 'visible' });
    assert.equal(await gap.textContent(), 'each time of day must fall in exactly one period: weekends 16:00-21:00 in January is in none');
    await tap('[data-action="add-period"]');
    await typeInto(id(`${base}/price/schedule/2/name`), 'off-peak');
    await typeInto(id(`${base}/price/schedule/2/amount`), '0.12');
    await choose(id(`${base}/price/schedule/2/days`), 'weekends');
    await typeInto(id(`${base}/price/schedule/2/from`), '16:00');
    await typeInto(id(`${base}/price/schedule/2/to`), '21.00');
    await gap.waitFor({ state: 'hidden' });
    const fuelsTaps = taps - houseTaps;

    await tap('#tab-systems');
    const sysPath = await page.evaluate(() => [...document.querySelectorAll('.system-card')]
      .find((card) => card.querySelector('select[data-path$="/system/kind"]')?.value === 'air-source-heat-pump')?.dataset.field);
    assert.ok(sysPath, 'the demo has a heat pump');
    await choose(id(`${sysPath}/water_heater/mode`), 'own');
    await choose(id(`${sysPath}/water_heater/kind`), 'heat-pump-water-heater');
    await choose(id(`${sysPath}/water_heater/fuel`), 'electricity');
    await typeInto(id(`${sysPath}/water_heater/uef`), '3.5');
    await choose(id(`${sysPath}/water_heater/location`), 'conditioned');
    const systemsTaps = taps - houseTaps - fuelsTaps;
    // counted by hand from the steps above: 8 on the House tab, 20 for a three-row tariff (the gap said on the way), 10 for the option's own water heater
    assert.deepEqual({ houseTaps, fuelsTaps, systemsTaps }, { houseTaps: 8, fuelsTaps: 20, systemsTaps: 10 });

    // the site is high up and its gas meter reads at the site's pressure: both go with the quote
    await tap('#tab-house');
    await typeInto(id('/settings/elevation/value'), '6200');
    await choose(id('/settings/gas_pressure_base_mode'), 'site');
    await page.locator('#site-elevation').screenshot({ path: join(ARTIFACTS, 'water-site-elevation-768.png') });

    await tap('#tab-verdict');
    // the charts repaint the verdict when they are drawn: the screenshots wait for them
    await chartsSettled(page);
    await page.waitForSelector('#services-table');
    for (const [w, h] of [[768, 1024], [390, 844]]) {
      await page.setViewportSize({ width: w, height: h });
      await page.locator('#services').screenshot({ path: join(ARTIFACTS, `water-services-${w}.png`) });
    }
    await page.setViewportSize({ width: 768, height: 1024 });

    // the exported quote evaluated by the CLI: the page shows the core's figures
    await page.tap('#tab-saved');
    const [download] = await Promise.all([page.waitForEvent('download'), page.tap('[data-action="export-json"]')]);
    const doc = JSON.parse(readFileSync(await download.path(), 'utf8'));
    assert.equal(doc.demand.water_heating.people, 3);
    assert.deepEqual([doc.settings.elevation, doc.settings.gas_pressure_base], [{ value: 6200, unit: 'ft' }, 'site']);
    const tariff = doc.options.find((o) => o.price?.schedule)?.price.schedule;
    assert.deepEqual(tariff.map((p) => [p.name, p.days ?? 'all', p.hours]),
      [['off-peak', 'all', [[21, 16]]], ['peak', 'weekdays', [[16, 21]]], ['off-peak', 'weekends', [[16, 21]]]]);
    assert.equal(tariff[1].amount, 0.34, 'the peak price typed as "$0.34/kWh"');
    assert.equal(doc.options.find((o) => o.water_heater)?.water_heater.kind, 'heat-pump-water-heater');
    const { results, ...scenario } = doc;
    const answer = await cliEvaluate(scenario);
    assert.deepEqual(answer.errors, []);
    const rows = await page.$$eval('#services-table tbody tr', (trs) => trs.map((tr) => ({
      id: tr.dataset.option, cells: [...tr.querySelectorAll('td')].map((td) => td.querySelector('span')?.textContent ?? '') })));
    assert.equal(rows.length, answer.options.length);
    for (const option of answer.options) {
      assert.ok(Math.abs(option.space_heating.annual_cost + option.water_heating.annual_cost - option.annual_cost) < 1e-6, option.id);
      if (option.electricity_periods) {
        const kwh = option.electricity_periods.reduce((sum, p) => sum + p.kwh, 0);
        assert.ok(Math.abs(kwh - option.electricity_kwh) <= 1e-9 * kwh, option.id);
      }
      const row = rows.find((r) => r.id === option.id);
      const dollars = (text) => Number(text.match(/\$([\d,]+)/)[1].replaceAll(',', ''));
      assert.equal(dollars(row.cells[0]), Math.round(option.space_heating.annual_cost), option.id);
      assert.equal(dollars(row.cells[1]), Math.round(option.water_heating.annual_cost), option.id);
    }
    const hp = answer.options.find((o) => o.water_heating.made_by === 'heat-pump-water-heater');
    assert.ok(hp.water_heating.heat_taken_from_space_kwh > 0, 'in the heated space it takes heat from the house');
    assert.deepEqual(hp.electricity_periods.map((p) => p.name), ['off-peak', 'peak']);

    // the sheet: both services on paper
    await page.tap('#tab-verdict');
    await page.emulateMedia({ media: 'print' });
    const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
    await page.emulateMedia({ media: 'screen' });
    const file = join(ARTIFACTS, 'sheet-water.pdf');
    writeFileSync(file, pdf);
    const text = execFileSync('pdftotext', ['-raw', file, '-'], { encoding: 'utf8' }).replace(/[ \t\n]+/g, ' ');
    execFileSync('pdftoppm', ['-png', '-r', '60', file, join(ARTIFACTS, 'sheet-water')]);
    assert.match(text, /Space heating and hot water/);
    assert.match(text, /by a heat-? ?pump water heater/);
    assert.match(text, /Hot water [\d,.]+ MMBtu a year for 3 people; water heater in the house now: storage on Natural gas, UEF 0\.62; .+ comes with its own: heat pump water heater on Electricity, UEF 3\.5, inside the heated space/);
    assert.deepEqual(consoleErrors, []);
  });
});
