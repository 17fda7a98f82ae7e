// A weather file (CSV of daily or hourly temperatures), the pure part: the
// request the page sends to the core's weather(), what the answer says in plain
// words (station, period, days or hours, annual degree-days, design
// temperatures, warnings, problems), and the labels the quote keeps for the
// climate and the bills' weather it came from. No DOM here, so Node can test it.
import { plainUnits } from './format.js';

/** Largest weather file read [bytes]: ten years of hourly readings fit in a few MB. */
export const MAX_WEATHER_BYTES = 32 * 1024 * 1024;

const isNumber = (v) => typeof v === 'number' && Number.isFinite(v);


/** The core's weather() request for a file's text; format and unit only when the user chose them. */
export function weatherRequest(text, { format = '', unit = '' } = {}) {
  const request = { text };
  if (format) request.format = format;
  if (unit) request.unit = unit;
  return request;
}

/** Why a picked file is not read at all (too big, empty), or null. */
export function fileProblem(file) {
  if (!file) return 'No file was picked.';
  if (file.size === 0) return `“${file.name}” is empty.`;
  if (file.size > MAX_WEATHER_BYTES) {
    return `“${file.name}” is ${Math.round(file.size / 1048576)} MB; a weather file may be at most ${MAX_WEATHER_BYTES / 1048576} MB. Export fewer years from the weather service.`;
  }
  return null;
}

/**
 * The answer of weather() in plain words, with `fmt` the page's formatter (number, date):
 * {ok, rows: [[label, text]], warnings: [text], errors: [text], climate, observed, climateMissing}.
 * `ok` is false when the core refused the file (errors); `climate` is null when the file does not span
 * whole years, and `climateMissing` then says so.
 */
export function weatherSummary(answer, fmt) {
  const errors = (answer?.errors ?? []).map((e) => plainUnits(e.message ?? String(e)));
  const warnings = (answer?.warnings ?? []).map((w) => plainUnits(w.message ?? String(w)));
  if (errors.length || !answer) return { ok: false, rows: [], warnings, errors: errors.length ? errors : ['The file could not be read.'], climate: null, observed: null };
  const unit = answer.unit === 'degC' ? '°C' : '°F';
  const temp = (v) => (isNumber(v) ? `${fmt.number(v, 3)} ${unit}` : 'not worked out');
  const rows = [];
  rows.push(['Weather station', typeof answer.station === 'string' && answer.station.trim() ? answer.station : 'not named in the file']);
  rows.push(['Period', answer.first_date && answer.last_date ? `${fmt.date(answer.first_date)} to ${fmt.date(answer.last_date)}` : 'unknown']);
  if (answer.format === 'hourly') {
    rows.push(['Readings', `${fmt.number(answer.hours ?? 0, 6)} hours on ${fmt.number(answer.days ?? 0, 6)} days`]);
  } else {
    rows.push(['Readings', `${fmt.number(answer.days ?? 0, 6)} days of daily temperatures`]);
  }
  const s = answer.summary ?? {};
  const base = isNumber(s.hdd_base?.value) ? ` (base ${fmt.number(s.hdd_base.value, 3)} ${s.hdd_base.unit === 'degC' ? '°C' : '°F'})` : '';
  rows.push([`Heating degree-days a year${base}`, isNumber(s.annual_hdd) ? `${fmt.number(s.annual_hdd, 4)} ${unit}·d` : 'not worked out']);
  rows.push(['Design temperature (99 %)', temp(s.design_temperature_99)]);
  rows.push(['Design temperature (99.6 %)', temp(s.design_temperature_996)]);
  const climate = answer.climate && typeof answer.climate === 'object' ? answer.climate : null;
  const observed = answer.observed && typeof answer.observed === 'object' ? answer.observed : null;
  return {
    ok: true, rows, warnings, errors: [], climate, observed,
    climateMissing: climate ? null : 'This file does not cover whole years, so it cannot stand for this quote\'s climate; it can still be the weather for the bills.',
  };
}

/** The label kept with a climate or observed weather taken from a file: "Weather file “name.csv”, STATION, first to last". */
export function weatherLabel(fileName, answer, fmt) {
  const station = typeof answer?.station === 'string' && answer.station.trim() ? `, ${answer.station.trim()}` : '';
  const period = answer?.first_date && answer?.last_date ? `, ${fmt.date(answer.first_date)} to ${fmt.date(answer.last_date)}` : '';
  return `Weather file “${fileName}”${station}${period}`;
}

/** The span of observed daily temperatures: {days, first, last} (null when there are none). */
export function observedSpan(observed) {
  const list = observed?.daily_mean ?? observed?.daily_max ?? null;
  if (!Array.isArray(list) || !list.length) return null;
  const dates = list.map((row) => (Array.isArray(row) ? row[0] : '')).filter((d) => typeof d === 'string').sort();
  return { days: list.length, first: dates[0], last: dates.at(-1) };
}
