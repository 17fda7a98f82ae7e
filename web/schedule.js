// Time-of-use price rows as the Fuels tab edits them ({name, amount, from, to, days, months_text}, one span of
// hours a row; rows of one name are one period) and the core's `price.schedule` they stand for, both ways.

const MONTHS = 12;

/**
 * Months typed as text ("6-9", "11-3", "1, 2, 12"; empty or "all" for the whole year) as month numbers 1-12, or
 * null when the text is not months (the core then says so at the field).
 */
export function parseMonths(text) {
  const clean = String(text ?? '').trim().toLowerCase();
  if (clean === '' || clean === 'all') return [];
  const months = new Set();
  for (const part of clean.split(/[,;\s]+/).filter(Boolean)) {
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

/** The core's schedule of the rows: each row one entry with its one span of hours; months as typed when they are not months. */
export function scheduleOfRows(rows) {
  return (rows ?? []).map((row) => {
    const out = { name: String(row.name ?? '').trim() };
    if (isNumber(row.amount)) out.amount = row.amount;
    out.hours = [[isNumber(row.from) ? row.from : null, isNumber(row.to) ? row.to : null]];
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

/** The workspace field of a core path inside a schedule row: hours/0/0 is the row's "from", hours/0/1 its "to", months its text. */
export function rowField(rest) {
  const [key, , end] = rest;
  if (key === 'hours') return end === '0' ? 'from' : end === '1' ? 'to' : 'from';
  if (key === 'months') return 'months_text';
  return key;
}
