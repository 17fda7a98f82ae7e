// IndexedDB in promises, for the device's stores (web/storage.js for quotes,
// web/climate-store.js for climates): one request as a promise, and a
// database opened with its one object store keyed by `id`.

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
