// Panel 3, heating systems: the existing system and the candidates, each with
// its fuel, kind, catalog record and nameplate rating; heat-pump data-sheet
// points and dual-fuel changeover; installed costs when the life-cycle view is on.
import { h } from '../dom.js';
import { checkField, numberField, radioField, selectField, textField } from '../fields.js';
import { FUEL_BURNING_KINDS, MODULATING, STAGES, auxiliaryDefault, cutoffOf, defaultCutoff, defaultRecord } from '../equipment.js';
import { formatInput } from '../format.js';
import { HEAT_PUMP_KINDS, RATINGS, SYSTEM_KINDS, fuelId } from '../scenario.js';
import { unitLabel } from '../units.js';
import { fuelName } from './fuels.js';
import { waterHeaterFields } from './water-heater.js';

const TEMPS = ['degF', 'degC'];
const CAPACITY = ['Btu/h', 'kW', 'W'];
export const KIND_NAMES = {
  furnace: 'Furnace', boiler: 'Boiler', stove: 'Stove', 'electric-resistance': 'Electric resistance',
  'air-source-heat-pump': 'Air-source heat pump', 'ground-source-heat-pump': 'Ground-source heat pump',
};
const RATING_NAMES = {
  AFUE: 'AFUE %', thermal: 'thermal %', 'seasonal-gcv': 'seasonal % (gross)', 'seasonal-ncv': 'seasonal % (net)',
  COP: 'COP', SCOP: 'SCOP', HSPF: 'HSPF', HSPF2: 'HSPF2',
};

const isNum = (v) => typeof v === 'number' && Number.isFinite(v);
const hasMinimum = (point) => isNum(point?.min_capacity?.value) || isNum(point?.min_cop);

