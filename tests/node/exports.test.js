// What the page exports (web/scenario.js exportDocument, web/results.js resultsCsv), in Node
// against the module: every fuel entered travels with the quote file (one no option uses as
// other_fuels) and comes back on import; the verdict rides along as a summary the core ignores; the
// CSV carries the quote's rows and numbers as the verdict shows them, negative ones unquoted.
// Every house and price here is invented.
import assert from 'node:assert/strict';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { loadCore, siteDir } from './helpers.js';

const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

let core;
let scenario;
let demo;
let verdict;
before(async () => {
  core = await loadCore();
  scenario = await web('scenario.js');
  demo = await web('demo.js');
  verdict = await web('results.js');
});

/** The fields of one CSV line (RFC 4180 quoting). */
function csvFields(line) {
  const out = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i];
    if (quoted) {
      if (c === '"' && line[i + 1] === '"') { field += '"'; i++; } else if (c === '"') quoted = false; else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') { out.push(field); field = ''; } else field += c;
  }
  out.push(field);
  return out;
}

const evaluate = (doc) => JSON.parse(core.evaluate(JSON.stringify(doc)));

/** The demo with wood pellets priced but used by no system. */
function demoWithSpareFuel() {
  const ws = demo.demoWorkspace();
  ws.fuels.push({ key: scenario.newFuelKey(ws), fuel: 'wood-pellets', price: { amount: 310, per: 'short_ton' }, fixed_charges: [] });
  return ws;
}

describe('the quote file', () => {
  test('carries a fuel no option uses, and brings it back on import', () => {
    const ws = demoWithSpareFuel();
    const doc = scenario.exportDocument(ws, null);
    assert.deepEqual(doc.other_fuels, [{ fuel: 'wood-pellets', price: { amount: 310, per: 'short_ton' } }]);
    assert.equal(doc.results, undefined, 'no verdict answers it: no summary');
    const back = scenario.fromScenario(doc);
    assert.equal(back.fuels.length, ws.fuels.length);
    assert.deepEqual(back.fuels.at(-1).price, { amount: 310, per: 'short_ton' });
    assert.deepEqual(scenario.exportDocument(back, null), doc, 'export, import, export is the same file');
  });

  test('carries the verdict it answers as a summary the core does not read', () => {
    const ws = demoWithSpareFuel();
    const plain = scenario.toScenario(ws);
    const result = evaluate(plain);
    const doc = scenario.exportDocument(ws, result);
    assert.deepEqual(doc.results.ranking.map((r) => r.id), result.ranking.map((r) => r.id));
    const best = result.options.find((o) => o.id === result.ranking[0].id);
    assert.equal(doc.results.ranking[0].annual_cost, best.annual_cost, 'full precision');
    assert.equal(doc.results.currency, 'USD');
    const again = evaluate(doc);
    assert.deepEqual(again.errors, []);
    assert.deepEqual(again.warnings.filter((w) => w.path === '' || w.path.startsWith('/results') || w.path.startsWith('/other_fuels')), []);
    assert.deepEqual(again.options.map((o) => o.annual_cost), result.options.map((o) => o.annual_cost));
    assert.deepEqual(evaluate({ ...plain, results: [] }).errors, [{ path: '/results', message: 'must be an object (the verdict as exported)' }]);
  });
});

