// Saved-quote records and their versions (web/storage.js, web/versions.js):
// every version 1 record of tests/fixtures/saved-quotes/ migrates to version 2
// field by field and still evaluates as it was saved; version 2 passes
// unchanged; a newer or unknown record, and a newer scenario file, are refused
// with their message; the messages shown when a write to the device fails; the
// copy kept when the page is left with its autosave still waiting.
import assert from 'node:assert/strict';
import { readdir, readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { loadCore, siteDir } from './helpers.js';

const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');
const fixturesDir = join(root, 'tests/fixtures/saved-quotes');
const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

const NEWER_MESSAGE = 'it was saved by a newer version of Fuelwright (fuelwright.saved-quote/3); '
  + 'this version reads saved quotes up to fuelwright.saved-quote/2';
const RECORD_FIELDS = ['id', 'created_at', 'updated_at', 'customer', 'site', 'date', 'title'];

let core;
let storage;
let scenario;
let quotesView;
const fixtures = new Map();
const bySchema = (schema) => [...fixtures].filter(([, r]) => r.record_schema === schema);

before(async () => {
  core = await loadCore();
  storage = await web('storage.js');
  scenario = await web('scenario.js');
  quotesView = await web('views/quotes.js');
  for (const name of (await readdir(fixturesDir)).filter((n) => n.endsWith('.json')).sort()) {
    fixtures.set(name, JSON.parse(await readFile(join(fixturesDir, name), 'utf8')));
  }
});

const evaluate = (doc) => JSON.parse(core.evaluate(JSON.stringify(doc)));
/** A workspace with its fuel keys (a running counter) renamed in order, to compare two builds of one scenario. */
function keyed(ws) {
  const copy = structuredClone(ws);
  const names = new Map(copy.fuels.map((f, i) => [f.key, `fuel-${i}`]));
  for (const f of copy.fuels) f.key = names.get(f.key);
  for (const sys of copy.systems) sys.fuel_key = names.get(sys.fuel_key) ?? sys.fuel_key;
  return copy;
}
const annualCosts = (result) => Object.fromEntries(result.options.map((o) => [o.id, o.annual_cost]));

describe('version 1 records migrate to version 2', () => {
  test('every field is kept, the summary is empty, the schema is version 2', () => {
    const v1 = bySchema('fuelwright.saved-quote/1');
    assert.ok(v1.length >= 2, `at least two version 1 fixtures (found ${v1.length})`);
    for (const [name, record] of v1) {
      const before = structuredClone(record);
      const migrated = storage.migrateRecord(record);
      assert.deepEqual(record, before, `${name}: the record passed in is not changed`);
      assert.equal(migrated.record_schema, 'fuelwright.saved-quote/2', name);
      assert.equal(migrated.summary, null, `${name}: summary`);
      for (const key of RECORD_FIELDS) assert.equal(migrated[key], record[key], `${name}: ${key}`);
      assert.deepEqual(migrated.workspace, record.workspace, `${name}: workspace`);
      assert.deepEqual(migrated.scenario, record.scenario, `${name}: scenario`);
      assert.deepEqual(Object.keys(migrated), [...Object.keys(record), 'summary'], `${name}: the fields, in order`);
      assert.equal(storage.migrateRecord(migrated), migrated, `${name}: migrating twice changes nothing`);
      assert.equal(storage.recordProblem(record), null, `${name}: can be opened`);
    }
  });

  test('the migrated workspace evaluates as the saved scenario does', () => {
    for (const [name, record] of bySchema('fuelwright.saved-quote/1')) {
      const saved = evaluate(record.scenario);
      assert.deepEqual(saved.errors, [], name);
      const reopened = evaluate(scenario.toScenario(storage.workspaceOf(record)));
      assert.deepEqual(annualCosts(reopened), annualCosts(saved), `${name}: annual costs`);
      assert.deepEqual(reopened.ranking.map((r) => r.id), saved.ranking.map((r) => r.id), `${name}: ranking`);
    }
  });

  test('a version 1 record without a usable workspace gets one rebuilt from its scenario', () => {
    for (const [name, record] of bySchema('fuelwright.saved-quote/1')) {
      for (const damaged of [undefined, null, {}, { quote: {}, settings: {}, demand: {}, fuels: 'none', systems: [] }]) {
        const copy = structuredClone(record);
        if (damaged === undefined) delete copy.workspace;
        else copy.workspace = damaged;
        const migrated = storage.migrateRecord(copy);
        assert.deepEqual(keyed(migrated.workspace), keyed(scenario.fromScenario(record.scenario)), `${name}: workspace ${JSON.stringify(damaged)}`);
        assert.equal(migrated.summary, null);
        assert.equal(migrated.id, record.id);
        const costs = annualCosts(evaluate(scenario.toScenario(migrated.workspace)));
        assert.deepEqual(costs, annualCosts(evaluate(record.scenario)), `${name}: rebuilt workspace evaluates the same`);
      }
    }
  });

  test('a version 1 record with neither workspace nor scenario is refused, not emptied', () => {
    const record = structuredClone(bySchema('fuelwright.saved-quote/1')[0][1]);
    delete record.workspace;
    delete record.scenario;
    assert.throws(() => storage.migrateRecord(record), { message: 'not a Fuelwright scenario: "schema" must be "fuelwright.scenario/1"' });
    assert.equal(storage.recordProblem(record), 'not a Fuelwright scenario: "schema" must be "fuelwright.scenario/1"');
  });
});

describe('version 2 records', () => {
  test('pass unchanged', () => {
    const v2 = bySchema('fuelwright.saved-quote/2');
    assert.ok(v2.length >= 1, 'a version 2 fixture');
    for (const [name, record] of v2) {
      const before = structuredClone(record);
      assert.equal(storage.migrateRecord(record), record, name);
      assert.deepEqual(record, before, name);
      assert.equal(storage.recordProblem(record), null, name);
    }
  });

  test('the saved summary is the verdict of the saved scenario', () => {
    for (const [name, record] of bySchema('fuelwright.saved-quote/2')) {
      const result = evaluate(record.scenario);
      const best = result.options.find((o) => o.id === result.ranking[0].id);
      // The stored cost was worked out by the core of its day: equal to 1e-9 relative, not to the last bit.
      const { annual_cost: stored, ...rest } = record.summary;
      assert.deepEqual(rest, { best_id: best.id, best_label: best.label, currency: result.settings.currency, option_count: result.options.length }, name);
      assert.ok(Math.abs(stored / best.annual_cost - 1) < 1e-9, `${name}: ${stored} vs ${best.annual_cost}`);
      const fresh = storage.verdictSummary(result);
      assert.deepEqual({ ...fresh, annual_cost: undefined }, { ...record.summary, annual_cost: undefined }, name);
      assert.equal(fresh.annual_cost, best.annual_cost, name);
    }
  });

  test('makeRecord writes version 2 with the summary', () => {
    const [, v1] = bySchema('fuelwright.saved-quote/1')[0];
    const result = evaluate(v1.scenario);
    const summary = storage.verdictSummary(result);
    const record = storage.makeRecord({ id: v1.id, createdAt: v1.created_at, workspace: v1.workspace, scenario: v1.scenario, summary });
    assert.equal(record.record_schema, 'fuelwright.saved-quote/2');
    assert.equal(record.created_at, v1.created_at);
    assert.equal(record.customer, v1.workspace.quote.customer);
    assert.deepEqual(record.summary, summary);
    assert.equal(storage.makeRecord({ workspace: v1.workspace, scenario: v1.scenario }).summary, null, 'no verdict yet');
  });

  test('no summary for a verdict with errors or none', () => {
    const [, v1] = bySchema('fuelwright.saved-quote/1')[0];
    const broken = structuredClone(v1.scenario);
    broken.options[0].price.amount = -3;
    const result = evaluate(broken);
    assert.ok(result.errors.length > 0);
    assert.equal(storage.verdictSummary(result), null);
    assert.equal(storage.verdictSummary(null), null);
  });
});

describe('newer and unknown records are refused', () => {
  test('a record of a newer version, with its message', () => {
    const newer = bySchema('fuelwright.saved-quote/3');
    assert.equal(newer.length, 1, 'one newer fixture');
    const [, record] = newer[0];
    const before = structuredClone(record);
    assert.throws(() => storage.migrateRecord(record), { name: 'UnreadableRecordError', message: NEWER_MESSAGE });
    assert.throws(() => storage.workspaceFromFile(record), { message: NEWER_MESSAGE });
    assert.equal(storage.recordProblem(record), NEWER_MESSAGE);
    assert.deepEqual(record, before, 'left as it was');
    assert.equal(quotesView.problemText(storage.recordProblem(record)), `Cannot be opened by this version: ${NEWER_MESSAGE}. It is kept unchanged on this device.`);
  });

  test('unknown record formats, with their message', () => {
    const [, record] = bySchema('fuelwright.saved-quote/1')[0];
    const cases = [
      ['acme.quote/1', 'it is in a format this version of Fuelwright does not know (record_schema "acme.quote/1"), perhaps from a newer version of Fuelwright; this version reads saved quotes up to fuelwright.saved-quote/2'],
      ['fuelwright.saved-quote/2.1', 'it is in a format this version of Fuelwright does not know (record_schema "fuelwright.saved-quote/2.1"), perhaps from a newer version of Fuelwright; this version reads saved quotes up to fuelwright.saved-quote/2'],
      ['fuelwright.saved-quote/0', 'it is in a format this version of Fuelwright does not know (record_schema "fuelwright.saved-quote/0"), perhaps from a newer version of Fuelwright; this version reads saved quotes up to fuelwright.saved-quote/2'],
      [undefined, 'it is in a format this version of Fuelwright does not know (record_schema missing), perhaps from a newer version of Fuelwright; this version reads saved quotes up to fuelwright.saved-quote/2'],
      ['fuelwright.saved-quote/12', 'it was saved by a newer version of Fuelwright (fuelwright.saved-quote/12); this version reads saved quotes up to fuelwright.saved-quote/2'],
    ];
    for (const [schema, message] of cases) {
      const copy = { ...record, record_schema: schema };
      if (schema === undefined) delete copy.record_schema;
      assert.throws(() => storage.migrateRecord(copy), { name: 'UnreadableRecordError', message }, String(schema));
    }
    assert.throws(() => storage.migrateRecord(null), { name: 'UnreadableRecordError' });
  });
});

describe('imported files', () => {
  test('a saved-quote record file opens its workspace', () => {
    for (const [name, record] of [...bySchema('fuelwright.saved-quote/1'), ...bySchema('fuelwright.saved-quote/2')]) {
      const ws = storage.workspaceFromFile(record);
      assert.deepEqual(ws, record.workspace, name);
      assert.notEqual(ws, record.workspace, `${name}: a copy`);
    }
  });

  test('a scenario file as before', async () => {
    const doc = JSON.parse(await readFile(join(root, 'data/examples/fjordvik-oil-bills.json'), 'utf8'));
    assert.deepEqual(keyed(storage.workspaceFromFile(doc)), keyed(scenario.fromScenario(doc)));
  });

  test('a scenario of a newer or unknown version is refused with its message', () => {
    const options = [{ id: 'a', fuel: 'natural-gas', price: { amount: 1, per: 'therm' }, system: { kind: 'furnace' } }];
    const cases = [
      ['fuelwright.scenario/2', 'it was saved by a newer version of Fuelwright (fuelwright.scenario/2); this version reads scenarios up to fuelwright.scenario/1'],
      ['fuelwright.scenario/next', 'it is in a format this version of Fuelwright does not know (schema "fuelwright.scenario/next"), perhaps from a newer version of Fuelwright; this version reads scenarios up to fuelwright.scenario/1'],
      ['something-else', 'not a Fuelwright scenario: "schema" must be "fuelwright.scenario/1"'],
    ];
    for (const [schema, message] of cases) {
      assert.throws(() => storage.workspaceFromFile({ schema, options }), { message }, schema);
    }
  });
});

describe('messages', () => {
  test('a write that fails for a full storage, or for another reason', () => {
    const full = new DOMException('The quota has been exceeded.', 'QuotaExceededError');
    assert.equal(storage.isQuotaError(full), true);
    assert.equal(storage.notSavedMessage(full), 'This quote was NOT saved on this device: the storage for this page on this device is full. '
      + 'Your work is still here while this page stays open. Export the quote file to keep it, and delete old saved quotes to make room.');
    const other = new DOMException('Disk I/O error', 'UnknownError');
    assert.equal(storage.isQuotaError(other), false);
    assert.equal(storage.notSavedMessage(other), 'This quote was NOT saved on this device: the browser refused to store it (Disk I/O error). '
      + 'Your work is still here while this page stays open. Export the quote file to keep it, and delete old saved quotes to make room.');
    assert.equal(storage.notRestoredMessage('Lee Example (invented)', full), 'The deleted quote for Lee Example (invented) was NOT put back on this device: '
      + 'the storage for this page on this device is full. Delete other old quotes to make room, then press Undo again.');
    assert.equal(storage.notDeletedMessage('', other), 'The quote for no customer was NOT deleted from this device: the browser refused to store it (Disk I/O error).');
    assert.equal(storage.notMigratedMessage(2, full), '2 saved quotes from an earlier version of Fuelwright could not be updated on this device: '
      + 'the storage for this page on this device is full. They still open as before, and the update is tried again the next time this page starts.');
  });

  test('the list line of a summary', () => {
    const summary = { best_id: 'ashp', best_label: 'Air-source heat pump', annual_cost: 1234.4, currency: 'USD', option_count: 5 };
    assert.equal(quotesView.summaryText(summary, 'en-US'), 'Lowest yearly cost: Air-source heat pump, $1,234/yr (best of 5 options)');
    assert.equal(quotesView.summaryText({ ...summary, currency: 'EUR', option_count: 1 }, 'de-DE'), 'Lowest yearly cost: Air-source heat pump, 1.234\u00a0€/yr (the only option)');
    assert.equal(quotesView.summaryText(null, 'en-US'), 'No verdict saved yet: open the quote to work it out.');
  });
});

describe('a record kept when the page is left before its autosave', () => {
  /** localStorage as the page has it: strings by key (Web Storage's getItem/setItem/removeItem). */
  function fakeLocalStorage() {
    const items = new Map();
    return {
      items,
      getItem: (key) => (items.has(key) ? items.get(key) : null),
      setItem: (key, value) => items.set(key, String(value)),
      removeItem: (key) => items.delete(key),
    };
  }
  const KEY = 'fuelwright.unsaved-quote';
  let saved;
  before(() => { saved = Object.getOwnPropertyDescriptor(globalThis, 'localStorage'); });
  const withStorage = (run) => {
    const ls = fakeLocalStorage();
    Object.defineProperty(globalThis, 'localStorage', { value: ls, configurable: true, writable: true });
    try { run(ls); } finally {
      if (saved) Object.defineProperty(globalThis, 'localStorage', saved);
      else delete globalThis.localStorage;
    }
  };
  const recordAt = (time, customer) => {
    const [, v2] = bySchema('fuelwright.saved-quote/2')[0];
    return { ...v2, updated_at: time, customer, workspace: { ...v2.workspace, quote: { ...v2.workspace.quote, customer } } };
  };

  test('is given back when nothing newer of its id is stored, and kept until it is stored', () => withStorage((ls) => {
    const kept = recordAt('2026-03-02T10:00:00.000Z', 'Kept on leaving (invented)');
    const before = recordAt('2026-03-02T09:59:59.999Z', 'Before');
    storage.keepUnsaved(kept, before.updated_at);
    assert.deepEqual(storage.unsavedNewerThan([]), { record: kept, basedOn: before.updated_at }, 'no stored record of its id');
    assert.deepEqual(storage.unsavedNewerThan([before]), { record: kept, basedOn: before.updated_at }, 'the stored one is older');
    storage.keepUnsaved(kept);
    assert.deepEqual(storage.unsavedNewerThan([]), { record: kept, basedOn: null }, 'a quote never stored before');
    assert.ok(ls.items.has(KEY), 'kept until a save of its id succeeds');
    storage.forgetUnsaved('some-other-quote');
    assert.ok(ls.items.has(KEY), 'a save of another quote leaves it');
    storage.forgetUnsaved(kept.id);
    assert.equal(ls.items.has(KEY), false);
  }));

  test('is dropped when the stored record is as new or newer, damaged, or of a version this one cannot read', () => withStorage((ls) => {
    const kept = recordAt('2026-03-02T10:00:00.000Z', 'Kept on leaving (invented)');
    for (const stored of [recordAt(kept.updated_at, 'Same time'), recordAt('2026-03-02T10:00:00.001Z', 'Later')]) {
      storage.keepUnsaved(kept);
      assert.equal(storage.unsavedNewerThan([stored]), null, stored.customer);
      assert.equal(ls.items.has(KEY), false, `${stored.customer}: forgotten`);
    }
    for (const [what, text] of [['not JSON', '{ cut short'], ['not a record', '"a string"'], ['null', 'null'], ['no record', '{"based_on": null}'],
      ['a newer version', JSON.stringify({ record: fixtures.get('v3-newer-version.json'), based_on: null })]]) {
      ls.setItem(KEY, text);
      assert.equal(storage.unsavedNewerThan([]), null, what);
      assert.equal(ls.items.has(KEY), false, `${what}: forgotten`);
    }
  }));
});

describe('a save overtaken by another window', () => {
  const at = (time) => ({ id: 'q-1', updated_at: time });
  test('a stored record counts as changed when it is not the one the window last had', () => {
    assert.equal(storage.changedSince(undefined, null), false, 'nothing stored: a new quote');
    assert.equal(storage.changedSince(undefined, '2026-03-02T10:00:00.000Z'), false, 'deleted elsewhere: written again, not lost');
    assert.equal(storage.changedSince(at('2026-03-02T10:00:00.000Z'), '2026-03-02T10:00:00.000Z'), false, 'the one this window had');
    assert.equal(storage.changedSince(at('2026-03-02T10:00:05.000Z'), '2026-03-02T10:00:00.000Z'), true, 'saved since by another window');
    assert.equal(storage.changedSince(at('2026-03-02T09:00:00.000Z'), '2026-03-02T10:00:00.000Z'), true, 'any other record, older too');
    assert.equal(storage.changedSince(at('2026-03-02T10:00:00.000Z'), null), true, 'stored, though this window never had it');
  });

  test('putUnlessChanged writes, or gives back the record that stopped it (memory storage)', async () => {
    const quotes = await withoutStorageApis(() => storage.openQuotes());
    assert.equal(quotes.kind, 'memory (not kept)');
    const first = { ...at('2026-03-02T10:00:00.000Z'), customer: 'First window (invented)' };
    assert.equal(await quotes.putUnlessChanged(first, null), null, 'a new quote is written');
    const second = { ...at('2026-03-02T10:00:05.000Z'), customer: 'Second window (invented)' };
    assert.deepEqual(await quotes.putUnlessChanged(second, null), first, 'a window that never had it is stopped');
    assert.deepEqual(await quotes.get('q-1'), first);
    assert.equal(await quotes.putUnlessChanged(second, first.updated_at), null, 'the window that had the stored one writes');
    assert.deepEqual(await quotes.get('q-1'), second);
  });
});

/** Runs `fn` with neither IndexedDB nor localStorage, as a browser with both turned off. */
async function withoutStorageApis(fn) {
  const saved = ['indexedDB', 'localStorage'].map((name) => [name, Object.getOwnPropertyDescriptor(globalThis, name)]);
  for (const [name] of saved) Object.defineProperty(globalThis, name, { value: undefined, configurable: true, writable: true });
  try {
    return await fn();
  } finally {
    for (const [name, descriptor] of saved) {
      if (descriptor) Object.defineProperty(globalThis, name, descriptor);
      else delete globalThis[name];
    }
  }
}