function heatPumpFields(ctx, ws, base, sys, index) {
  const modulating = MODULATING.includes(sys.stages);
  const rows = (sys.ratings ?? []).map((point, i) => {
    const p = `${base}/system/ratings/${i}`;
    const capacityUnit = point.capacity?.unit ?? 'Btu/h';
    return h('div', { class: 'row-card' },
      h('div', { class: 'grid three' },
        numberField(ctx, { label: `Point ${i + 1}: outdoor`, path: `${p}/outdoor/value`, value: point.outdoor?.value,
          unit: { path: `${p}/outdoor/unit`, value: point.outdoor?.unit ?? 'degF', choices: TEMPS } }),
        numberField(ctx, { label: modulating ? 'Maximum capacity' : 'Capacity', path: `${p}/capacity/value`, value: point.capacity?.value,
          unit: { path: `${p}/capacity/unit`, value: capacityUnit, choices: CAPACITY } }),
        numberField(ctx, { label: modulating ? 'COP at maximum' : 'COP', path: `${p}/cop`, value: point.cop })),
      modulating ? h('div', { class: 'grid three minimum' },
        h('p', { class: 'hint', text: 'Lowest speed at this temperature (optional):' }),
        numberField(ctx, { label: 'Minimum capacity', path: `${p}/min_capacity/value`, value: point.min_capacity?.value,
          unit: { path: `${p}/min_capacity/unit`, value: point.min_capacity?.unit ?? capacityUnit, choices: CAPACITY } }),
        numberField(ctx, { label: 'COP at minimum', path: `${p}/min_cop`, value: point.min_cop })) : null,
      h('button', { type: 'button', class: 'quiet', dataset: { action: 'remove-rating', system: String(index), index: String(i) }, text: `Remove point ${i + 1}` }));
  });
  const others = ws.systems.filter((s, j) => j !== index).map((s) => [s.id, `${s.label || s.id}`]);
  const stages = sys.stages ?? 'single';
  const keptMinimum = !modulating && (sys.ratings ?? []).some(hasMinimum);
  const nodes = [
    radioField(ctx, { legend: 'Compressor', path: `${base}/system/stages`, value: stages, choices: STAGES }),
    h('p', { class: 'hint', text: modulating
      ? 'A two-stage or variable-speed unit runs slower when the house needs less heat. Give the lowest capacity and its COP where the data sheet has them; without them the calculation assumes a usual share of the maximum.'
      : 'A single-stage unit runs at full capacity and cycles on and off.' }),
    keptMinimum ? h('p', { class: 'notice', id: `stages-note-${index}`, text: 'The minimum capacities typed for this heat pump are kept but not used: a single-stage unit has one capacity. Choose two-stage or variable-speed to use them again.' }) : null,
    h('p', { class: 'hint', text: 'Data-sheet points, e.g. at 47, 17 and 5 °F. With them the heat pump is worked out over temperature bins.' }),
    h('div', { class: 'rows' }, rows),
    h('button', { type: 'button', class: 'secondary', dataset: { action: 'add-rating', system: String(index) }, text: 'Add a data-sheet point' }),
  ];
  if (!(sys.ratings ?? []).length) {
    nodes.push(numberField(ctx, { label: 'Capacity at 47 °F (optional)', path: `${base}/system/capacity/value`, value: sys.capacity?.value,
      unit: { path: `${base}/system/capacity/unit`, value: sys.capacity?.unit ?? 'Btu/h', choices: CAPACITY } }));
  }
  const cutoff = cutoffOf(sys, ws.settings.units);
  const assumed = formatInput(Math.round(defaultCutoff(sys.stages, cutoff.unit) * 10) / 10 || 0, ctx.locale);
  nodes.push(h('div', { class: 'grid two' },
    numberField(ctx, { label: 'Low-temperature cut-out (optional)', path: `${base}/system/cutoff/value`, value: sys.cutoff?.value,
      placeholder: assumed,
      hint: `Below it the compressor stops and the backup heats alone. Left empty: ${assumed} ${unitLabel(cutoff.unit)}, usual for a ${
        stages === 'variable' ? 'variable-speed' : stages === 'two' ? 'two-stage' : 'single-stage'} unit; the data sheet's figure is better.`,
      unit: { path: `${base}/system/cutoff/unit`, value: cutoff.unit, choices: TEMPS, structural: true } }),
    numberField(ctx, { label: 'Cycling coefficient Cd (optional)', path: `${base}/system/cd`, value: sys.cd })));
  nodes.push(selectField(ctx, { label: 'Backup heat', path: `${base}/system/backup`, value: sys.backup ?? '', structural: true,
    choices: [['', 'None'], ['electric-resistance', 'Electric resistance strips'], ...others.map(([id, label]) => [id, `${label} (dual fuel)`])] }));
  if (sys.backup && sys.backup !== 'electric-resistance') {
    nodes.push(radioField(ctx, { legend: 'Change over to the backup', path: `${base}/system/changeover_mode`, value: sys.changeover_mode ?? 'temperature',
      choices: [['temperature', 'Below a set temperature'], ['optimal', 'When it is cheaper (optimal)']] }));
    if ((sys.changeover_mode ?? 'temperature') === 'temperature') {
      nodes.push(numberField(ctx, { label: 'Changeover temperature', path: `${base}/system/changeover/value`, value: sys.changeover?.value,
        unit: { path: `${base}/system/changeover/unit`, value: sys.changeover?.unit ?? 'degF', choices: TEMPS } }));
    }
  }
  return h('details', { class: 'more', open: (sys.ratings ?? []).length > 0 || Boolean(sys.backup) || Boolean(sys.stages) },
    h('summary', { text: 'Heat-pump data sheet and backup' }), nodes);
}

const AUX_UNITS = [['kWh', 'kWh a year'], ['W', 'W while the burner runs']];
/** Fuels burned as gas, whose appliances the fuel gas code derates at altitude. */
const GAS_FUELS = ['natural-gas', 'propane'];

