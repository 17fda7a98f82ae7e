// The verdict's traces: what opens when a number is tapped. An option's full account (trace, sources, bins)
// is asked of the core's explain when it opens, once per scenario and option; the charts' values show what
// the core was asked and answered.
import { h } from '../dom.js';
import { heatingBins } from '../results.js';
import { convertTemperature, unitLabel } from '../units.js';
import { openTrace } from './trace.js';
import { ECONOMIC_LABELS, isNum } from './verdict-numbers.js';

/**
 * The core's full account of one option (or, without an id, of the heat need) for the scenario the verdict
 * shows: the evaluation is lean, so traces, sources and bins are asked for when the user opens one, once per
 * scenario and option. Resolves to null when the core cannot give it (not kept: the next tap asks again).
 */
export function accountOf(state, ctx, optionId = '') {
  if (!state.key) return Promise.resolve(null);
  if (state.accounts?.key !== state.key) state.accounts = { key: state.key, byOption: new Map() };
  const known = state.accounts.byOption.get(optionId);
  if (known) return known;
  const request = { scenario: JSON.parse(state.key), ...(optionId ? { option: optionId } : {}) };
  const accounts = state.accounts.byOption;
  const promise = ctx.core.explain(request).then((account) => (account?.errors?.length ? null : account), () => null)
    .then((account) => {
      if (!account && accounts.get(optionId) === promise) accounts.delete(optionId);
      return account;
    });
  accounts.set(optionId, promise);
  return promise;
}

/** The line a trace shows when the core's account could not be had. */
const NO_ACCOUNT = 'How this was worked out could not be fetched just now: tap the number again.';

/** The heat need's trace lines: how the demand and the climate were worked out (the climate's first with `climateFirst`). */
async function heatNeedTrace(state, ctx, { climateFirst = false } = {}) {
  const account = await accountOf(state, ctx);
  if (!account) return [NO_ACCOUNT];
  const demand = account.demand?.trace ?? [];
  const climate = account.climate?.trace ?? [];
  return climateFirst ? [...climate, ...demand] : [...demand, ...climate];
}

export async function showOptionTrace(state, option, ctx, key) {
  const account = await accountOf(state, ctx, option.id);
  const full = account?.option ?? option;
  const lines = account ? [] : [NO_ACCOUNT];
  if (isNum(option.seasonal_cop)) lines.push(`seasonal COP ${ctx.format.number(option.seasonal_cop, 3)}`);
  const extra = [];
  const reason = key === 'simple_payback_years' ? option.simple_payback_reason : key === 'discounted_payback_years' ? option.discounted_payback_reason : null;
  if (reason) extra.push(h('p', { class: 'lead', id: 'trace-reason', text: `${ECONOMIC_LABELS[key]}: ${reason}.` }));
  openTrace({ title: option.label ?? option.id, subtitle: `${option.fuel_name ?? option.fuel}`, trace: [...(full.trace ?? []), ...lines],
    sources: full.sources ?? [], extra });
}


export function sweepTrace(state, ctx, button) {
  const { result, analysis } = state;
  const sweep = analysis?.sweep;
  if (!sweep) return;
  const { format } = ctx;
  const labels = new Map((result?.options ?? []).map((o) => [o.id, o.label ?? o.id]));
  const lines = [
    `the core's sweep: ${sweep.x.length} evaluations of the scenario with the price of ${analysis.fuelName} from ${format.price(sweep.x[0])} to ${format.price(sweep.x.at(-1))} ${sweep.unit} (today ${format.price(sweep.current)})`,
    `cost basis: ${sweep.basis === 'life-cycle' ? 'life-cycle cost over the analysis period' : 'cost per year'}; every option that burns ${analysis.fuelName} follows the price`,
    ...(sweep.break_even ?? []).map((b) => `break-even with ${labels.get(b.with) ?? b.with}: ${format.number(b.value, 6)} ${sweep.unit} (solved by the core, not read off the chart)`),
  ];
  if (analysis.breakEven) {
    const be = analysis.breakEven;
    lines.push(`breakEven ${labels.get(analysis.pair?.a) ?? analysis.pair?.a} against ${labels.get(analysis.pair?.b) ?? analysis.pair?.b}: ${be.break_even
      ? `${format.number(be.break_even.value, 6)} ${be.break_even.unit}` : be.reason ?? 'no break-even'}`);
    for (const [id, cost] of Object.entries(be.costs_at_break_even ?? {})) lines.push(`  cost of ${labels.get(id) ?? id} there: ${format.money(cost)}`);
  }
  const focus = button?.dataset.with;
  openTrace({ title: focus ? `Break-even with ${labels.get(focus) ?? focus}` : 'Cost against the price', subtitle: analysis.breakEven?.statement, trace: lines });
}

