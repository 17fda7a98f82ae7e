// The open quote kept on the device (web/quote-keeper.js) in Node, against a storage that stands in for
// IndexedDB: the autosave after its wait, saves one after another, a fork when another window saved the
// quote since, and a failed write said with the work kept. The workspace is the page's invented demo.
import assert from 'node:assert/strict';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { siteDir } from './helpers.js';

const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

let keeperModule;
let demo;
before(async () => {
  keeperModule = await web('quote-keeper.js');
  demo = await web('demo.js');
});

/** A storage in memory; `blockWith` makes the next putUnlessChanged find a newer copy, `failWith` makes it throw. */
function memoryStorage() {
  const records = new Map();
  return {
    records,
    writes: [],
    blockWith: null,
    failWith: null,
    async putUnlessChanged(record, knownAt) {
      this.writes.push(['putUnlessChanged', record.id, knownAt]);
      if (this.failWith) throw this.failWith;
      if (this.blockWith) return this.blockWith;
      records.set(record.id, record);
      return null;
    },
    async put(record) {
      this.writes.push(['put', record.id]);
      records.set(record.id, record);
    },
  };
}

function keeperWith(storage) {
  const quotes = { records: [], currentId: 'q-1', knownAt: null };
  const states = [];
  const alerts = [];
  const saved = [];
  const ws = demo.demoWorkspace();
  const keeper = keeperModule.createQuoteKeeper({
    quotes, workspace: () => ws, summaryFor: () => null, delayMs: 5,
    onState: (state) => states.push(state),
    alerts: { set: (kind, text) => alerts.push([kind, text]), clear: () => {} },
    onSaved: (record) => saved.push(record.id),
  });
  keeper.attach(storage);
  return { keeper, quotes, states, alerts, saved };
}

const wait = (ms) => new Promise((r) => setTimeout(r, ms));

describe('web/quote-keeper.js', () => {
  test('the autosave writes after its wait; the next save knows what the one before it wrote', async () => {
    const storage = memoryStorage();
    const { keeper, quotes, states, saved } = keeperWith(storage);
    keeper.schedule();
    keeper.schedule();
    assert.deepEqual(states, ['waiting', 'waiting']);
    await wait(30);
    assert.deepEqual(saved, ['q-1'], 'one save for two changes');
    const first = storage.records.get('q-1');
    assert.equal(quotes.knownAt, first.updated_at);
    await keeper.saveNow();
    assert.deepEqual(storage.writes.map((w) => w[2]), [null, first.updated_at]);
    assert.deepEqual(states.slice(2), ['saving', 'saved', 'saving', 'saved']);
    assert.equal(quotes.records.length, 1);
  });

  test('a quote saved meanwhile in another window is not written over: this work becomes a quote of its own', async () => {
    const storage = memoryStorage();
    const { keeper, quotes, alerts } = keeperWith(storage);
    const theirs = { id: 'q-1', updated_at: '2026-12-04T10:00:00.000Z' };
    storage.blockWith = theirs;
    await keeper.saveNow();
    assert.notEqual(quotes.currentId, 'q-1');
    assert.ok(storage.records.has(quotes.currentId));
    assert.equal(alerts.length, 1);
    assert.equal(alerts[0][0], 'forked');
    assert.deepEqual(quotes.records.map((r) => r.id).sort(), ['q-1', quotes.currentId].sort());
  });

  test('a failed write is said, and the save state says so', async () => {
    const storage = memoryStorage();
    const { keeper, states, alerts, saved } = keeperWith(storage);
    storage.failWith = new Error('QuotaExceededError');
    await keeper.saveNow();
    assert.deepEqual(states, ['saving', 'failed']);
    assert.equal(alerts[0][0], 'not-saved');
    assert.deepEqual(saved, []);
  });

  test('a waiting autosave is dropped by cancel and made now by flush', async () => {
    const storage = memoryStorage();
    const { keeper, saved } = keeperWith(storage);
    keeper.schedule();
    keeper.cancel();
    await wait(20);
    assert.deepEqual(saved, []);
    keeper.schedule();
    await keeper.flush();
    assert.deepEqual(saved, ['q-1']);
  });
});
