// Registers the service worker (sw.js) that keeps the site usable offline.
export function registerServiceWorker() {
  if (!('serviceWorker' in navigator)) return Promise.resolve(null);
  return navigator.serviceWorker.register(new URL('./sw.js', import.meta.url), { scope: './' })
    .catch((error) => {
      console.warn('offline support unavailable:', error.message);
      return null;
    });
}