export function tornadoTrace(state, ctx, button) {
  const t = state.analysis?.tornado;
  const input = t?.inputs?.[Number(button.dataset.index)];
  if (!input) return;
  const { format } = ctx;
  const labels = new Map((state.result?.options ?? []).map((o) => [o.id, o.label ?? o.id]));
  const pct = format.percent(t.change ?? 0.2);
  openTrace({ title: input.input, subtitle: `${labels.get(t.winner) ?? t.winner} against ${labels.get(t.runner_up) ?? t.runner_up}`, trace: [
    `lead today: ${format.money(t.margin)} (${t.basis === 'life-cycle' ? 'life-cycle cost' : 'cost per year'})`,
    `${pct} lower: the lead becomes ${format.money(input.margin_low)} (the winner's cost changes by ${format.money(input.change_low)})`,
    `${pct} higher: the lead becomes ${format.money(input.margin_high)} (the winner's cost changes by ${format.money(input.change_high)})`,
    `swing ${format.money(input.swing)}; ${Math.sign(input.margin_low) !== Math.sign(input.margin_high) || input.margin_low < 0 || input.margin_high < 0
      ? 'within this range the order of the two changes' : 'the order of the two holds over this range'}`,
    'each end is a new evaluation of the scenario by the core with this one input changed',
  ] });
}

export async function binsTrace(state, ctx, button) {
  const option = (await accountOf(state, ctx, button.dataset.option))?.option;
  if (!option) return;
  const { format } = ctx;
  const ws = ctx.store.state;
  const want = ws.settings.units === 'us' ? 'degF' : 'degC';
  const from = state.result?.climate?.unit ?? ws.climate.unit ?? want;
  const bins = heatingBins(option.bins ?? []);
  const rows = bins.map((b) => h('tr', {}, [convertTemperature(b.t, from, want), b.hours, b.load_kw, b.off ? null : b.capacity_kw, b.off ? null : b.cop,
    b.heat_pump_heat_kwh, b.backup_heat_kwh, b.heat_pump_kwh].map((v) => h('td', { text: isNum(v) ? format.number(v, 3) : '—' })),
  h('td', { text: [b.off ? 'off' : '', b.extrapolated ? 'extrapolated' : ''].filter(Boolean).join(', ') })));
  const tableNode = h('div', { class: 'table-wrap' }, h('table', { class: 'ranked bins-table', id: 'bins-table' },
    h('thead', {}, h('tr', {}, [`Outdoor ${unitLabel(want)}`, 'Hours', 'Load kW', 'Capacity kW', 'COP', 'Heat pump heat kWh', 'Backup heat kWh', 'Electricity kWh', '']
      .map((t) => h('th', { scope: 'col', text: t })))),
    h('tbody', {}, rows)));
  openTrace({ title: `${option.label ?? option.id}: bin by bin`, subtitle: option.fuel_name, trace: option.trace ?? [], sources: option.sources ?? [], extra: [tableNode] });
}

export function uncertaintyTrace(state, ctx, button) {
  const u = state.mc?.uncertainty;
  const o = u?.options?.find((x) => x.id === button.dataset.option);
  if (!o) return;
  const { format } = ctx;
  const label = state.result?.options?.find((x) => x.id === o.id)?.label ?? o.id;
  openTrace({ title: label, subtitle: `${format.number(u.draws)} price draws, seed ${u.seed}, ${u.form}`, trace: [
    ...(u.notes ?? []),
    `chance of the lowest life-cycle cost: ${format.percent(o.p_cheapest, 2)} of the draws`,
    `cost a year: P10 ${format.money(o.annual_cost_p10)}, P50 ${format.money(o.annual_cost_p50)}, P90 ${format.money(o.annual_cost_p90)}`,
    `life-cycle cost: P10 ${format.money(o.life_cycle_cost_p10)}, P50 ${format.money(o.life_cycle_cost_p50)}, P90 ${format.money(o.life_cycle_cost_p90)}; `
      + `mean ${format.money(o.life_cycle_cost_mean)} ± ${format.money(o.life_cycle_cost_standard_error)} (standard error)`,
    ...(u.cancelled ? ['the run was stopped early: these figures come from the draws made until then'] : []),
  ] });
}

export async function billsTrace(state, ctx) {
  openTrace({ title: 'Heat need from past bills', trace: await heatNeedTrace(state, ctx) });
}

/** Opens the heat need's trace: how the demand and the climate were worked out. */
export async function openHeatNeedTrace(state, ctx, title = 'Heat the house needs', { climateFirst = false } = {}) {
  openTrace({ title, trace: await heatNeedTrace(state, ctx, { climateFirst }) });
}
