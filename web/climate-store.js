// The climate library on this device: IndexedDB (database "fuelwright-climates",
// store "climates", apart from the quotes' database so neither waits for the
// other's upgrade), or localStorage when IndexedDB is unavailable, as
// web/storage.js does for quotes; memory (not kept) as the last resort.
// Entries are those of web/climate-library.js. Nothing leaves the device.

import { localStorageWorks, openDatabase, request } from './idb.js';

const DB_NAME = 'fuelwright-climates';
const STORE = 'climates';
const LS_PREFIX = 'fuelwright.climate.';


class IdbClimates {
  kind = 'IndexedDB';
  constructor(db) { this.db = db; }
  list() { return request(this.db.transaction(STORE, 'readonly').objectStore(STORE).getAll()); }
  put(entry) { return this.#write((store) => store.put(entry)).then(() => entry); }
  delete(id) { return this.#write((store) => store.delete(id)); }
  /** Settles when the write is committed (a full disk aborts the transaction after the request succeeded). */
  #write(fn) {
    const tx = this.db.transaction(STORE, 'readwrite');
    const done = new Promise((resolve, reject) => {
      tx.oncomplete = () => resolve();
      tx.onabort = () => reject(tx.error ?? new DOMException('The write was aborted', 'AbortError'));
    });
    fn(tx.objectStore(STORE));
    return done;
  }
}

class LocalClimates {
  kind = 'localStorage';
  async list() {
    const out = [];
    for (let i = 0; i < localStorage.length; i++) {
      const key = localStorage.key(i);
      if (!key?.startsWith(LS_PREFIX)) continue;
      try { out.push(JSON.parse(localStorage.getItem(key))); } catch { /* a damaged entry is skipped */ }
    }
    return out;
  }
  async put(entry) { localStorage.setItem(LS_PREFIX + entry.id, JSON.stringify(entry)); return entry; }
  async delete(id) { localStorage.removeItem(LS_PREFIX + id); }
}

class MemoryClimates {
  kind = 'memory (not kept)';
  #map = new Map();
  async list() { return [...this.#map.values()].map((e) => structuredClone(e)); }
  async put(entry) { this.#map.set(entry.id, structuredClone(entry)); return entry; }
  async delete(id) { this.#map.delete(id); }
}

/** Opens the climate library's storage: IndexedDB, else localStorage, else memory; each offers list(), put(entry), delete(id). */
export async function openClimates() {
  try {
    return new IdbClimates(await openDatabase(DB_NAME, STORE));
  } catch {
    return localStorageWorks() ? new LocalClimates() : new MemoryClimates();
  }
}
