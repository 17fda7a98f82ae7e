// Locale formatting and parsing through Intl.NumberFormat: money in the
// scenario's currency, quantities, dates, and numbers typed with the locale's
// decimal separator (a decimal comma is accepted where the locale uses one).
import { unitLabel } from './units.js';

const cache = new Map();
function nf(locale, options) {
  const key = `${locale}|${JSON.stringify(options)}`;
  let format = cache.get(key);
  if (!format) {
    format = new Intl.NumberFormat(locale, options);
    cache.set(key, format);
  }
  return format;
}

const dateCache = new Map();
/** The locale's long date format in UTC, made once per locale (a new Intl.DateTimeFormat costs far more than a format). */
function longDate(locale) {
  let format = dateCache.get(locale);
  if (!format) {
    format = new Intl.DateTimeFormat(locale, { dateStyle: 'long', timeZone: 'UTC' });
    dateCache.set(locale, format);
  }
  return format;
}

/** True when `code` is a currency Intl can format (ISO 4217, three capital letters). */
export function isCurrency(code) {
  if (!/^[A-Z]{3}$/.test(code ?? '')) return false;
  try {
    nf('en', { style: 'currency', currency: code });
    return true;
  } catch {
    return false;
  }
}

/** True when `locale` is a well-formed BCP 47 tag Intl accepts. */
export function isLocale(locale) {
  try {
    return Intl.NumberFormat.supportedLocalesOf([locale]).length > 0;
  } catch {
    return false;
  }
}

/** The locale's decimal and group separators. */
export function separators(locale) {
  const parts = nf(locale, { useGrouping: true }).formatToParts(12345.6);
  return {
    decimal: parts.find((p) => p.type === 'decimal')?.value ?? '.',
    group: parts.find((p) => p.type === 'group')?.value ?? ',',
  };
}

const PLAIN = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;

/**
 * Parses a number typed in `locale`: null for an empty field, NaN when it is not a number.
 * Where the locale uses a decimal comma, "1,40" is 1.4 and "1.400" is 1400; a point is also
 * accepted as the decimal separator when it cannot be a group separator ("1.4").
 */