/** A furnace's, boiler's or stove's output capacity and its own electricity, with the catalog's default shown, not entered. */
function fuelBurningFields(ctx, ws, base, sys, entry) {
  const fallback = auxiliaryDefault(sys, typeof entry?.fuel === 'string' ? entry.fuel : '', ctx.catalog);
  const aux = sys.auxiliary_electricity ?? {};
  const unit = aux.unit ?? fallback?.unit ?? 'kWh';
  const what = { furnace: 'furnace', boiler: 'boiler', stove: 'stove' }[sys.kind] ?? 'system';
  const defaultText = fallback
    ? `Left empty: ${ctx.format.number(fallback.value, 4)} ${fallback.unit === 'W' ? 'W while the burner runs' : 'kWh a year'}, a typical ${
      KIND_NAMES[fallback.record.kind]?.toLowerCase() ?? what} (${fallback.record.variant}) from the catalog.`
    : `Left empty: none is counted for this ${what}.`;
  const meaning = unit === 'W'
    ? 'In W: the power of the circulator pump, fans and burner motor while the burner runs; it is counted for the hours the burner runs (from the output capacity, or the house\'s load).'
    : 'In kWh a year: a furnace\'s rated yearly electricity for its blower, draft fan and controls (the "Eae" figure in its efficiency listing).';
  const placeholder = fallback && fallback.unit === unit ? formatInput(fallback.value, ctx.locale) : fallback ? '' : '0';
  return h('div', { class: 'grid two equipment' },
    numberField(ctx, { label: 'Output capacity (optional)', path: `${base}/system/capacity/value`, value: sys.capacity?.value,
      unit: { path: `${base}/system/capacity/unit`, value: sys.capacity?.unit ?? (ws.settings.units === 'us' ? 'Btu/h' : 'kW'), choices: ['Btu/h', 'kW'] },
      hint: 'From the nameplate. Used to count the burner\'s hours and to compare its size with the house\'s load; the size itself is for a professional\'s load calculation.' }),
    numberField(ctx, { label: 'Its own electricity (optional)', path: `${base}/system/auxiliary_electricity/value`, value: aux.value,
      placeholder: placeholder || undefined,
      unit: { path: `${base}/system/auxiliary_electricity/unit`, value: unit, choices: AUX_UNITS, structural: true },
      hint: `${meaning} ${defaultText}` }),
    // at a site elevation a gas appliance's output is derated unless it is rated for altitude
    typeof ws.settings.elevation?.value === 'number' && GAS_FUELS.includes(typeof entry?.fuel === 'string' ? entry.fuel : '')
      ? checkField(ctx, { label: 'Rated for this altitude (no derating)', path: `${base}/system/altitude_rated`, checked: Boolean(sys.altitude_rated),
        hint: 'Tick it when the appliance\'s listing covers the site\'s elevation, as high-altitude models and kits do.' })
      : null);
}

function economicFields(ctx, ws, base, sys) {
  const currency = ws.settings.currency;
  // the life the core appraises over when none is typed: the catalog record's median service life
  const record = ctx.catalog.systemsById.get(sys.system?.catalog)
    ?? defaultRecord(sys.system ?? {}, fuelId(ws.fuels.find((f) => f.key === sys.fuel_key)), ctx.catalog)
    ?? ctx.catalog.systems.find((m) => m.kind === sys.system?.kind);
  const life = record?.service_life;
  return h('div', { class: 'economics' },
    h('div', { class: 'grid two' },
      sys.existing ? null : numberField(ctx, { label: 'Installed cost', path: `${base}/installed_cost`, value: sys.installed_cost, unit: currency }),
      sys.existing ? null : numberField(ctx, { label: 'Incentives and rebates', path: `${base}/incentives`, value: sys.incentives, unit: currency }),
      numberField(ctx, { label: 'Maintenance per year', path: `${base}/annual_maintenance`, value: sys.annual_maintenance, unit: currency }),
      numberField(ctx, { label: 'Expected life', path: `${base}/life_years`, value: sys.life_years, unit: 'years',
        placeholder: life ? String(life.years) : undefined,
        hint: life ? `Left empty: ${life.years} years, the usual (median) life of a ${KIND_NAMES[record.kind].toLowerCase()} (${record.variant}).` : undefined })));
}

