// The verdict's heat-pump cards: seasonal COP, the backup's share and hours below the balance point; the
// chart by outdoor temperature in a disclosure, drawn from the option's account when opened.
import { binsChart } from '../charts.js';
import { h } from '../dom.js';
import { heatingBins } from '../results.js';
import { convertTemperature, POWER_W, unitLabel } from '../units.js';
import { isNum, traceButton } from './verdict-numbers.js';
import { accountOf } from './verdict-traces.js';

/** The chart of one heat pump's bins (from its account: the lean verdict carries none). */
function binsChartOf(option, result, ws, ctx) {
  const want = ws.settings.units === 'us' ? 'degF' : 'degC';
  const from = result.climate?.unit ?? ws.climate.unit ?? want;
  const bins = heatingBins(option.bins);
  return binsChart(bins.length ? bins : option.bins, { tempLabel: unitLabel(want), toTemp: (t) => convertTemperature(t, from, want),
    number: (v) => ctx.format.number(v, 3), title: `Heat pump ${option.label ?? option.id} over temperature bins`,
    // a US quote's capacities are typed in Btu/h: the chart says them so (1 kW = 1000 / (1055.05585262 / 3600) Btu/h)
    ...(ws.settings.units === 'us' ? { powerLabel: 'Btu/h', kwTo: 1000 / POWER_W['Btu/h'] } : {}) });
}

/** Draws an opened bins disclosure's chart from the option's account, once per scenario. */
export async function fillBinsChart(details, state, ctx) {
  const slot = details.querySelector('.bins-chart-body');
  if (!slot || slot.dataset.key === state.key) return;
  slot.dataset.key = state.key;
  const key = state.key;
  const option = (await accountOf(state, ctx, details.dataset.option))?.option;
  if (state.key !== key || !state.result) return;
  if (!option) delete slot.dataset.key;  // asked again when the disclosure next opens
  slot.replaceChildren(Array.isArray(option?.bins) && option.bins.length
    ? binsChartOf(option, state.result, ctx.store.state, ctx)
    : h('p', { class: 'hint', text: 'The chart could not be worked out for these entries.' }));
}

export function binsSection(result, ws, ctx, state) {
  const hp = (result.options ?? []).filter((o) => isNum(o.seasonal_cop));
  if (!hp.length) return null;
  const want = ws.settings.units === 'us' ? 'degF' : 'degC';
  const from = result.climate?.unit ?? ws.climate.unit ?? want;
  state.binsOpen ??= new Set();
  return hp.map((o) => {
    const backupName = o.backup_option ? (result.options.find((x) => x.id === o.backup_option)?.label ?? o.backup_option) : 'resistance strips';
    const open = state.binsOpen.has(o.id);
    const details = h('details', { class: 'bins-chart', id: `bins-chart-${o.id}`, dataset: { option: o.id }, ...(open ? { open: '' } : {}) },
      h('summary', { text: 'Chart by outdoor temperature' }),
      h('div', { class: 'bins-chart-body' }, h('p', { class: 'hint', text: 'Working out…' })));
    if (open) queueMicrotask(() => fillBinsChart(details, state, ctx));
    return h('section', { class: 'chart-card bins', id: `bins-${o.id}` },
      h('h3', { text: `${o.label ?? o.id}: performance by outdoor temperature` }),
      details,
      h('p', { class: 'hint' },
        isNum(o.seasonal_cop) ? ['Seasonal COP ', traceButton('bins', o.seasonal_cop, ctx.format.number(o.seasonal_cop, 3), 'Seasonal COP', { option: o.id }), '. '] : null,
        isNum(o.backup_share) ? `The backup (${backupName}) supplies ${ctx.format.percent(o.backup_share, 1)} of the heat. ` : '',
        isNum(o.hours_below_balance_point) ? `${ctx.format.number(o.hours_below_balance_point)} hours a year below the balance point. ` : '',
        o.changeover && typeof o.changeover === 'object' && isNum(o.changeover.value)
          ? `Changeover to the backup below ${ctx.format.number(convertTemperature(o.changeover.value, o.changeover.unit ?? from, want), 3)} ${unitLabel(want)}. ` : '',
        Array.isArray(o.bin_cop_range) ? `COP from ${ctx.format.number(o.bin_cop_range[0], 3)} to ${ctx.format.number(o.bin_cop_range[1], 3)} over the bins.` : ''),
      h('button', { type: 'button', class: 'quiet', dataset: { trace: 'bins', option: o.id }, text: 'Bin by bin' }));
  });
}
