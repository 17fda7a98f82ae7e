// Scenario building: the workspace the page edits <-> the scenario document the
// core evaluates (fuelwright.scenario/1, data/schema/scenario.schema.json).
//
// The workspace keeps local fuel prices once per fuel (`fuels`) and the heating
// systems that burn them (`systems`); each system becomes one scenario option
// carrying its fuel's price. It also keeps the fields of every demand method and
// climate form, so switching the method picker loses nothing; only the chosen
// method's fields are sent. Every entered quantity keeps its own unit.
import { rowPath, rowsOfSchedule, scheduleOfRows } from './schedule.js';
import { FUEL_BURNING_KINDS, MODULATING, electricSystems } from './equipment.js';
import { unreadableVersionMessage } from './versions.js';

export const SCENARIO_FAMILY = 'fuelwright.scenario';
export const SCENARIO_VERSION = 1;
export const SCENARIO_SCHEMA = `${SCENARIO_FAMILY}/${SCENARIO_VERSION}`;
export const WORKSPACE_VERSION = 1;

/** Option fields that belong to the fuel and its price (kept in `fuels`). */
const FUEL_FIELDS = ['fuel', 'price', 'fixed_charges', 'heating_value', 'wood_species', 'moisture_pct', 'bag_mass',
  'face_cord_fraction'];
/** Option fields that belong to the system (kept in `systems`). */
/** Settings the page edits and writes itself; any other travels on unchanged. */
const SETTINGS_FIELDS = ['units', 'currency', 'gwp', 'electricity_co2e_kg_per_kwh', 'electricity', 'kept_services', 'elevation', 'gas_pressure_base'];
const SYSTEM_FIELDS = ['id', 'label', 'system', 'existing', 'installed_cost', 'incentives', 'annual_maintenance',
  'life_years', 'equipment'];
/** Text fields of the quote, printed on the sheet. */
const QUOTE_TEXT = ['customer', 'site', 'date', 'prepared_by', 'notes', 'number', 'valid_until', 'terms'];
const ECONOMIC_FIELDS = ['existing', 'installed_cost', 'incentives', 'annual_maintenance', 'life_years'];
export const HEAT_PUMP_KINDS = ['air-source-heat-pump', 'ground-source-heat-pump'];
export const SYSTEM_KINDS = ['furnace', 'boiler', 'stove', 'electric-resistance', 'air-source-heat-pump',
  'ground-source-heat-pump'];
/** A heat pump's compressor as `system.stages` spells it. */
export const STAGE_IDS = ['single', 'two', 'variable'];
export const RATINGS = ['AFUE', 'thermal', 'seasonal-gcv', 'seasonal-ncv', 'COP', 'SCOP', 'HSPF', 'HSPF2'];
export const DEMAND_METHODS = ['direct', 'heat-loss', 'bills'];
export const CLIMATE_MODES = ['none', 'monthly_mean', 'monthly_hdd', 'annual_hdd'];
/** How bill dates are read: a bill covers end - start days (meter reads, the default) or end - start + 1 (inclusive). */
export const BILL_DATES = ['meter-reads', 'inclusive'];

const clone = (value) => (value === undefined ? undefined : structuredClone(value));
const isQuantity = (q) => q && typeof q === 'object' && typeof q.value === 'number' && Number.isFinite(q.value) && q.unit;
const isNumber = (v) => typeof v === 'number' && Number.isFinite(v);
const isText = (v) => typeof v === 'string' && v.trim() !== '';

