// Price lists and equipment kept on the device (web/templates.js), pure functions: the demo quote's
// prices kept and put into a new quote (fuels added, one currency only), a system card kept and added
// to another quote with its data sheet, a dual-fuel backup not kept, the export file read back, a
// newer file refused, bad entries refused one by one with the reason; and the quote built from them
// evaluated by the core the same as the demo's own options. The demo is invented.
import assert from 'node:assert/strict';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { loadCore, siteDir } from './helpers.js';

const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

let templates;
let scenario;
let demo;
let core;
before(async () => {
  templates = await web('templates.js');
  scenario = await web('scenario.js');
  demo = await web('demo.js');
  core = await loadCore();
});

const evaluate = (doc) => JSON.parse(core.evaluate(JSON.stringify(doc)));

describe('price lists', () => {
  test('the demo\'s prices kept and put into a blank quote give the same fuels and prices', () => {
    const ws = demo.demoWorkspace();
    const { list, unpriced } = templates.priceListFrom(ws, ' Winter prices ', 'p1');
    assert.equal(list.name, 'Winter prices');
    assert.equal(list.currency, ws.settings.currency);
    assert.equal(unpriced.length, ws.fuels.filter((f) => typeof f.price?.amount !== 'number').length);
    assert.ok(list.fuels.every((f) => !('key' in f)), 'the quote\'s own keys are not kept');
    const blank = scenario.blankWorkspace();
    blank.settings.currency = ws.settings.currency;
    const answer = templates.applyPriceList(blank, list);
    assert.equal(answer.ok, true);
    assert.equal(answer.added.length, list.fuels.length);
    for (const f of list.fuels) {
      const entry = blank.fuels.find((e) => scenario.fuelId(e) === f.fuel);
      assert.deepEqual(entry.price, f.price, `${f.fuel}: price`);
      assert.deepEqual(entry.fixed_charges, f.fixed_charges ?? [], `${f.fuel}: charges`);
      assert.ok(entry.key, `${f.fuel}: a key of the new quote`);
    }
  });

  test('a fuel already on the quote takes the list\'s price and keeps its place; another currency changes nothing', () => {
    const ws = demo.demoWorkspace();
    const { list } = templates.priceListFrom(ws, 'Winter prices', 'p1');
    const gas = list.fuels.find((f) => f.fuel === 'natural-gas');
    gas.price = { amount: 1.45, per: 'therm' };
    const other = demo.demoWorkspace();
    const keyBefore = other.fuels.find((e) => scenario.fuelId(e) === 'natural-gas').key;
    const count = other.fuels.length;
    const answer = templates.applyPriceList(other, list);
    assert.equal(answer.ok, true);
    assert.equal(other.fuels.length, count, 'nothing added');
    const entry = other.fuels.find((e) => scenario.fuelId(e) === 'natural-gas');
    assert.equal(entry.key, keyBefore);
    assert.deepEqual(entry.price, { amount: 1.45, per: 'therm' });
    other.settings.currency = 'CAD';
    const refused = templates.applyPriceList(other, list);
    assert.equal(refused.ok, false);
    assert.equal(refused.message, `“Winter prices” is in ${list.currency} and this quote is in CAD: nothing was changed. Change the quote's currency first, or keep a price list in CAD.`);
  });
});

