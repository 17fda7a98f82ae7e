// The House tab's pure parts for issue 12 in Node: bills as printed (bill dates,
// a bill's average outdoor temperature) and the weather of the bills through
// web/scenario.js; a climate from a weather file (design temperature, day-to-day
// spread, hourly bins) kept through the workspace <-> scenario mapping and a
// change of unit system; the climate library's names and file
// (web/climate-library.js); a weather answer in plain words (web/weather.js);
// and the kiosk's scenario taking the climate of the supplier's price file.
// Every climate and weather value here is invented.
import assert from 'node:assert/strict';
import { readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { loadCore, siteDir } from './helpers.js';

const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');
const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

let core;
let scenario;
let library;
let weather;
let kiosk;
let demo;
before(async () => {
  core = await loadCore();
  scenario = await web('scenario.js');
  library = await web('climate-library.js');
  weather = await web('weather.js');
  kiosk = await web('kiosk-scenario.js');
  demo = await web('demo.js');
});

/** An invented climate as a weather file's answer might carry it: monthly means with spread, design temperature and bins. */
const IMPORTED = {
  monthly_mean: [21.5, 24, 33.5, 45, 56, 65.5, 70.5, 68.5, 60.5, 48.5, 37.5, 26],
  monthly_sd: [7.1, 6.8, 6.2, 5.4, 4.6, 3.9, 3.1, 3.2, 4.1, 5.0, 5.9, 6.9],
  unit: 'degF',
  daily_range: 18.5,
  design_temperature: { value: 3, unit: 'degF' },
  bins: [{ t: 1, hours: 12 }, { t: 3, hours: 40 }, { t: 5, hours: 95 }, { t: 61, hours: 8613 }],
  bin_width: 2,
  base: { value: 65, unit: 'degF' },
};

/** A direct-demand scenario with one option and `climate`. */
function withClimate(climate) {
  return {
    schema: 'fuelwright.scenario/1',
    settings: { units: 'us', currency: 'USD' },
    demand: { method: 'direct', annual_useful_heat: { value: 60, unit: 'MMBtu' } },
    climate,
    options: [{ id: 'gas', fuel: 'natural-gas', price: { amount: 1.4, per: 'therm' },
      system: { kind: 'furnace', efficiency: { value: 95, rating: 'AFUE' } } }],
  };
}

/** A bills scenario of three invented bills. */
function billsScenario(extraDemand = {}, billExtra = {}) {
  return {
    schema: 'fuelwright.scenario/1',
    settings: { units: 'us', currency: 'USD' },
    demand: {
      method: 'bills', option: 'gas',
      bills: [
        { start: '2025-11-12', end: '2025-12-11', quantity: 120, unit: 'therm', ...billExtra },
        { start: '2025-12-11', end: '2026-01-13', quantity: 160, unit: 'therm' },
        { start: '2026-01-13', end: '2026-02-11', quantity: 150, unit: 'therm' },
      ],
      ...extraDemand,
    },
    climate: { monthly_mean: IMPORTED.monthly_mean, unit: 'degF' },
    options: withClimate(null).options,
  };
}

describe('web/scenario.js: bills as printed and the weather of the bills', () => {
  test('a new quote reads bill dates as meter reads and sends the choice with its bills', () => {
    const ws = scenario.blankWorkspace();
    assert.equal(ws.demand.bill_dates, 'meter-reads');
    ws.demand.method = 'bills';
    assert.equal(scenario.toScenario(ws).demand.bill_dates, 'meter-reads');
    ws.demand.bill_dates = 'inclusive';
    assert.equal(scenario.toScenario(ws).demand.bill_dates, 'inclusive');
    ws.demand.method = 'direct';
    assert.equal('bill_dates' in scenario.toScenario(ws).demand, false, 'only the chosen method\'s fields are sent');
  });

  test('bill dates, a bill\'s average temperature, the observed weather and fields the page does not edit survive import and export', () => {
    const observed = { unit: 'degC', daily_mean: [['2025-11-12', -1.5], ['2025-11-13', 0.5]] };
    const doc = billsScenario({ bill_dates: 'inclusive', observed },
      { mean_temperature: { value: 28.4, unit: 'degF' }, meter: 'invented-meter-7' });
    const ws = scenario.fromScenario(doc);
    assert.equal(ws.demand.bill_dates, 'inclusive');
    assert.deepEqual(ws.demand.bills[0].mean_temperature, { value: 28.4, unit: 'degF' });
    const back = scenario.toScenario(ws);
    assert.deepEqual(back.demand.bills, doc.demand.bills);
    assert.equal(back.demand.bill_dates, 'inclusive');
    assert.deepEqual(back.demand.observed, observed);
    assert.deepEqual(scenario.toScenario(scenario.fromScenario(back)), back, 'a second round trip changes nothing');
  });

  test('bills without the date rule send none (the core keeps their old meaning), and a value the core does not know is sent as it is', () => {
    const old = scenario.fromScenario(billsScenario());
    assert.equal(old.demand.bill_dates, undefined);
    assert.equal('bill_dates' in scenario.toScenario(old).demand, false);
    const saved = scenario.blankWorkspace();
    delete saved.demand.bill_dates;  // a quote saved before the choice existed
    saved.demand.method = 'bills';
    assert.equal('bill_dates' in scenario.toScenario(saved).demand, false);
    assert.equal(scenario.fromScenario(withClimate(null)).demand.bill_dates, 'meter-reads', 'no bills yet: a new quote\'s rule');
    const odd = scenario.fromScenario(billsScenario({ bill_dates: 'calendar-months' }));
    assert.equal(scenario.toScenario(odd).demand.bill_dates, 'calendar-months', 'not quietly read as meter reads');
  });

  test('an average temperature typed without a value is not sent; one without a unit is not a quantity', () => {
    const ws = scenario.fromScenario(billsScenario());
    ws.demand.bills[1].mean_temperature = { unit: 'degF' };
    assert.equal('mean_temperature' in scenario.toScenario(ws).demand.bills[1], false);
  });
});

describe('web/scenario.js: a climate from a weather file keeps everything it carries', () => {
  test('monthly means with spread, daily range, design temperature and bins: scenario -> workspace -> scenario', () => {
    const doc = withClimate(IMPORTED);
    const ws = scenario.fromScenario(doc);
    assert.equal(ws.climate.mode, 'monthly_mean');
    assert.deepEqual(ws.climate.bins, IMPORTED.bins);
    assert.deepEqual(scenario.toScenario(ws).climate, IMPORTED);
    // saved: the record keeps the workspace as JSON; reopened and exported again
    const reopened = JSON.parse(JSON.stringify(ws));
    assert.deepEqual(scenario.toScenario(reopened).climate, IMPORTED);
    assert.deepEqual(scenario.toScenario(scenario.fromScenario(scenario.toScenario(reopened))).climate, IMPORTED);
  });

  test('the design temperature and daily range are sent with monthly degree-days too', () => {
    const c = { monthly_hdd: [1300, 1100, 950, 600, 280, 60, 10, 20, 150, 500, 820, 1200], unit: 'degF', base: { value: 65, unit: 'degF' },
      design_temperature: { value: 2, unit: 'degF' }, daily_range: 17 };
    assert.deepEqual(scenario.toScenario(scenario.fromScenario(withClimate(c))).climate, c);
  });

  test('climateFromScenario keeps the climate\'s own unit and the label it is given', () => {
    const wc = scenario.climateFromScenario({ ...IMPORTED, unit: 'degC', monthly_mean: IMPORTED.monthly_mean.map((t) => (t - 32) / 1.8) },
      { units: 'us', label: 'Weather file “invented.csv”' });
    assert.equal(wc.unit, 'degC');
    assert.equal(wc.label, 'Weather file “invented.csv”');
    assert.equal('label' in scenario.climateToScenario(wc), false, 'the label stays on the page');
    assert.equal(scenario.climateToScenario({ ...wc, mode: 'none' }), null);
  });

  test('the core evaluates the workspace\'s climate with its spread, design temperature and bins', () => {
    const result = JSON.parse(core.evaluate(JSON.stringify(scenario.toScenario(scenario.fromScenario(withClimate(IMPORTED))))));
    assert.deepEqual(result.errors, []);
  });

  test('a weather file read by the module: its climate and its days through the workspace, evaluated by the module', () => {
    // an invented daily file: two whole years at an invented station, in °C as its header says
    const lines = ['DATE,TAVG (°C)'];
    const day = new Date(Date.UTC(2024, 0, 1));
    for (let i = 0; day.getUTCFullYear() < 2026; i++) {
      lines.push(`${day.toISOString().slice(0, 10)},${(8 - 13 * Math.cos((2 * Math.PI * (i - 20)) / 365.25) + 3 * Math.sin(i * 1.3)).toFixed(1)}`);
      day.setUTCDate(day.getUTCDate() + 1);
    }
    const answer = JSON.parse(core.weather(JSON.stringify({ text: lines.join('\n') })));
    assert.deepEqual(answer.errors, []);
    assert.equal(answer.days, 731);
    assert.ok(answer.climate, 'two whole years make a climate');
    const ws = scenario.fromScenario(billsScenario());
    ws.climate = scenario.climateFromScenario(answer.climate, { units: 'us', label: 'Weather file “invented.csv”' });
    ws.demand.observed = answer.observed;
    ws.demand.bill_dates = 'meter-reads';
    ws.demand.bills = [
      { start: '2024-11-12', end: '2024-12-11', quantity: 120, unit: 'therm' },
      { start: '2024-12-11', end: '2025-01-13', quantity: 160, unit: 'therm' },
      { start: '2025-01-13', end: '2025-02-11', quantity: 150, unit: 'therm' },
      { start: '2025-02-11', end: '2025-03-12', quantity: 118, unit: 'therm' },
      { start: '2025-03-12', end: '2025-04-10', quantity: 84, unit: 'therm' },
      { start: '2025-04-10', end: '2025-05-12', quantity: 47, unit: 'therm' },
      { start: '2025-05-12', end: '2025-06-11', quantity: 22, unit: 'therm' },
    ];
    const doc = scenario.toScenario(ws);
    assert.deepEqual(doc.climate, { ...answer.climate, base: { value: 18.3, unit: 'degC' } },
      'the climate goes to the core as the file gave it, with the base the core would take');
    const result = JSON.parse(core.evaluate(JSON.stringify(doc)));
    assert.deepEqual(result.errors, []);
    assert.equal(result.demand.fit.weather, 'observed-daily');
    assert.deepEqual(scenario.toScenario(scenario.fromScenario(doc)), doc, 'export and import keep it all');
  });
});

describe('web/climate-library.js', () => {
  test('a climate moved to °C: temperatures converted, differences scaled, bin hours unchanged', () => {
    const wc = scenario.climateFromScenario(IMPORTED);
    const c = library.climateInUnit(wc, 'degC');
    assert.equal(c.unit, 'degC');
    assert.ok(Math.abs(c.monthly_mean[0] - (21.5 - 32) / 1.8) < 1e-12);
    assert.ok(Math.abs(c.monthly_sd[0] - 7.1 / 1.8) < 1e-12);
    assert.ok(Math.abs(c.daily_range - 18.5 / 1.8) < 1e-12);
    assert.ok(Math.abs(c.bins[1].t - (3 - 32) / 1.8) < 1e-12);
    assert.equal(c.bins[1].hours, 40);
    assert.ok(Math.abs(c.bin_width - 2 / 1.8) < 1e-12);
    assert.deepEqual(c.design_temperature, IMPORTED.design_temperature, 'a quantity keeps its own unit');
    assert.equal(wc.unit, 'degF', 'the climate passed in is not changed');
    const back = library.climateInUnit(c, 'degF');
    assert.ok(Math.abs(back.bins[0].t - 1) < 1e-9 && Math.abs(back.monthly_mean[11] - 26) < 1e-9);
  });

  test('names: required, at most 80 characters, unique whatever the case', () => {
    const entries = [{ id: 'a', name: 'Birchford valley' }];
    assert.match(library.nameProblem('  ', entries), /Give the climate a name/);
    assert.match(library.nameProblem('x'.repeat(81), entries), /at most 80 characters; this one has 81/);
    assert.match(library.nameProblem('birchford VALLEY ', entries), /already kept on this device/);
    assert.equal(library.nameProblem('Birchford valley', entries, 'a'), null, 'renaming an entry to its own name');
    assert.equal(library.uniqueName('Birchford valley', entries), 'Birchford valley (2)');
    assert.equal(library.uniqueName('Ashby ridge', entries), 'Ashby ridge');
  });

  test('a quote\'s climate can be kept only once it is complete', () => {
    const ws = scenario.blankWorkspace();
    assert.match(library.keepableClimate(ws.climate).problem, /no climate yet/);
    ws.climate.mode = 'monthly_mean';
    ws.climate.monthly_mean[3] = 45;
    assert.match(library.keepableClimate(ws.climate).problem, /12 monthly mean temperatures/);
    const full = library.keepableClimate(scenario.climateFromScenario(IMPORTED));
    assert.equal(full.problem, null);
    assert.deepEqual(full.climate, IMPORTED);
  });

  test('export and import: the file names its format, and every climate comes back as it was', () => {
    const entries = [
      library.makeEntry({ id: '1', name: 'Ashby ridge', note: 'invented', climate: IMPORTED, now: '2026-12-01T00:00:00.000Z' }),
      library.makeEntry({ id: '2', name: 'Birchford valley', climate: { annual_hdd: 3100, unit: 'degC', design_temperature: { value: -14, unit: 'degC' } } }),
    ];
    const file = JSON.parse(JSON.stringify(library.libraryFile(entries, '2026-12-03T10:00:00.000Z')));
    assert.equal(file.schema, 'fuelwright.climates/1');
    assert.deepEqual(file.climates.map((c) => c.name), ['Ashby ridge', 'Birchford valley']);
    const read = library.readLibraryFile(file);
    assert.deepEqual(read.refused, []);
    assert.deepEqual(read.climates.map((c) => c.climate), entries.map((e) => e.climate));
    assert.equal(read.climates[0].note, 'invented');
  });

  test('a bad file says why; a bad entry is refused by name and the others are kept', () => {
    assert.throws(() => library.readLibraryFile([]), /not a climate library file/);
    assert.throws(() => library.readLibraryFile({ schema: 'fuelwright.scenario/1' }), /not a Fuelwright climate library/);
    assert.throws(() => library.readLibraryFile({ schema: 'fuelwright.climates/2', climates: [] }), /newer version of Fuelwright \(fuelwright\.climates\/2\)/);
    assert.throws(() => library.readLibraryFile({ schema: 'fuelwright.climates/1' }), /no "climates" list/);
    const read = library.readLibraryFile({ schema: 'fuelwright.climates/1', climates: [
      { name: 'Ashby ridge', climate: IMPORTED },
      { name: 'Cold corner', climate: { monthly_mean: [1, 2, 3], unit: 'degF' } },
      { name: 'No unit', climate: { monthly_hdd: Array(12).fill(100) } },
      { climate: IMPORTED },
      { name: 'Only annual', climate: { annual_hdd: 5000, unit: 'degF' } },
    ] });
    assert.deepEqual(read.climates.map((c) => c.name), ['Ashby ridge']);
    assert.deepEqual(read.refused.map((r) => r.message), [
      'Climate “Cold corner” was not kept: it needs 12 monthly mean temperatures, January first.',
      'Climate “No unit” was not kept: its temperature unit must be °F ("degF") or °C ("degC").',
      'Climate number 4 has no name.',
      'Climate “Only annual” was not kept: annual degree-days need a design temperature.',
    ]);
  });

  test('a kept climate described in plain words', () => {
    assert.equal(library.describeClimate(IMPORTED),
      'monthly mean temperatures (°F), design temperature 3 °F, day-to-day spread from weather records, hourly temperature bins');
    assert.equal(library.describeClimate({ monthly_hdd: [], unit: 'degC' }), 'monthly heating degree-days (°C·d)');
  });

  test('the demo\'s climate says it is invented', () => {
    assert.match(demo.demoWorkspace().climate.label, /invented/);
  });
});

describe('web/weather.js', () => {
  const fmt = { number: (v) => String(v), date: (iso) => iso };
  const answer = {
    format: 'daily', unit: 'degF', station: 'INVENTED RIDGE 2', first_date: '2024-01-01', last_date: '2025-12-31', days: 731,
    observed: { unit: 'degF', daily_mean: [['2024-01-01', 20.5], ['2025-12-31', 22]] },
    climate: IMPORTED,
    summary: { annual_hdd: 6612.4, hdd_base: { value: 65, unit: 'degF' }, design_temperature_99: 3.2, design_temperature_996: null },
    errors: [], warnings: [{ path: '/text', message: '3 days have no reading; their degC means were left out' }],
  };

  test('what was read, in plain words', () => {
    const s = weather.weatherSummary(answer, fmt);
    assert.equal(s.ok, true);
    assert.deepEqual(s.rows, [
      ['Weather station', 'INVENTED RIDGE 2'],
      ['Period', '2024-01-01 to 2025-12-31'],
      ['Readings', '731 days of daily temperatures'],
      ['Heating degree-days a year (base 65 °F)', '6612.4 °F·d'],
      ['Design temperature (99 %)', '3.2 °F'],
      ['Design temperature (99.6 %)', 'not worked out'],
    ]);
    assert.deepEqual(s.warnings, ['3 days have no reading; their °C means were left out']);
    assert.equal(s.climateMissing, null);
    const hourly = weather.weatherSummary({ ...answer, format: 'hourly', hours: 17544, station: null, climate: null }, fmt);
    assert.deepEqual(hourly.rows[0], ['Weather station', 'not named in the file']);
    assert.deepEqual(hourly.rows[2], ['Readings', '17544 hours on 731 days']);
    assert.match(hourly.climateMissing, /does not cover whole years/);
  });

  test('problems come back as the core words them, with units as people write them', () => {
    const s = weather.weatherSummary({ errors: [{ path: '/text', message: 'line 4: -150 degF is not a plausible temperature' }], warnings: [] }, fmt);
    assert.equal(s.ok, false);
    assert.deepEqual(s.errors, ['line 4: -150 °F is not a plausible temperature']);
  });

  test('the request carries only the choices made', () => {
    assert.deepEqual(weather.weatherRequest('a,b'), { text: 'a,b' });
    assert.deepEqual(weather.weatherRequest('a,b', { format: 'hourly', unit: 'degC' }), { text: 'a,b', format: 'hourly', unit: 'degC' });
  });

  test('an empty or too large file is not read, and says so', () => {
    assert.equal(weather.fileProblem({ name: 'w.csv', size: 0 }), '“w.csv” is empty.');
    assert.match(weather.fileProblem({ name: 'w.csv', size: 40 * 1048576 }), /is 40 MB; a weather file may be at most 32 MB/);
    assert.equal(weather.fileProblem({ name: 'w.csv', size: 1000 }), null);
  });

  test('labels and spans', () => {
    assert.equal(weather.weatherLabel('ridge.csv', answer, fmt), 'Weather file “ridge.csv”, INVENTED RIDGE 2, 2024-01-01 to 2025-12-31');
    assert.deepEqual(weather.observedSpan(answer.observed), { days: 2, first: '2024-01-01', last: '2025-12-31' });
    assert.equal(weather.observedSpan({ unit: 'degF', daily_mean: [] }), null);
  });
});

describe('web/kiosk-scenario.js: the climate of the supplier\'s area', () => {
  test('a price file\'s climate goes into the visitor\'s scenario, checked and evaluated by the core', async () => {
    const file = JSON.parse(await readFile(join(root, 'data/examples/supplier-prices.json'), 'utf8'));
    file.climate = { monthly_mean: IMPORTED.monthly_mean, unit: 'degF' };
    const text = JSON.stringify(file);
    const check = JSON.parse(core.checkPrices(text, file.effective));
    assert.deepEqual(check.errors, []);
    const offer = kiosk.kioskOffer(check, file, JSON.parse(core.catalog()));
    const visitor = { size: 'medium', current: '', prices: { electricity: 0.16 } };
    const { scenario: s } = kiosk.kioskScenario(offer, visitor, { units: 'us', currency: 'USD', climate: file.climate });
    assert.deepEqual(s.climate, file.climate);
    const result = JSON.parse(core.evaluate(JSON.stringify(s)));
    assert.deepEqual(result.errors, []);
    assert.ok(result.climate, 'the result reports the climate it used');
    const without = kiosk.kioskScenario(offer, visitor, { units: 'us', currency: 'USD' });
    assert.equal('climate' in without.scenario, false);
  });
});
