// The device's storage, for the quotes (web/storage.js) and the climates
// (web/climate-store.js): IndexedDB in promises (one request as a promise, a
// database opened with its one object store keyed by `id`), and whether
// localStorage, the fallback, can be written.

/** The result of an IndexedDB request, as a promise. */
export function request(req) {
  return new Promise((resolve, reject) => {
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error);
  });
}

/** Opens database `name` (version 1) with its object store `store` (keyPath "id"); rejects without IndexedDB or when blocked. */
export function openDatabase(name, store) {
  return new Promise((resolve, reject) => {
    if (typeof indexedDB === 'undefined') return reject(new Error('no IndexedDB'));
    const req = indexedDB.open(name, 1);
    req.onupgradeneeded = () => {
      const db = req.result;
      if (!db.objectStoreNames.contains(store)) db.createObjectStore(store, { keyPath: 'id' });
    };
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error);
    req.onblocked = () => reject(new Error('IndexedDB blocked'));
  });
}

/** Whether localStorage can be written (private modes and full storage refuse it). */
export function localStorageWorks() {
  try {
    localStorage.setItem('fuelwright.probe', '1');
    localStorage.removeItem('fuelwright.probe');
    return true;
  } catch {
    return false;
  }
}
