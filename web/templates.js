// Templates, pure part (tested in Node): price lists and equipment a contractor keeps on the device
// and reuses across quotes, and the file they are exported in (fuelwright.templates/1). A price list
// is the quote's fuels with their prices and charges, in one currency; an equipment entry is one
// system card (kind, catalog type, rating, a heat pump's data-sheet points and cut-out, a furnace's
// capacity and own electricity, make and model, installed cost, incentives, maintenance, life) with
// the fuel it uses. No DOM and no storage here: web/template-shelf.js keeps them and wires the tabs.
//
// shelf: {price_lists: [{id, name, currency, fuels: [fuel entry without key]}], equipment: [{id, name, fuel, item}]}
// file:  {schema, exported_at, price_lists: [{name, currency, fuels}], equipment: [{name, fuel, item}]}
import { SYSTEM_KINDS, fuelId, newFuelKey, uniqueSystemId } from './scenario.js';
import { unreadableVersionMessage } from './versions.js';

export const TEMPLATES_FAMILY = 'fuelwright.templates';
export const TEMPLATES_VERSION = 1;
export const TEMPLATES_SCHEMA = `${TEMPLATES_FAMILY}/${TEMPLATES_VERSION}`;
/** Longest name a template may have [characters]. */
export const TEMPLATE_NAME_MAX = 80;

/** The fields of a system card an equipment entry keeps (the card's id, label, fuel and existing flag belong to the quote). */
const ITEM_KEYS = ['system', 'equipment', 'installed_cost', 'incentives', 'annual_maintenance', 'life_years'];

const isObject = (v) => v !== null && typeof v === 'object' && !Array.isArray(v);
const clone = (v) => (v === undefined ? undefined : structuredClone(v));
const folded = (name) => name.trim().toLocaleLowerCase();

/** An empty shelf. */
export const emptyShelf = () => ({ price_lists: [], equipment: [] });

/** Why `name` cannot name a template among `entries` (empty, too long, taken), or null. */
export function templateNameProblem(name, entries, what) {
  const text = typeof name === 'string' ? name.trim() : '';
  if (!text) return `Give the ${what} a name.`;
  if (text.length > TEMPLATE_NAME_MAX) return `A name may have at most ${TEMPLATE_NAME_MAX} characters; this one has ${text.length}.`;
  if (entries.some((e) => folded(e.name) === folded(text))) return `A ${what} called “${text}” is already kept on this device; choose another name.`;
  return null;
}

/** `name`, or `name (2)`…: the first no entry uses. */
function uniqueTemplateName(name, entries) {
  const base = name.trim().slice(0, TEMPLATE_NAME_MAX - 5) || 'Template';
  const used = new Set(entries.map((e) => folded(e.name)));
  if (!used.has(folded(base))) return base;
  for (let n = 2; ; n++) if (!used.has(folded(`${base} (${n})`))) return `${base} (${n})`;
}

/** The catalog id of a fuel, or the id of a custom fuel object ('' when it has none). */
const fuelKeyOf = (fuel) => (typeof fuel === 'string' ? fuel : isObject(fuel) && typeof fuel.id === 'string' ? fuel.id : '');

/** The quote's fuels with their prices as a price list named `name` (fuels without a typed price are left out and listed). */
/** Whether a fuel entry has a price: one amount, or electricity's time-of-use periods. */
const isPriced = (price) => (typeof price?.amount === 'number' && Number.isFinite(price.amount))
  || (price?.time_of_use === true && Array.isArray(price.schedule) && price.schedule.length > 0);

export function priceListFrom(ws, name, id) {
  const fuels = [];
  const unpriced = [];
  for (const entry of ws.fuels) {
    if (!isPriced(entry.price)) {
      unpriced.push(entry);
      continue;
    }
    const { key, ...rest } = structuredClone(entry);
    fuels.push(rest);
  }
  return { list: { id, name: name.trim(), currency: ws.settings.currency, fuels }, unpriced };
}

