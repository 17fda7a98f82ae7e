// Units: exact conversion factors (the same definitions as the core's units,
// checked against the core's convert() in tests/node/units.test.js), the unit
// each quantity is shown in for the US-customary and metric views, labels, and
// the conversion of entered quantities when the user switches unit system.

const BTU_J = 1055.05585262;  // Btu_IT [J]

/** Energy units [kWh per unit]. */
export const ENERGY_KWH = {
  J: 1 / 3.6e6, kJ: 1 / 3600, MJ: 1 / 3.6, GJ: 1000 / 3.6, kWh: 1,
  Btu: BTU_J / 3.6e6, MMBtu: BTU_J / 3.6, therm: BTU_J * 1e5 / 3.6e6,
  kcal: 4186.8 / 3.6e6, cal: 4.1868 / 3.6e6, kcal_th: 4184 / 3.6e6, cal_th: 4.184 / 3.6e6,
};
/** Power units [W per unit]. */
export const POWER_W = { W: 1, kW: 1000, 'Btu/h': BTU_J / 3600 };
/** Mass units [kg per unit]. */
export const MASS_KG = { kg: 1, g: 0.001, lb: 0.45359237, short_ton: 907.18474, tonne: 1000 };
/** Volume units [m3 per unit]. */
export const VOLUME_M3 = {
  m3: 1, L: 0.001, gal: 0.003785411784, imp_gal: 0.00454609, ft3: 0.028316846592,
  ccf: 2.8316846592, Mcf: 28.316846592,
};
/** Heat-loss coefficient units [W/K per unit]. */
export const UA_W_PER_K = { 'W/K': 1, 'Btu/h/degF': (BTU_J / 3600) * 1.8 };
export const TEMPERATURE_UNITS = ['degF', 'degC', 'K'];

export const toCelsius = (value, unit) => (unit === 'degF' ? (value - 32) / 1.8 : unit === 'K' ? value - 273.15 : value);
export const fromCelsius = (value, unit) => (unit === 'degF' ? value * 1.8 + 32 : unit === 'K' ? value + 273.15 : value);
export const convertTemperature = (value, from, to) => fromCelsius(toCelsius(value, from), to);
/** A temperature difference (or degree-days) from one unit to another. */
export const convertTemperatureDifference = (value, from, to) =>
  value * (from === 'degF' ? 1 / 1.8 : 1) * (to === 'degF' ? 1.8 : 1);

const TABLES = [ENERGY_KWH, POWER_W, MASS_KG, VOLUME_M3, UA_W_PER_K];

/** Converts a value between two units of the same table (energy, power, mass, volume, UA) or temperatures. */
export function convert(value, from, to) {
  if (from === to) return value;
  if (TEMPERATURE_UNITS.includes(from) && TEMPERATURE_UNITS.includes(to)) return convertTemperature(value, from, to);
  for (const table of TABLES) {
    if (from in table && to in table) return (value * table[from]) / table[to];
  }
  throw new Error(`cannot convert ${from} to ${to}`);
}

/** The unit each kind of quantity is shown in, per unit system. */
export const DISPLAY = {
  us: { temperature: 'degF', power: 'Btu/h', ua: 'Btu/h/degF', mass: 'lb', energyChoices: ['MMBtu', 'therm'] },
  metric: { temperature: 'degC', power: 'kW', ua: 'W/K', mass: 'kg', energyChoices: ['kWh', 'GJ'] },
};

/** Which system a unit belongs to, for converting entered quantities when the system changes. */
const SYSTEM_OF = {
  MMBtu: 'us', therm: 'us', Btu: 'us', kWh: 'metric', GJ: 'metric', MJ: 'metric',
  degF: 'us', degC: 'metric', 'Btu/h': 'us', kW: 'metric', W: 'metric',
  'Btu/h/degF': 'us', 'W/K': 'metric', lb: 'us', kg: 'metric',
};
const COUNTERPART = {
  energy: { us: 'MMBtu', metric: 'kWh' },
  temperature: { us: 'degF', metric: 'degC' },
  power: { us: 'Btu/h', metric: 'kW' },
  ua: { us: 'Btu/h/degF', metric: 'W/K' },
  mass: { us: 'lb', metric: 'kg' },
};
const KIND_OF = (unit) => (unit in ENERGY_KWH ? 'energy' : TEMPERATURE_UNITS.includes(unit) ? 'temperature'
  : unit in POWER_W ? 'power' : unit in UA_W_PER_K ? 'ua' : unit in MASS_KG ? 'mass' : null);

/** The unit a quantity entered in `unit` should move to in `system`, or null to leave it. */
export function counterpartUnit(unit, system) {
  const kind = KIND_OF(unit);
  if (!kind || !SYSTEM_OF[unit] || SYSTEM_OF[unit] === system) return null;
  return COUNTERPART[kind][system];
}

/** Converts a {value, unit} quantity into `system`'s counterpart unit (a new object), or returns it unchanged. */
export function convertQuantity(quantity, system) {
  if (!quantity || typeof quantity.value !== 'number' || !quantity.unit) return quantity;
  const to = counterpartUnit(quantity.unit, system);
  return to ? { ...quantity, value: convert(quantity.value, quantity.unit, to), unit: to } : quantity;
}

/** Display labels for unit spellings. */
const LABELS = {
  degF: '°F', degC: '°C', K: 'K', m3: 'm³', ft3: 'ft³', short_ton: 'short ton', face_cord: 'face cord',
  imp_gal: 'imp. gal', 'Btu/h/degF': 'Btu/h·°F', 'W/K': 'W/K', kcal_th: 'kcal (th)', cal_th: 'cal (th)',
};
export const unitLabel = (unit) => LABELS[unit] ?? unit;

export const ENERGY_UNITS = Object.keys(ENERGY_KWH);
export const POWER_UNITS = Object.keys(POWER_W);
export const UA_UNITS = Object.keys(UA_W_PER_K);
export const MASS_UNITS = Object.keys(MASS_KG);
export const VOLUME_UNITS = Object.keys(VOLUME_M3);
/** Units a custom fuel may be sold in. */
export const SALE_UNITS = [...MASS_UNITS, ...VOLUME_UNITS];
/** kg of CO2e per display mass unit. */
export const co2In = (kg, system) => (system === 'us' ? kg / MASS_KG.lb : kg);
