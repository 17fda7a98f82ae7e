// The climate library, the pure part: named climates a contractor keeps on the
// device (from a weather file, typed monthly means or monthly degree-days), the
// names they go by, the file they are exported in (fuelwright.climates/1), and
// a workspace climate moved to the other unit system. No DOM and no storage
// here, so Node can test it; web/climate-store.js keeps the entries and
// web/climates.js wires them to the House tab.
//
// entry: {id, name, note, climate (a scenario climate object), created_at, updated_at}
// file:  {schema: "fuelwright.climates/1", exported_at, climates: [{name, note, climate}]}
import { climateToScenario } from './scenario.js';
import { convertTemperature, convertTemperatureDifference } from './units.js';
import { unreadableVersionMessage } from './versions.js';

export const LIBRARY_FAMILY = 'fuelwright.climates';
export const LIBRARY_VERSION = 1;
export const LIBRARY_SCHEMA = `${LIBRARY_FAMILY}/${LIBRARY_VERSION}`;
/** Longest name a kept climate may have [characters]. */
export const NAME_MAX = 80;

const isNumber = (v) => typeof v === 'number' && Number.isFinite(v);
const twelveNumbers = (list) => Array.isArray(list) && list.length === 12 && list.every(isNumber);
const folded = (name) => name.trim().toLocaleLowerCase();

/** Why `name` cannot name a kept climate (empty, too long, already used by another entry), or null when it can. */
export function nameProblem(name, entries, exceptId = null) {
  const text = typeof name === 'string' ? name.trim() : '';
  if (!text) return 'Give the climate a name, e.g. the town or the weather station.';
  if (text.length > NAME_MAX) return `A name may have at most ${NAME_MAX} characters; this one has ${text.length}.`;
  if (entries.some((e) => e.id !== exceptId && folded(e.name) === folded(text))) return `A climate called “${text}” is already kept on this device; choose another name.`;
  return null;
}

/** `name`, or `name (2)`, `name (3)`… : the first that no entry uses. */
export function uniqueName(name, entries) {
  const base = name.trim().slice(0, NAME_MAX - 5) || 'Climate';
  const used = new Set(entries.map((e) => folded(e.name)));
  if (!used.has(folded(base))) return base;
  for (let n = 2; ; n++) if (!used.has(folded(`${base} (${n})`))) return `${base} (${n})`;
}

/**
 * Why `climate` cannot be kept (not a climate object the page can show), or null. The core checks the
 * values themselves (web/climates.js asks its climate() before keeping an imported one).
 */
export function climateProblem(climate) {
  if (!climate || typeof climate !== 'object' || Array.isArray(climate)) return 'it has no climate';
  if (climate.unit !== 'degF' && climate.unit !== 'degC') return 'its temperature unit must be °F ("degF") or °C ("degC")';
  if ('monthly_mean' in climate) return twelveNumbers(climate.monthly_mean) ? null : 'it needs 12 monthly mean temperatures, January first';
  if ('monthly_hdd' in climate) return twelveNumbers(climate.monthly_hdd) ? null : 'it needs 12 monthly degree-day totals, January first';
  if ('annual_hdd' in climate) {
    if (!isNumber(climate.annual_hdd)) return 'its annual degree-days must be a number';
    return isNumber(climate.design_temperature?.value) ? null : 'annual degree-days need a design temperature';
  }
  return 'it has neither monthly temperatures, monthly degree-days nor annual degree-days';
}

/**
 * What a workspace climate would be kept as: {climate, problem}. `problem` says in words why it cannot
 * be kept (no climate chosen, months not all filled in), else null.
 */
export function keepableClimate(workspaceClimate) {
  const climate = climateToScenario(workspaceClimate);
  if (!climate) return { climate: null, problem: 'This quote has no climate yet: choose or type one above first.' };
  const problem = climateProblem(climate);
  return { climate, problem: problem ? `This quote's climate cannot be kept yet: ${problem}.` : null };
}

/** A new library entry; `now` an ISO time. */
export function makeEntry({ id, name, note = '', climate, now = new Date().toISOString() }) {
  return { id, name: name.trim(), note, climate: structuredClone(climate), created_at: now, updated_at: now };
}

