// Service worker: precaches everything the page runs on into a versioned cache
// on install, deletes older caches on activate and answers GETs cache-first.
// tools/build-site replaces the MANIFEST line below with the list of shipped
// files and a hash of their contents; unbuilt, it precaches nothing.
// Files that are not shipped with the site (a supplier's price file, a kiosk's
// kiosk.json, placed beside it on the server) are fetched from the network
// first and kept in a second cache, so a kiosk still starts offline with the
// last prices it read.
const MANIFEST = { version: 'dev', files: [] };

const PREFIX = 'fuelwright-';
const CACHE = `${PREFIX}${MANIFEST.version}`;
const LOCAL = `${PREFIX}local-files`;

self.addEventListener('install', (event) => {
  event.waitUntil(
    caches.open(CACHE)
      // past the HTTP cache: a new version must not precache an older copy
      .then((cache) => cache.addAll(MANIFEST.files.map((file) => new Request(file, { cache: 'reload' }))))
      .then(() => self.skipWaiting()));
});

self.addEventListener('activate', (event) => {
  event.waitUntil(
    caches.keys()
      .then((names) => Promise.all(names
        .filter((name) => name.startsWith(PREFIX) && name !== CACHE && name !== LOCAL)
        .map((name) => caches.delete(name))))
      .then(() => self.clients.claim()));
});

/** Network first for files the site does not ship; the last good copy when offline. */
async function networkFirst(request) {
  const local = await caches.open(LOCAL);
  try {
    const response = await fetch(request, { cache: 'no-cache' });
    if (response.ok) await local.put(request, response.clone());
    return response;
  } catch (failure) {
    const cached = await local.match(request);
    if (cached) return cached;
    throw failure;
  }
}

self.addEventListener('fetch', (event) => {
  const { request } = event;
  if (request.method !== 'GET' || new URL(request.url).origin !== self.location.origin) return;
  event.respondWith(
    caches.open(CACHE)
      .then((cache) => cache.match(request, { ignoreSearch: true }))
      .then((cached) => cached ?? networkFirst(request)));
});
