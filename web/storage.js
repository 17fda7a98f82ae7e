// Saved quotes on this device: IndexedDB (database "fuelwright", store
// "quotes"), or localStorage when IndexedDB is unavailable. Each record carries
// a schema version. Nothing leaves the device.
//
// record: {record_schema, id, created_at, updated_at, customer, site, date, title,
//          workspace (the page's form state), scenario (fuelwright.scenario/1)}

export const RECORD_SCHEMA = 'fuelwright.saved-quote/1';
const DB_NAME = 'fuelwright';
const STORE = 'quotes';
const LS_PREFIX = 'fuelwright.quote.';
const CURRENT_KEY = 'fuelwright.current-quote';
const PREFS_KEY = 'fuelwright.preferences';

function request(req) {
  return new Promise((resolve, reject) => {
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error);
  });
}

function openDatabase() {
  return new Promise((resolve, reject) => {
    if (typeof indexedDB === 'undefined') return reject(new Error('no IndexedDB'));
    const req = indexedDB.open(DB_NAME, 1);
    req.onupgradeneeded = () => {
      const db = req.result;
      if (!db.objectStoreNames.contains(STORE)) db.createObjectStore(STORE, { keyPath: 'id' });
    };
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error);
    req.onblocked = () => reject(new Error('IndexedDB blocked'));
  });
}

class IdbQuotes {
  kind = 'IndexedDB';
  constructor(db) { this.db = db; }
  #store(mode) { return this.db.transaction(STORE, mode).objectStore(STORE); }
  list() { return request(this.#store('readonly').getAll()); }
  get(id) { return request(this.#store('readonly').get(id)); }
  async put(record) { await request(this.#store('readwrite').put(record)); return record; }
  async delete(id) { await request(this.#store('readwrite').delete(id)); }
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
  async delete(id) { localStorage.removeItem(LS_PREFIX + id); }
}

class MemoryQuotes {
  kind = 'memory (not kept)';
  #map = new Map();
  async list() { return [...this.#map.values()].map((r) => structuredClone(r)); }
  async get(id) { const r = this.#map.get(id); return r && structuredClone(r); }
  async put(record) { this.#map.set(record.id, structuredClone(record)); return record; }
  async delete(id) { this.#map.delete(id); }
}

function localStorageWorks() {
  try {
    localStorage.setItem('fuelwright.probe', '1');
    localStorage.removeItem('fuelwright.probe');
    return true;
  } catch {
    return false;
  }
}

/** Opens the quote storage: IndexedDB, else localStorage, else memory. */
export async function openQuotes() {
  try {
    return new IdbQuotes(await openDatabase());
  } catch {
    return localStorageWorks() ? new LocalQuotes() : new MemoryQuotes();
  }
}

/** A new record id. */
export function newId() {
  if (globalThis.crypto?.randomUUID) return crypto.randomUUID();
  return `q-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 10)}`;
}

/** Makes a record for a workspace and its scenario document. */
export function makeRecord({ id = newId(), createdAt, workspace, scenario }) {
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
  };
}

/** Whether a stored record can be opened by this version of the page. */
export const isCurrentRecord = (record) => record?.record_schema === RECORD_SCHEMA && record.workspace;

function local(key) {
  try { return localStorage.getItem(key); } catch { return null; }
}
function setLocal(key, value) {
  try {
    if (value === null) localStorage.removeItem(key);
    else localStorage.setItem(key, value);
  } catch { /* private mode: not kept */ }
}

export const currentQuoteId = () => local(CURRENT_KEY);
export const setCurrentQuoteId = (id) => setLocal(CURRENT_KEY, id);

/** Device preferences (locale), kept apart from the quotes. */
export function loadPreferences() {
  try { return JSON.parse(local(PREFS_KEY) ?? '{}') ?? {}; } catch { return {}; }
}
export const savePreferences = (prefs) => setLocal(PREFS_KEY, JSON.stringify(prefs));
