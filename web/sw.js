// Service worker: precaches everything the site ships into a versioned cache
// on install, deletes older caches on activate and answers GETs cache-first.
// tools/build-site replaces the MANIFEST line below with the list of shipped
// files and a hash of their contents; unbuilt, it precaches nothing.
const MANIFEST = { version: 'dev', files: [] };

const PREFIX = 'fuelwright-';
const CACHE = `${PREFIX}${MANIFEST.version}`;

self.addEventListener('install', (event) => {
  event.waitUntil(
    caches.open(CACHE)
      .then((cache) => cache.addAll(MANIFEST.files))
      .then(() => self.skipWaiting()));
});

self.addEventListener('activate', (event) => {
  event.waitUntil(
    caches.keys()
      .then((names) => Promise.all(names
        .filter((name) => name.startsWith(PREFIX) && name !== CACHE)
        .map((name) => caches.delete(name))))
      .then(() => self.clients.claim()));
});

self.addEventListener('fetch', (event) => {
  const { request } = event;
  if (request.method !== 'GET' || new URL(request.url).origin !== self.location.origin) return;
  event.respondWith(
    caches.open(CACHE)
      .then((cache) => cache.match(request, { ignoreSearch: true }))
      .then((cached) => cached ?? fetch(request)));
});