describe('the results CSV', () => {
  test("starts with the quote's rows and rounds as the verdict shows, negative numbers unquoted", () => {
    const ws = demo.demoWorkspace();
    ws.quote.customer = 'Rowan Vale, "Ridge" farm';
    ws.economics.enabled = true;
    ws.systems[0].existing = true;
    const result = evaluate(scenario.toScenario(ws));
    const lines = verdict.resultsCsv(result, ws).trimEnd().split('\r\n');
    assert.equal(lines[0], 'quote number,HC-0117');
    assert.equal(lines[1], 'customer,"Rowan Vale, ""Ridge"" farm"');
    const blank = lines.indexOf('');
    const header = lines[blank + 1].split(',');
    assert.equal(header[0], 'rank');
    const rows = lines.slice(blank + 2);
    assert.equal(rows.length, result.options.length);
    for (const line of rows) {
      assert.doesNotMatch(line, /\d\.\d{5,}/, `no float noise: ${line}`);
      assert.doesNotMatch(line, /"-\d/, `negative numbers unquoted: ${line}`);
    }
    const annual = header.indexOf('annual cost (USD)');
    const ranked = verdict.rankedOptions(result, 'annual');
    for (const [i, o] of ranked.entries()) assert.equal(csvFields(rows[i])[annual], String(Math.round(o.annual_cost)), rows[i]);
    assert.ok(rows.some((line) => csvFields(line).some((f) => /^-\d+$/.test(f))), 'some saving is negative against the existing boiler');
  });
});

describe('payback in plain words', () => {
  test('years rounded as people say them, and no payback longer than the equipment lasts', async () => {
    const { createFormat } = await web('format.js');
    const format = createFormat({ locale: 'en-US', currency: 'USD' });
    const words = (option, extra = {}) => verdict.paybackWords({ id: 'hp', ...option }, { format, baselineId: 'oil', studyYears: 15, ...extra });
    assert.equal(words({ simple_payback_years: 7.3649, annual_saving: 900 }), '7.4 years');
    assert.equal(words({ simple_payback_years: 23.7, annual_saving: 300 }), '24 years');
    assert.equal(words({ simple_payback_years: 1.04, annual_saving: 5000 }), '1 year');
    // 79 years for a heat pump that lasts 15: it never pays back
    assert.equal(words({ simple_payback_years: 79.2, annual_saving: 90 }, { lifeYears: 15 }), 'does not pay back within its 15-year life');
    assert.equal(words({ simple_payback_years: null, annual_saving: -47.62 }), 'no saving a year: it costs $48 more to run');
    assert.equal(words({ simple_payback_years: null, annual_saving: 50 }), 'does not pay back within 15 years');
    assert.equal(words({ id: 'oil', simple_payback_years: null }), null, 'the system in the house now');
    // no life entered: the core's catalog median (ASHRAE's 15 years for a heat pump) is the usual life
    const catalogLife = { simple_payback_years: 34.1, annual_saving: 372, life_years: 15, life_years_from: 'catalog' };
    assert.equal(words(catalogLife, { lifeYears: verdict.lifeOf({ systems: [{ id: 'hp' }] }, { id: 'hp', ...catalogLife }) }),
      'does not pay back within its usual 15-year life');
    assert.equal(verdict.lifeOf({ systems: [{ id: 'hp', life_years: 12 }] }, { id: 'hp' }), 12, 'no result yet: the life on the card');
  });
});

describe('charts in the customer\'s units', () => {
  test('the system in the house now, named in a sentence', () => {
    assert.equal(verdict.systemNowWords('Existing oil boiler, 86 AFUE'), 'the existing oil boiler, 86 AFUE');
    assert.equal(verdict.systemNowWords('Gas furnace, 80 AFUE'), 'Gas furnace, 80 AFUE, the system in the house now');
    assert.equal(verdict.systemNowWords('Existingly odd'), 'Existingly odd, the system in the house now');
  });

  test('the bills chart speaks the bills\' energy unit; a volume stays in the core\'s kWh', () => {
    const fit = { unit: 'kWh' };
    const therms = [{ unit: 'therm' }, { unit: 'therm' }];
    // 1 therm = 100,000 Btu (IT) = 105.505585262 MJ = 29.307107017222 kWh (NIST SP 811, exact)
    const shown = verdict.billsUnitOf(fit, therms);
    assert.equal(shown.unit, 'therm');
    assert.ok(Math.abs(shown.factor * 29.307107017222222 - 1) < 1e-12, String(shown.factor));
    assert.deepEqual(verdict.billsUnitOf(fit, [{ unit: 'L' }]), { factor: 1, unit: 'kWh' }, 'litres of oil need the heating value');
    assert.deepEqual(verdict.billsUnitOf(fit, [{ unit: 'therm' }, { unit: 'MMBtu' }]), { factor: 1, unit: 'kWh' }, 'mixed units');
  });
});

describe('the core\'s messages in the customer\'s words', () => {
  test('no field names, ids or file names of the core reach the page', async () => {
    const { plainUnits } = await web('format.js');
    assert.equal(plainUnits('is required (a fuel id or a custom fuel object)'), 'choose a fuel (the Fuels tab holds this quote\'s fuels)');
    assert.equal(plainUnits('below -13 degF (set demand.balance_point)'), 'below -13 °F (give the balance point under Heat need)');
    assert.equal(plainUnits('give either amount_per_month or amount_per_year'), 'give the amount either a month or a year');
    assert.equal(plainUnits('service life 15 years: the median for air-source-heat-pump (…); give life_years to replace it'),
      'service life 15 years: the median for air-source-heat-pump (…); type its expected life to replace it');
    assert.equal(plainUnits('"XeF2" is not in data/species.json; give its standard enthalpy of formation'),
      '"XeF2" is not in the built-in table of compounds; give its standard enthalpy of formation');
  });
});