export function parseNumber(text, locale) {
  let t = String(text ?? '').trim().replace(/[\s\u00a0\u202f'’]/g, '').replace(/^\u2212/, '-');
  if (!t) return null;
  const { decimal } = separators(locale);
  if (decimal === ',') {
    if (t.includes(',')) {
      if ((t.match(/,/g) ?? []).length > 1) return NaN;
      t = t.replaceAll('.', '').replace(',', '.');
    } else if (/^[-+]?\d{1,3}(\.\d{3})+$/.test(t)) {
      t = t.replaceAll('.', '');
    }
  } else if (t.includes(',')) {
    if (!/^[-+]?\d{1,3}(,\d{3})+(\.\d*)?$/.test(t)) return NaN;
    t = t.replaceAll(',', '');
  }
  return PLAIN.test(t) ? Number(t) : NaN;
}

const CLOCK = /^(\d{1,2})(?:[:h.](\d{2})|h)?\s*(a\.?\s?m\.?|p\.?\s?m\.?)?$/;

/**
 * A time of day typed as a tariff sheet prints it, in hours from 0 to 24: "16", "16:30", "16.30" (two digits
 * after the point are minutes, as British sheets print times), "22h" and "16h30", "4 pm", "4:30 p.m.", "12 am" (0),
 * "noon", "midnight" or "12 midnight" (0; a period ending at 0 runs to midnight), "24:00", or decimal hours
 * ("16.5"). null for an empty field, NaN when it is not a time of day.
 */
export function parseClock(text, locale) {
  const t = String(text ?? '').trim().toLowerCase().replace(/\s+/g, ' ');
  if (!t) return null;
  if (/^(12(:00)? )?midnight$/.test(t)) return 0;
  if (/^(12(:00)? )?noon$/.test(t) || t === 'midday') return 12;
  const clock = CLOCK.exec(t);
  if (clock && (clock[2] !== undefined || clock[3] !== undefined || !t.includes('.'))) {
    let hours = Number(clock[1]);
    const minutes = clock[2] === undefined ? 0 : Number(clock[2]);
    if (minutes >= 60) return NaN;
    if (clock[3]) {
      if (hours < 1 || hours > 12) return NaN;
      hours = (hours % 12) + (clock[3].startsWith('p') ? 12 : 0);
    }
    const value = hours + minutes / 60;
    return value <= 24 ? value : NaN;
  }
  const number = /e/.test(t) ? NaN : parseNumber(t, locale);
  return number === null || Number.isNaN(number) || number < 0 || number > 24 ? NaN : number;
}

/** Hours from 0 to 24 as a clock reads them: "16:00", "0:30", "24:00" (minutes rounded). */
export function clockTime(hours) {
  if (typeof hours !== 'number' || !Number.isFinite(hours)) return '';
  const minutes = Math.round(hours * 60);
  return `${Math.floor(minutes / 60)}:${String(minutes % 60).padStart(2, '0')}`;
}

/** Hours for a time field: a whole hour as its number ("16"), any other as a clock time ("16:30"). */
export function clockInput(hours) {
  if (typeof hours !== 'number' || !Number.isFinite(hours)) return '';
  return Number.isInteger(hours) ? String(hours) : clockTime(hours);
}

/** Unit words a price may be typed per, as sheets and receipts print them, by the unit they name. */
const PER_WORDS = {
  therm: ['therm', 'therms', 'thm'], kWh: ['kwh'], gal: ['gal', 'gallon', 'gallons'], L: ['l', 'litre', 'liter', 'litres', 'liters', 'ltr'],
  ccf: ['ccf'], Mcf: ['mcf'], m3: ['m3', 'm³', 'cubic metre', 'cubic meter'], ft3: ['ft3', 'ft³', 'cubic foot', 'cubic feet'],
  kg: ['kg'], lb: ['lb', 'lbs', 'pound'], short_ton: ['ton', 'short ton'], tonne: ['tonne', 't'], cord: ['cord'], face_cord: ['face cord'],
  MMBtu: ['mmbtu'], GJ: ['gj'], MJ: ['mj'], imp_gal: ['imp gal', 'imp. gal', 'imperial gallon'],
};

/**
 * A price typed as a bill or a sign prints it, in `currency` per `unit`: "1.42", "$1.42", "1,42 €", "USD 1.42",
 * "$1.42/therm", "17.5¢/kWh" (cents are hundredths), "0.17 per kWh". The currency sign must be the quote's and
 * the unit the one chosen beside the field. {value} (null for an empty field), or {message} saying what does not read.
 */
export function parsePrice(text, locale, { currency, unit }) {
  let t = String(text ?? '').trim().replace(/\s+/g, ' ');
  if (!t) return { value: null };
  let per;
  const perMatch = /\s*(?:\/|\bper\b|\ba\b)\s*([a-z³0-9. ]+?)\.?$/i.exec(t);
  if (perMatch) {
    per = perMatch[1].toLowerCase().trim();
    t = t.slice(0, perMatch.index).trim();
    const named = Object.entries(PER_WORDS).find(([, words]) => words.includes(per))?.[0];
    if (!named) return { message: `"${perMatch[1].trim()}" is not a unit a price is given per` };
    if (named !== unit) return { message: `typed per ${perMatch[1].trim()}; this price is per ${unitLabel(unit)}: choose ${unitLabel(named)} in the menu beside it` };
  }
  let scale = 1;
  if (/(¢|\bcents?)$/i.test(t)) {
    scale = 0.01;
    t = t.replace(/\s*(¢|cents?)$/i, '');
  }
  const symbols = new Set([currency]);
  try {
    for (const display of ['symbol', 'narrowSymbol']) {
      const part = new Intl.NumberFormat(locale, { style: 'currency', currency, currencyDisplay: display }).formatToParts(1).find((p) => p.type === 'currency');
      if (part) symbols.add(part.value);
    }
  } catch { /* a currency Intl does not know: its code alone */ }
  for (const symbol of symbols) {
    const escaped = symbol.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
    const stripped = t.replace(new RegExp(`^${escaped}\\s*|\\s*${escaped}$`, 'i'), '');
    if (stripped !== t) { t = stripped; break; }
  }
  // a sign or code left over is another currency's ("€1.42" on a quote in USD)
  const foreign = /^([^\d\s.,+\-−a-z]{1,3}|[A-Z]{3})\s*[\d.,]|[\d.,]\s*([^\d\s.,'’a-z]{1,3}|[A-Z]{3})$/.exec(t);
  if (foreign) return { message: `${foreign[1] ?? foreign[2]} is not this quote's currency (${currency}): type the price in ${currency}` };
  const number = parseNumber(t, locale);
  if (number === null || Number.isNaN(number)) return { message: 'Not a number' };
  return { value: Number((number * scale).toPrecision(12)) };
}

/** A number for an input field: the locale's decimal separator, no grouping, up to 6 significant digits. */
export function formatInput(value, locale) {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '';
  return nf(locale, { useGrouping: false, maximumSignificantDigits: 6 }).format(value);
}

/** The formatter of one view: money in `currency`, quantities in `locale`. */
export function createFormat({ locale, currency }) {
  const money = (value, digits) => (Number.isFinite(value)
    ? nf(locale, { style: 'currency', currency, minimumFractionDigits: digits, maximumFractionDigits: digits }).format(value)
    : '—');
  return {
    locale,
    currency,
    /** Yearly amounts: whole currency units. */
    money: (value) => money(value, 0),
    /** Prices and costs per unit: two decimals, or four below 0.1. */
    price: (value) => money(value, Math.abs(value) < 0.1 && value !== 0 ? 4 : 2),
    /** A quantity with `digits` significant digits (default 4), grouped, no exponent. */
    number: (value, digits = 4) => {
      if (!Number.isFinite(value)) return '—';
      const abs = Math.abs(value);
      if (abs >= 10 ** digits) return nf(locale, { maximumFractionDigits: 0 }).format(value);
      return nf(locale, { maximumSignificantDigits: digits }).format(value);
    },
    fixed: (value, decimals) => (Number.isFinite(value)
      ? nf(locale, { minimumFractionDigits: decimals, maximumFractionDigits: decimals }).format(value) : '—'),
    percent: (fraction, decimals = 0) => (Number.isFinite(fraction)
      ? nf(locale, { style: 'percent', maximumFractionDigits: decimals }).format(fraction) : '—'),
    date: (iso) => {
      if (!iso) return '';
      const [y, m, d] = iso.split('-').map(Number);
      if (!y || !m || !d) return iso;
      return longDate(locale).format(Date.UTC(y, m - 1, d));
    },
    currencySymbol: () => nf(locale, { style: 'currency', currency }).formatToParts(0)
      .find((p) => p.type === 'currency')?.value ?? currency,
  };
}

/** The core's names of scenario fields in its messages, and the words the page uses for them. */
const FIELD_WORDS = [
  [/\(set demand\.balance_point\)/g, '(give the balance point under Heat need)'],
  [/\bdemand\.balance_point\b/g, 'the balance point under Heat need'],
  [/\bsettings\.electricity or an electricity option\b/g, 'an electricity price for the equipment on the Fuels tab'],
  [/\bsettings\.electricity\b/g, 'the electricity price for the equipment (Fuels tab)'],
  [/\bmonthly_sd\b/g, 'the spread of daily temperatures'],
  [/\bdaily_range\b/g, 'the daily temperature range'],
  [/\bmonthly_mean \(12 values\)/g, 'the twelve monthly mean temperatures'],
  [/\bmonthly_hdd \(12 values\)/g, 'twelve monthly degree-days'],
  [/\bannual_hdd\b/g, 'annual degree-days'],
  [/\bdesign_temperature\b/g, 'the design temperature'],
  [/\bno bill_dates given\b/g, 'no bill-date rule chosen'],
  [/^is required \(a fuel id or a custom fuel object\)$/, 'choose a fuel (the Fuels tab holds this quote\'s fuels)'],
  [/\bmust be a fuel id or a custom fuel object\b/g, 'must be one of the fuels on the Fuels tab'],
  [/\bis required \(or give a catalog system\)/g, 'is required (or choose a catalog type)'],
  [/\bgive electric-resistance or the id of a furnace or boiler option\b/g, 'choose electric resistance strips or a furnace or boiler of this quote'],
  [/\bgive either amount_per_month or amount_per_year\b/g, 'give the amount either a month or a year'],
  [/\bwithout one give efficiency\b/g, 'without one give its rated efficiency'],
  [/\bgive life_years to replace it\b/g, 'type its expected life to replace it'],
  [/\bis not in data\/species\.json\b/g, 'is not in the built-in table of compounds'],
];

/** Core words in a message ("-5 degF", "set demand.balance_point") as people write them ("-5 °F", "give the balance point"). */
export const plainUnits = (text) => FIELD_WORDS.reduce((t, [pattern, words]) => t.replace(pattern, words),
  String(text ?? '').replace(/\bdegF\b/g, '°F').replace(/\bdegC\b/g, '°C'));

/** Short month names of the locale, January first. */
/** A message of the core ("the lines never cross") as a sentence: capital first letter, full stop. */
export const asSentence = (text) => (text ? `${text[0].toUpperCase()}${text.slice(1)}${/[.!?]$/.test(text) ? '' : '.'}` : '');

export function monthNames(locale) {
  const format = new Intl.DateTimeFormat(locale, { month: 'short', timeZone: 'UTC' });
  return Array.from({ length: 12 }, (_, m) => format.format(Date.UTC(2025, m, 15)));
}