function systemCard(ctx, ws, sys, index) {
  const { catalog } = ctx;
  const base = `/systems/${index}`;
  const entry = ws.fuels.find((f) => f.key === sys.fuel_key);
  const fid = fuelId(entry);
  const kind = sys.system?.kind ?? 'furnace';
  const models = catalog.systems.filter((m) => m.kind === kind && (!fid || typeof entry?.fuel === 'object' || m.fuels.includes(fid)));
  const model = catalog.systemsById.get(sys.system?.catalog);
  const ratings = model?.ratings ?? RATINGS;
  const typical = model?.typical;
  const typed = typeof sys.system?.efficiency?.value === 'number';
  const nodes = [
    h('div', { class: 'card-head' },
      h('h3', { text: sys.label || sys.id }),
      sys.existing ? h('span', { class: 'badge existing', text: 'in the house now' }) : null),
    checkField(ctx, { label: 'This is the system in the house now', path: `${base}/existing`, checked: sys.existing, structural: true }),
    h('div', { class: 'grid two' },
      textField(ctx, { label: 'Name on the quote', path: `${base}/label`, value: sys.label, maxlength: 120 }),
      textField(ctx, { label: 'Make and model (optional)', path: `${base}/equipment`, value: sys.equipment, maxlength: 160 }),
      selectField(ctx, { label: 'Fuel', path: `${base}/fuel_key`, value: sys.fuel_key ?? '', structural: true,
        choices: [['', 'Choose a fuel…'], ...ws.fuels.map((f) => [f.key, fuelName(f, catalog)])] }),
      selectField(ctx, { label: 'Kind', path: `${base}/system/kind`, value: kind, structural: true,
        choices: SYSTEM_KINDS.map((k) => [k, KIND_NAMES[k]]) }),
      selectField(ctx, { label: 'Catalog type', path: `${base}/system/catalog`, value: sys.system?.catalog ?? '', structural: true,
        choices: [['', 'None (rating below)'], ...models.map((m) => [m.id, `${KIND_NAMES[m.kind]}, ${m.variant}`])] })),
    h('div', { class: 'grid two' },
      numberField(ctx, { label: 'Rated efficiency', path: `${base}/system/efficiency/value`, value: sys.system?.efficiency?.value,
        placeholder: typical ? String(typical.value) : undefined,
        unit: { path: `${base}/system/efficiency/rating`, value: sys.system?.efficiency?.rating || typical?.rating || ratings[0],
          choices: ratings.map((r) => [r, RATING_NAMES[r] ?? r]) },
        hint: typical ? `${typed ? 'Typical' : 'Left empty: the typical'} ${typical.value} ${typical.rating}${typed ? '' : ' is used'}; minimum ${
          model.minimum?.value} ${model.minimum?.rating}.` : undefined }),
      h('div', { class: 'grid two tight' },
        numberField(ctx, { label: 'Duct or pipe loss', path: `${base}/system/distribution_loss`, value: sys.system?.distribution_loss, scale: 100, unit: '%' }),
        numberField(ctx, { label: 'Loss with age', path: `${base}/system/age_derating`, value: sys.system?.age_derating, scale: 100, unit: '%' }))),
  ];
  if (HEAT_PUMP_KINDS.includes(kind)) nodes.push(heatPumpFields(ctx, ws, base, sys.system ?? {}, index));
  if (FUEL_BURNING_KINDS.includes(kind)) nodes.push(fuelBurningFields(ctx, ws, base, sys.system ?? {}, entry));
  if (ws.demand.water_heating?.enabled) nodes.push(waterHeaterChoice(ctx, base, sys));
  if (ws.economics?.enabled) nodes.push(economicFields(ctx, ws, base, sys));
  nodes.push(h('div', { class: 'card-actions' },
    sys.existing ? null : h('button', { type: 'button', class: 'quiet', dataset: { action: 'equipment-keep', index: String(index) },
      'aria-label': `Keep ${sys.label || sys.id} in your equipment`, text: 'Keep in your equipment' }),
    h('button', { type: 'button', class: 'quiet', dataset: { action: 'duplicate-system', index: String(index) }, text: 'Duplicate' }),
    h('button', { type: 'button', class: 'quiet danger', dataset: { action: 'remove-system', index: String(index) }, text: 'Remove' })));
  return h('article', { class: 'card system-card', dataset: { field: base, systemId: sys.id } }, nodes);
}

