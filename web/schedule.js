// Time-of-use price rows as the Fuels tab edits them ({name, amount, from, to, days, months_text}, one span of
// hours a row; rows of one name are one period) and the core's `price.schedule` they stand for, both ways.

const MONTHS = 12;
const MONTH_NAMES = ['january', 'february', 'march', 'april', 'may', 'june', 'july', 'august', 'september', 'october', 'november', 'december'];

/**
 * Months typed as text ("6-9", "6 - 9", "11-3", "1, 2, 12", "Jun-Sep"; empty or "all" for the whole year) as month numbers 1-12, or
 * null when the text is not months (the core then says so at the field).
 */
export function parseMonths(text) {
  const clean = String(text ?? '').trim().toLowerCase();
  if (clean === '' || clean === 'all') return [];
  const months = new Set();
  // "6 - 9" is 6-9; month names as a tariff sheet prints them ("Jun-Sep", "June") are their numbers
  const named = clean.replace(/[a-z]+/g, (word) => {
    const m = MONTH_NAMES.findIndex((name) => word.length >= 3 && name.startsWith(word.slice(0, 3)) && name.startsWith(word));
    return m >= 0 ? String(m + 1) : word;
  }).replace(/\s*[-–]\s*/g, '-');
  for (const part of named.split(/[,;\s]+/).filter(Boolean)) {
    const range = /^(\d{1,2})\s*[-–]\s*(\d{1,2})$/.exec(part);
    const single = /^(\d{1,2})$/.exec(part);
    if (range) {
      const from = Number(range[1]);
      const to = Number(range[2]);
      if (from < 1 || from > MONTHS || to < 1 || to > MONTHS) return null;
      // 11-3 runs over the new year: November to March
      for (let m = from; ; m = (m % MONTHS) + 1) {
        months.add(m);
        if (m === to) break;
      }
    } else if (single) {
      const m = Number(single[1]);
      if (m < 1 || m > MONTHS) return null;
      months.add(m);
    } else {
      return null;
    }
  }
  return [...months].sort((a, b) => a - b);
}

/** Month numbers as the shortest text parseMonths reads back ("6-9", "1-3, 11, 12"); "" for the whole year. */
export function monthsText(months) {
  const list = [...new Set((months ?? []).filter((m) => Number.isInteger(m) && m >= 1 && m <= MONTHS))].sort((a, b) => a - b);
  if (!list.length || list.length === MONTHS) return '';
  const runs = [];
  for (const m of list) {
    const last = runs.at(-1);
    if (last && m === last[1] + 1) last[1] = m;
    else runs.push([m, m]);
  }
  return runs.map(([a, b]) => (a === b ? String(a) : b === a + 1 ? `${a}, ${b}` : `${a}-${b}`)).join(', ');
}

const isNumber = (v) => typeof v === 'number' && Number.isFinite(v);

const sameEntry = (a, b) => a.name === b.name && a.amount === b.amount && (a.days ?? 'all') === (b.days ?? 'all')
  && String(a.months_text ?? '') === String(b.months_text ?? '');

/** The rows grouped into the core's entries: consecutive rows alike but for their hours are one entry ([[row indices]]). */
export function entryGroups(rows) {
  const groups = [];
  (rows ?? []).forEach((row, k) => {
    const last = groups.at(-1);
    if (last && sameEntry(rows[last[0]], row)) last.push(k);
    else groups.push([k]);
  });
  return groups;
}

/**
 * The core's schedule of the rows: consecutive rows alike but for their hours are one entry with several spans (as an
 * imported tariff came); months as typed when they are not months.
 */
export function scheduleOfRows(rows) {
  const list = rows ?? [];
  return entryGroups(list).map((group) => {
    const row = list[group[0]];
    const out = { name: String(row.name ?? '').trim() };
    if (isNumber(row.amount)) out.amount = row.amount;
    out.hours = group.map((k) => [isNumber(list[k].from) ? list[k].from : null, isNumber(list[k].to) ? list[k].to : null]);
    if (row.days && row.days !== 'all') out.days = row.days;
    const months = parseMonths(row.months_text);
    if (months === null) out.months = [row.months_text];
    else if (months.length && months.length < MONTHS) out.months = months;
    return out;
  });
}

/** The rows of a core schedule: an entry with several spans of hours becomes one row per span (same name and price). */
export function rowsOfSchedule(schedule) {
  const rows = [];
  for (const entry of Array.isArray(schedule) ? schedule : []) {
    const hours = Array.isArray(entry?.hours) ? entry.hours : [];
    const spans = hours.length === 2 && hours.every(isNumber) ? [hours] : hours.filter(Array.isArray);
    for (const [from, to] of spans.length ? spans : [[undefined, undefined]]) {
      rows.push({ name: entry?.name ?? '', amount: entry?.amount, from, to, days: entry?.days ?? 'all', months_text: monthsText(entry?.months) });
    }
  }
  return rows;
}

/**
 * The workspace field of a core path inside entry `entry` of the schedule (`rest` the path after the entry's index):
 * hours/j/0 is row j of the entry's "from", hours/j/1 its "to", months its text, anything else (or the entry itself)
 * the entry's first row.
 */
export function rowPath(rows, entry, rest) {
  const group = entryGroups(rows)[entry] ?? [entry];
  const [key, span, end] = rest;
  if (key === undefined) return String(group[0]);
  if (key === 'hours') {
    const row = group[/^\d+$/.test(span ?? '') ? Math.min(Number(span), group.length - 1) : 0];
    return `${row}/${end === '1' ? 'to' : 'from'}`;
  }
  return `${group[0]}/${key === 'months' ? 'months_text' : key}`;
}
