// Kiosk mode, the pure part: which price file and idle time the kiosk uses,
// whether a checked price file may be shown, what it offers (fuels with the
// supplier's locked prices, systems from the catalog) and the scenario a
// visitor's few answers make. No DOM here, so Node can test it.
import { SCENARIO_SCHEMA } from './scenario.js';

export const DEFAULT_IDLE_SECONDS = 120;

/** Rough yearly useful heat by house size; invented round figures for a first look, not a heat-loss estimate. */
export const HOUSE_SIZES = {
  us: [
    { id: 'small', label: 'Small', detail: 'up to 1,200 sq ft', heat: { value: 35, unit: 'MMBtu' } },
    { id: 'medium', label: 'Medium', detail: '1,200 to 2,500 sq ft', heat: { value: 60, unit: 'MMBtu' } },
    { id: 'large', label: 'Large', detail: 'over 2,500 sq ft', heat: { value: 90, unit: 'MMBtu' } },
  ],
  metric: [
    { id: 'small', label: 'Small', detail: 'up to 110 m²', heat: { value: 10000, unit: 'kWh' } },
    { id: 'medium', label: 'Medium', detail: '110 to 230 m²', heat: { value: 17500, unit: 'kWh' } },
    { id: 'large', label: 'Large', detail: 'over 230 m²', heat: { value: 26000, unit: 'kWh' } },
  ],
};

const US_UNITS = new Set(['gal', 'therm', 'ccf', 'Mcf', 'ft3', 'MMBtu', 'short_ton', 'lb', 'cord', 'face_cord']);
const METRIC_UNITS = new Set(['L', 'm3', 'kg', 'tonne', 'GJ']);

/**
 * The kiosk's settings from the page's query (kiosk=1, prices=URL, idle=seconds,
 * units, locale) over those of a kiosk.json file ({prices, idle_seconds, units, locale}).
 */
export function kioskSettings(query, file = {}) {
  const idleText = query.get('idle') ?? file.idle_seconds ?? file.idle;
  const idle = Number(idleText);
  const units = query.get('units') ?? file.units;
  return {
    prices: query.get('prices') ?? (typeof file.prices === 'string' ? file.prices : ''),
    idleSeconds: Number.isFinite(idle) && idle > 0 ? idle : DEFAULT_IDLE_SECONDS,
    units: units === 'us' || units === 'metric' ? units : '',
    locale: query.get('locale') ?? (typeof file.locale === 'string' ? file.locale : ''),
  };
}

/** True when the page was opened as a kiosk (?kiosk=1). */
export const isKiosk = (query) => ['1', 'true', 'yes'].includes(query.get('kiosk') ?? '');

/**
 * The URL of the price file if it is on this site (same origin), else null.
 * `base` is the page's address.
 */
export function sameOriginUrl(path, base) {
  let url;
  try {
    url = new URL(path, base);
  } catch {
    return null;
  }
  return url.origin === new URL(base).origin ? url : null;
}

/**
 * Whether a price file may be shown, from checkPrices' answer: {ok, expired, problems}.
 * A clean file is shown; one whose only problem is its expiry date is shown with a
 * warning (the kiosk says so); any other problem refuses it.
 */
export function priceFileVerdict(check) {
  const errors = Array.isArray(check?.errors) ? check.errors : [{ path: '', message: 'the validator gave no answer' }];
  if (check?.valid === true && !errors.length) return { ok: true, expired: false, problems: [] };
  const expiryOnly = check?.expired === true && errors.length > 0 && errors.every((e) => e.path === '/expires');
  if (expiryOnly) return { ok: true, expired: true, problems: errors };
  return { ok: false, expired: check?.expired === true, problems: errors };
}

/** The unit system a price file suggests (its sale units), unless one is set. */
export function unitsOf(prices, wanted = '') {
  if (wanted) return wanted;
  let us = 0;
  let metric = 0;
  for (const p of prices ?? []) {
    if (US_UNITS.has(p.unit)) us++;
    else if (METRIC_UNITS.has(p.unit)) metric++;
  }
  return metric > us ? 'metric' : 'us';
}

const titleCase = (text) => (text ? text[0].toUpperCase() + text.slice(1) : '');

/** A system's name for visitors: "Condensing furnace", "Pellet stove", "Air-source heat pump". */
export function systemName(model) {
  const kind = { furnace: 'furnace', boiler: 'boiler', stove: 'stove', 'electric-resistance': 'electric heat',
    'air-source-heat-pump': 'air-source heat pump', 'ground-source-heat-pump': 'ground-source heat pump' }[model.kind] ?? model.kind;
  const variant = model.variant && !/ or |split|loop/.test(model.variant) ? `${model.variant} ` : '';
  return titleCase(`${variant}${kind}`);
}

