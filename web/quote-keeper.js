// The open quote kept on the device: an autosave once typing stops, saves made one after another (each
// knows what the one before it wrote), a save that would write over a copy another window or tab saved
// since written as a quote of its own (a fork, said once), the record kept at once in localStorage when
// the page is hidden or left with a save waiting, and that record written on the next start. It holds
// no page: app.js gives it the workspace, the verdict's summary and where the save state is said.
import { toScenario } from './scenario.js';
import {
  FORKED_MESSAGE, currentQuoteId, forgetUnsaved, keepUnsaved, makeRecord, newId, notSavedMessage, setCurrentQuoteId, unsavedNewerThan,
} from './storage.js';

/**
 * `quotes` is the page's list state {records, currentId, knownAt}; `workspace()` the open workspace;
 * `summaryFor(scenario)` the verdict's summary for that scenario (or null); `delayMs` the autosave's wait;
 * `onState(state, at)` is told 'waiting', 'saving', 'saved' (with the time) or 'failed';
 * `alerts.set(kind, text)` and `alerts.clear(...kinds)` show and hide the persistent messages;
 * `onSaved(record)` follows every successful save. `attach(storage)` gives it the opened storage.
 */
export function createQuoteKeeper({ quotes, workspace, summaryFor, delayMs, onState, alerts, onSaved }) {
  let storage = null;
  let timer = 0;
  let saving = Promise.resolve();

  /** Puts `record` in the saved list kept in memory, in place of the one with its id. */
  const listRecord = (record) => {
    const i = quotes.records.findIndex((r) => r.id === record.id);
    if (i >= 0) quotes.records[i] = record;
    else quotes.records.push(record);
  };

  /** The open workspace as the current quote's record (its first-saved time kept); it becomes the current quote. */
  const currentRecord = () => {
    const ws = workspace();
    const scenario = toScenario(ws);
    const existing = quotes.records.find((r) => r.id === quotes.currentId);
    const record = makeRecord({ id: quotes.currentId ?? newId(), createdAt: existing?.created_at, workspace: structuredClone(ws), scenario,
      summary: summaryFor(scenario) });
    quotes.currentId = record.id;
    setCurrentQuoteId(record.id);
    return record;
  };

  /** Writes `record` unless its quote was saved elsewhere since `knownAt`; then as a new quote. Resolves to what was written. */
  const writeRecord = async (record, knownAt) => {
    const blocked = await storage.putUnlessChanged(record, knownAt);
    if (!blocked) return record;
    listRecord(blocked);
    const copy = { ...record, id: newId(), created_at: record.updated_at };
    await storage.put(copy);
    alerts.set('forked', FORKED_MESSAGE);
    return copy;
  };

  const saveOnce = async () => {
    if (!storage) return;
    const record = currentRecord();
    let written;
    onState('saving');
    try {
      written = await writeRecord(record, quotes.knownAt);
    } catch (failure) {
      // the work stays in the store (memory); the message stays until a save succeeds
      alerts.set('not-saved', notSavedMessage(failure));
      onState('failed');
      return;
    }
    onState('saved', written.updated_at);
    if (quotes.currentId === record.id) {
      quotes.currentId = written.id;
      quotes.knownAt = written.updated_at;
      setCurrentQuoteId(written.id);
    }
    forgetUnsaved(record.id);
    alerts.clear('not-saved', 'not-migrated', 'not-deleted', 'not-restored');
    listRecord(written);
    onSaved(written);
  };

  /** Saves the open quote now, after any save already under way. */
  const saveNow = () => {
    clearTimeout(timer);
    timer = 0;
    const run = saving.then(saveOnce);
    saving = run.catch(() => {});
    return run;
  };

  return {
    attach(opened) { storage = opened; },
    listRecord,
    /** The autosave: `delayMs` after the last change. */
    schedule() {
      onState('waiting');
      clearTimeout(timer);
      timer = setTimeout(saveNow, delayMs);
    },
    saveNow,
    /** A waiting autosave made now (before another quote opens). */
    async flush() {
      if (timer) await saveNow();
    },
    /** A waiting autosave dropped (its quote is being deleted). */
    cancel() {
      clearTimeout(timer);
      timer = 0;
    },
    /** The page is hidden or left with its autosave waiting: the record is kept at once, then written as usual. */
    saveBeforeLeaving() {
      if (!timer || !storage) return;
      keepUnsaved(currentRecord(), quotes.knownAt);
      saveNow();
    },
    /** A record kept by saveBeforeLeaving that did not reach the storage: written now, and listed. */
    async restoreUnsaved() {
      const kept = unsavedNewerThan(quotes.records);
      if (!kept) return;
      const { record, basedOn } = kept;
      try {
        const written = await writeRecord(record, basedOn);
        listRecord(written);
        if (written.id !== record.id && currentQuoteId() === record.id) setCurrentQuoteId(written.id);
        forgetUnsaved(record.id);
      } catch (failure) {
        listRecord(record);
        alerts.set('not-saved', notSavedMessage(failure));
      }
    },
  };
}
