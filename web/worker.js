// Web Worker (module): loads the WebAssembly core once and answers numbered
// requests. Protocol (web/README.md): {id, fn, request} -> {id, ok, result}
// or {id, ok: false, error}. `result` is the parsed JSON the core returned;
// input problems arrive as result.errors, not as ok: false.
import createFuelwrightCore from './fuelwright_core.mjs';

/** Functions of the module that may be called, and whether they take a request. */
const EXPORTS = {
  heatingValue: { takesRequest: true },
  convert: { takesRequest: true },
  units: { takesRequest: false },
  evaluate: { takesRequest: true },
  catalog: { takesRequest: false },
};

const core = createFuelwrightCore({
  locateFile: (path) => new URL(path, import.meta.url).href,
});

self.addEventListener('message', async (event) => {
  const { id, fn, request } = event.data ?? {};
  try {
    const spec = Object.hasOwn(EXPORTS, fn) ? EXPORTS[fn] : null;
    if (!spec) throw new Error(`unknown function: ${String(fn)}`);
    const module = await core;
    const text = spec.takesRequest ? module[fn](JSON.stringify(request ?? {})) : module[fn]();
    self.postMessage({ id, ok: true, result: JSON.parse(text) });
  } catch (error) {
    self.postMessage({ id, ok: false, error: String(error?.message ?? error) });
  }
});