/**
 * What the kiosk offers, from the checked price file (`check.prices`, the
 * validator's normalised list), the file itself (`file.offer`) and the catalog:
 * {fuels: [{fuel, name, prices: [...], price (the one compared), locked}], options: [{id, label, fuel, model}]}.
 * A fuel offered but not priced in the file (often electricity) is not locked:
 * the visitor may enter its price.
 */
export function kioskOffer(check, file, catalog) {
  const priced = new Map();
  for (const p of check.prices ?? []) {
    if (!priced.has(p.fuel)) priced.set(p.fuel, []);
    priced.get(p.fuel).push(p);
  }
  const offeredFuels = Array.isArray(file?.offer?.fuels) && file.offer.fuels.length ? file.offer.fuels : [...priced.keys()];
  const fuels = [];
  for (const id of offeredFuels) {
    const record = catalog.fuels.find((f) => f.id === id);
    if (!record) continue;
    const prices = priced.get(id) ?? [];
    // the price compared: the first one not per bag (a bag needs its mass), else the first
    const price = prices.find((p) => p.unit !== 'bag') ?? prices[0] ?? null;
    fuels.push({ fuel: id, name: record.name, prices, price, locked: Boolean(price), unit: price?.unit ?? record.sale_units[0]?.unit });
  }
  const offeredSystems = Array.isArray(file?.offer?.systems) && file.offer.systems.length
    ? file.offer.systems.map((id) => catalog.systems.find((m) => m.id === id)).filter(Boolean)
    : null;
  const options = [];
  for (const entry of fuels) {
    const models = offeredSystems
      ? offeredSystems.filter((m) => m.fuels.includes(entry.fuel))
      : [catalog.systems.find((m) => m.fuels.includes(entry.fuel))].filter(Boolean);
    for (const model of models) {
      options.push({ id: `${model.id}-${entry.fuel}`, label: `${systemName(model)}, ${entry.name}`, fuel: entry.fuel, model });
    }
  }
  return { fuels, options };
}

function priceOf(p) {
  if (Array.isArray(p.schedule) && p.schedule.length) return { per: 'kWh', schedule: JSON.parse(JSON.stringify(p.schedule)) };
  if (Array.isArray(p.tiers) && p.tiers.length) {
    return { per: p.unit, tiers: p.tiers.map((t) => ({ from: t.from, ...(typeof t.to === 'number' ? { to: t.to } : {}), amount: t.amount })) };
  }
  return { amount: p.amount, per: p.unit };
}

function chargesOf(p) {
  return (p.fixed_charges ?? []).map((c) => {
    const out = {};
    if (c.label) out.label = c.label;
    if (typeof c.amount_per_month === 'number') out.amount_per_month = c.amount_per_month;
    else if (typeof c.amount_per_year === 'number') out.amount_per_year = c.amount_per_year;
    return out;
  });
}

/**
 * The scenario of a visitor's answers: {size, current (option id or ''), prices: {fuel: amount}} with the
 * offer's locked prices, tiers and fixed charges. Options whose fuel has no price yet are left out and
 * listed in `missing`. `climate` is the price file's climate of the supplier's area (a scenario climate
 * object, checked by checkPrices), used for the visitor's scenario when given. Returns {scenario,
 * missing: [option]} (scenario null before a house size is chosen).
 */
export function kioskScenario(offer, visitor, { units, currency, climate = null }) {
  const size = HOUSE_SIZES[units].find((s) => s.id === visitor.size);
  const missing = [];
  const options = [];
  for (const option of offer.options) {
    const entry = offer.fuels.find((f) => f.fuel === option.fuel);
    let price = null;
    let charges = [];
    if (entry?.price) {
      price = priceOf(entry.price);
      charges = chargesOf(entry.price);
    } else {
      const typed = visitor.prices?.[option.fuel];
      if (typeof typed === 'number' && Number.isFinite(typed) && typed > 0) price = { amount: typed, per: entry?.unit };
    }
    if (!price) {
      missing.push(option);
      continue;
    }
    const out = { id: option.id, label: option.label, fuel: option.fuel, price };
    if (charges.length) out.fixed_charges = charges;
    out.system = { kind: option.model.kind, catalog: option.model.id, efficiency: { value: option.model.typical.value, rating: option.model.typical.rating } };
    if (visitor.current === option.id) out.existing = true;
    options.push(out);
  }
  if (!size || !options.length) return { scenario: null, missing };
  const scenario = {
    schema: SCENARIO_SCHEMA,
    title: 'Heating cost comparison at the counter',
    settings: { units, currency },
    demand: { method: 'direct', annual_useful_heat: { ...size.heat } },
    options,
  };
  if (climate && typeof climate === 'object') scenario.climate = structuredClone(climate);
  return { scenario, missing };
}
