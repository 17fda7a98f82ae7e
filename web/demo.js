// The demo quote shown on first start: the invented Maple Hollow house
// (data/examples/maple-hollow-gas-vs-heat-pump.json) with an invented climate,
// heat-pump data-sheet points and installed costs added. Not a real house,
// customer, contractor or tariff.
import { fromScenario } from './scenario.js';

export const DEMO_SCENARIO = {
  schema: 'fuelwright.scenario/1',
  title: 'Maple Hollow: replacing an oil boiler (invented example)',
  description: 'An invented example, not a real house, customer, contractor or tariff: a house in the invented town of Maple Hollow that needs 60 MMBtu of useful heat a year. The existing oil boiler is compared with a condensing gas furnace, an air-source heat pump, a propane furnace and electric baseboard. Prices, costs and the climate are round illustrative numbers.',
  quote: {
    customer: 'Pat and Robin Example (invented)',
    site: '14 Lantern Lane, Maple Hollow (invented address)',
    date: '2026-11-16',
    prepared_by: 'Hollow Creek Heating & Cooling (invented contractor)',
    notes: 'Illustrative prices; replace them with the customer\'s own bills and quotes.',
    number: 'HC-0117',
    valid_until: '2026-12-16',
    terms: 'Invented terms for the demo: prices hold until the date above; a 20 % deposit confirms the order; the balance is due on completion. Work to local codes, with the permits it needs.',
    company: {
      name: 'Hollow Creek Heating & Cooling (invented contractor)',
      address: '2 Mill Road, Maple Hollow (invented address)',
      phone: '555-0142',
      email: 'quotes@hollowcreek.invalid',
      licence: 'MH-M-00417 (invented)',
    },
    financing: { rate: 0.079, years: 10 },
  },
  settings: { units: 'us', currency: 'USD', gwp: 'AR5' },
  climate: {
    monthly_mean: [24, 27, 36, 47, 58, 67, 72, 70, 62, 50, 40, 29],
    unit: 'degF',
    base: { value: 65, unit: 'degF' },
  },
  demand: {
    method: 'direct',
    annual_useful_heat: { value: 60, unit: 'MMBtu' },
  },
  economics: { analysis_years: 15, discount_rate: 0.05, escalation: { default: 0.02 }, basis: 'real' },
  options: [
    {
      id: 'oil-boiler',
      label: 'Existing oil boiler, 86 AFUE',
      fuel: 'heating-oil-2',
      price: { amount: 3.80, per: 'gal' },
      system: { kind: 'boiler', catalog: 'oil-boiler', efficiency: { value: 86, rating: 'AFUE' } },
      existing: true,
      annual_maintenance: 300,
    },
    {
      id: 'gas-furnace',
      label: 'Condensing gas furnace, 95 AFUE',
      fuel: 'natural-gas',
      price: { amount: 1.40, per: 'therm' },
      fixed_charges: [{ label: 'Gas customer charge', amount_per_month: 15 }],
      system: { kind: 'furnace', catalog: 'gas-furnace-condensing', efficiency: { value: 95, rating: 'AFUE' } },
      equipment: 'Invented Co. model GF-60 (invented)',
      installed_cost: 7500,
      annual_maintenance: 150,
      life_years: 18,
    },
    {
      id: 'heat-pump',
      label: 'Air-source heat pump, HSPF2 8.5',
      fuel: 'electricity',
      price: { amount: 0.16, per: 'kWh' },
      system: {
        kind: 'air-source-heat-pump',
        catalog: 'air-source-heat-pump',
        efficiency: { value: 8.5, rating: 'HSPF2' },
        ratings: [
          { outdoor: { value: 47, unit: 'degF' }, capacity: { value: 36000, unit: 'Btu/h' }, cop: 3.8 },
          { outdoor: { value: 17, unit: 'degF' }, capacity: { value: 24000, unit: 'Btu/h' }, cop: 2.5 },
          { outdoor: { value: 5, unit: 'degF' }, capacity: { value: 19500, unit: 'Btu/h' }, cop: 2.0 },
        ],
        cutoff: { value: -5, unit: 'degF' },
        backup: 'electric-resistance',
      },
      equipment: 'Invented Co. model AH-36 (invented)',
      installed_cost: 14000,
      incentives: 2000,
      annual_maintenance: 150,
      life_years: 15,
    },
    {
      id: 'propane-furnace',
      label: 'Condensing propane furnace, 95 AFUE',
      fuel: 'propane',
      price: { amount: 2.60, per: 'gal' },
      system: { kind: 'furnace', catalog: 'gas-furnace-condensing', efficiency: { value: 95, rating: 'AFUE' } },
      installed_cost: 6500,
      annual_maintenance: 150,
      life_years: 18,
    },
    {
      id: 'baseboard',
      label: 'Electric baseboard',
      fuel: 'electricity',
      price: { amount: 0.16, per: 'kWh' },
      system: { kind: 'electric-resistance', catalog: 'electric-baseboard', efficiency: { value: 1, rating: 'COP' } },
      installed_cost: 4000,
      life_years: 25,
    },
  ],
};

/** The name the demo's climate goes by on the page (and if kept on the device): invented, and says so. */
export const DEMO_CLIMATE_LABEL = 'Maple Hollow, an invented climate for the demo';

/** A fresh workspace holding the demo quote. */
export function demoWorkspace() {
  const ws = fromScenario(DEMO_SCENARIO);
  ws.climate.label = DEMO_CLIMATE_LABEL;
  return ws;
}
