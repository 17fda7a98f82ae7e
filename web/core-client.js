// The page's only way to the core: a messenger to the Web Worker in worker.js.
// Each call is numbered and answered by a promise. If the worker fails to load,
// crashes or does not answer in time (stuck), it is terminated, pending calls
// are rejected and the next call starts a new worker.

const DEFAULT_TIMEOUT_MS = 20_000;

export class CoreClient {
  #worker = null;
  #nextId = 1;
  #pending = new Map();
  #url;

  constructor(url = new URL('./worker.js', import.meta.url)) {
    this.#url = url;
  }

  /**
   * Calls `fn` of the core with a request object; resolves to the parsed response.
   * `onProgress({done, total})` hears progress of long calls; `timeoutMs` bounds the wait.
   */
  call(fn, request, { onProgress, timeoutMs = DEFAULT_TIMEOUT_MS } = {}) {
    const worker = this.#ensureWorker();
    const id = this.#nextId++;
    return new Promise((resolve, reject) => {
      const timer = setTimeout(() => {
        this.#fail(worker, new Error(`calculation core did not answer within ${Math.round(timeoutMs / 1000)} s; restarted`));
      }, timeoutMs);
      this.#pending.set(id, { resolve, reject, onProgress, timer });
      worker.postMessage({ id, fn, request });
    });
  }

  heatingValue(request) { return this.call('heatingValue', request); }
  convert(request) { return this.call('convert', request); }
  units() { return this.call('units'); }
  evaluate(scenario, options) { return this.call('evaluate', scenario, options); }
  catalog() { return this.call('catalog'); }
  /** Degree-days, bins and design temperatures of a climate (the core's climate()). */
  climate(request) { return this.call('climate', request); }
  /** Evaluates `scenario` once per price of `prices` for the options `options` (indexes); see worker.js. */
  priceSweep(request, options) { return this.call('priceSweep', request, { timeoutMs: 60_000, ...options }); }

  #ensureWorker() {
    if (this.#worker) return this.#worker;
    const worker = new Worker(this.#url, { type: 'module' });
    worker.addEventListener('message', (event) => this.#onMessage(event.data));
    worker.addEventListener('error', (event) => {
      event.preventDefault();
      this.#fail(worker, new Error(`calculation core failed: ${event.message || 'worker error'}`));
    });
    this.#worker = worker;
    return worker;
  }

  #onMessage({ id, ok, result, error, progress }) {
    const entry = this.#pending.get(id);
    if (!entry) return;
    if (progress) {
      entry.onProgress?.(progress);
      return;
    }
    clearTimeout(entry.timer);
    this.#pending.delete(id);
    if (ok) entry.resolve(result);
    else entry.reject(new Error(error));
  }

  #fail(worker, error) {
    if (this.#worker !== worker) return;
    worker.terminate();
    this.#worker = null;
    for (const { reject, timer } of this.#pending.values()) {
      clearTimeout(timer);
      reject(error);
    }
    this.#pending.clear();
  }
}
