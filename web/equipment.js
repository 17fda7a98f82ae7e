// Equipment as it is rated and sold, pure part (no DOM here, so Node can test it):
// the defaults the core assumes where a card has no value (a heat pump's
// low-temperature cut-out by compressor type, a fuel-burning system's own
// electricity from the catalog), which electricity price the core puts on that
// electricity, and the verdict's and the quote sheet's plain-word lines for the
// result fields auxiliary_kwh, auxiliary_cost, kept_services_cost, design_load,
// capacity_at_design and balance_point.
import { convertTemperature, unitLabel } from './units.js';

/** Kinds that burn fuel: they have an output capacity and their own electricity (blower, pump, burner motor). */
export const FUEL_BURNING_KINDS = ['furnace', 'boiler', 'stove'];
/** A heat pump's compressor (system.stages) with its name on the card. */
export const STAGES = [['single', 'Single-stage'], ['two', 'Two-stage'], ['variable', 'Variable-speed']];
/** Compressors that run below their full capacity, so a data-sheet point may carry a minimum capacity and its COP. */
export const MODULATING = ['two', 'variable'];

const isNum = (v) => typeof v === 'number' && Number.isFinite(v);

/**
 * The cut-out the core assumes when none is given [in `unit`, degF or degC]: 0 degF for single- and
 * two-stage units, -13 degF (-25 degC) for variable-speed ones (the core's default_cutoff_c).
 */
export function defaultCutoff(stages, unit) {
  const c = stages === 'variable' ? -25 : (0 - 32) / 1.8;
  return convertTemperature(c, 'degC', unit);
}

/**
 * The catalog record whose own electricity the core uses for a system without one: the chosen catalog
 * type, else the record of the same kind burning the fuel whose typical efficiency is nearest the one
 * entered in the same rating (the core's typical_system_for). Null for a custom fuel or no match.
 */
export function defaultRecord(system, fuel, catalog) {
  if (!system || !FUEL_BURNING_KINDS.includes(system.kind)) return null;
  if (system.catalog) return catalog.systems.find((m) => m.id === system.catalog) ?? null;
  if (typeof fuel !== 'string' || !fuel) return null;
  let best = null;
  let bestGap = Infinity;
  for (const record of catalog.systems) {
    if (record.kind !== system.kind || !record.fuels.includes(fuel)) continue;
    const eff = system.efficiency ?? {};
    const gap = record.typical.rating === eff.rating && isNum(eff.value) ? Math.abs(record.typical.value - eff.value) : 1e9;
    if (!best || gap < bestGap) {
      best = record;
      bestGap = gap;
    }
  }
  return best;
}

/** The own electricity the core assumes for `system` burning `fuel` (catalog id): {value, unit, record} or null (none counted). */
export function auxiliaryDefault(system, fuel, catalog) {
  const record = defaultRecord(system, fuel, catalog);
  const aux = record?.auxiliary_electricity;
  return aux && isNum(aux.value) && aux.value > 0 ? { value: aux.value, unit: aux.unit, record } : null;
}

/** The catalog fuel id of a workspace fuel entry ('' for a custom fuel). */
const catalogFuel = (entry) => (typeof entry?.fuel === 'string' ? entry.fuel : '');

/** The systems of the workspace that run on electricity, in option order. */
export function electricSystems(ws) {
  const electric = new Set(ws.fuels.filter((f) => catalogFuel(f) === 'electricity').map((f) => f.key));
  return ws.systems.filter((s) => electric.has(s.fuel_key));
}

/**
 * Which price the core puts on the equipment's own electricity: the first electricity option's
 * ({from: 'option', system, entry}), else the price typed for it ({from: 'typed', amount}), else none.
 */
export function equipmentElectricityPrice(ws) {
  const first = electricSystems(ws)[0];
  if (first) return { from: 'option', system: first, entry: ws.fuels.find((f) => f.key === first.fuel_key) };
  const amount = ws.settings?.electricity?.price?.amount;
  return isNum(amount) ? { from: 'typed', amount } : { from: 'none' };
}

