// The page's only way to the core: a messenger to the Web Worker in worker.js.
// Each call is numbered and answered by a promise. If the worker fails to load
// or crashes, pending calls are rejected and the next call starts a new worker.

export class CoreClient {
  #worker = null;
  #nextId = 1;
  #pending = new Map();
  #url;

  constructor(url = new URL('./worker.js', import.meta.url)) {
    this.#url = url;
  }

  /** Calls `fn` of the core with a request object; resolves to the parsed response. */
  call(fn, request) {
    const worker = this.#ensureWorker();
    const id = this.#nextId++;
    return new Promise((resolve, reject) => {
      this.#pending.set(id, { resolve, reject });
      worker.postMessage({ id, fn, request });
    });
  }

  heatingValue(request) { return this.call('heatingValue', request); }
  convert(request) { return this.call('convert', request); }
  units() { return this.call('units'); }
  evaluate(scenario) { return this.call('evaluate', scenario); }
  catalog() { return this.call('catalog'); }

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

  #onMessage({ id, ok, result, error }) {
    const entry = this.#pending.get(id);
    if (!entry) return;
    this.#pending.delete(id);
    if (ok) entry.resolve(result);
    else entry.reject(new Error(error));
  }

  #fail(worker, error) {
    if (this.#worker !== worker) return;
    worker.terminate();
    this.#worker = null;
    for (const { reject } of this.#pending.values()) reject(error);
    this.#pending.clear();
  }
}
