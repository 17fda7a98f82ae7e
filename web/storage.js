// Saved quotes on this device: IndexedDB (database "fuelwright", store
// "quotes"), or localStorage when IndexedDB is unavailable. Each record carries
// a schema version. Nothing leaves the device.
//
// record (fuelwright.saved-quote/2): {record_schema, id, created_at, updated_at,
//   customer, site, date, title, workspace (the page's form state), scenario
//   (fuelwright.scenario/1), summary (the verdict when it was saved, or null)}
// A fuelwright.saved-quote/1 record is the same without `summary`; migrateRecord
// turns it into a version 2 record. Newer or unknown records are refused, never
// rewritten.
import { localStorageWorks, openDatabase, request } from './idb.js';
import { fromScenario } from './scenario.js';
import { unreadableVersionMessage, versionOf } from './versions.js';

export const RECORD_FAMILY = 'fuelwright.saved-quote';
export const RECORD_VERSION = 2;
export const RECORD_SCHEMA = `${RECORD_FAMILY}/${RECORD_VERSION}`;
const DB_NAME = 'fuelwright';
const STORE = 'quotes';
const LS_PREFIX = 'fuelwright.quote.';
const CURRENT_KEY = 'fuelwright.current-quote';
const PREFS_KEY = 'fuelwright.preferences';
/** The contractor's profile on this device (web/profile.js). */
const PROFILE_KEY = 'fuelwright.profile';
const TEMPLATES_KEY = 'fuelwright.templates';
const UNSAVED_KEY = 'fuelwright.unsaved-quote';


