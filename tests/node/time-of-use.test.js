// Hot water and time-of-use electricity on the page, in Node: the months a tariff row is typed with, the rows and
// the core's schedule both ways, the workspace's hot water and water heaters as the scenario sends them, and the
// core's message for a row landing on the field it came from.
import assert from 'node:assert/strict';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { loadCore, siteDir } from './helpers.js';

const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

let schedule;
let format;
let scenario;
let editing;
let core;
before(async () => {
  core = await loadCore();
  schedule = await web('schedule.js');
  format = await web('format.js');
  scenario = await web('scenario.js');
  editing = await web('editing.js');
});

describe('web/format.js times of day', () => {
  test('as tariff sheets print them', () => {
    const cases = [['16', 16], ['16:30', 16.5], [' 0:30 ', 0.5], ['00:30', 0.5], ['16.30', 16.5], ['7.30', 7.5], ['16.5', 16.5],
      ['4 pm', 16], ['4:30 PM', 16.5], ['4:30 p.m.', 16.5], ['9pm', 21], ['12 am', 0], ['12 pm', 12], ['12:30 am', 0.5],
      ['noon', 12], ['Midnight', 0], ['24:00', 24], ['24', 24], ['16h30', 16.5], ['22h', 22], ['12 midnight', 0], ['12:00 midnight', 0],
      ['12 noon', 12]];
    for (const [text, hours] of cases) assert.equal(format.parseClock(text, 'en-US'), hours, text);
    assert.equal(format.parseClock('', 'en-US'), null);
    assert.equal(format.parseClock('   ', 'en-US'), null);
    for (const text of ['25', '16:60', '13 pm', '0 am', 'peak', '-1', '24:30', '4 p', '1e1', '13 midnight', 'h']) assert.ok(Number.isNaN(format.parseClock(text, 'en-US')), text);
    assert.equal(format.parseClock('16,5', 'de-DE'), 16.5, 'decimal hours with a decimal comma');
  });

  test('shown as a clock reads them, and read back', () => {
    assert.equal(format.clockTime(16), '16:00');
    assert.equal(format.clockTime(0.5), '0:30');
    assert.equal(format.clockTime(24), '24:00');
    assert.equal(format.clockInput(16), '16');
    assert.equal(format.clockInput(7.5), '7:30');
    assert.equal(format.clockInput(undefined), '');
    for (const hours of [0, 0.5, 7.5, 16, 23.5, 24]) assert.equal(format.parseClock(format.clockInput(hours), 'en-US'), hours);
  });
});

describe('web/format.js prices as printed', () => {
  test('a currency sign, cents and a unit are read; another currency or unit is said', () => {
    const usd = { currency: 'USD', unit: 'therm' };
    const read = (text, opts = usd, locale = 'en-US') => format.parsePrice(text, locale, opts);
    assert.deepEqual(read('1.42'), { value: 1.42 });
    assert.deepEqual(read('$1.42'), { value: 1.42 });
    assert.deepEqual(read(' $ 1.42 '), { value: 1.42 });
    assert.deepEqual(read('USD 1.42'), { value: 1.42 });
    assert.deepEqual(read('$1.42/therm'), { value: 1.42 });
    assert.deepEqual(read('1.42 per therm'), { value: 1.42 });
    assert.deepEqual(read('$0.17/kWh', { currency: 'USD', unit: 'kWh' }), { value: 0.17 });
    assert.deepEqual(read('17.5¢/kWh', { currency: 'USD', unit: 'kWh' }), { value: 0.175 });
    assert.deepEqual(read('1,42 €', { currency: 'EUR', unit: 'kWh' }, 'de-DE'), { value: 1.42 });
    assert.deepEqual(read('$3.89/gal', { currency: 'USD', unit: 'gal' }), { value: 3.89 });
    assert.deepEqual(read(''), { value: null });
    assert.deepEqual(read('$1.42/kWh'), { message: 'typed per kWh; this price is per therm: choose kWh in the menu beside it' });
    assert.deepEqual(read('€1.42'), { message: '€ is not this quote\'s currency (USD): type the price in USD' });
    assert.deepEqual(read('1.42/bucket'), { message: '"bucket" is not a unit a price is given per' });
    assert.deepEqual(read('abc'), { message: 'Not a number' });
    assert.deepEqual(read('1..45'), { message: 'Not a number' });
  });
});

