// The verdict's results, as pure functions (tested in Node): the rows in the core's ranking (the page
// never ranks on its own), the values each row shows in the quote's display units, payback and life in
// words, the equipment notes beside the fuel, and the verdict as CSV. The verdict view, the quote sheet
// and the page's controller all read the core's answer through this module.
import { keptServicesName, siteCostLines, sizingSentence } from './equipment.js';
import { ENERGY_KWH, co2In, unitLabel } from './units.js';

const isNum = (v) => typeof v === 'number' && Number.isFinite(v);

/** The values a verdict row shows, in the display units of `ws.settings`. */
export function displayValues(option, ws) {
  const energyUnit = ws.settings.energy_unit;
  const perUnit = ENERGY_KWH[energyUnit];
  return {
    annual_cost: option.annual_cost,
    energy_cost: option.energy_cost,
    fixed_cost: option.fixed_cost,
    cost_per_useful: option.cost_per_useful_kwh * perUnit,
    useful_heat: option.useful_heat_kwh / perUnit,
    fuel_quantity: option.fuel_quantity?.value,
    co2e: co2In(option.co2e_kg, ws.settings.units),
    lcoh: isNum(option.lcoh_per_kwh) ? option.lcoh_per_kwh * perUnit : undefined,
    co2e_saved_t: isNum(option.co2e_saved_kg_life) ? option.co2e_saved_kg_life / 1000 : undefined,
  };
}


/** Whether the verdict shows the costs over the years: asked for on the page, and worked out by the core. */
export const hasLifeCycle = (result, ws) => Boolean(ws?.economics?.enabled) && (result?.options ?? []).length > 0
  && result.options.every((o) => isNum(o.life_cycle_cost));

const MADE_BY = {
  'heating-system': 'the heating system', storage: 'a storage water heater', tankless: 'a tankless water heater',
  'heat-pump-water-heater': 'a heat-pump water heater', indirect: 'the boiler, through an indirect tank', combi: 'the combi boiler',
};

/** Who makes an option's hot water, in words. */
export const madeByWords = (id) => MADE_BY[id] ?? id;

/**
 * The two services of each option in rank order (space heating and hot water, each its cost a year, what it burns
 * and how much) and the option's electricity by time-of-use period; null when the verdict has no hot water and no
 * period (nothing to split).
 */
export function serviceRows(result, by) {
  const list = rankedOptions(result, by);
  const water = list.some((o) => (o.water_heating?.useful_heat_kwh ?? 0) > 0);
  const periods = list.some((o) => Array.isArray(o.electricity_periods) && o.electricity_periods.length);
  if (!water && !periods) return null;
  return list.map((o) => ({
    id: o.id,
    label: o.label ?? o.id,
    space: o.space_heating ?? null,
    water: water ? o.water_heating ?? null : null,
    periods: (o.electricity_periods ?? []).map((p) => ({ name: p.name, kwh: p.kwh, cost: p.cost })),
    electricity_kwh: o.electricity_kwh,
  }));
}

/** Rows of the ranked table, in rank order by `by` ('annual', or 'life' for the core's life-cycle ranking). */
export function rankedOptions(result, by) {
  const byId = new Map((result.options ?? []).map((o) => [o.id, o]));
  const ranking = by === 'life' && Array.isArray(result.ranking_life_cycle) && result.ranking_life_cycle.length
    ? result.ranking_life_cycle : result.ranking ?? [];
  const list = ranking.map((r) => byId.get(r.id)).filter(Boolean);
  return list.length ? list : [...byId.values()];
}

/** A number of years as people say it: one decimal below 10 ("7.4 years"), whole years above ("24 years"). */
export function years(value, format) {
  const rounded = value < 10 ? Math.round(value * 10) / 10 : Math.round(value);
  return `${format.number(rounded, 3)} ${rounded === 1 ? 'year' : 'years'}`;
}

/**
 * An option's payback in plain words for the customer (pure): "7.4 years"; "does not pay back within
 * its 15-year life" when it would take longer than the equipment lasts (`lifeYears`, as entered); "no
 * saving a year: it costs $48 more to run" when there is nothing to pay back with; null for the system
 * in the house now. `key`: simple_payback_years or discounted_payback_years.
 */