describe('equipment', () => {
  test('the demo\'s heat pump kept and added to a quote evaluates as the demo\'s own', () => {
    const ws = demo.demoWorkspace();
    const index = ws.systems.findIndex((s) => s.system?.kind === 'air-source-heat-pump');
    const sys = ws.systems[index];
    const { entry, dropped } = templates.equipmentFrom(ws, sys, 'CX heat pump', 'e1');
    assert.deepEqual(dropped, []);
    assert.equal(entry.fuel, 'electricity');
    // a new quote with the demo's prices, its heat pump removed, then added back from the kept entry
    const other = demo.demoWorkspace();
    other.systems.splice(index, 1);
    const { system, addedFuel } = templates.applyEquipment(other, entry);
    assert.equal(addedFuel, null, 'the quote has electricity already');
    assert.equal(system.label, 'CX heat pump');
    assert.deepEqual(system.system, sys.system);
    const a = evaluate(scenario.toScenario(ws));
    const b = evaluate(scenario.toScenario(other));
    assert.deepEqual(a.errors, []);
    assert.deepEqual(b.errors, []);
    const cost = (r, id) => r.options.find((o) => o.id === id).annual_cost;
    assert.equal(cost(b, system.id), cost(a, sys.id));
  });

  test('a dual-fuel backup belongs to each house and is not kept; a fuel missing from the quote is added without a price', () => {
    const ws = demo.demoWorkspace();
    const sys = structuredClone(ws.systems.find((s) => s.system?.kind === 'air-source-heat-pump'));
    sys.system.backup = ws.systems.find((s) => s.existing).id;
    sys.system.changeover = { value: 25, unit: 'degF' };
    const { entry, dropped } = templates.equipmentFrom(ws, sys, 'CX dual', 'e2');
    assert.deepEqual(dropped, ['its dual-fuel backup (each house has its own)']);
    assert.equal(entry.item.system.backup, undefined);
    assert.equal(entry.item.system.changeover, undefined);
    const blank = scenario.blankWorkspace();
    const { system, addedFuel } = templates.applyEquipment(blank, entry);
    assert.equal(addedFuel, 'electricity');
    assert.equal(blank.fuels.length, 1);
    assert.equal(system.fuel_key, blank.fuels[0].key);
    assert.equal(blank.fuels[0].price.amount, undefined, 'its price is the user\'s to give');
  });
});

describe('the file of price lists and equipment', () => {
  test('exported and read back unchanged; bad entries refused one by one; a newer file refused', () => {
    const ws = demo.demoWorkspace();
    const shelf = templates.emptyShelf();
    templates.shelve(shelf, 'price_lists', templates.priceListFrom(ws, 'Winter prices', 'p1').list);
    templates.shelve(shelf, 'price_lists', templates.priceListFrom(ws, 'winter prices', 'p2').list);
    assert.deepEqual(shelf.price_lists.map((l) => l.name), ['Winter prices', 'winter prices (2)'], 'names stay unique');
    templates.shelve(shelf, 'equipment', templates.equipmentFrom(ws, ws.systems[1], 'Furnace', 'e1').entry);
    const file = templates.templatesFile(shelf, '2026-12-04T10:00:00Z');
    assert.equal(file.schema, 'fuelwright.templates/1');
    const read = templates.readTemplatesFile(JSON.parse(JSON.stringify(file)));
    assert.deepEqual(read.refused, []);
    assert.deepEqual(read.price_lists, file.price_lists);
    assert.deepEqual(read.equipment, file.equipment);

    const bad = structuredClone(file);
    bad.price_lists.push({ name: 'No currency', fuels: file.price_lists[0].fuels });
    bad.equipment.push({ name: 'Odd', fuel: 'electricity', item: { system: { kind: 'fireplace' } } });
    const partly = templates.readTemplatesFile(bad);
    assert.equal(partly.price_lists.length, 2);
    assert.equal(partly.equipment.length, 1);
    assert.deepEqual(partly.refused, [
      'Price list 3 (“No currency”) was not kept: it has no currency (three capital letters, e.g. USD).',
      'Equipment 2 (“Odd”) was not kept: it has an unknown kind of system ("fireplace").',
    ]);
    assert.throws(() => templates.readTemplatesFile({ ...file, schema: 'fuelwright.templates/2' }),
      { message: 'it was saved by a newer version of Fuelwright (fuelwright.templates/2); this version reads price lists and equipment up to fuelwright.templates/1' });
    assert.throws(() => templates.readTemplatesFile([]), { message: 'it is not a file of price lists and equipment' });
  });

  test('names: empty, too long and taken are refused with the reason', () => {
    const entries = [{ name: 'Winter prices' }];
    assert.equal(templates.templateNameProblem('  ', entries, 'price list'), 'Give the price list a name.');
    assert.equal(templates.templateNameProblem('x'.repeat(81), entries, 'price list'), 'A name may have at most 80 characters; this one has 81.');
    assert.equal(templates.templateNameProblem('WINTER PRICES', entries, 'price list'), 'A price list called “WINTER PRICES” is already kept on this device; choose another name.');
    assert.equal(templates.templateNameProblem('Spring', entries, 'price list'), null);
  });
});