/** Today as YYYY-MM-DD in local time. */
export function today() {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

/** An empty workspace in the given unit system. */
export function blankWorkspace({ units = 'us', currency = 'USD' } = {}) {
  const us = units === 'us';
  return {
    version: WORKSPACE_VERSION,
    title: '',
    description: '',
    quote: { customer: '', site: '', date: today(), prepared_by: '', notes: '', number: '', valid_until: '', terms: '' },
    settings: { units, currency, gwp: 'AR5', energy_unit: us ? 'MMBtu' : 'kWh', paper: us ? 'letter' : 'a4',
      elevation: { unit: us ? 'ft' : 'm' }, gas_pressure_base_mode: '' },
    demand: {
      method: 'direct',
      annual_useful_heat: { unit: us ? 'MMBtu' : 'kWh' },
      ua_mode: 'ua',
      ua: { unit: us ? 'Btu/h/degF' : 'W/K' },
      design_heat_loss: { unit: us ? 'Btu/h' : 'kW' },
      indoor: { value: us ? 68 : 20, unit: us ? 'degF' : 'degC' },
      design_outdoor: { unit: us ? 'degF' : 'degC' },
      gains_mode: 'balance_point',
      balance_point: { unit: us ? 'degF' : 'degC' },
      internal_gains: { unit: us ? 'Btu/h' : 'W' },
      hot_water: { unit: us ? 'MMBtu' : 'kWh' },
      bills: [],
      bills_option: '',
      bill_dates: 'meter-reads',
    },
    climate: {
      mode: 'none',
      unit: us ? 'degF' : 'degC',
      monthly_mean: Array(12).fill(null),
      monthly_hdd: Array(12).fill(null),
      base: us ? { value: 65, unit: 'degF' } : { value: 18.3, unit: 'degC' },
      design_temperature: { unit: us ? 'degF' : 'degC' },
      leap_year: false,
    },
    fuels: [],
    systems: [],
    economics: { enabled: false, analysis_years: 15, discount_rate: 0.05, escalation_default: 0.02, basis: 'real' },
    uncertainty: { enabled: false, draws: 2000, seed: 1, form: 'lognormal' },
  };
}

/** The id a fuel entry's fuel goes by (catalog id or custom fuel id). */
export const fuelId = (entry) => (typeof entry?.fuel === 'string' ? entry.fuel : entry?.fuel?.id ?? '');

let keyCounter = 0;
/** A fuel-entry key not used in the workspace. */
export function newFuelKey(ws) {
  const used = new Set(ws.fuels.map((f) => f.key));
  let key;
  do key = `fuel-${(++keyCounter).toString(36)}`; while (used.has(key));
  return key;
}

/** An option id not used in the workspace, from a base like "furnace-natural-gas". */
export function uniqueSystemId(ws, base, except = null) {
  const clean = (base || 'option').toLowerCase().replace(/[^a-z0-9_.-]+/g, '-').replace(/^[^a-z0-9]+/, '').slice(0, 56) || 'option';
  const used = new Set(ws.systems.filter((s) => s !== except).map((s) => s.id));
  if (!used.has(clean)) return clean;
  for (let n = 2; ; n++) if (!used.has(`${clean}-${n}`)) return `${clean}-${n}`;
}

function quantity(q) {
  return isQuantity(q) ? { value: q.value, unit: q.unit } : undefined;
}

function put(target, key, value) {
  if (value !== undefined && value !== null && value !== '') target[key] = value;
}

function demandOf(d, ws) {
  const out = { method: d.method };
  if (d.method === 'direct') {
    put(out, 'annual_useful_heat', quantity(d.annual_useful_heat) ?? clone(d.annual_useful_heat));
    put(out, 'balance_point', quantity(d.balance_point));
  } else if (d.method === 'heat-loss') {
    if (d.ua_mode === 'design') {
      put(out, 'design_heat_loss', quantity(d.design_heat_loss));
      put(out, 'indoor', quantity(d.indoor));
      put(out, 'design_outdoor', quantity(d.design_outdoor));
    } else {
      put(out, 'ua', quantity(d.ua));
      put(out, 'indoor', quantity(d.indoor));
    }
    if (d.gains_mode === 'internal_gains') put(out, 'internal_gains', quantity(d.internal_gains));
    else put(out, 'balance_point', quantity(d.balance_point));
    if (isNumber(d.degree_day_correction)) out.degree_day_correction = d.degree_day_correction;
    put(out, 'hot_water', quantity(d.hot_water));
  } else if (d.method === 'bills') {
    out.bills = (d.bills ?? []).map((b) => {
      const bill = {};
      put(bill, 'start', b.start);
      put(bill, 'end', b.end);
      if (isNumber(b.quantity)) bill.quantity = b.quantity;
      put(bill, 'unit', b.unit);
      put(bill, 'mean_temperature', quantity(b.mean_temperature));
      // fields of an imported bill this page does not edit travel on unchanged
      for (const [key, value] of Object.entries(b)) if (!BILL_FIELDS.includes(key)) bill[key] = clone(value);
      return bill;
    });
    // sent as chosen (a value the core does not know comes back as an error at the choice); a quote
    // saved or imported without the rule sends none, so the core keeps its old meaning (inclusive
    // unless two bills share a day)
    put(out, 'bill_dates', d.bill_dates);
    if (d.observed && typeof d.observed === 'object') out.observed = clone(d.observed);
    if (d.bills_fuel !== undefined || d.bills_system !== undefined) {
      put(out, 'fuel', clone(d.bills_fuel));
      put(out, 'system', clone(d.bills_system));
    } else {
      put(out, 'option', d.bills_option);
    }
    put(out, 'balance_point', quantity(d.balance_point));
  }
  if (d.water_heating?.enabled) {
    // hot water as its own service replaces the older yearly figure
    delete out.hot_water;
    out.water_heating = waterHeatingOf(d.water_heating, ws);
  }
  for (const [key, value] of Object.entries(d.extra ?? {})) if (!(key in out)) out[key] = clone(value);
  return out;
}

/** Water heaters the house's boiler heats (no fuel or rating of their own). */
export const BOILER_WATER_HEATERS = ['indirect', 'combi'];

/**
 * A water heater as the core reads it ({kind, fuel, uef, location, standby_loss}) from its workspace form; with
 * `ws`, a fuel no system burns is priced by its card on the Fuels tab (a propane tank kept for the water heater alone).
 */
export function waterHeaterOf(heater, ws) {
  const out = {};
  put(out, 'kind', heater?.kind || undefined);
  if (!BOILER_WATER_HEATERS.includes(heater?.kind)) {
    // a heat-pump water heater runs on electricity alone: that is its fuel until another is chosen
    put(out, 'fuel', heater?.fuel || (heater?.kind === 'heat-pump-water-heater' ? 'electricity' : undefined));
    if (isNumber(heater?.uef)) out.uef = heater.uef;
    else if (isNumber(heater?.efficiency?.value)) out.efficiency = { value: heater.efficiency.value, rating: heater.efficiency.rating ?? 'UEF' };
    else out.uef = null;  // the core asks for it at its field
  }
  put(out, 'location', heater?.location || undefined);
  if (heater?.kind === 'indirect') put(out, 'standby_loss', quantity(heater.standby_loss));
  const entry = ws && out.fuel ? ws.fuels.find((f) => fuelId(f) === out.fuel) : null;
  const burned = entry && ws.systems.some((sys) => fuelId(ws.fuels.find((f) => f.key === sys.fuel_key)) === out.fuel);
  if (entry && !burned && isNumber(entry.price?.amount) && entry.price.per) {
    out.price = { amount: entry.price.amount, per: entry.price.per };
    const charges = (entry.fixed_charges ?? []).map(fixedChargeOf).filter((c) => 'amount_per_month' in c || 'amount_per_year' in c);
    if (charges.length) out.fixed_charges = charges;
  }
  return out;
}

/** `demand.water_heating` of the House tab's hot-water section: the heat (by people or a yearly amount) and the house's heater. */
function waterHeatingOf(w, ws) {
  const out = {};
  if (w.mode === 'annual') {
    out.annual_heat = quantity(w.annual_heat) ?? { value: null, unit: w.annual_heat?.unit ?? 'kWh' };
  } else {
    out.people = isNumber(w.people) ? w.people : null;
    put(out, 'volume_per_person_day', quantity(w.volume_per_person_day));
    put(out, 'temperature_rise', quantity(w.temperature_rise));
  }
  if (w.heater?.kind) out.heater = waterHeaterOf(w.heater, ws);
  return out;
}

/** Bill fields the page edits; any other field of an imported bill is kept as it came. */
const BILL_FIELDS = ['start', 'end', 'quantity', 'unit', 'mean_temperature'];

const twelve = (list) => (Array.isArray(list) && list.length === 12 && list.every(isNumber) ? [...list] : undefined);

/**
 * The scenario's climate object of a workspace climate (null for mode 'none'). Every field the page
 * shows is sent in every form: the design temperature and the daily range (optional with monthly
 * data), the day-to-day spread of imported monthly means and the bins of an hourly weather file.
 */
export function climateToScenario(c) {
  if (!c || c.mode === 'none' || !CLIMATE_MODES.includes(c.mode)) return null;
  const out = {};
  if (c.mode === 'monthly_mean') {
    out.monthly_mean = twelve(c.monthly_mean) ?? (c.monthly_mean ?? []).map((v) => (isNumber(v) ? v : null));
    out.unit = c.unit;
    if (Array.isArray(c.monthly_sd)) out.monthly_sd = twelve(c.monthly_sd) ?? clone(c.monthly_sd);
  } else if (c.mode === 'monthly_hdd') {
    out.monthly_hdd = twelve(c.monthly_hdd) ?? (c.monthly_hdd ?? []).map((v) => (isNumber(v) ? v : null));
    out.unit = c.unit;
  } else if (c.mode === 'annual_hdd') {
    if (isNumber(c.annual_hdd)) out.annual_hdd = c.annual_hdd;
    out.unit = c.unit;
  }
  put(out, 'design_temperature', quantity(c.design_temperature));
  if (isNumber(c.daily_range)) out.daily_range = c.daily_range;
  if (Array.isArray(c.bins) && c.bins.length) {
    out.bins = clone(c.bins);
    if (c.bin_width !== undefined) out.bin_width = c.bin_width;
  }
  put(out, 'base', quantity(c.base));
  if (c.leap_year) out.leap_year = true;
  for (const [key, value] of Object.entries(c.extra ?? {})) if (!(key in out)) out[key] = clone(value);
  return out;
}

/** Climate fields the workspace keeps by name; any other field of an imported climate is kept in `extra`. */
const CLIMATE_KNOWN = ['monthly_mean', 'monthly_hdd', 'monthly_sd', 'annual_hdd', 'unit', 'base', 'design_temperature',
  'daily_range', 'leap_year', 'bins', 'bin_width'];

/**
 * The workspace climate of a scenario climate object (an imported file, a weather file's answer, a
 * climate kept on the device), in a workspace of unit system `units`. The climate keeps its own unit.
 */
export function climateFromScenario(c, { units = 'us', label } = {}) {
  const wc = blankWorkspace({ units }).climate;
  if (!c || typeof c !== 'object') return wc;
  wc.mode = c.monthly_mean ? 'monthly_mean' : c.monthly_hdd ? 'monthly_hdd' : c.annual_hdd !== undefined ? 'annual_hdd' : 'monthly_mean';
  if (c.unit) wc.unit = c.unit;
  // without a base the core uses 65 degF or 18.3 degC by the climate's unit: shown and kept as exactly that
  if (c.base === undefined && (c.unit === 'degF' || c.unit === 'degC')) {
    wc.base = c.unit === 'degF' ? { value: 65, unit: 'degF' } : { value: 18.3, unit: 'degC' };
  }
  if (c.monthly_mean) wc.monthly_mean = clone(c.monthly_mean);
  if (c.monthly_hdd) wc.monthly_hdd = clone(c.monthly_hdd);
  if (c.monthly_sd) wc.monthly_sd = clone(c.monthly_sd);
  if (c.annual_hdd !== undefined) wc.annual_hdd = c.annual_hdd;
  for (const key of ['base', 'design_temperature', 'daily_range', 'bins', 'bin_width']) if (c[key] !== undefined) wc[key] = clone(c[key]);
  if (wc.daily_range && typeof wc.daily_range === 'object') wc.daily_range = wc.daily_range.value;
  if (!wc.design_temperature || typeof wc.design_temperature !== 'object') wc.design_temperature = { unit: wc.unit };
  wc.leap_year = Boolean(c.leap_year);
  const extra = Object.fromEntries(Object.entries(c).filter(([key]) => !CLIMATE_KNOWN.includes(key)));
  if (Object.keys(extra).length) wc.extra = clone(extra);
  if (typeof label === 'string' && label) wc.label = label;
  return wc;
}

/**
 * A workspace system's scenario `system` object. A heat pump sends its compressor (`stages`) when one is
 * chosen, and the minimum capacity and its COP of a data-sheet point only for a two-stage or variable-speed
 * compressor (a single-stage card keeps them, unsent, and says so); a furnace, boiler or stove sends its
 * output `capacity` and its own electricity (`auxiliary_electricity`) when typed.
 */
function systemOf(sys) {
  const out = { kind: sys.kind };
  put(out, 'catalog', sys.catalog || undefined);
  if (isNumber(sys.efficiency?.value)) out.efficiency = { value: sys.efficiency.value, rating: sys.efficiency.rating };
  if (isNumber(sys.distribution_loss)) out.distribution_loss = sys.distribution_loss;
  if (isNumber(sys.age_derating)) out.age_derating = sys.age_derating;
  if (HEAT_PUMP_KINDS.includes(sys.kind)) {
    const modulating = MODULATING.includes(sys.stages);
    const ratings = (sys.ratings ?? [])
      .filter((r) => r && (isQuantity(r.outdoor) || isQuantity(r.capacity) || isNumber(r.cop)
        || (modulating && (isQuantity(r.min_capacity) || isNumber(r.min_cop)))))
      .map((r) => {
        const point = {};
        put(point, 'outdoor', quantity(r.outdoor));
        put(point, 'capacity', quantity(r.capacity));
        if (isNumber(r.cop)) point.cop = r.cop;
        if (modulating) {
          // either one alone is sent, so the core says at the other field that it is needed too
          put(point, 'min_capacity', quantity(r.min_capacity));
          if (isNumber(r.min_cop)) point.min_cop = r.min_cop;
        }
        return point;
      });
    put(out, 'stages', STAGE_IDS.includes(sys.stages) ? sys.stages : undefined);
    if (ratings.length) out.ratings = ratings;
    put(out, 'cutoff', quantity(sys.cutoff));
    if (isNumber(sys.cd)) out.cd = sys.cd;
    put(out, 'backup', sys.backup || undefined);
    if (sys.changeover_mode === 'optimal') out.changeover = 'optimal';
    else put(out, 'changeover', quantity(sys.changeover));
    if (!ratings.length) put(out, 'capacity', quantity(sys.capacity));
  }
  if (FUEL_BURNING_KINDS.includes(sys.kind)) {
    put(out, 'capacity', quantity(sys.capacity));
    const aux = sys.auxiliary_electricity;
    if (isNumber(aux?.value)) out.auxiliary_electricity = { value: aux.value, unit: aux.unit ?? 'kWh' };
  }
  for (const [key, value] of Object.entries(sys.extra ?? {})) if (!(key in out)) out[key] = clone(value);
  return out;
}

function tiersOf(tiers) {
  return tiers.map((t) => {
    const tier = { from: t.from };
    if (isNumber(t.to)) tier.to = t.to;
    tier.amount = t.amount;
    return tier;
  });
}

function fixedChargeOf(charge) {
  const out = {};
  put(out, 'label', isText(charge.label) ? charge.label : undefined);
  if (isNumber(charge.amount_per_month)) out.amount_per_month = charge.amount_per_month;
  else if (isNumber(charge.amount_per_year)) out.amount_per_year = charge.amount_per_year;
  return out;
}

function customFuelOf(fuel) {
  const out = {};
  for (const [key, value] of Object.entries(fuel)) {
    if (key === 'kind') continue;
    if (value === '' || value === null || value === undefined) continue;
    if (typeof value === 'number' && !Number.isFinite(value)) continue;
    out[key] = clone(value);
  }
  // exactly one composition, the one picked
  const kind = fuel.kind ?? (fuel.formula ? 'formula' : fuel.mixture ? 'mixture' : 'ultimate');
  const drop = {
    formula: ['mixture', 'fractions', 'normalise', 'ultimate', 'moisture', 'basis'],
    mixture: ['formula', 'phase', 'dhf_kj_per_mol', 'hhv_kj_per_mol', 'ultimate', 'moisture', 'basis'],
    ultimate: ['formula', 'phase', 'dhf_kj_per_mol', 'hhv_kj_per_mol', 'mixture', 'fractions', 'normalise'],
  }[kind] ?? [];
  for (const key of drop) delete out[key];
  if (out.normalise === false) delete out.normalise;
  return out;
}

/**
 * The site's electricity for what fuel-burning systems use themselves (`settings.electricity`): the price
 * typed for it only when no system runs on electricity (otherwise the core prices it as the first
 * electricity option's kWh; the typed price is kept and used again once there is none); any other field
 * of an imported one (its fixed charges) as it came.
 */
function electricityOf(ws) {
  const e = ws.settings?.electricity;
  if (!e || typeof e !== 'object') return undefined;
  const out = {};
  for (const [key, value] of Object.entries(e)) if (key !== 'price') out[key] = clone(value);
  if (isNumber(e.price?.amount) && !electricSystems(ws).length) out.price = { amount: e.price.amount, per: 'kWh' };
  else if (Array.isArray(e.price?.schedule) && !electricSystems(ws).length) out.price = clone(e.price);
  return Object.keys(out).length ? out : undefined;
}

/**
 * `settings.kept_services` of the fuel entries ticked as kept for other appliances (the gas service for a
 * range and a water heater): each with the entry's fixed charges, once per fuel.
 */
function keptServicesOf(ws) {
  const out = [];
  for (const entry of ws.fuels ?? []) {
    const id = typeof entry.fuel === 'string' ? entry.fuel : '';
    if (!entry.keep_service || !id || out.some((k) => k.fuel === id)) continue;
    const service = { fuel: id };
    put(service, 'label', isText(entry.keep_service_label) ? entry.keep_service_label : undefined);
    service.fixed_charges = (entry.fixed_charges ?? []).map(fixedChargeOf).filter((c) => 'amount_per_month' in c || 'amount_per_year' in c);
    out.push(service);
  }
  return out;
}

/** The fuel half of an option (fuel, price, fixed charges, heating value and the wood details) of a fuel entry. */
function fuelPartOf(entry) {
  const option = {};
  option.fuel = typeof entry.fuel === 'string' ? entry.fuel : customFuelOf(entry.fuel);
  option.price = { amount: entry.price?.amount, per: entry.price?.per };
  if (!isNumber(option.price.amount)) delete option.price.amount;
  if (Array.isArray(entry.price?.tiers) && entry.price.tiers.length) option.price.tiers = tiersOf(entry.price.tiers);
  // electricity by time of use: the rows' schedule instead of one price
  if (entry.price?.time_of_use) option.price = { per: 'kWh', schedule: scheduleOfRows(entry.price.schedule) };
  const charges = (entry.fixed_charges ?? []).map(fixedChargeOf).filter((c) => 'amount_per_month' in c || 'amount_per_year' in c);
  if (charges.length) option.fixed_charges = charges;
  if (isNumber(entry.heating_value?.value)) {
    option.heating_value = { value: entry.heating_value.value, unit: entry.heating_value.unit };
    put(option.heating_value, 'basis', entry.heating_value.basis);
  }
  const fid = fuelId(entry);
  if (fid === 'cordwood') {
    put(option, 'wood_species', entry.wood_species || undefined);
    if (isNumber(entry.face_cord_fraction)) option.face_cord_fraction = entry.face_cord_fraction;
  }
  if (fid === 'cordwood' || fid === 'wood-pellets') {
    if (isNumber(entry.moisture_pct)) option.moisture_pct = entry.moisture_pct;
  }
  if (fid === 'wood-pellets' && option.price.per === 'bag') put(option, 'bag_mass', quantity(entry.bag_mass));
  return option;
}

/** Builds the scenario document of a workspace (what is exported, evaluated and saved). */
export function toScenario(ws) {
  const doc = { schema: SCENARIO_SCHEMA };
  put(doc, 'title', isText(ws.title) ? ws.title : undefined);
  put(doc, 'description', isText(ws.description) ? ws.description : undefined);
  const quote = {};
  for (const key of QUOTE_TEXT) {
    if (isText(ws.quote?.[key])) quote[key] = ws.quote[key];
  }
  const company = Object.fromEntries(Object.entries(ws.quote?.company ?? {}).filter(([, v]) => isText(v)));
  if (Object.keys(company).length) quote.company = company;
  const financing = {};
  if (isNumber(ws.quote?.financing?.rate)) financing.rate = ws.quote.financing.rate;
  if (isNumber(ws.quote?.financing?.years)) financing.years = ws.quote.financing.years;
  if (Object.keys(financing).length) quote.financing = financing;
  if (Object.keys(quote).length) doc.quote = quote;
  const settings = { units: ws.settings.units, currency: ws.settings.currency };
  put(settings, 'gwp', ws.settings.gwp);
  if (isNumber(ws.settings.electricity_co2e_kg_per_kwh)) settings.electricity_co2e_kg_per_kwh = ws.settings.electricity_co2e_kg_per_kwh;
  put(settings, 'electricity', electricityOf(ws));
  const kept = keptServicesOf(ws);
  if (kept.length) settings.kept_services = kept;
  if (isNumber(ws.settings.elevation?.value)) settings.elevation = { value: ws.settings.elevation.value, unit: ws.settings.elevation.unit };
  // the gas meter's pressure base: the site's air pressure, or one given in an imported quote (else the utility's standard)
  if (ws.settings.gas_pressure_base_mode === 'site') settings.gas_pressure_base = 'site';
  else if (ws.settings.gas_pressure_base_mode === 'given' && ws.settings.gas_pressure_base_given) settings.gas_pressure_base = clone(ws.settings.gas_pressure_base_given);
  // settings of an imported quote this page does not edit travel on unchanged
  for (const [key, value] of Object.entries(ws.settings.extra ?? {})) if (!(key in settings)) settings[key] = clone(value);
  doc.settings = settings;
  doc.demand = demandOf(ws.demand, ws);
  const climate = climateToScenario(ws.climate);
  if (climate) doc.climate = climate;

  const fuels = new Map(ws.fuels.map((f) => [f.key, f]));
  doc.options = ws.systems.map((sys) => {
    const entry = fuels.get(sys.fuel_key);
    const option = { id: sys.id };
    put(option, 'label', isText(sys.label) ? sys.label : undefined);
    if (entry) Object.assign(option, fuelPartOf(entry));
    option.system = systemOf(sys.system ?? {});
    if (ws.demand.water_heating?.enabled && sys.water_heater?.mode === 'own') option.water_heater = waterHeaterOf(sys.water_heater, ws);
    put(option, 'equipment', isText(sys.equipment) ? sys.equipment : undefined);
    // the system in the house now is the baseline of every saving, with or without the costs over the years
    if (sys.existing) option.existing = true;
    if (ws.economics?.enabled) for (const key of ECONOMIC_FIELDS.slice(1)) if (isNumber(sys[key])) option[key] = sys[key];
    for (const [key, value] of Object.entries(sys.extra ?? {})) if (!(key in option)) option[key] = clone(value);
    return option;
  });

  if (ws.economics?.enabled && ws.economics.emit !== false) {
    const e = ws.economics;
    const economics = {};
    if (isNumber(e.analysis_years)) economics.analysis_years = e.analysis_years;
    if (isNumber(e.discount_rate)) economics.discount_rate = e.discount_rate;
    const escalation = {};
    if (isNumber(e.escalation_default)) escalation.default = e.escalation_default;
    for (const entry of ws.fuels) {
      const id = fuelId(entry);
      if (id && isNumber(entry.escalation) && !(id in escalation)) escalation[id] = entry.escalation;
    }
    if (Object.keys(escalation).length) economics.escalation = escalation;
    if (isNumber(e.maintenance_escalation)) economics.maintenance_escalation = e.maintenance_escalation;
    put(economics, 'basis', e.basis);
    doc.economics = economics;
  }
  if (ws.uncertainty?.enabled) {
    const u = ws.uncertainty;
    const uncertainty = {};
    if (isNumber(u.draws)) uncertainty.draws = u.draws;
    if (isNumber(u.seed)) uncertainty.seed = u.seed;
    put(uncertainty, 'form', u.form === 'triangular' || u.form === 'lognormal' ? u.form : undefined);
    const spread = {};
    if (isNumber(u.spread_default)) spread.default = u.spread_default;
    for (const entry of ws.fuels) {
      const id = fuelId(entry);
      if (id && isNumber(entry.spread) && !(id in spread)) spread[id] = entry.spread;
    }
    if (Object.keys(spread).length) uncertainty.spread = spread;
    doc.uncertainty = uncertainty;
  }
  return doc;
}

/** The scenario without its Monte Carlo (what the verdict, the charts and the break-even analyses evaluate). */
export function withoutUncertainty(doc) {
  if (!doc || !('uncertainty' in doc)) return doc;
  const { uncertainty, ...rest } = doc;
  return rest;
}

/**
 * The workspace path of the field a scenario path (an error's `path`) points at,
 * e.g. "/options/1/price/amount" -> "/fuels/0/price/amount".
 */
export function workspacePath(path, ws) {
  const parts = path.split('/');
  if (parts[1] === 'options' && /^\d+$/.test(parts[2] ?? '')) {
    const index = Number(parts[2]);
    const sys = ws.systems[index];
    if (!sys) return '/systems';
    const field = parts[3];
    if (field === undefined) return `/systems/${index}`;
    if (FUEL_FIELDS.includes(field)) {
      const fi = ws.fuels.findIndex((f) => f.key === sys.fuel_key);
      if (fi < 0) return `/systems/${index}/fuel_key`;
      if (parts[3] === 'price' && parts[4] === 'schedule' && /^\d+$/.test(parts[5] ?? '')) {
        return `/fuels/${fi}/price/schedule/${rowPath(ws.fuels[fi].price?.schedule, Number(parts[5]), parts.slice(6))}`;
      }
      return [`/fuels/${fi}`, ...parts.slice(3)].join('/');
    }
    if (field === 'system' && parts[4] === 'changeover') return `/systems/${index}/system/changeover`;
    return [`/systems/${index}`, ...parts.slice(3)].join('/');
  }
  if (parts[1] === 'economics' && parts[2] === 'escalation') {
    if (parts[3] === 'default' || parts[3] === undefined) return '/economics/escalation_default';
    const fi = ws.fuels.findIndex((f) => fuelId(f) === parts[3]);
    return fi >= 0 ? `/fuels/${fi}/escalation` : '/economics';
  }
  if (parts[1] === 'uncertainty' && parts[2] === 'spread') {
    const fi = ws.fuels.findIndex((f) => fuelId(f) === parts[3]);
    return fi >= 0 ? `/fuels/${fi}/spread` : '/uncertainty';
  }
  if (parts[1] === 'demand' && parts[2] === 'option') return '/demand/bills_option';
  if (path.startsWith('/settings/gas_pressure_base')) return '/settings/gas_pressure_base_mode';
  // a climate the method needs is asked for at the choice of climate
  if (path === '/climate') return '/climate/mode';
  // the core asks for ua or a design heat loss at /demand/ua; the page shows the one the user chose
  if (path === '/demand/ua' && ws.demand?.ua_mode === 'design') return '/demand/design_heat_loss';
  return path;
}

function splitOption(option) {
  const fuelPart = {};
  const systemPart = {};
  const extra = {};
  for (const [key, value] of Object.entries(option)) {
    if (FUEL_FIELDS.includes(key)) fuelPart[key] = clone(value);
    else if (SYSTEM_FIELDS.includes(key)) systemPart[key] = clone(value);
    else extra[key] = clone(value);
  }
  return { fuelPart, systemPart, extra };
}

function systemFromScenario(sys = {}) {
  const known = ['kind', 'catalog', 'efficiency', 'distribution_loss', 'age_derating', 'ratings', 'cutoff', 'cd',
    'backup', 'changeover', 'capacity', 'stages', 'auxiliary_electricity'];
  const out = { kind: sys.kind ?? 'furnace', catalog: sys.catalog ?? '', efficiency: clone(sys.efficiency) ?? { rating: '' } };
  for (const key of ['distribution_loss', 'age_derating', 'cutoff', 'cd', 'backup', 'capacity', 'stages', 'auxiliary_electricity']) {
    if (sys[key] !== undefined) out[key] = clone(sys[key]);
  }
  out.ratings = clone(sys.ratings) ?? [];
  if (sys.changeover === 'optimal') out.changeover_mode = 'optimal';
  else if (sys.changeover !== undefined) {
    out.changeover_mode = 'temperature';
    out.changeover = clone(sys.changeover);
  }
  const extra = Object.fromEntries(Object.entries(sys).filter(([key]) => !known.includes(key)));
  if (Object.keys(extra).length) out.extra = clone(extra);
  return out;
}

/**
 * Ticks the fuel entry of each kept service whose fixed charges are the service's; a service whose
 * charges no entry of its fuel has gets an entry of its own (no system burns it), so that it shows on
 * the Fuels tab and is sent as it came.
 */
function keptServicesFromScenario(ws, kept) {
  if (!Array.isArray(kept)) return;
  for (const service of kept) {
    if (!service || typeof service !== 'object') continue;
    const charges = JSON.stringify(service.fixed_charges ?? []);
    let entry = ws.fuels.find((f) => f.fuel === service.fuel && !f.keep_service && JSON.stringify(f.fixed_charges ?? []) === charges);
    if (!entry) {
      entry = { key: newFuelKey(ws), fuel: service.fuel ?? '', price: { per: '' }, fixed_charges: clone(service.fixed_charges) ?? [] };
      ws.fuels.push(entry);
    }
    entry.keep_service = true;
    if (service.label !== undefined) entry.keep_service_label = service.label;
  }
}

/** Builds a workspace from a scenario document (an imported file or an example). */
/** A fuel entry of the workspace from the fuel half of an option (or an entry of `other_fuels`). */
function fuelEntryOf(ws, fuelPart) {
  const entry = {
    key: newFuelKey(ws),
    fuel: typeof fuelPart.fuel === 'object' && fuelPart.fuel
      ? { kind: fuelPart.fuel.formula !== undefined ? 'formula' : fuelPart.fuel.mixture !== undefined ? 'mixture' : 'ultimate', ...fuelPart.fuel }
      : fuelPart.fuel ?? '',
    price: fuelPart.price ?? { per: '' },
    fixed_charges: fuelPart.fixed_charges ?? [],
  };
  if (Array.isArray(entry.price.schedule)) entry.price = { per: 'kWh', time_of_use: true, schedule: rowsOfSchedule(entry.price.schedule) };
  for (const key of ['heating_value', 'wood_species', 'moisture_pct', 'bag_mass', 'face_cord_fraction']) {
    if (fuelPart[key] !== undefined) entry[key] = fuelPart[key];
  }
  return entry;
}

/**
 * The quote file the page exports: the scenario, every fuel entered (those no option uses as
 * `other_fuels`) and, when `result` answers this scenario, a `results` summary of the verdict
 * (full precision, for other programs; the core does not read it back).
 */
export function exportDocument(ws, result) {
  const doc = toScenario(ws);
  const used = new Set(ws.systems.map((s) => s.fuel_key));
  const other = ws.fuels.filter((f) => !used.has(f.key)).map(fuelPartOf);
  if (other.length) doc.other_fuels = other;
  const results = resultsSummaryOf(result);
  if (results) doc.results = results;
  return doc;
}

/** The verdict as an export carries it: the core's ranking with each option's yearly figures, or null. */
export function resultsSummaryOf(result) {
  if (!result || result.errors?.length || !Array.isArray(result.options) || !result.ranking?.length) return null;
  const byId = new Map(result.options.map((o) => [o.id, o]));
  const keys = ['annual_cost', 'energy_cost', 'fixed_cost', 'cost_per_useful_kwh', 'fuel_quantity', 'backup_fuel_quantity', 'co2e_kg',
    'net_installed_cost', 'annual_saving', 'simple_payback_years', 'discounted_payback_years', 'npv', 'life_cycle_cost', 'lcoh_per_kwh'];
  return {
    currency: result.settings?.currency ?? '',
    useful_heat_kwh: result.options[0]?.useful_heat_kwh,
    ranking: result.ranking.map(({ id }) => {
      const o = byId.get(id) ?? {};
      const row = { id, label: o.label || id };
      for (const key of keys) if (o[key] !== undefined && o[key] !== null) row[key] = clone(o[key]);
      return row;
    }),
  };
}

export function fromScenario(doc) {
  if (!doc || typeof doc !== 'object' || doc.schema !== SCENARIO_SCHEMA) {
    if (typeof doc?.schema === 'string' && doc.schema.startsWith(`${SCENARIO_FAMILY}/`)) {
      throw new Error(unreadableVersionMessage(doc.schema, { family: SCENARIO_FAMILY, newest: SCENARIO_VERSION, what: 'scenarios', field: 'schema' }));
    }
    throw new Error(`not a Fuelwright scenario: "schema" must be "${SCENARIO_SCHEMA}"`);
  }
  if (!Array.isArray(doc.options)) throw new Error('the scenario has no "options" list');
  const settings = doc.settings ?? {};
  const ws = blankWorkspace({ units: settings.units === 'metric' ? 'metric' : 'us', currency: settings.currency ?? 'USD' });
  ws.title = doc.title ?? '';
  ws.description = doc.description ?? '';
  ws.quote = { ...ws.quote, date: '', ...(doc.quote ?? {}) };
  ws.settings.gwp = settings.gwp;
  if (settings.electricity_co2e_kg_per_kwh !== undefined) ws.settings.electricity_co2e_kg_per_kwh = settings.electricity_co2e_kg_per_kwh;
  if (settings.electricity && typeof settings.electricity === 'object') ws.settings.electricity = clone(settings.electricity);
  if (settings.elevation && typeof settings.elevation === 'object') ws.settings.elevation = clone(settings.elevation);
  if (settings.gas_pressure_base === 'site') ws.settings.gas_pressure_base_mode = 'site';
  else if (settings.gas_pressure_base !== undefined) {
    ws.settings.gas_pressure_base_mode = 'given';
    ws.settings.gas_pressure_base_given = clone(settings.gas_pressure_base);
  }
  const extra = Object.fromEntries(Object.entries(settings).filter(([key]) => !SETTINGS_FIELDS.includes(key)).map(([k, v]) => [k, clone(v)]));
  if (Object.keys(extra).length) ws.settings.extra = extra;

  const d = doc.demand ?? { method: 'direct' };
  const wd = ws.demand;
  wd.method = d.method ?? 'direct';
  const demandKnown = ['method', 'annual_useful_heat', 'balance_point', 'ua', 'design_heat_loss', 'indoor', 'design_outdoor',
    'internal_gains', 'degree_day_correction', 'hot_water', 'bills', 'option', 'fuel', 'system', 'bill_dates', 'observed', 'water_heating'];
  for (const key of ['annual_useful_heat', 'balance_point', 'ua', 'design_heat_loss', 'indoor', 'design_outdoor',
    'internal_gains', 'hot_water']) {
    if (d[key] !== undefined) wd[key] = clone(d[key]);
  }
  if (d.design_heat_loss !== undefined && d.ua === undefined) wd.ua_mode = 'design';
  if (d.internal_gains !== undefined && d.balance_point === undefined) wd.gains_mode = 'internal_gains';
  if (d.degree_day_correction !== undefined) wd.degree_day_correction = d.degree_day_correction;
  if (Array.isArray(d.bills)) wd.bills = clone(d.bills);
  if (d.option !== undefined) wd.bills_option = d.option;
  if (d.fuel !== undefined) wd.bills_fuel = clone(d.fuel);
  if (d.system !== undefined) wd.bills_system = clone(d.system);
  // bills without the date rule keep the core's reading of them (no rule sent); a new quote's bills are meter reads
  if (d.bill_dates !== undefined || (Array.isArray(d.bills) && d.bills.length)) wd.bill_dates = d.bill_dates;
  if (d.observed !== undefined) wd.observed = clone(d.observed);
  if (d.water_heating && typeof d.water_heating === 'object') {
    wd.water_heating = { enabled: true, mode: d.water_heating.annual_heat !== undefined ? 'annual' : 'people', ...clone(d.water_heating) };
  }
  const heaters = [wd.water_heating?.heater, ...doc.options.map((o) => o?.water_heater)].filter((x) => x && typeof x === 'object');
  const demandExtra = Object.fromEntries(Object.entries(d).filter(([key]) => !demandKnown.includes(key)));
  if (Object.keys(demandExtra).length) wd.extra = clone(demandExtra);

  if (doc.climate && typeof doc.climate === 'object') ws.climate = climateFromScenario(doc.climate, { units: ws.settings.units });

  const byFuel = new Map();
  for (const option of doc.options) {
    const { fuelPart, systemPart, extra } = splitOption(option);
    const signature = JSON.stringify(FUEL_FIELDS.map((key) => fuelPart[key] ?? null));
    let entry = byFuel.get(signature);
    if (!entry) {
      entry = fuelEntryOf(ws, fuelPart);
      byFuel.set(signature, entry);
      ws.fuels.push(entry);
    }
    const sys = {
      id: systemPart.id ?? uniqueSystemId(ws, 'option'),
      label: systemPart.label ?? '',
      fuel_key: entry.key,
      system: systemFromScenario(systemPart.system),
    };
    for (const key of [...ECONOMIC_FIELDS, 'equipment']) if (systemPart[key] !== undefined) sys[key] = systemPart[key];
    if (extra.water_heater && typeof extra.water_heater === 'object') {
      sys.water_heater = { mode: 'own', ...extra.water_heater };
      delete extra.water_heater;
    }
    if (Object.keys(extra).length) sys.extra = extra;
    ws.systems.push(sys);
  }

  // priced fuels no option uses, kept with the quote (an export carries every fuel entered)
  for (const part of Array.isArray(doc.other_fuels) ? doc.other_fuels : []) {
    if (part && typeof part === 'object') ws.fuels.push(fuelEntryOf(ws, part));
  }
  // a water heater's own price is its fuel's card on the Fuels tab (sent with the heater while no system burns that fuel)
  for (const heater of heaters) {
    if (heater.price && typeof heater.fuel === 'string' && !ws.fuels.some((f) => fuelId(f) === heater.fuel)) {
      ws.fuels.push(fuelEntryOf(ws, { fuel: heater.fuel, price: clone(heater.price), fixed_charges: clone(heater.fixed_charges) ?? [] }));
    }
  }
  keptServicesFromScenario(ws, settings.kept_services);

  if (doc.economics && typeof doc.economics === 'object') {
    const e = doc.economics;
    ws.economics = {
      enabled: true,
      analysis_years: e.analysis_years,
      discount_rate: e.discount_rate,
      escalation_default: isNumber(e.escalation) ? e.escalation : e.escalation?.default,
      basis: e.basis ?? 'real',
    };
    if (e.maintenance_escalation !== undefined) ws.economics.maintenance_escalation = e.maintenance_escalation;
    for (const [id, rate] of Object.entries(e.escalation && typeof e.escalation === 'object' ? e.escalation : {})) {
      if (id === 'default') continue;
      for (const entry of ws.fuels) if (fuelId(entry) === id) entry.escalation = rate;
    }
  } else if (doc.options.some((o) => ECONOMIC_FIELDS.slice(1).some((key) => o[key] !== undefined))) {
    // per-option costs without study settings: keep them, add no settings of our own
    ws.economics.enabled = true;
    ws.economics.emit = false;
  }
  if (doc.uncertainty && typeof doc.uncertainty === 'object') {
    const u = doc.uncertainty;
    ws.uncertainty = { enabled: true, draws: u.draws, seed: u.seed, form: u.form };
    if (isNumber(u.spread)) ws.uncertainty.spread_default = u.spread;
    else if (isNumber(u.spread?.default)) ws.uncertainty.spread_default = u.spread.default;
    for (const [id, spread] of Object.entries(u.spread && typeof u.spread === 'object' ? u.spread : {})) {
      if (id === 'default') continue;
      for (const entry of ws.fuels) if (fuelId(entry) === id) entry.spread = spread;
    }
  }
  return ws;
}