export function paybackWords(option, { key = 'simple_payback_years', lifeYears, studyYears, baselineId, format }) {
  if (option.id === baselineId) return null;
  const value = option[key];
  const life = isNum(lifeYears) && lifeYears > 0 ? lifeYears : null;
  // a life the core took from the catalog (none entered) is the usual one for such equipment
  const its = option.life_years_from === 'catalog' && lifeYears === option.life_years ? 'its usual' : 'its';
  if (isNum(value)) {
    if (life && value > life) return `does not pay back within ${its} ${format.number(life, 3)}-year life`;
    return years(value, format);
  }
  if (isNum(option.annual_saving) && option.annual_saving <= 0) {
    return option.annual_saving < 0 ? `no saving a year: it costs ${format.money(-option.annual_saving)} more to run` : 'no saving a year';
  }
  if (life) return `does not pay back within ${its} ${format.number(life, 3)}-year life`;
  return isNum(studyYears) ? `does not pay back within ${format.number(studyYears, 3)} years` : 'does not pay back';
}

/** An option's service life [years]: the core's (as entered, or its catalog record's median), else as entered on its card. */
export const lifeOf = (ws, option) => (isNum(option?.life_years) ? option.life_years : ws.systems?.find((s) => s.id === option?.id)?.life_years);

/** The fuel an option burns in a year; a dual-fuel option's two fuels both ("3,120 kWh + 180 therm"). */
export function fuelUsedText(o, v, format) {
  const main = `${format.number(v.fuel_quantity)} ${unitLabel(o.fuel_quantity?.unit ?? '')}`;
  const backup = o.backup_fuel_quantity;
  return backup && Number.isFinite(backup.value) && backup.value > 0 ? `${main} + ${format.number(backup.value)} ${unitLabel(backup.unit ?? '')}` : main;
}


/** The words for a heat pump's backup: the dual-fuel option's name, or the resistance strips the core assumes otherwise. */
function backupName(option, result) {
  if (option.backup_option) {
    const other = (result.options ?? []).find((o) => o.id === option.backup_option);
    return `the backup (${other?.label ?? other?.fuel_name ?? 'the other system'})`;
  }
  return 'the backup (electric resistance strips)';
}

/**
 * Per option, in plain words: what it pays beside its fuel (its own electricity, the gas service kept for
 * other appliances) and, for a heat pump, its size against the house's load. [{option, lines, sizing, resistance}]
 */
export function equipmentNotes(result, ws, ctx, by = 'annual') {
  const keptName = keptServicesName(ws, ctx.catalog);
  return rankedOptions(result, by).map((option) => {
    const system = (ws.systems ?? []).find((s) => s.id === option.id)?.system ?? {};
    const sizing = sizingSentence(option, { ws, result, format: ctx.format, system, backupName: backupName(option, result) });
    const short = sizing && option.capacity_at_design?.value < option.design_load?.value;
    return { option, lines: siteCostLines(option, { format: ctx.format, keptName }), sizing, resistance: short && !option.backup_option };
  }).filter((n) => n.lines.length || n.sizing);
}


/** Numbers as the verdict shows them: yearly money in whole units, prices to 2 decimals (4 below 0.1), quantities to 4 significant digits. */
const SHOWN = {
  money: (v) => Math.round(v),
  price: (v) => Number(v.toFixed(Math.abs(v) < 0.1 && v !== 0 ? 4 : 2)),
  quantity: (v) => (Math.abs(v) >= 1e4 ? Math.round(v) : Number(v.toPrecision(4))),
  years: (v) => Number(v.toFixed(1)),
};

