// Bills pasted as a block, pure part (tested in Node): one bill a line, "start, end, quantity" as a
// utility's statement or a spreadsheet gives them (tab-, comma-, semicolon- or space-separated, dates
// as 2025-11-12, 11/12/2025 (US) or 12/11/2025 and 12.11.2025 (elsewhere), an optional unit after
// the quantity). Every line gives a bill or a message naming the line; nothing is dropped silently.
import { parseNumber } from './format.js';

/** Units a pasted quantity may name, as the bills' unit menu spells them. */
const UNITS = { therm: 'therm', therms: 'therm', thm: 'therm', kwh: 'kWh', ccf: 'ccf', mcf: 'Mcf', m3: 'm3', 'm³': 'm3', gal: 'gal',
  gallon: 'gal', gallons: 'gal', l: 'L', litre: 'L', liter: 'L', litres: 'L', liters: 'L', kg: 'kg', lb: 'lb', mmbtu: 'MMBtu', mj: 'MJ', gj: 'GJ' };

const pad = (n) => String(n).padStart(2, '0');

/** [YYYY-MM-DD] A date as written, month first for `monthFirst` (US), else day first; null if not a date. */
export function readDate(text, monthFirst) {
  const t = text.trim();
  let m = /^(\d{4})-(\d{1,2})-(\d{1,2})$/.exec(t);
  let y;
  let mo;
  let d;
  if (m) [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  else if ((m = /^(\d{1,2})[/.](\d{1,2})[/.](\d{2}|\d{4})$/.exec(t))) {
    const [a, b] = [Number(m[1]), Number(m[2])];
    [mo, d] = monthFirst ? [a, b] : [b, a];
    y = m[3].length === 2 ? 2000 + Number(m[3]) : Number(m[3]);
  } else return null;
  const date = new Date(Date.UTC(y, mo - 1, d));
  if (date.getUTCFullYear() !== y || date.getUTCMonth() !== mo - 1 || date.getUTCDate() !== d) return null;
  return `${y}-${pad(mo)}-${pad(d)}`;
}

/**
 * The bills of a pasted block: {bills: [{start, end, quantity, unit?}], problems: [{line, text, message}]}.
 * `locale` decides month-first dates (en-US) and the decimal separator of quantities.
 */
export function parseBillLines(text, locale = 'en-US') {
  const monthFirst = /^en-US$/i.test(locale);
  const decimalComma = parseNumber('1,5', locale) === 1.5;
  const bills = [];
  const problems = [];
  String(text ?? '').split(/\r?\n/).forEach((raw, i) => {
    const line = raw.trim();
    if (!line) return;
    const problem = (message) => problems.push({ line: i + 1, text: line, message });
    // dates first (the quantity may hold commas or spaces as group separators)
    const dates = [...line.matchAll(/\d{4}-\d{1,2}-\d{1,2}|\d{1,2}[/.]\d{1,2}[/.](?:\d{4}|\d{2})(?!\d)/g)];
    if (dates.length < 2) return problem('needs a start date, an end date and the quantity billed');
    const start = readDate(dates[0][0], monthFirst);
    const end = readDate(dates[1][0], monthFirst);
    if (!start || !end) return problem(`"${(start ? dates[1] : dates[0])[0]}" is not a date`);
    if (end <= start) return problem(`the end date ${end} is not after the start date ${start}`);
    let rest = line.slice(dates[1].index + dates[1][0].length).replace(/^[\s,;\t–-]+/, '').trim();
    const unitMatch = /([A-Za-z³]+[0-9³]*)\.?$/.exec(rest);
    let unit;
    if (unitMatch && rest.slice(0, unitMatch.index).trim()) {
      unit = UNITS[unitMatch[1].toLowerCase()];
      if (!unit) return problem(`"${unitMatch[1]}" is not a unit a bill is read in (therm, kWh, ccf, m3, gal, L…)`);
      rest = rest.slice(0, unitMatch.index).trim();
    }
    // a separator comma left between columns (not a decimal or group comma)
    rest = rest.replace(/^[,;\t]+|[,;\t]+$/g, '').trim();
    if (!decimalComma) rest = rest.replace(/\s+/g, '');
    const quantity = parseNumber(rest, locale);
    if (quantity === null || Number.isNaN(quantity)) return problem(rest ? `"${rest}" is not a quantity` : 'has no quantity billed');
    if (!(quantity >= 0)) return problem(`the quantity ${rest} is negative`);
    bills.push({ start, end, quantity, ...(unit ? { unit } : {}) });
  });
  return { bills, problems };
}