/** What makes this option's hot water: the house's water heater (House tab) or one that comes with the option. */
function waterHeaterChoice(ctx, base, sys) {
  const own = sys.water_heater?.mode === 'own';
  // the core's message about the option's hot water as a whole (a boiler's tank with no boiler) shows here
  return h('fieldset', { class: 'group inner water-heater-choice field', dataset: { field: `${base}/water_heater` } },
    h('legend', { text: 'Hot water with this option' }),
    selectField(ctx, { label: 'Hot water made by', path: `${base}/water_heater/mode`, value: own ? 'own' : 'house', structural: true,
      choices: [['house', 'The water heater in the house now (House tab)'], ['own', 'A water heater that comes with this option']] }),
    own ? waterHeaterFields(ctx, `${base}/water_heater`, sys.water_heater, { boiler: sys.system?.kind === 'boiler' }) : null,
    h('p', { class: 'field-msg', hidden: true }));
}

/** The add menu's choice for a heat pump backed by the fuel-burning system in the house now (dual fuel in one step). */
export const DUAL_FUEL_CHOICE = 'air-source-heat-pump+existing-backup';

/** Renders the systems panel. */
export function renderSystems(container, ctx) {
  const ws = ctx.store.state;
  const existingBurner = ws.systems.find((sys) => sys.existing && FUEL_BURNING_KINDS.includes(sys.system?.kind));
  const e = ws.economics;
  const cards = ws.systems.map((sys, i) => systemCard(ctx, ws, sys, i));
  const add = h('div', { class: 'add-row' },
    h('label', { for: 'add-system-kind', text: 'Add a system' }),
    h('div', { class: 'with-unit' },
      h('select', { id: 'add-system-kind' }, SYSTEM_KINDS.map((k) => h('option', { value: k, text: KIND_NAMES[k] })),
        existingBurner ? h('option', { value: DUAL_FUEL_CHOICE, text: `Air-source heat pump, with ${existingBurner.label || existingBurner.id} as backup (dual fuel)` }) : null),
      h('button', { type: 'button', class: 'primary', dataset: { action: 'add-system' }, text: 'Add' })));
  const economics = h('fieldset', { class: 'group' }, h('legend', { text: 'Costs over the years' }),
    checkField(ctx, { label: 'Compare installed costs, payback and life-cycle cost', path: '/economics/enabled', checked: e.enabled, structural: true }),
    e.enabled ? h('div', { class: 'grid two' },
      numberField(ctx, { label: 'Years to compare', path: '/economics/analysis_years', value: e.analysis_years, unit: 'years' }),
      numberField(ctx, { label: 'Discount rate', path: '/economics/discount_rate', value: e.discount_rate, scale: 100, unit: '%' }),
      numberField(ctx, { label: 'Energy prices rise by', path: '/economics/escalation_default', value: e.escalation_default, scale: 100, unit: '% a year',
        hint: 'Each fuel\'s own rise can be set on its card (Fuels).' }),
      numberField(ctx, { label: 'Maintenance costs rise by (optional)', path: '/economics/maintenance_escalation', value: e.maintenance_escalation, scale: 100, unit: '% a year' }),
      numberField(ctx, { label: 'Loan offered: interest (optional)', path: '/quote/financing/rate', value: ws.quote?.financing?.rate, scale: 100, unit: '% a year',
        hint: 'With a term, the sheet shows each option\'s monthly payment on its net price.' }),
      numberField(ctx, { label: 'Loan term (optional)', path: '/quote/financing/years', value: ws.quote?.financing?.years, unit: 'years' }),
      selectField(ctx, { label: 'Money in', path: '/economics/basis', value: e.basis ?? 'real',
        choices: [['real', 'today\'s money (real)'], ['nominal', 'future money (nominal)']] })) : null);
  container.replaceChildren(...[
    ws.fuels.length ? null : h('p', { class: 'notice', text: 'Add a fuel with its local price first (Fuels tab).' }),
    // the equipment kept on this device: a node owned by web/template-shelf.js, placed here as it is
    h('div', { class: 'cards' }, cards), add, ctx.templateTools?.equipmentNode, economics].filter(Boolean));
}
