// The page's editing rules, as pure functions on the workspace (tested in Node): a system's label in
// words, fitting a system to the catalog when its fuel or kind changes, a new fuel or system as the
// add menus make it (a dual-fuel option pairs the heat pump with the burner in the house now), a fuel
// changed on its card, and switching every entered quantity between US and metric units. They change
// the workspace they are given and touch no page; app.js runs them inside the store's mutations.
import { climateInUnit } from './climate-library.js';
import { FUEL_BURNING_KINDS, dualFuelSystem, efficiencyFor } from './equipment.js';
import { HEAT_PUMP_KINDS, fuelId, newFuelKey, uniqueSystemId } from './scenario.js';
import { DISPLAY, convert, convertQuantity } from './units.js';
import { fuelName, saleUnitsOf } from './views/fuels.js';
import { DUAL_FUEL_CHOICE, KIND_NAMES } from './views/systems.js';

/** A custom fuel as the fuel menu's "custom" starts it: a formula to type, sold by the kg. */
const customFuel = () => ({ kind: 'formula', id: 'custom-fuel', name: 'Custom fuel', formula: '', sale_unit: 'kg' });

/**
 * A system's label in words: "Existing furnace, Natural gas" for the system in the house now (never
 * confused with a new one of the same kind and fuel), "Dual fuel: air-source heat pump + furnace
 * (Natural gas)" for a heat pump with a fuel-burning backup (never read as the heat pump alone).
 */
export function autoLabel(ws, sys, catalog) {
  const entry = ws.fuels.find((f) => f.key === sys.fuel_key);
  const backup = sys.system?.backup && ws.systems.find((s) => s.id === sys.system.backup);
  if (backup) {
    const backupFuel = ws.fuels.find((f) => f.key === backup.fuel_key);
    return `Dual fuel: ${(KIND_NAMES[sys.system.kind] ?? 'heat pump').toLowerCase()} + ${(KIND_NAMES[backup.system?.kind] ?? 'system').toLowerCase()}${
      backupFuel ? ` (${fuelName(backupFuel, catalog)})` : ''}`;
  }
  const kind = KIND_NAMES[sys.system?.kind] ?? 'System';
  return `${sys.existing ? `Existing ${kind.toLowerCase()}` : kind}${entry ? `, ${fuelName(entry, catalog)}` : ''}`;
}

/**
 * Keeps a system's catalog type one of its kind that burns its fuel (the first such record when it is
 * not), its rating the type's (efficiencyFor), and an automatic label up to date.
 */
export function fitSystemToCatalog(ws, sys, catalog) {
  const entry = ws.fuels.find((f) => f.key === sys.fuel_key);
  const fid = fuelId(entry);
  const kind = sys.system.kind;
  const fits = (m) => m && m.kind === kind && (!fid || typeof entry?.fuel === 'object' || m.fuels.includes(fid));
  if (!fits(catalog.systemsById.get(sys.system.catalog))) sys.system.catalog = catalog.systems.find(fits)?.id ?? '';
  const current = catalog.systemsById.get(sys.system.catalog);
  if (current) sys.system.efficiency = efficiencyFor(sys.system.efficiency, current);
  if (sys.label_auto) sys.label = autoLabel(ws, sys, catalog);
}

/** A fuel entry as the add menu makes it: catalog fuel `id` (or "custom"), priced per its first sale unit. */
export function newFuelEntry(ws, id, catalog) {
  const entry = { key: newFuelKey(ws), fuel: id === 'custom' ? customFuel() : id, price: {}, fixed_charges: [] };
  entry.price.per = saleUnitsOf(entry, catalog)[0];
  return entry;
}

/** A fuel card's fuel changed to `value`: its price unit kept when the new fuel is sold in it, its systems refitted. */
export function setFuel(ws, entry, value, catalog) {
  entry.fuel = value === 'custom' ? customFuel() : value;
  const units = saleUnitsOf(entry, catalog);
  if (!units.includes(entry.price?.per)) entry.price = { ...entry.price, per: units[0] };
  for (const sys of ws.systems) if (sys.fuel_key === entry.key) fitSystemToCatalog(ws, sys, catalog);
}

