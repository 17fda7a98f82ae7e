// Web Worker (module): loads the WebAssembly core once and answers numbered
// requests. Protocol (web/README.md): {id, fn, request} -> {id, ok, result}
// or {id, ok: false, error}; long calls also post {id, progress: {done, total}}.
// `result` is the parsed JSON the core returned; input problems arrive as
// result.errors, not as ok: false.
import createFuelwrightCore from './fuelwright_core.mjs';

const core = createFuelwrightCore({
  locateFile: (path) => new URL(path, import.meta.url).href,
});

const call = (module, fn, request) => JSON.parse(module[fn](JSON.stringify(request ?? {})));

/**
 * Annual cost against one price: evaluates `scenario` once per entry of `prices`,
 * with price.amount of every option listed in `options` (indexes) set to it.
 * Request {scenario, options: [i…], prices: [p…]}; result {points: [{price, annual_cost: {id: cost}}], errors}.
 * Legitimate because evaluate is linear in price; the core's own sweeps replace it when present.
 */
function priceSweep(module, { scenario, options = [], prices = [] }, progress) {
  const points = [];
  let errors = [];
  prices.forEach((price, n) => {
    const doc = structuredClone(scenario);
    for (const i of options) if (doc.options?.[i]?.price) doc.options[i].price.amount = price;
    const result = call(module, 'evaluate', doc);
    if (result.errors?.length) errors = result.errors;
    const annual = {};
    for (const option of result.options ?? []) annual[option.id] = option.annual_cost;
    points.push({ price, annual_cost: annual });
    progress({ done: n + 1, total: prices.length });
  });
  return { points, errors };
}

/** Functions that may be called: whether they take a request, and how they run. */
const EXPORTS = {
  heatingValue: { takesRequest: true },
  convert: { takesRequest: true },
  units: { takesRequest: false },
  evaluate: { takesRequest: true },
  catalog: { takesRequest: false },
  climate: { takesRequest: true },
  priceSweep: { composite: priceSweep },
};

self.addEventListener('message', async (event) => {
  const { id, fn, request } = event.data ?? {};
  try {
    const spec = Object.hasOwn(EXPORTS, fn) ? EXPORTS[fn] : null;
    if (!spec) throw new Error(`unknown function: ${String(fn)}`);
    const module = await core;
    let result;
    if (spec.composite) result = spec.composite(module, request ?? {}, (progress) => self.postMessage({ id, progress }));
    else result = spec.takesRequest ? call(module, fn, request) : JSON.parse(module[fn]());
    self.postMessage({ id, ok: true, result });
  } catch (error) {
    self.postMessage({ id, ok: false, error: String(error?.message ?? error) });
  }
});
