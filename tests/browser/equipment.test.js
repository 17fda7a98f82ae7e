// Equipment as rated and sold (issue 13) in headless Chromium with touch, driven as a
// person would (taps and typing, files picked): the demo's heat pump made variable-speed
// with a minimum and a maximum capacity at two points, its sizing sentence in the
// verdict against the CLI's answer for the exported quote; the gas furnace's own
// electricity shown as the catalog's default (a placeholder, not a value) and its cost
// in the verdict; the gas service kept for the range added to the heat pump's cost;
// every new field kept through save, reload, export and import. Screenshots of the
// Systems tab and the verdict at 768x1024 and 390x844. The demo is invented.
import assert from 'node:assert/strict';
import { mkdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { importAndWait, sidewaysOverflow, tabletSession, verdictSettled } from './chromium-page.js';
import { siteDir } from '../node/helpers.js';
import { cliEvaluate } from './scenario-fixture.js';
import { serve } from './server.js';

const TIMEOUT = 60_000;
const ARTIFACTS = resolve(process.env.FUELWRIGHT_ARTIFACTS ?? join(siteDir, '..', 'test-artifacts'));

let server;
let session;
let page;
let consoleErrors = [];

before(async () => {
  mkdirSync(ARTIFACTS, { recursive: true });
  server = await serve(siteDir);
  session = await tabletSession('equipment', { acceptDownloads: true });
  ({ page, consoleErrors } = session);
}, { timeout: TIMEOUT });

after(async () => {
  await session?.close();
  await server?.close();
}, { timeout: TIMEOUT });

/** Taps a field and types into it as a person does (what was there first is cleared). */
async function typeInto(selector, text) {
  await page.tap(selector);
  await page.fill(selector, '');
  if (text) await page.type(selector, text);
}

/** The quote as exported (the scenario file the page offers). */
async function exported() {
  await page.tap('#tab-saved');
  const [download] = await Promise.all([page.waitForEvent('download'), page.tap('[data-action="export-json"]')]);
  const path = await download.path();
  return { doc: JSON.parse(readFileSync(path, 'utf8')), path };
}

/** The verdict's equipment lines of an option: {sizing, lines: {key: text}}. */
function equipmentOf(id) {
  return page.evaluate((optionId) => {
    const li = document.querySelector(`#equipment li[data-option="${optionId}"]`);
    if (!li) return null;
    return {
      sizing: li.querySelector('.sizing')?.textContent ?? null,
      lines: Object.fromEntries([...li.querySelectorAll('li[data-key]')].map((n) => [n.dataset.key, n.querySelector('button.num')?.textContent])),
    };
  }, id);
}

const annualCost = (id) => page.$eval(`#verdict-table tr[data-option="${id}"] button.num[data-key="annual_cost"]`, (b) => Number(b.dataset.value));
const HP = '/systems/2/system';
const id = (path, suffix = '') => `#f${path.replace(/[^A-Za-z0-9]+/g, '-')}${suffix}`;

describe('Equipment as rated and sold (Chromium, 768x1024 with touch)', () => {
  test('a variable-speed heat pump with minimum and maximum at two points shows its sizing sentence', { timeout: TIMEOUT }, async () => {
    await page.goto(server.url);
    await verdictSettled(page);
    await page.tap('#tab-systems');
    const card = page.locator('.system-card[data-system-id="heat-pump"]');
    assert.equal(await page.isChecked(id(`${HP}/stages`, '-single')), true, 'single-stage until chosen');
    assert.equal(await page.locator(id(`${HP}/ratings/0/min_capacity/value`)).count(), 0, 'no minimum for a single-stage unit');
    // the demo's third point removed; the cut-out cleared shows the core's assumption as a placeholder
    await card.locator('[data-action="remove-rating"][data-index="2"]').tap();
    await typeInto(id(`${HP}/cutoff/value`), '');
    await page.waitForFunction((sel) => document.querySelector(sel)?.placeholder === '0', id(`${HP}/cutoff/value`));
    await page.tap(`label[for="${id(`${HP}/stages`, '-variable').slice(1)}"]`);
    await page.waitForSelector(id(`${HP}/ratings/1/min_cop`));
    assert.equal(await page.getAttribute(id(`${HP}/cutoff/value`), 'placeholder'), '-13', 'a variable-speed unit stops lower');
    assert.equal(await page.inputValue(id(`${HP}/cutoff/value`)), '', 'the assumption is not entered');
    await typeInto(id(`${HP}/ratings/0/min_capacity/value`), '9000');
    await typeInto(id(`${HP}/ratings/0/min_cop`), '4.4');
    await typeInto(id(`${HP}/ratings/1/min_capacity/value`), '7000');
    await typeInto(id(`${HP}/ratings/1/min_cop`), '2.9');
    await page.tap('#tab-verdict');
    await verdictSettled(page);
    const hp = await equipmentOf('heat-pump');
    assert.match(hp.sizing, /^At -?\d+ °F the heat pump gives [\d,]+ (of the [\d,]+ Btu\/h the house needs; below -?\d+ °F the backup \(electric resistance strips\) helps|Btu\/h, enough for the [\d,]+ Btu\/h the house needs)\. Below -13 °F the compressor stops/);
    assert.doesNotMatch(hp.sizing, /degF|design_load|balance_point|undefined|NaN/);

    // the same numbers as the CLI's answer for the quote as exported
    const { doc } = await exported();
    const sys = doc.options.find((o) => o.id === 'heat-pump').system;
    assert.equal(sys.stages, 'variable');
    assert.equal(sys.cutoff, undefined);
    assert.deepEqual(sys.ratings.map((p) => [p.min_capacity, p.min_cop]),
      [[{ value: 9000, unit: 'Btu/h' }, 4.4], [{ value: 7000, unit: 'Btu/h' }, 2.9]], 'typed in the unit shown, without touching its menu');
    const cli = await cliEvaluate(doc);
    const option = cli.options.find((o) => o.id === 'heat-pump');
    const round = (v) => (Math.round(v / 100) * 100).toLocaleString('en-US');
    assert.ok(hp.sizing.includes(round(option.capacity_at_design.value)), `${hp.sizing} / ${option.capacity_at_design.value}`);
    assert.ok(hp.sizing.includes(`${round(option.design_load.value)} Btu/h the house needs`));
    if (option.balance_point) assert.ok(hp.sizing.includes(`below ${Math.round(option.balance_point.value)} °F`));
  });

  test('the cut-out typed without touching its unit menu is kept in that unit', { timeout: TIMEOUT }, async () => {
    await page.tap('#tab-systems');
    await typeInto(id(`${HP}/cutoff/value`), '-10');
    await page.tap('#tab-verdict');
    await verdictSettled(page);
    const { doc } = await exported();
    assert.deepEqual(doc.options.find((o) => o.id === 'heat-pump').system.cutoff, { value: -10, unit: 'degF' });
    assert.match((await equipmentOf('heat-pump')).sizing, /Below -10 °F the compressor stops and the backup \(electric resistance strips\) heats alone\.( Resistance strips need their own circuit and may need a larger electrical service: a licensed electrician decides, to local code\.)?$/);
  });

  test('a furnace shows its default own electricity as a placeholder, and its cost in the verdict', { timeout: TIMEOUT }, async () => {
    await page.tap('#tab-systems');
    const aux = id('/systems/1/system/auxiliary_electricity/value');
    assert.equal(await page.inputValue(aux), '', 'not entered');
    assert.equal(await page.getAttribute(aux, 'placeholder'), '400');
    assert.equal(await page.inputValue(id('/systems/1/system/auxiliary_electricity/unit')), 'kWh');
    const hint = await page.textContent(id('/systems/1/system/auxiliary_electricity/value', '-hint'));
    assert.match(hint, /blower, draft fan and controls/);
    assert.match(hint, /Left empty: 400 kWh a year, a typical furnace \(condensing\) from the catalog\./);
    await page.tap('#tab-verdict');
    await verdictSettled(page);
    const furnace = await equipmentOf('gas-furnace');
    const { doc } = await exported();
    const cli = (await cliEvaluate(doc)).options.find((o) => o.id === 'gas-furnace');
    assert.equal(cli.auxiliary_kwh, 400);
    const dollars = Math.round(cli.auxiliary_cost).toLocaleString('en-US');
    assert.equal(furnace.lines.auxiliary_cost, `400 kWh a year, $${dollars} a year`);
    // the boiler's default is in W while the burner runs
    await page.tap('#tab-systems');
    assert.equal(await page.inputValue(id('/systems/0/system/auxiliary_electricity/unit')), 'W');
    assert.equal(await page.getAttribute(id('/systems/0/system/auxiliary_electricity/value'), 'placeholder'), '230');
    // a value typed replaces the default
    await typeInto(aux, '250');
    await page.tap('#tab-verdict');
    await verdictSettled(page);
    assert.match((await equipmentOf('gas-furnace')).lines.auxiliary_cost, /^250 kWh a year, \$40 a year$/);
  });

  test('ticking "keeps its gas service" adds the gas charge to the heat pump\'s cost', { timeout: TIMEOUT }, async () => {
    const before = await annualCost('heat-pump');
    const furnaceBefore = await annualCost('gas-furnace');
    assert.equal((await equipmentOf('heat-pump')).lines.kept_services_cost, undefined);
    const stamp = await page.evaluate(() => document.body.dataset.saved);
    await page.tap('#tab-fuels');
    const gasCard = page.locator('.fuel-card', { has: page.locator('h3', { hasText: 'Natural gas' }) });
    const tick = gasCard.locator('input[data-path$="/keep_service"]');
    assert.equal(await tick.isChecked(), false);
    await gasCard.locator('label.check', { hasText: 'keeps its gas service' }).tap();
    await page.waitForFunction(() => /added to every option that does not burn gas/.test(
      document.querySelector('.fuel-card input[data-path$="/keep_service"]')?.closest('.field')?.textContent ?? ''));
    assert.match(await page.textContent('#equipment-electricity'), /priced per kWh at the price on the Electricity card above, since “Air-source heat pump, HSPF2 8\.5” runs on it\./);
    await page.tap('#tab-verdict');
    await verdictSettled(page);
    const after = await annualCost('heat-pump');
    assert.ok(Math.abs(after - before - 180) < 1e-6, `${before} -> ${after}`);
    assert.equal(await annualCost('gas-furnace'), furnaceBefore, 'the gas furnace pays it already');
    assert.equal((await equipmentOf('heat-pump')).lines.kept_services_cost, '$180 a year');
    assert.equal((await equipmentOf('oil-boiler')).lines.kept_services_cost, '$180 a year');
    await page.waitForFunction((s) => document.body.dataset.saved && document.body.dataset.saved !== s, stamp);
  });

  test('every new field is kept through save, reload, export and import', { timeout: TIMEOUT }, async () => {
    await page.reload();
    await verdictSettled(page);
    const check = async (where) => {
      await page.tap('#tab-systems');
      assert.equal(await page.isChecked(id(`${HP}/stages`, '-variable')), true, where);
      assert.equal(await page.inputValue(id(`${HP}/ratings/1/min_capacity/value`)), '7000', where);
      assert.equal(await page.inputValue(id(`${HP}/ratings/1/min_cop`)), '2.9', where);
      assert.equal(await page.inputValue(id(`${HP}/cutoff/value`)), '-10', where);
      assert.equal(await page.inputValue(id('/systems/1/system/auxiliary_electricity/value')), '250', where);
      await page.tap('#tab-fuels');
      assert.equal(await page.locator('.fuel-card input[data-path$="/keep_service"]:checked').count(), 1, where);
    };
    await check('after a reload');
    const { doc, path } = await exported();
    assert.deepEqual(doc.settings.kept_services, [{ fuel: 'natural-gas', fixed_charges: [{ label: 'Gas customer charge', amount_per_month: 15 }] }]);
    assert.deepEqual(doc.options.find((o) => o.id === 'gas-furnace').system.auxiliary_electricity, { value: 250, unit: 'kWh' });
    const msg = await importAndWait(page, path);
    assert.equal(msg.ok, true, msg.text);
    await check('after an import');
    const again = await exported();
    assert.deepEqual(again.doc, doc, 'the imported quote exports as it came');
  });

  test('the Systems tab and the verdict at 768x1024 and 390x844', { timeout: TIMEOUT }, async () => {
    for (const [width, height] of [[768, 1024], [390, 844]]) {
      await page.setViewportSize({ width, height });
      await page.tap('#tab-systems');
      await page.screenshot({ path: join(ARTIFACTS, `chromium-systems-equipment-${width}.png`), fullPage: true });
      // the cards themselves, readable at their size
      await page.locator('.system-card[data-system-id="heat-pump"]').screenshot({ path: join(ARTIFACTS, `chromium-systems-heat-pump-${width}.png`) });
      await page.locator('.system-card[data-system-id="gas-furnace"]').screenshot({ path: join(ARTIFACTS, `chromium-systems-furnace-${width}.png`) });
      const overflow = await sidewaysOverflow(page, width);
      assert.ok(overflow <= 0, `the Systems tab is ${overflow} px wider than ${width} px`);
      await page.tap('#tab-fuels');
      const fuelsOverflow = await sidewaysOverflow(page, width);
      assert.ok(fuelsOverflow <= 0, `the Fuels tab (with a fixed charge) is ${fuelsOverflow} px wider than ${width} px`);
      await page.locator('.fuel-card', { has: page.locator('input[data-path$="/keep_service"]') }).screenshot({ path: join(ARTIFACTS, `chromium-fuels-gas-${width}.png`) });
      await page.tap('#tab-verdict');
      await verdictSettled(page);
      await page.locator('#equipment').scrollIntoViewIfNeeded();
      await page.screenshot({ path: join(ARTIFACTS, `chromium-verdict-equipment-${width}.png`), fullPage: true });
      await page.locator('#equipment').screenshot({ path: join(ARTIFACTS, `chromium-verdict-equipment-section-${width}.png`) });
      assert.doesNotMatch(await page.textContent('#equipment'), /\bnull\b|undefined|NaN|_kwh|_cost|degF/);
    }
    assert.deepEqual(consoleErrors, []);
  });
  test('a heat pump with the boiler in the house now as its backup is one choice in the add menu', { timeout: TIMEOUT }, async () => {
    await page.tap('#tab-systems');
    const choice = 'air-source-heat-pump+existing-backup';
    const label = await page.$eval(`#add-system-kind option[value="${choice}"]`, (o) => o.textContent);
    assert.equal(label, 'Air-source heat pump, with Existing oil boiler, 86 AFUE as backup (dual fuel)');
    const before = await page.locator('.system-card').count();
    await page.selectOption('#add-system-kind', choice);
    await page.tap('[data-action="add-system"]');
    await page.waitForFunction((n) => document.querySelectorAll('.system-card').length === n + 1, before);
    assert.equal(await page.inputValue(id(`/systems/${before}/system/backup`)), 'oil-boiler');
    await page.tap('#tab-verdict');
    await verdictSettled(page);
    const { doc } = await exported();
    const added = doc.options[before];
    assert.equal(added.system.backup, 'oil-boiler');
    const cli = await cliEvaluate(doc);
    assert.deepEqual(cli.errors, []);
    const option = cli.options.find((o) => o.id === added.id);
    assert.equal(option.backup_option, 'oil-boiler');
    assert.equal(option.backup_fuel_quantity.unit, 'gal');
    assert.ok(option.backup_fuel_quantity.value > 0, 'the boiler burns oil in the coldest hours');
    assert.deepEqual(consoleErrors, []);
  });
});