/** Whether any system of the workspace burns fuel (and so may use electricity of its own). */
export const burnsFuelAnywhere = (ws) => ws.systems.some((s) => FUEL_BURNING_KINDS.includes(s.system?.kind));

/** A temperature {value, unit} (or a number in `from`) as text in the display unit of `units` ('us' or 'metric'). */
export function temperatureText(t, units, format, from) {
  const value = typeof t === 'object' && t ? t.value : t;
  const unit = typeof t === 'object' && t ? t.unit : from;
  if (!isNum(value) || !unit) return '—';
  const want = units === 'us' ? 'degF' : 'degC';
  const shown = convertTemperature(value, unit, want);
  const rounded = want === 'degF' ? Math.round(shown) : Math.round(shown * 10) / 10;
  return `${format.number(Object.is(rounded, -0) ? 0 : rounded, 4)} ${unitLabel(want)}`;
}

/** A power {value, unit} as the quote shows it: Btu/h to the nearest 100, kW to 0.1. */
export function powerText(q, format) {
  if (!q || !isNum(q.value)) return '—';
  if (q.unit === 'Btu/h') return `${format.number(Math.round(q.value / 100) * 100, 8)} Btu/h`;
  if (q.unit === 'kW') return `${format.number(Math.round(q.value * 10) / 10, 6)} kW`;
  return `${format.number(q.value, 4)} ${unitLabel(q.unit ?? '')}`;
}

/** The design temperature the core sizes against: the one typed on the House tab, else the climate's 99 % one. */
export function designTemperature(ws, result) {
  const typed = ws.climate?.design_temperature;
  if (ws.climate?.mode !== 'none' && isNum(typed?.value) && typed.unit) return typed;
  const c = result?.climate;
  return isNum(c?.design_temperature_99) ? { value: c.design_temperature_99, unit: c.unit } : null;
}

/** The cut-out a heat pump's card has, or the one the core assumes: {value, unit, assumed}. */
export function cutoffOf(system, units) {
  const unit = system?.cutoff?.unit ?? (units === 'us' ? 'degF' : 'degC');
  if (isNum(system?.cutoff?.value)) return { value: system.cutoff.value, unit, assumed: false };
  return { value: defaultCutoff(system?.stages, unit), unit, assumed: true };
}

/**
 * The sizing sentence of a heat-pump option of the result: where its capacity at the design temperature
 * stands against the house's load, below which temperature the backup helps, and where it stops. Null
 * when the result has no sizing (no climate). `backupName` names the backup in words.
 */
export function sizingSentence(option, { ws, result, format, system, backupName }) {
  const load = option.design_load;
  const capacity = option.capacity_at_design;
  if (!isNum(load?.value) || !isNum(capacity?.value)) return null;
  const units = ws.settings.units;
  const design = designTemperature(ws, result);
  const at = design ? `At ${temperatureText(design, units, format)}` : 'On the coldest days';
  const backup = backupName || 'the backup';
  const cut = cutoffOf(system, units);
  const assumedCut = cut.assumed ? ' (a usual cut-out for this compressor: the data sheet\'s own figure is better)' : '';
  if (design && capacity.value === 0 && load.value > 0) {
    // the design temperature is below the cut-out: the compressor has stopped there
    return `${at}, below the heat pump's cut-out of ${temperatureText(cut, units, format)}${assumedCut}, the compressor has stopped: `
      + `${backup} carries all ${powerText(load, format)} the house needs.`;
  }
  let text;
  if (capacity.value >= load.value) {
    text = `${at} the heat pump gives ${powerText(capacity, format)}, enough for the ${powerText(load, format)} the house needs.`;
  } else {
    const shortfall = `${at} the heat pump gives ${powerText(capacity, format).replace(/ (Btu\/h|kW)$/, '')} of the ${powerText(load, format)} the house needs`;
    text = option.balance_point && isNum(option.balance_point.value)
      ? `${shortfall}; below ${temperatureText(option.balance_point, units, format)} ${backup} helps.`
      : `${shortfall}; ${backup} helps whenever the house needs heat.`;
  }
  text += ` Below ${temperatureText(cut, units, format)} the compressor stops and ${backup} heats alone${assumedCut}.`;
  return text;
}