/**
 * A system as the add menu makes it for `choice` (a kind, or DUAL_FUEL_CHOICE): on electricity for an
 * electric kind, else on the first fuel; a dual-fuel option copies the heat pump already typed and takes
 * the fuel-burning system in the house now as its backup, changing over by temperature.
 */
export function newSystem(ws, choice, catalog) {
  const dual = choice === DUAL_FUEL_CHOICE;
  const kind = dual ? 'air-source-heat-pump' : choice;
  const electric = kind === 'electric-resistance' || HEAT_PUMP_KINDS.includes(kind);
  const fuel = ws.fuels.find((f) => (fuelId(f) === 'electricity') === electric) ?? ws.fuels[0];
  const sys = { id: '', label: '', label_auto: true, fuel_key: fuel?.key ?? '', system: { kind, catalog: '', efficiency: { rating: '' }, ratings: [] } };
  fitSystemToCatalog(ws, sys, catalog);
  if (!sys.system.efficiency?.rating) sys.system.efficiency = { rating: electric ? 'COP' : 'thermal' };
  sys.id = uniqueSystemId(ws, `${kind}-${fuelId(fuel) || 'fuel'}`);
  const backup = dual ? ws.systems.find((other) => other.existing && FUEL_BURNING_KINDS.includes(other.system?.kind)) : null;
  if (backup) {
    const copy = dualFuelSystem(ws, backup.id);
    if (copy) Object.assign(sys, copy);
    sys.system.backup = backup.id;
    sys.system.changeover_mode = 'temperature';
    sys.id = uniqueSystemId(ws, `dual-fuel-${fuelId(ws.fuels.find((f) => f.key === backup.fuel_key)) || 'backup'}`);
  }
  sys.label = autoLabel(ws, sys, catalog);
  return sys;
}

/** A copy of system `index` right after it: an id of its own, "(copy)" in its label, not the system in the house now. */
export function duplicateSystem(ws, index) {
  const copy = structuredClone(ws.systems[index]);
  copy.id = uniqueSystemId(ws, copy.id);
  copy.label = `${copy.label || copy.id} (copy)`;
  copy.existing = false;
  ws.systems.splice(index + 1, 0, copy);
}

/** A new data-sheet point on system `index`, its temperature and capacity units the quote's. */
export function addRating(ws, index) {
  const s = ws.systems[index].system;
  const us = ws.settings.units === 'us';
  s.ratings = [...(s.ratings ?? []), { outdoor: { unit: us ? 'degF' : 'degC' }, capacity: { unit: us ? 'Btu/h' : 'kW' } }];
}

/** The unit of a new bill and of its average temperature: the last bill's, else the quote's (therm, degF in US units). */
function billUnits(ws) {
  const last = ws.demand.bills.at(-1);
  const us = ws.settings.units === 'us';
  return { unit: last?.unit ?? (us ? 'therm' : 'kWh'), temperature: last?.mean_temperature?.unit ?? (us ? 'degF' : 'degC') };
}

/** A new empty bill, starting where the last one ended when the dates are meter reads. */
export function addBill(ws) {
  const last = ws.demand.bills.at(-1);
  const start = ws.demand.bill_dates !== 'inclusive' && last?.end ? last.end : '';
  const { unit, temperature } = billUnits(ws);
  ws.demand.bills.push({ start, end: '', unit, mean_temperature: { unit: temperature } });
}

/**
 * Bills read from pasted lines ({start, end, quantity, unit?}), each in the unit it gives, else the last bill's; the
 * first ones pasted into an empty list without a unit take the first unit a later line names ("84" then "131 ccf").
 */