class IdbQuotes {
  kind = 'IndexedDB';
  constructor(db) { this.db = db; }
  #store(mode) { return this.db.transaction(STORE, mode).objectStore(STORE); }
  list() { return request(this.#store('readonly').getAll()); }
  get(id) { return request(this.#store('readonly').get(id)); }
  async put(record) { await this.#write((store) => store.put(record)); return record; }
  /** See `putUnlessChanged` below: the read and the write are one transaction, which IndexedDB runs alone among this origin's windows. */
  async putUnlessChanged(record, expectedUpdatedAt) {
    let blocked = null;
    await this.#write((store) => {
      const read = store.get(record.id);
      read.onsuccess = () => {
        if (changedSince(read.result, expectedUpdatedAt)) blocked = read.result;
        else store.put(record);
      };
    });
    return blocked;
  }
  async delete(id) { await this.#write((store) => store.delete(id)); }
  /** Runs one write and settles when it is committed: a full disk or quota aborts the transaction after the request itself succeeded. */
  #write(fn) {
    const tx = this.db.transaction(STORE, 'readwrite');
    const done = committed(tx);
    try {
      fn(tx.objectStore(STORE));
    } catch (failure) {
      try { tx.abort(); } catch { /* already finished */ }
      done.catch(() => {});
      throw failure;
    }
    return done;
  }
}

/** Resolves when a transaction commits; rejects with its error when it aborts. */
function committed(tx) {
  return new Promise((resolve, reject) => {
    tx.oncomplete = () => resolve();
    tx.onabort = () => reject(tx.error ?? new DOMException('The write was aborted', 'AbortError'));
  });
}

class LocalQuotes {
  kind = 'localStorage';
  async list() {
    const out = [];
    for (let i = 0; i < localStorage.length; i++) {
      const key = localStorage.key(i);
      if (key?.startsWith(LS_PREFIX)) {
        try { out.push(JSON.parse(localStorage.getItem(key))); } catch { /* skip a damaged record */ }
      }
    }
    return out;
  }
  async get(id) {
    const text = localStorage.getItem(LS_PREFIX + id);
    return text ? JSON.parse(text) : undefined;
  }
  async put(record) { localStorage.setItem(LS_PREFIX + record.id, JSON.stringify(record)); return record; }
  async putUnlessChanged(record, expectedUpdatedAt) {
    const stored = await this.get(record.id);
    if (changedSince(stored, expectedUpdatedAt)) return stored;
    await this.put(record);
    return null;
  }
  async delete(id) { localStorage.removeItem(LS_PREFIX + id); }
}

class MemoryQuotes {
  kind = 'memory (not kept)';
  #map = new Map();
  async list() { return [...this.#map.values()].map((r) => structuredClone(r)); }
  async get(id) { const r = this.#map.get(id); return r && structuredClone(r); }
  async put(record) { this.#map.set(record.id, structuredClone(record)); return record; }
  async putUnlessChanged(record, expectedUpdatedAt) {
    const stored = this.#map.get(record.id);
    if (changedSince(stored, expectedUpdatedAt)) return structuredClone(stored);
    await this.put(record);
    return null;
  }
  async delete(id) { this.#map.delete(id); }
}

/**
 * True when a stored record is not the one a window last read or wrote (`expectedUpdatedAt`, null for a
 * quote it has never stored): another window or tab has saved it since. A missing record is no change
 * (a quote deleted elsewhere is written again rather than lost).
 */
export function changedSince(stored, expectedUpdatedAt) {
  return Boolean(stored) && stored.updated_at !== (expectedUpdatedAt ?? undefined);
}

/**
 * Opens the quote storage: IndexedDB, else localStorage, else memory. Each offers list(), get(id),
 * put(record), delete(id) and putUnlessChanged(record, expectedUpdatedAt), which writes the record
 * unless the stored one of its id has changed since (changedSince) and then returns that stored
 * record instead (null when written).
 */
export async function openQuotes() {
  try {
    return new IdbQuotes(await openDatabase(DB_NAME, STORE));
  } catch {
    return localStorageWorks() ? new LocalQuotes() : new MemoryQuotes();
  }
}

/** A new record id. */
export function newId() {
  if (globalThis.crypto?.randomUUID) return crypto.randomUUID();
  return `q-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 10)}`;
}

/** Makes a record for a workspace, its scenario document and the summary of its verdict (null when there is none). */
export function makeRecord({ id = newId(), createdAt, workspace, scenario, summary = null }) {
  const now = new Date().toISOString();
  return {
    record_schema: RECORD_SCHEMA,
    id,
    created_at: createdAt ?? now,
    updated_at: now,
    customer: workspace.quote?.customer ?? '',
    site: workspace.quote?.site ?? '',
    date: workspace.quote?.date ?? '',
    title: workspace.title ?? '',
    workspace,
    scenario,
    summary,
  };
}

/** The summary kept with a record: the cheapest option a year, its cost and currency, how many options; null without a clean verdict. */
export function verdictSummary(result) {
  if (!result || result.errors?.length || !Array.isArray(result.options) || !result.ranking?.length) return null;
  const best = result.options.find((o) => o.id === result.ranking[0].id);
  if (!best || !Number.isFinite(best.annual_cost)) return null;
  return {
    best_id: best.id,
    best_label: best.label || best.id,
    annual_cost: best.annual_cost,
    currency: result.settings?.currency ?? '',
    option_count: result.options.length,
  };
}

/** Whether a record's workspace has the parts the page edits. */
const usableWorkspace = (ws) => Boolean(ws && typeof ws === 'object' && ws.quote && ws.settings && ws.demand
  && Array.isArray(ws.fuels) && Array.isArray(ws.systems));

/** Thrown for a record this version of the page cannot read; `schema` is what the record says it is. */
export class UnreadableRecordError extends Error {
  name = 'UnreadableRecordError';
  constructor(message, schema) {
    super(message);
    this.schema = schema;
  }
}

/**
 * A stored record as this version reads it: version 1 becomes version 2 (summary
 * null, every other field kept, the workspace rebuilt from the scenario when it
 * is missing or damaged); version 2 is returned as it is; a newer or unknown
 * record throws UnreadableRecordError. Pure: the record passed in is not changed.
 */
export function migrateRecord(record) {
  const schema = record && typeof record === 'object' ? record.record_schema : undefined;
  const version = versionOf(schema, RECORD_FAMILY);
  if (version === RECORD_VERSION) return record;
  if (version !== 1) {
    throw new UnreadableRecordError(unreadableVersionMessage(schema, { family: RECORD_FAMILY, newest: RECORD_VERSION, what: 'saved quotes', field: 'record_schema' }), schema);
  }
  const workspace = usableWorkspace(record.workspace) ? structuredClone(record.workspace) : fromScenario(record.scenario);
  return { ...structuredClone(record), record_schema: RECORD_SCHEMA, workspace, summary: null };
}

/** Why a stored record cannot be opened by this version, or null when it can. */
export function recordProblem(record) {
  try {
    workspaceOf(record);
    return null;
  } catch (failure) {
    return failure.message;
  }
}

/** The workspace to open for a record (migrated first; a damaged version 2 workspace is rebuilt from its scenario). */
export function workspaceOf(record) {
  const current = migrateRecord(record);
  return usableWorkspace(current.workspace) ? current.workspace : fromScenario(current.scenario);
}

/** The workspace in an imported file: a scenario document, or a saved-quote record of a version this page reads. */
export function workspaceFromFile(doc) {
  if (doc && typeof doc === 'object' && 'record_schema' in doc) return structuredClone(workspaceOf(doc));
  return fromScenario(doc);
}

/** Whether a storage failure means the device's storage for this page is full. */
export const isQuotaError = (failure) => ['QuotaExceededError', 'NS_ERROR_DOM_QUOTA_REACHED'].includes(failure?.name) || failure?.code === 22;

/** Why a write failed, in words for the user. */
function writeFailure(failure) {
  if (isQuotaError(failure)) return 'the storage for this page on this device is full';
  return `the browser refused to store it (${failure?.message || failure?.name || String(failure)})`;
}

/** Shown when this window's save found its quote changed by another window or tab. */
export const FORKED_MESSAGE = 'This quote had been changed in another window or tab since this one opened it. '
  + 'So that neither version is lost, the changes made here were saved as a separate quote, which is the one open now; '
  + 'the other version is kept as it was, under Saved quotes.';

/** The message shown while the open quote could not be saved. */
export function notSavedMessage(failure) {
  return `This quote was NOT saved on this device: ${writeFailure(failure)}. Your work is still here while this page stays open. `
    + 'Export the quote file to keep it, and delete old saved quotes to make room.';
}

/** The message shown when a deleted quote could not be put back. */
export function notRestoredMessage(customer, failure) {
  return `The deleted quote for ${customer || 'no customer'} was NOT put back on this device: ${writeFailure(failure)}. `
    + 'Delete other old quotes to make room, then press Undo again.';
}

/** The message shown when a quote could not be deleted. */
export function notDeletedMessage(customer, failure) {
  return `The quote for ${customer || 'no customer'} was NOT deleted from this device: ${writeFailure(failure)}.`;
}

/** The message shown when records of an earlier version could not be written back in the new form. */
export function notMigratedMessage(count, failure) {
  const quotes = count === 1 ? '1 saved quote' : `${count} saved quotes`;
  return `${quotes} from an earlier version of Fuelwright could not be updated on this device: ${writeFailure(failure)}. `
    + 'They still open as before, and the update is tried again the next time this page starts.';
}

function local(key) {
  try { return localStorage.getItem(key); } catch { return null; }
}
// Best-effort on purpose: a lost preference or current-quote pointer only means
// the page starts on its defaults (or another quote); no quote is lost with it.
function setLocal(key, value) {
  try {
    if (value === null) localStorage.removeItem(key);
    else localStorage.setItem(key, value);
  } catch { /* private mode or full storage: not kept, see above */ }
}

/**
 * Keeps a record at once (localStorage is written synchronously) when the page is hidden or left with its
 * autosave still waiting: IndexedDB may not commit before a tablet discards the page. `basedOn` is the
 * updated_at of the stored record the window had (null for a quote it had never stored).
 */
export const keepUnsaved = (record, basedOn = null) => setLocal(UNSAVED_KEY, JSON.stringify({ record, based_on: basedOn }));

function keptUnsaved() {
  try {
    const kept = JSON.parse(local(UNSAVED_KEY) ?? 'null');
    return kept && typeof kept === 'object' && kept.record && typeof kept.record === 'object' ? kept : null;
  } catch {
    return null;
  }
}

/** Forgets the kept record once record `id` is stored (any id when none is given). */
export function forgetUnsaved(id) {
  if (id === undefined || keptUnsaved()?.record.id === id) setLocal(UNSAVED_KEY, null);
}

/**
 * What keepUnsaved kept, {record, basedOn}, when the record is readable and newer than the stored record
 * of its id in `records`; else null (and it is forgotten).
 */
export function unsavedNewerThan(records) {
  const kept = keptUnsaved();
  const record = kept?.record;
  const stored = record ? records.find((r) => r.id === record.id) : null;
  if (!record || recordProblem(record) || (stored && textTime(stored) >= textTime(record))) {
    forgetUnsaved();
    return null;
  }
  return { record, basedOn: typeof kept.based_on === 'string' ? kept.based_on : null };
}

const textTime = (record) => (typeof record.updated_at === 'string' ? record.updated_at : '');

export const currentQuoteId = () => local(CURRENT_KEY);
export const setCurrentQuoteId = (id) => setLocal(CURRENT_KEY, id);

/** Device preferences (locale), kept apart from the quotes. */
export function loadPreferences() {
  try { return JSON.parse(local(PREFS_KEY) ?? '{}') ?? {}; } catch { return {}; }
}
export const savePreferences = (prefs) => setLocal(PREFS_KEY, JSON.stringify(prefs));

/** The contractor's profile kept on this device (raw: normalize with profile.js), or null. */
export function loadProfile() {
  try { return JSON.parse(local(PROFILE_KEY) ?? 'null'); } catch { return null; }
}
/** Keeps the profile on this device (best effort, as the preferences: a refusal leaves the last copy). */
export const saveProfile = (profile) => setLocal(PROFILE_KEY, JSON.stringify(profile));

/** The price lists and equipment kept on this device (raw: normalize with templates.js), or null. */
export function loadTemplates() {
  try { return JSON.parse(local(TEMPLATES_KEY) ?? 'null'); } catch { return null; }
}
/** Keeps the price lists and equipment on this device; throws when the browser refuses (full storage, private mode): they are the contractor's work. */
export function saveTemplates(shelf) {
  localStorage.setItem(TEMPLATES_KEY, JSON.stringify(shelf));
}