/**
 * Puts a price list's prices into the quote: a fuel already on the quote gets the list's price, unit,
 * fixed charges and rise; a fuel not yet on it is added. Refused (nothing changed) when the list's
 * currency is not the quote's. {ok, updated: [fuel ids], added: [fuel ids], message}.
 */
export function applyPriceList(ws, list) {
  if (list.currency !== ws.settings.currency) {
    return { ok: false, updated: [], added: [],
      message: `“${list.name}” is in ${list.currency} and this quote is in ${ws.settings.currency}: nothing was changed. Change the quote's currency first, or keep a price list in ${ws.settings.currency}.` };
  }
  const updated = [];
  const added = [];
  for (const item of list.fuels) {
    const id = fuelKeyOf(item.fuel);
    const entry = ws.fuels.find((f) => fuelKeyOf(f.fuel) === id && id);
    if (entry) {
      for (const k of Object.keys(entry)) if (k !== 'key' && k !== 'fuel') delete entry[k];
      Object.assign(entry, clone(item), { key: entry.key, fuel: entry.fuel });
      updated.push(id);
    } else {
      ws.fuels.push({ ...clone(item), key: newFuelKey(ws), fixed_charges: clone(item.fixed_charges) ?? [] });
      added.push(id);
    }
  }
  return { ok: true, updated, added, message: `Prices from “${list.name}” put into this quote.` };
}

/**
 * A system card as an equipment entry named `name`. A fuel-burning backup of a dual-fuel heat pump
 * belongs to each house, so it is not kept (said in `dropped`); electric strips are.
 */
export function equipmentFrom(ws, sys, name, id) {
  const item = {};
  for (const k of ITEM_KEYS) if (sys[k] !== undefined) item[k] = clone(sys[k]);
  const dropped = [];
  if (item.system?.backup && item.system.backup !== 'electric-resistance') {
    dropped.push('its dual-fuel backup (each house has its own)');
    delete item.system.backup;
    delete item.system.changeover_mode;
    delete item.system.changeover;
  }
  const fuelEntry = ws.fuels.find((f) => f.key === sys.fuel_key);
  return { entry: { id, name: name.trim(), fuel: clone(fuelEntry?.fuel) ?? '', item }, dropped };
}

/**
 * Adds an equipment entry to the quote as a new system card named after the entry, on the quote's
 * fuel of the same id, or on that fuel added without a price (the Fuels tab then asks for it).
 * {system, addedFuel (the fuel id added, or null)}.
 */
export function applyEquipment(ws, entry) {
  const id = fuelKeyOf(entry.fuel);
  let fuelEntry = id ? ws.fuels.find((f) => fuelKeyOf(f.fuel) === id) : null;
  let addedFuel = null;
  if (!fuelEntry && entry.fuel) {
    fuelEntry = { key: newFuelKey(ws), fuel: clone(entry.fuel), price: {}, fixed_charges: [] };
    ws.fuels.push(fuelEntry);
    addedFuel = id;
  }
  const item = clone(entry.item);
  const system = {
    ...item, id: uniqueSystemId(ws, `${item.system?.kind ?? 'option'}-${fuelId(fuelEntry) || 'fuel'}`),
    label: entry.name, label_auto: false, fuel_key: fuelEntry?.key ?? '', existing: false,
  };
  ws.systems.push(system);
  return { system, addedFuel };
}

/** Adds a kept entry to the shelf under a name no other entry of its kind uses. */
export function shelve(shelf, kind, entry) {
  const entries = shelf[kind];
  entries.push({ ...entry, name: uniqueTemplateName(entry.name, entries) });
  return entries.at(-1);
}

/** The export file of the shelf. */
export function templatesFile(shelf, now = new Date().toISOString()) {
  return {
    schema: TEMPLATES_SCHEMA, exported_at: now,
    price_lists: shelf.price_lists.map(({ name, currency, fuels }) => ({ name, currency, fuels })),
    equipment: shelf.equipment.map(({ name, fuel, item }) => ({ name, fuel, item })),
  };
}