describe('web/schedule.js', () => {
  test('months as typed', () => {
    assert.deepEqual(schedule.parseMonths(''), []);
    assert.deepEqual(schedule.parseMonths('all'), []);
    assert.deepEqual(schedule.parseMonths('6-9'), [6, 7, 8, 9]);
    assert.deepEqual(schedule.parseMonths('11-3'), [1, 2, 3, 11, 12], 'a span over the new year');
    assert.deepEqual(schedule.parseMonths('1, 2; 12'), [1, 2, 12]);
    assert.deepEqual(schedule.parseMonths('6–9'), [6, 7, 8, 9], 'an en dash as a tariff sheet prints it');
    assert.deepEqual(schedule.parseMonths('6 - 9'), [6, 7, 8, 9], 'spaces around the dash');
    assert.deepEqual(schedule.parseMonths('Jun-Sep'), [6, 7, 8, 9], 'month names as a tariff sheet prints them');
    assert.deepEqual(schedule.parseMonths('June, December'), [6, 12]);
    assert.equal(schedule.parseMonths('summer'), null);
    assert.equal(schedule.parseMonths('0-4'), null);
    assert.equal(schedule.monthsText([6, 7, 8, 9]), '6-9');
    assert.equal(schedule.monthsText([1, 2, 3, 11, 12]), '1-3, 11, 12');
    assert.equal(schedule.monthsText([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]), '');
    for (const text of ['6-9', '1-3, 11, 12', '5', '1, 2']) assert.equal(schedule.monthsText(schedule.parseMonths(text)), text);
  });

  test('rows and the schedule both ways: a period with two spans is two rows and one entry again', () => {
    const tariff = [
      { name: 'off-peak', amount: 0.11, hours: [[23, 24], [0, 7]] },
      { name: 'peak', amount: 0.32, hours: [16, 21], days: 'weekdays', months: [6, 7, 8, 9] },
    ];
    const rows = schedule.rowsOfSchedule(tariff);
    assert.equal(rows.length, 3);
    assert.deepEqual(rows[2], { name: 'peak', amount: 0.32, from: 16, to: 21, days: 'weekdays', months_text: '6-9' });
    assert.deepEqual(schedule.scheduleOfRows(rows), [
      { name: 'off-peak', amount: 0.11, hours: [[23, 24], [0, 7]] },
      { name: 'peak', amount: 0.32, hours: [[16, 21]], days: 'weekdays', months: [6, 7, 8, 9] },
    ]);
    // the core's path of entry 0's second span lands on row 1; entry 1's months on row 2's text
    assert.equal(schedule.rowPath(rows, 0, ['hours', '1', '1']), '1/to');
    assert.equal(schedule.rowPath(rows, 1, ['months', '0']), '2/months_text');
    assert.equal(schedule.rowPath(rows, 1, ['amount']), '2/amount');
    assert.equal(schedule.rowPath(rows, 1, []), '2', 'an overlap is said at the entry: its first row');
  });

  test('months that are not months go to the core as typed, and its message comes back to the row', () => {
    const ws = scenario.blankWorkspace({ units: 'us' });
    const entry = { key: 'e', fuel: 'electricity', price: { per: 'kWh', amount: 0.2 }, fixed_charges: [] };
    ws.fuels.push(entry);
    ws.systems.push({ id: 'baseboard', fuel_key: 'e', system: { kind: 'electric-resistance', efficiency: { value: 1, rating: 'COP' } } });
    ws.demand.annual_useful_heat = { value: 40, unit: 'MMBtu' };
    editing.addPeriod(entry);
    assert.deepEqual(entry.price.schedule[0], { name: 'all hours', amount: 0.2, from: 0, to: 24, days: 'all', months_text: '' },
      'the first period covers every hour at today\'s price');
    const second = structuredClone(entry);
    editing.addPeriod(second);
    assert.deepEqual(second.price.schedule[1], { name: 'period 2', days: 'all', months_text: '' }, 'a later period has a name of its own');
    entry.price.time_of_use = true;
    entry.price.schedule[0].months_text = 'summer';
    const answer = JSON.parse(core.evaluate(JSON.stringify(scenario.toScenario(ws))));
    assert.equal(answer.errors[0].path, '/options/0/price/schedule/0/months/0');
    assert.equal(answer.errors[0].message, 'must be a month number from 1 (January) to 12');
    assert.equal(scenario.workspacePath(answer.errors[0].path, ws), '/fuels/0/price/schedule/0/months_text');
    entry.price.schedule[0].months_text = '';
    const clean = JSON.parse(core.evaluate(JSON.stringify(scenario.toScenario(ws))));
    assert.deepEqual(clean.errors, []);
    assert.equal(clean.options[0].electricity_periods[0].name, 'all hours');
    assert.ok(Math.abs(clean.options[0].electricity_periods[0].kwh - clean.options[0].electricity_kwh) < 1e-9 * clean.options[0].electricity_kwh);
  });
});