/** A CSV cell: a number as shown (never quoted, negative ones included), text quoted where needed and never read as a formula. */
function csvCell(value, kind) {
  if (typeof value === 'number') return Number.isFinite(value) ? String(SHOWN[kind] ? SHOWN[kind](value) : value) : '';
  const text = value === undefined || value === null ? '' : String(value);
  const guarded = /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
  return /[",\n\r]/.test(guarded) || guarded !== text ? `"${guarded.replaceAll('"', '""')}"` : guarded;
}

/**
 * The results table as CSV text (numbers with a point, in the display units, rounded as the verdict shows
 * them), after the quote's customer, site, date and number.
 */
export function resultsCsv(result, ws, by = 'annual') {
  const energyUnit = ws.settings.energy_unit;
  const massUnit = ws.settings.units === 'us' ? 'lb' : 'kg';
  const currency = ws.settings.currency;
  const list = rankedOptions(result, by);
  const econ = hasLifeCycle(result, ws);
  const header = ['rank', 'id', 'option', 'fuel', `annual cost (${currency})`, `energy cost (${currency})`, `fixed cost (${currency})`,
    `cost per useful ${energyUnit} (${currency})`, 'fuel used', 'fuel unit', `CO2e (${massUnit}/year)`];
  // the two services, when the verdict has hot water of its own
  const water = list.some((o) => (o.water_heating?.useful_heat_kwh ?? 0) > 0);
  if (water) header.push(`space heating (${currency}/year)`, `hot water (${currency}/year)`, 'hot water made by');
  if (econ) {
    header.push(`net installed cost (${currency})`, `annual saving (${currency})`, 'simple payback (years)', 'discounted payback (years)',
      `NPV (${currency})`, `life-cycle cost (${currency})`, `levelized cost per useful ${energyUnit} (${currency})`, 'CO2e avoided over the period (t)',
      `cost per tonne CO2e avoided (${currency})`);
  }
  const q = ws.quote ?? {};
  const lines = [['quote number', q.number], ['customer', q.customer], ['site', q.site], ['date', q.date], ['prepared by', q.prepared_by]]
    .filter(([, v]) => v !== undefined && v !== null && String(v).trim() !== '')
    .map(([k, v]) => [csvCell(k), csvCell(String(v))].join(','));
  if (lines.length) lines.push('');
  lines.push(header.map((c) => csvCell(c)).join(','));
  list.forEach((o, i) => {
    const v = displayValues(o, ws);
    const row = [[i + 1], [o.id], [o.label ?? o.id], [o.fuel_name ?? o.fuel], [v.annual_cost, 'money'], [v.energy_cost, 'money'],
      [v.fixed_cost, 'money'], [v.cost_per_useful, 'price'], [v.fuel_quantity, 'quantity'], [o.fuel_quantity?.unit], [v.co2e, 'quantity']];
    if (water) row.push([o.space_heating?.annual_cost, 'money'], [o.water_heating?.annual_cost, 'money'], [madeByWords(o.water_heating?.made_by)]);
    if (econ) {
      row.push([o.net_installed_cost, 'money'], [o.annual_saving, 'money'], [o.simple_payback_years, 'years'], [o.discounted_payback_years, 'years'],
        [o.npv, 'money'], [o.life_cycle_cost, 'money'], [v.lcoh, 'price'], [v.co2e_saved_t, 'quantity'], [o.cost_per_tonne_co2e_avoided, 'money']);
    }
    lines.push(row.map(([value, kind]) => csvCell(value, kind)).join(','));
  });
  return `${lines.join('\r\n')}\r\n`;
}

/**
 * The fit's energy per day in the unit the bills are in when they are all in one energy unit (therm, MMBtu,
 * GJ…): {factor per fit unit, unit}; else the fit's own unit (a volume or mass needs the fuel's heating value).
 */
export function billsUnitOf(fit, bills) {
  const units = new Set((bills ?? []).map((b) => b.unit).filter(Boolean));
  const [only] = units;
  const fitKwh = ENERGY_KWH[fit.unit ?? 'kWh'];
  if (units.size === 1 && ENERGY_KWH[only] && fitKwh) return { factor: fitKwh / ENERGY_KWH[only], unit: only };
  return { factor: 1, unit: fit.unit ?? 'kWh' };
}

/** The bins worth drawing: an hour or more a year, and a load to meet. */
export const heatingBins = (bins) => bins.filter((b) => (b.hours ?? 0) >= 1 && (b.load_kw ?? 0) > 0);

/**
 * The system in the house now as a sentence names it: "the existing oil boiler, 86 AFUE" for a label that
 * says so already, else "Gas furnace, the system in the house now".
 */
export function systemNowWords(label) {
  return /^existing\s/i.test(label) ? `the e${label.slice(1)}` : `${label}, the system in the house now`;
}
