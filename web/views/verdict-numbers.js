// The verdict's tappable numbers: a value of an option's (opens its account) or of a chart's (opens what the
// core was asked and answered), and the names of the economic figures.
import { h } from '../dom.js';

export const isNum = (v) => typeof v === 'number' && Number.isFinite(v);

export function numButton(option, key, value, text, label, extra = {}) {
  return h('button', { type: 'button', class: 'num', dataset: { option: option.id, key, ...(isNum(value) ? { value: String(value) } : {}), ...extra },
    'aria-label': `${label}: ${text}. Show how it was worked out.`, text });
}

/** A button for a value that is not an option's: `trace` names what its dialog shows. */
export function traceButton(trace, value, text, label, extra = {}) {
  return h('button', { type: 'button', class: 'num', dataset: { trace, ...(isNum(value) ? { value: String(value) } : {}), ...extra },
    'aria-label': `${label}: ${text}. Show how it was worked out.`, text });
}

export const ECONOMIC_LABELS = {
  net_installed_cost: 'Net installed cost', annual_saving: 'Saving a year', simple_payback_years: 'Simple payback',
  discounted_payback_years: 'Discounted payback', npv: 'Net present value of switching', life_cycle_cost: 'Life-cycle cost',
  lcoh: 'Levelized cost of heat', co2e_saved_t: 'CO2e avoided over the period', cost_per_tonne_co2e_avoided: 'Cost per tonne of CO2e avoided',
};