describe('hot water in the workspace', () => {
  test('the House tab\'s hot water and an option\'s own water heater as the scenario sends them', () => {
    const ws = scenario.blankWorkspace({ units: 'us' });
    ws.fuels.push({ key: 'g', fuel: 'natural-gas', price: { per: 'therm', amount: 1.5 }, fixed_charges: [] });
    ws.fuels.push({ key: 'e', fuel: 'electricity', price: { per: 'kWh', amount: 0.16 }, fixed_charges: [] });
    ws.systems.push({ id: 'furnace', fuel_key: 'g', system: { kind: 'furnace', efficiency: { value: 95, rating: 'AFUE' } } });
    ws.systems.push({ id: 'hp', fuel_key: 'e', system: { kind: 'ground-source-heat-pump', efficiency: { value: 4, rating: 'COP' } },
      water_heater: { mode: 'own', kind: 'heat-pump-water-heater', fuel: 'electricity', uef: 3.3, location: 'unconditioned' } });
    ws.demand.annual_useful_heat = { value: 60, unit: 'MMBtu' };
    ws.demand.hot_water = { value: 10, unit: 'MMBtu' };  // the older field, replaced while the section is on
    ws.demand.water_heating = { enabled: true, mode: 'people', people: 3, heater: { kind: 'storage', fuel: 'natural-gas', uef: 0.62 } };
    const doc = scenario.toScenario(ws);
    assert.equal(doc.demand.hot_water, undefined);
    assert.deepEqual(doc.demand.water_heating, { people: 3, heater: { kind: 'storage', fuel: 'natural-gas', uef: 0.62 } });
    assert.deepEqual(doc.options[1].water_heater, { kind: 'heat-pump-water-heater', fuel: 'electricity', uef: 3.3, location: 'unconditioned' });
    assert.equal(doc.options[0].water_heater, undefined, 'the furnace keeps the house\'s');
    const answer = JSON.parse(core.evaluate(JSON.stringify(doc)));
    assert.deepEqual(answer.errors, []);
    const hp = answer.options.find((o) => o.id === 'hp');
    assert.equal(hp.water_heating.made_by, 'heat-pump-water-heater');
    assert.ok(Math.abs(hp.space_heating.annual_cost + hp.water_heating.annual_cost - hp.annual_cost) < 1e-9);
    // a propane water heater, propane burned by no system: priced by propane's card on the Fuels tab
    ws.fuels.push({ key: 'p', fuel: 'propane', price: { per: 'gal', amount: 2.9 }, fixed_charges: [{ label: 'tank rental', amount_per_year: 85 }] });
    ws.demand.water_heating.heater = { kind: 'storage', fuel: 'propane', uef: 0.6 };
    const propane = scenario.toScenario(ws);
    assert.deepEqual(propane.demand.water_heating.heater, { kind: 'storage', fuel: 'propane', uef: 0.6, price: { amount: 2.9, per: 'gal' },
      fixed_charges: [{ label: 'tank rental', amount_per_year: 85 }] });
    const priced = JSON.parse(core.evaluate(JSON.stringify(propane)));
    assert.deepEqual(priced.errors, []);
    assert.equal(priced.options[0].water_heating.fuel_quantity.unit, 'gal');
    const back = scenario.fromScenario(propane);
    assert.equal(back.fuels.filter((f) => f.fuel === 'propane').length, 1, 'the card is there once');
    assert.deepEqual(scenario.toScenario(back).demand.water_heating, propane.demand.water_heating);
    ws.demand.water_heating.heater = { kind: 'storage', fuel: 'natural-gas', uef: 0.62 };
    ws.fuels.pop();
    // the workspace comes back from the scenario with the same hot water
    const again = scenario.toScenario(scenario.fromScenario(doc));
    assert.deepEqual(again.demand.water_heating, doc.demand.water_heating);
    assert.deepEqual(again.options[1].water_heater, doc.options[1].water_heater);
  });
});
