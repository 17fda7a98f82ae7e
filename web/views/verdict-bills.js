// The verdict's past bills against the weather: the fitted line in the bills' own unit and what the fit rests on.
import { billsChart } from '../charts.js';
import { h } from '../dom.js';
import { billsUnitOf } from '../results.js';
import { ENERGY_KWH, unitLabel } from '../units.js';
import { isNum, traceButton } from './verdict-numbers.js';

export function billsSection(result, ctx, ws) {
  const raw = result.demand?.fit;
  if (!raw || !Array.isArray(raw.points) || !raw.points.length) return null;
  const { format } = ctx;
  const tUnit = unitLabel(raw.temperature_unit ?? 'degC');
  // use per day in the bills' own unit (therm for a gas customer billed in therms)
  const shown = billsUnitOf(raw, ws?.demand?.bills);
  const fit = { ...raw, base_per_day: raw.base_per_day * shown.factor, slope: raw.slope * shown.factor,
    points: raw.points.map((p) => ({ ...p, use_per_day: p.use_per_day * shown.factor })) };
  const unit = unitLabel(shown.unit);
  // the heat need in the unit the quote shows it in (MMBtu, therm, kWh, GJ…)
  const heatUnit = ENERGY_KWH[ws?.settings?.energy_unit] ? ws.settings.energy_unit : 'kWh';
  return h('section', { class: 'chart-card', id: 'chart-bills' },
    h('h3', { text: 'Past bills against the weather' }),
    billsChart(fit.points, { base: fit.base_per_day, slope: fit.slope, number: (v) => format.number(v, 3),
      xLabel: `heating degree-days per day (${tUnit}·d, base ${isNum(fit.tau) ? format.number(fit.tau, 3) : '—'} ${tUnit})`,
      yLabel: `${unit} a day`, title: 'Use per day against heating degree-days per day, with the fitted line' }),
    h('p', { class: 'hint' }, 'Each dot is a bill; the line is use = ',
      traceButton('bills', fit.base_per_day, `${format.number(fit.base_per_day, 4)} ${unit}`, 'Base use per day'), ' a day + ',
      traceButton('bills', fit.slope, `${format.number(fit.slope, 4)} ${unit}`, 'Use per degree-day'), ` per ${tUnit}·d`,
      isNum(fit.r2) ? ` (R² ${format.fixed(fit.r2, 3)})` : '',
      isNum(result.demand.uncertainty_kwh) ? `; the heat need is known to about ±${format.number(result.demand.uncertainty_kwh / ENERGY_KWH[heatUnit], 3)} ${unitLabel(heatUnit)}.` : '.'),
    fit.weather ? h('p', { class: 'hint', id: 'bills-weather', text: billsWeatherText(fit, format) }) : null);
}

/** Which weather the bills were set against (the core's fit.weather) and how closely the normal year's use is known. */
function billsWeatherText(fit, format) {
  const weather = {
    'observed-daily': 'Each bill is set against the outdoor temperatures of its own days, from the weather file.',
    'observed-period-mean': 'Each bill is set against the average outdoor temperature printed on it.',
    normals: 'The bills are set against the climate\'s usual months, not the weather of their own days.',
  }[fit.weather] ?? '';
  const spread = isNum(fit.cv_nac) ? ` The use in a normal year is known to about ±${format.percent(fit.cv_nac, 1)}.` : '';
  return `${weather}${spread}`.trim();
}
