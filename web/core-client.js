// The page's only way to the core: a messenger to the Web Worker in worker.js.
// Each call is numbered and answered by a promise. If the worker fails to load,
// crashes or does not answer in time (stuck), it is terminated, pending calls
// are rejected and the next call starts a new worker.

const DEFAULT_TIMEOUT_MS = 20_000;
/** How long a cancelled run may take to answer (its progress callback returns false) before the worker is replaced [ms]. */
const CANCEL_GRACE_MS = 1500;

/** The error a cancelled call rejects with (`error.cancelled === true`). */
export class CancelledError extends Error {
  constructor(message = 'cancelled') {
    super(message);
    this.name = 'CancelledError';
    this.cancelled = true;
  }
}

/** True when the page may share memory with its workers (cross-origin isolated), so a run can be told to stop. */
export const canSignalCancel = () => typeof SharedArrayBuffer === 'function' && globalThis.crossOriginIsolated === true;

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
  call(fn, request, options = {}) {
    return this.start(fn, request, options).promise;
  }

  /**
   * Starts a call that can be cancelled: {promise, cancel()}. cancel() sets the
   * shared flag the worker's progress callback reads (when the page is
   * cross-origin isolated) and waits CANCEL_GRACE_MS for the answer, which
   * then resolves normally (a Monte Carlo result with `cancelled: true`);
   * without shared memory, or when the worker does not answer in time, the
   * worker is terminated and the call rejects with a CancelledError.
   */
  start(fn, request, { onProgress, timeoutMs = DEFAULT_TIMEOUT_MS } = {}) {
    const worker = this.#ensureWorker();
    const id = this.#nextId++;
    const flag = canSignalCancel() ? new Int32Array(new SharedArrayBuffer(4)) : null;
    let entry;
    const promise = new Promise((resolve, reject) => {
      const timer = setTimeout(() => {
        this.#fail(worker, new Error(`calculation core did not answer within ${Math.round(timeoutMs / 1000)} s; restarted`));
      }, timeoutMs);
      entry = { resolve, reject, onProgress, timer };
      this.#pending.set(id, entry);
      worker.postMessage(flag ? { id, fn, request, cancel: flag } : { id, fn, request });
    });
    const cancel = () => {
      if (!this.#pending.has(id)) return;
      entry.onProgress = undefined;
      if (flag) {
        Atomics.store(flag, 0, 1);
        clearTimeout(entry.timer);
        entry.timer = setTimeout(() => this.#fail(worker, new CancelledError('cancelled; the calculation did not stop in time, so it was restarted')),
          CANCEL_GRACE_MS);
      } else {
        this.#fail(worker, new CancelledError());
      }
    };
    return { promise, cancel, signalled: Boolean(flag) };
  }

  heatingValue(request) { return this.call('heatingValue', request); }
  convert(request) { return this.call('convert', request); }
  units() { return this.call('units'); }
  evaluate(scenario, options) { return this.call('evaluate', scenario, options); }
  /** One option's full account (trace, sources, bins) and the heat need's: {scenario, option?} (the core's explain()). */
  explain(request) { return this.call('explain', request); }
  catalog() { return this.call('catalog'); }
  /** Degree-days, bins and design temperatures of a climate (the core's climate()). */
  climate(request) { return this.call('climate', request); }
  /** Reads a weather file: {text, format?, unit?} -> station, period, observed days, climate, summary (the core's weather()). */
  weather(request) { return this.call('weather', request, { timeoutMs: 60_000 }); }
  /** Where two options cost the same: {scenario, a, b, vary, of, basis}. */
  breakEven(request, options) { return this.call('breakEven', request, options); }
  /** Every option's cost over a range of one input: {scenario, vary, of, from, to, points, basis}. */
  sweep(request, options) { return this.call('sweep', request, { timeoutMs: 60_000, ...options }); }
  /** Every option's cost and the ranking with one input set to a value: {scenario, vary, of, value, basis} (the core's whatIf). */
  whatIf(request, options) { return this.call('whatIf', request, options); }
  /** The winner's margin for -/+ change on each input: {scenario, basis, change}. */
  tornado(request, options) { return this.call('tornado', request, { timeoutMs: 60_000, ...options }); }
  /** Checks a supplier price file's text against today's date (YYYY-MM-DD). */
  checkPrices(text, today) { return this.call('checkPrices', { text, today }); }
  /** evaluate with the Monte Carlo's progress; cancellable: {promise, cancel()}. */
  evaluateWithProgress(scenario, { onProgress, timeoutMs = 180_000 } = {}) {
    return this.start('evaluateWithProgress', scenario, { onProgress, timeoutMs });
  }

  /** Starts the worker (which loads the module) ahead of the first call, so that the call itself fetches nothing. */
  warm() {
    this.#ensureWorker();
  }

  /** Stops the worker (and rejects what is pending); the next call starts a new one. */
  terminate() {
    if (this.#worker) this.#fail(this.#worker, new CancelledError('stopped'));
  }

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
