// Web Worker (module): loads the WebAssembly core once and answers numbered
// requests. Protocol (web/README.md): {id, fn, request, cancel?} -> {id, ok, result}
// or {id, ok: false, error}; long calls also post {id, progress: {done, total}}.
// `result` is the parsed JSON the core returned; input problems arrive as
// result.errors, not as ok: false.
//
// A WASM call runs to its end without giving the worker's event loop a turn, so
// a "cancel" message could only be read after the run. Cancellation therefore
// travels in shared memory: `cancel` is an Int32Array over a SharedArrayBuffer
// (available when the page is cross-origin isolated) that the page sets to 1;
// the progress callback of evaluateWithProgress reads it and answers false,
// which stops the Monte Carlo. Without shared memory the page terminates this
// worker instead (core-client.js).
import createFuelwrightCore from './fuelwright_core.mjs';

// tools/build-site rewrites the module's two file names to their content-hashed copies.
const WASM_FILE = 'fuelwright_core.wasm';

const core = createFuelwrightCore({
  locateFile: (path) => new URL(path === 'fuelwright_core.wasm' ? WASM_FILE : path, import.meta.url).href,
});

const call = (module, fn, request) => JSON.parse(module[fn](JSON.stringify(request ?? {})));

/** evaluate with progress (fraction 0..1 as {done, total: 1}) and cancellation through `cancel`. */
function evaluateWithProgress(module, scenario, progress, cancel) {
  let last = -1;
  const text = module.evaluateWithProgress(JSON.stringify(scenario ?? {}), (fraction) => {
    const stop = cancel ? Atomics.load(cancel, 0) !== 0 : false;
    if (!stop && fraction - last >= 0.01) {
      last = fraction;
      progress({ done: fraction, total: 1 });
    }
    return !stop;
  });
  return JSON.parse(text);
}

/** checkPrices(text, today): the supplier price-file validator. Request {text, today}. */
function checkPrices(module, { text = '', today = '' } = {}) {
  return JSON.parse(module.checkPrices(String(text), String(today)));
}

/** Functions that may be called: whether they take a request, or how they run. */
const EXPORTS = {
  heatingValue: { takesRequest: true },
  convert: { takesRequest: true },
  units: { takesRequest: false },
  evaluate: { takesRequest: true },
  explain: { takesRequest: true },
  catalog: { takesRequest: false },
  climate: { takesRequest: true },
  weather: { takesRequest: true },
  breakEven: { takesRequest: true },
  sweep: { takesRequest: true },
  tornado: { takesRequest: true },
  whatIf: { takesRequest: true },
  checkPrices: { run: checkPrices },
  evaluateWithProgress: { run: evaluateWithProgress },
};

self.addEventListener('message', async (event) => {
  const { id, fn, request, cancel } = event.data ?? {};
  try {
    const spec = Object.hasOwn(EXPORTS, fn) ? EXPORTS[fn] : null;
    if (!spec) throw new Error(`unknown function: ${String(fn)}`);
    const module = await core;
    let result;
    if (spec.run) result = spec.run(module, request ?? {}, (progress) => self.postMessage({ id, progress }), cancel);
    else result = spec.takesRequest ? call(module, fn, request) : JSON.parse(module[fn]());
    self.postMessage({ id, ok: true, result });
  } catch (error) {
    self.postMessage({ id, ok: false, error: String(error?.message ?? error) });
  }
});