/** The library as a file to export: {schema, exported_at, climates: [{name, note, climate}]}, by name. */
export function libraryFile(entries, now = new Date().toISOString()) {
  const climates = [...entries].sort((a, b) => a.name.localeCompare(b.name))
    .map((e) => ({ name: e.name, ...(e.note ? { note: e.note } : {}), climate: structuredClone(e.climate) }));
  return { schema: LIBRARY_SCHEMA, exported_at: now, climates };
}

/**
 * The climates in an imported library file: {climates: [{index, name, note, climate}], refused:
 * [{index, name, message}]} (names as given; the caller makes them unique). Throws an Error whose
 * message says why for a document that is not a climate library this version reads.
 */
export function readLibraryFile(doc) {
  if (!doc || typeof doc !== 'object' || Array.isArray(doc)) throw new Error('it is not a climate library file');
  if (doc.schema !== LIBRARY_SCHEMA) {
    if (typeof doc.schema === 'string' && doc.schema.startsWith(`${LIBRARY_FAMILY}/`)) {
      throw new Error(unreadableVersionMessage(doc.schema, { family: LIBRARY_FAMILY, newest: LIBRARY_VERSION, what: 'climate libraries', field: 'schema' }));
    }
    throw new Error(`it is not a Fuelwright climate library (such a file begins with "schema": "${LIBRARY_SCHEMA}")`);
  }
  if (!Array.isArray(doc.climates)) throw new Error('it has no "climates" list');
  const climates = [];
  const refused = [];
  doc.climates.forEach((item, index) => {
    const name = typeof item?.name === 'string' ? item.name.trim() : '';
    const label = name ? `“${name}”` : `number ${index + 1}`;
    if (!name) return refused.push({ index, name, message: `Climate ${label} has no name.` });
    if (name.length > NAME_MAX) return refused.push({ index, name, message: `Climate ${label} has a name longer than ${NAME_MAX} characters.` });
    const problem = climateProblem(item.climate);
    if (problem) return refused.push({ index, name, message: `Climate ${label} was not kept: ${problem}.` });
    climates.push({ index, name, note: typeof item.note === 'string' ? item.note : '', climate: structuredClone(item.climate) });
  });
  return { climates, refused };
}

/** A short description of a kept climate in plain words: its form, unit and what it carries. */
export function describeClimate(climate) {
  const unit = climate?.unit === 'degC' ? '°C' : '°F';
  const parts = [];
  if (Array.isArray(climate?.monthly_mean)) parts.push(`monthly mean temperatures (${unit})`);
  else if (Array.isArray(climate?.monthly_hdd)) parts.push(`monthly heating degree-days (${unit}·d)`);
  else if (climate?.annual_hdd !== undefined) parts.push(`annual heating degree-days (${unit}·d)`);
  if (isNumber(climate?.design_temperature?.value)) {
    parts.push(`design temperature ${climate.design_temperature.value} ${climate.design_temperature.unit === 'degC' ? '°C' : '°F'}`);
  }
  if (Array.isArray(climate?.monthly_sd)) parts.push('day-to-day spread from weather records');
  if (Array.isArray(climate?.bins) && climate.bins.length) parts.push('hourly temperature bins');
  return parts.join(', ');
}

/**
 * A workspace climate in unit `want` (degF or degC): temperatures converted, degree-days, spreads,
 * ranges and bin widths converted as differences, the hourly bins' temperatures moved with their
 * hours unchanged. Returns a new object; one already in `want` comes back as a copy.
 */
export function climateInUnit(c, want) {
  const out = structuredClone(c);
  if (!c || c.unit === want) return out;
  const from = c.unit;
  const temp = (v) => (isNumber(v) ? convertTemperature(v, from, want) : v);
  const diff = (v) => (isNumber(v) ? convertTemperatureDifference(v, from, want) : v);
  out.monthly_mean = (c.monthly_mean ?? []).map(temp);
  out.monthly_hdd = (c.monthly_hdd ?? []).map(diff);
  if (Array.isArray(c.monthly_sd)) out.monthly_sd = c.monthly_sd.map(diff);
  if (isNumber(c.annual_hdd)) out.annual_hdd = diff(c.annual_hdd);
  if (isNumber(c.daily_range)) out.daily_range = diff(c.daily_range);
  if (Array.isArray(c.bins)) out.bins = c.bins.map((bin) => ({ ...bin, t: temp(bin?.t) }));
  if (isNumber(c.bin_width)) out.bin_width = diff(c.bin_width);
  out.unit = want;
  return out;
}
