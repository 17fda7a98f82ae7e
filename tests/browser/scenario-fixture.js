// What the browser tests type into the page, as the scenario JSON the page
// must build from it, and the native CLI's answer for a scenario.
import { spawn } from 'node:child_process';

import { cliPath } from '../node/helpers.js';

/** Today as the page writes it (local date, YYYY-MM-DD). */
export function today() {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

export const TYPED = {
  customer: 'Ada Example <img src=x onerror=alert(1)>',
  site: '3 Juniper Row, Elm Fork (invented)',
  heat: '80',
  gasPrice: '1.25',
  gasCharge: '12',
  electricityPrice: '0.15',
  furnaceAfue: '96',
  heatPumpHspf2: '9',
};

/** The scenario the page must build after typing TYPED (see the tests' steps). */
/** [YYYY-MM-DD] `days` after the date `iso` (calendar days). */
export function daysAfter(iso, days) {
  const [y, m, d] = iso.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d) + days * 86_400_000).toISOString().slice(0, 10);
}

export function typedScenario({ gasPrice = 1.25, units = 'us', currency = 'USD', number = 'Q-0001' } = {}) {
  return {
    schema: 'fuelwright.scenario/1',
    // a new quote on a device with no company profile yet: the first number of the device's counter, prices
    // holding for the profile's default 30 days, nobody named as its author (not the demo's contractor)
    quote: { customer: TYPED.customer, site: TYPED.site, date: today(), number, valid_until: daysAfter(today(), 30) },
    settings: { units, currency, gwp: 'AR5' },
    demand: { method: 'direct', annual_useful_heat: { value: 80, unit: 'MMBtu' } },
    options: [
      {
        id: 'furnace-natural-gas',
        label: 'Furnace, Natural gas',
        fuel: 'natural-gas',
        price: { amount: gasPrice, per: 'therm' },
        fixed_charges: [{ label: 'Customer charge', amount_per_month: 12 }],
        system: { kind: 'furnace', catalog: 'gas-furnace-condensing', efficiency: { value: 96, rating: 'AFUE' } },
      },
      {
        id: 'air-source-heat-pump-electricity',
        label: 'Air-source heat pump, Electricity',
        fuel: 'electricity',
        price: { amount: 0.15, per: 'kWh' },
        system: { kind: 'air-source-heat-pump', catalog: 'air-source-heat-pump', efficiency: { value: 9, rating: 'HSPF2' } },
      },
    ],
  };
}

/** Runs `fuelwright evaluate -` on a scenario; resolves to the parsed result. */
export function cliEvaluate(scenario) {
  return new Promise((resolve, reject) => {
    const child = spawn(cliPath, ['evaluate', '-', '--detail', 'all'], { stdio: ['pipe', 'pipe', 'pipe'] });
    let out = '';
    child.stdout.on('data', (chunk) => { out += chunk; });
    child.stderr.resume();
    child.on('error', reject);
    child.on('close', () => {
      try { resolve(JSON.parse(out)); } catch { reject(new Error(`CLI printed no JSON: ${out}`)); }
    });
    child.stdin.end(JSON.stringify(scenario));
  });
}

/** Relative closeness for numbers the page computed from the same result. */
export function close(actual, expected, rel = 1e-9) {
  return Math.abs(actual - expected) <= rel * Math.max(1, Math.abs(expected));
}

/** The page's money format for yearly amounts. */
export const money = (value, currency = 'USD', locale = 'en-US') =>
  new Intl.NumberFormat(locale, { style: 'currency', currency, minimumFractionDigits: 0, maximumFractionDigits: 0 }).format(value);