export function appendBills(ws, bills) {
  const named = bills.find((bill) => bill.unit)?.unit;
  for (const bill of bills) {
    const { unit, temperature } = billUnits(ws);
    const carried = ws.demand.bills.length ? unit : named ?? unit;
    ws.demand.bills.push({ start: bill.start, end: bill.end, quantity: bill.quantity, unit: bill.unit ?? carried, mean_temperature: { unit: temperature } });
  }
}

/** A quantity with a unit but no value yet takes the new system's unit. */
function convertUnitOnly(q, system) {
  if (!q || typeof q.value === 'number' || !q.unit) return q;
  try {
    return { ...q, unit: convertQuantity({ value: 1, unit: q.unit }, system).unit };
  } catch {
    return q;
  }
}

/** Both conversions a quantity gets: its value (when it has one) and its unit. */
const inSystem = (q, system) => convertUnitOnly(convertQuantity(q, system), system);

/** Switches the workspace to `system` ('us' or 'metric'), converting every entered quantity with a known factor. */
export function switchUnits(ws, system) {
  if (ws.settings.units === system) return;
  ws.settings.units = system;
  ws.settings.energy_unit = DISPLAY[system].energyChoices[0];
  const d = ws.demand;
  for (const key of ['annual_useful_heat', 'balance_point', 'ua', 'design_heat_loss', 'indoor', 'design_outdoor', 'internal_gains', 'hot_water']) {
    d[key] = inSystem(d[key], system);
  }
  ws.climate = climateInUnit(ws.climate, DISPLAY[system].temperature);
  ws.climate.base = inSystem(ws.climate.base, system);
  ws.climate.design_temperature = inSystem(ws.climate.design_temperature, system);
  for (const sys of ws.systems) {
    const s = sys.system;
    for (const point of s.ratings ?? []) {
      point.outdoor = inSystem(point.outdoor, system);
      point.capacity = inSystem(point.capacity, system);
      if (point.min_capacity) point.min_capacity = inSystem(point.min_capacity, system);
    }
    for (const key of ['cutoff', 'changeover', 'capacity']) if (s[key]) s[key] = inSystem(s[key], system);
  }
  for (const entry of ws.fuels) if (entry.bag_mass) entry.bag_mass = convertQuantity(entry.bag_mass, system);
  const w = d.water_heating;
  if (w) {
    w.annual_heat = inSystem(w.annual_heat, system);
    w.volume_per_person_day = litresOrGallons(w.volume_per_person_day, system);
    w.temperature_rise = riseIn(w.temperature_rise, system);
  }
}

/** Hot water a person a day in gal (US) or L (metric). */
function litresOrGallons(q, system) {
  if (!q) return q;
  const to = system === 'us' ? 'gal' : 'L';
  if (q.unit === to || (q.unit !== 'gal' && q.unit !== 'L')) return q;
  const value = typeof q.value === 'number' ? convert(q.value, q.unit, to) : q.value;
  return { ...q, value, unit: to };
}

/** A temperature rise (a difference, not a temperature) in degF (US) or K (metric): x 5/9 or x 9/5. */
function riseIn(q, system) {
  if (!q) return q;
  const to = system === 'us' ? 'degF' : 'K';
  if (q.unit === to || !['degF', 'K', 'degC'].includes(q.unit)) return q;
  const value = typeof q.value === 'number' ? (to === 'K' ? q.value * 5 / 9 : q.value * 9 / 5) : q.value;
  return { ...q, value, unit: to };
}

/**
 * A new time-of-use row on an electricity entry: the first one covers every hour at the entry's one price (so the
 * tariff is complete from the start), later ones start with a name of their own ("period 2") and no price or hours.
 */
export function addPeriod(entry) {
  const schedule = entry.price.schedule ?? [];
  entry.price.schedule = schedule;
  if (!schedule.length) schedule.push({ name: 'all hours', amount: entry.price.amount, from: 0, to: 24, days: 'all', months_text: '' });
  else schedule.push({ name: `period ${schedule.length + 1}`, days: 'all', months_text: '' });
}