/** Why one price list of a file cannot be kept, or null. */
function priceListProblem(p) {
  if (!isObject(p)) return 'is not an object';
  if (typeof p.name !== 'string' || !p.name.trim()) return 'has no name';
  if (typeof p.currency !== 'string' || !/^[A-Z]{3}$/.test(p.currency)) return 'has no currency (three capital letters, e.g. USD)';
  if (!Array.isArray(p.fuels) || !p.fuels.length) return 'has no fuels';
  const bad = p.fuels.findIndex((f) => !isObject(f) || !fuelKeyOf(f.fuel) || !isObject(f.price) || !isPriced(f.price));
  return bad >= 0 ? `fuel ${bad + 1} has no fuel or no price` : null;
}

/** Why one equipment entry of a file cannot be kept, or null. */
function equipmentProblem(e) {
  if (!isObject(e)) return 'is not an object';
  if (typeof e.name !== 'string' || !e.name.trim()) return 'has no name';
  if (!isObject(e.item) || !isObject(e.item.system)) return 'has no system';
  if (!SYSTEM_KINDS.includes(e.item.system.kind)) return `has an unknown kind of system (${JSON.stringify(e.item.system.kind)})`;
  if (e.fuel !== '' && !fuelKeyOf(e.fuel)) return 'has no fuel';
  return null;
}

/**
 * The entries of a templates file: {price_lists, equipment, refused: [message]}. Throws with a message
 * for a file that is not one (or is of a newer version than this page reads).
 */
export function readTemplatesFile(doc) {
  if (!isObject(doc)) throw new Error('it is not a file of price lists and equipment');
  if (doc.schema !== TEMPLATES_SCHEMA) {
    throw new Error(unreadableVersionMessage(doc.schema, { family: TEMPLATES_FAMILY, newest: TEMPLATES_VERSION, what: 'price lists and equipment', field: 'schema' }));
  }
  const out = { price_lists: [], equipment: [], refused: [] };
  (Array.isArray(doc.price_lists) ? doc.price_lists : []).forEach((p, i) => {
    const problem = priceListProblem(p);
    if (problem) out.refused.push(`Price list ${i + 1}${isObject(p) && typeof p.name === 'string' ? ` (“${p.name}”)` : ''} was not kept: it ${problem}.`);
    else out.price_lists.push({ name: p.name.trim().slice(0, TEMPLATE_NAME_MAX), currency: p.currency, fuels: clone(p.fuels) });
  });
  (Array.isArray(doc.equipment) ? doc.equipment : []).forEach((e, i) => {
    const problem = equipmentProblem(e);
    if (problem) out.refused.push(`Equipment ${i + 1}${isObject(e) && typeof e.name === 'string' ? ` (“${e.name}”)` : ''} was not kept: it ${problem}.`);
    else out.equipment.push({ name: e.name.trim().slice(0, TEMPLATE_NAME_MAX), fuel: clone(e.fuel), item: clone(e.item) });
  });
  return out;
}

/** A shelf read from storage, every entry checked as a file's are (an unreadable one dropped and counted). */
export function normalizeShelf(raw) {
  const shelf = emptyShelf();
  let unreadable = 0;
  for (const [kind, problem] of [['price_lists', priceListProblem], ['equipment', equipmentProblem]]) {
    for (const e of Array.isArray(raw?.[kind]) ? raw[kind] : []) {
      if (problem(e) || typeof e.id !== 'string') unreadable += 1;
      else shelf[kind].push(e);
    }
  }
  return { shelf, unreadable };
}

/** A price list in words: "Natural gas 1.45 per therm + 18 a month; Electricity 0.16 per kWh". */
export function priceListSummary(list, { fuelName, format }) {
  return list.fuels.map((f) => {
    const charges = (f.fixed_charges ?? []).map((c) => (typeof c.amount_per_month === 'number'
      ? ` + ${format.price(c.amount_per_month)} a month` : typeof c.amount_per_year === 'number' ? ` + ${format.price(c.amount_per_year)} a year` : ''));
    return `${fuelName(f)} ${format.price(f.price.amount)} per ${f.price.per ?? ''}${charges.join('')}`;
  }).join('; ');
}