/**
 * Plain-word lines for what an option pays beside its fuel: its own electricity (blower, pumps,
 * burner motor) and the gas service kept for other appliances. [{key, value, text}] in the quote's currency.
 */
export function siteCostLines(option, { format, keptName = 'Gas service kept for other appliances' }) {
  const lines = [];
  if (isNum(option.auxiliary_kwh) && option.auxiliary_kwh > 0) {
    const kwh = `${format.number(option.auxiliary_kwh, 3)} kWh a year`;
    lines.push({ key: 'auxiliary_cost', value: option.auxiliary_cost,
      label: 'Blower and pump electricity',
      text: isNum(option.auxiliary_cost) && option.auxiliary_cost > 0 ? `${kwh}, ${format.money(option.auxiliary_cost)} a year` : `${kwh}, not priced` });
  }
  if (isNum(option.kept_services_cost) && option.kept_services_cost > 0) {
    lines.push({ key: 'kept_services_cost', value: option.kept_services_cost, label: keptName,
      text: `${format.money(option.kept_services_cost)} a year` });
  }
  return lines;
}

/** What the kept services are called on the verdict: the gas service, or services of several fuels. */
export function keptServicesName(ws, catalog) {
  const fuels = [...new Set((ws.fuels ?? []).filter((f) => f.keep_service).map(catalogFuel))];
  if (fuels.length === 1 && fuels[0] === 'natural-gas') return 'Gas service kept for other appliances';
  if (fuels.length === 1) return `${catalog?.fuels?.find((f) => f.id === fuels[0])?.name ?? 'Fuel'} service kept for other appliances`;
  return 'Services kept for other appliances';
}

/**
 * The system the bills belong to after an edit: the one they name while it is still the system in the house
 * now, else the one system marked as in the house now (bills are that system's by definition), else what
 * they named (possibly '' — the House tab then asks for it).
 */
export function billedSystemId(ws) {
  const named = ws.demand?.bills_option ?? '';
  const existing = (ws.systems ?? []).filter((s) => s.existing);
  if (named && existing.some((s) => s.id === named)) return named;
  return existing.length === 1 ? existing[0].id : named;
}

/**
 * The heat pump of a dual-fuel option added with `backupId` as its backup: a copy of the last candidate
 * air-source heat pump without a fuel-burning backup (the same unit from its data sheet, typed once), or
 * null when there is none. Changeover below a set temperature, as dual-fuel thermostats do (common practice).
 */
export function dualFuelSystem(ws, backupId) {
  const ids = new Set((ws.systems ?? []).map((s) => s.id));
  const template = [...(ws.systems ?? [])].reverse().find((s) => !s.existing && s.system?.kind === 'air-source-heat-pump'
    && (!s.system.backup || s.system.backup === 'electric-resistance' || !ids.has(s.system.backup)));
  if (!template) return null;
  const system = structuredClone(template.system);
  system.backup = backupId;
  system.changeover_mode = 'temperature';
  return { fuel_key: template.fuel_key, equipment: template.equipment, system };
}

/**
 * A card's efficiency after its catalog type is chosen or changes: a value typed in a rating the type is
 * rated in stays; otherwise the type's rating with no value, so the type's typical value shows as the
 * field's placeholder and is what the core uses — never a value the user did not type.
 */
export function efficiencyFor(efficiency, record) {
  if (record.ratings.includes(efficiency?.rating)) return { ...efficiency };
  return { rating: record.typical.rating };
}
