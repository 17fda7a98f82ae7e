// The verdict's price Monte Carlo: its progress, Cancel and results (chance of being cheapest, P10-P90).
import { probabilityBars, rangeChart } from '../charts.js';
import { h } from '../dom.js';
import { isNum, traceButton } from './verdict-numbers.js';

/** The price Monte Carlo: inputs live on the Fuels panel; here its progress, Cancel, and results. */
export function uncertaintySection(result, ws, ctx, mc) {
  if (!ws.uncertainty?.enabled) return null;
  const { format } = ctx;
  const running = mc?.state === 'running';
  const u = mc?.uncertainty;
  const status = {
    running: `Drawing prices… ${format.percent(mc?.fraction ?? 0)}`,
    waiting: 'Waiting for the entries to settle…',
    cancelled: 'Cancelled.',
    error: `The price draws could not be worked out: ${mc?.message ?? ''}`,
    done: u ? `${format.number(u.draws)} draws${u.cancelled ? ' (stopped early)' : ''}, seed ${u.seed}, ${u.form ?? 'lognormal'} spread${mc?.stale ? ' — for the earlier entries' : ''}.` : '',
  }[mc?.state ?? 'waiting'] ?? '';
  const nodes = [h('h3', { text: 'How sure is the ranking?' }),
    h('p', { class: 'status', id: 'mc-status', role: 'status', text: status }),
    h('div', { class: 'mc-progress', id: 'mc-progress-box', hidden: !running },
      h('div', { class: 'bar', id: 'mc-progress', role: 'progressbar', 'aria-label': 'Price draws', 'aria-valuemin': '0', 'aria-valuemax': '100',
        'aria-valuenow': String(Math.round(100 * (mc?.fraction ?? 0))), style: undefined })),
    h('div', { class: 'card-actions start' },
      running ? h('button', { type: 'button', class: 'secondary', id: 'mc-cancel', dataset: { action: 'mc-cancel' }, text: 'Cancel' })
        : h('button', { type: 'button', class: 'secondary', id: 'mc-run', dataset: { action: 'mc-run' }, text: u ? 'Draw the prices again' : 'Draw the prices' }))];
  if (u && Array.isArray(u.options) && u.options.length && mc.state !== 'running') {
    const labels = new Map((result.options ?? mc.options ?? []).map((o) => [o.id, o.label ?? o.id]));
    const n = mc.analysisYears;
    const lifeWord = isNum(n) ? `over ${n} years` : 'over the years';
    const ordered = [...u.options].sort((a, b) => (b.p_cheapest ?? 0) - (a.p_cheapest ?? 0));
    nodes.push(h('h4', { text: `Chance of the lowest cost ${lifeWord}` }),
      probabilityBars(ordered.map((o) => ({ label: labels.get(o.id) ?? o.id, p: o.p_cheapest ?? 0 })), { percent: (p) => format.percent(p, 1),
        title: 'Probability of being cheapest' }));
    const annualRows = u.options.filter((o) => isNum(o.annual_cost_p10)).map((o) => ({ label: labels.get(o.id) ?? o.id,
      p10: o.annual_cost_p10, p50: o.annual_cost_p50, p90: o.annual_cost_p90 }));
    if (annualRows.length) nodes.push(h('h4', { text: 'Cost a year, 10th to 90th percentile' }), rangeChart(annualRows, { money: format.money, title: 'Annual cost, 10th to 90th percentile' }));
    const lifeRows = u.options.filter((o) => isNum(o.life_cycle_cost_p10)).map((o) => ({ label: labels.get(o.id) ?? o.id,
      p10: o.life_cycle_cost_p10, p50: o.life_cycle_cost_p50, p90: o.life_cycle_cost_p90 }));
    if (lifeRows.length) nodes.push(h('h4', { text: `Life-cycle cost ${lifeWord}, 10th to 90th percentile` }), rangeChart(lifeRows, { money: format.money, title: 'Life-cycle cost, 10th to 90th percentile' }));
    const cell = (o, key, text) => h('td', {}, traceButton('uncertainty', o[key], text, `${key.replaceAll('_', ' ')} of ${labels.get(o.id) ?? o.id}`, { option: o.id, key }));
    nodes.push(h('div', { class: 'table-wrap' }, h('table', { id: 'uncertainty-table', class: 'ranked' },
      h('thead', {}, h('tr', {}, ['Option', 'Chance cheapest', 'Per year P10', 'P50', 'P90', 'Life-cycle P10', 'P50', 'P90'].map((t) => h('th', { scope: 'col', text: t })))),
      h('tbody', {}, ordered.map((o) => h('tr', { dataset: { option: o.id } },
        h('th', { scope: 'row', class: 'opt', text: labels.get(o.id) ?? o.id }),
        cell(o, 'p_cheapest', format.percent(o.p_cheapest, 1)),
        cell(o, 'annual_cost_p10', format.money(o.annual_cost_p10)), cell(o, 'annual_cost_p50', format.money(o.annual_cost_p50)),
        cell(o, 'annual_cost_p90', format.money(o.annual_cost_p90)),
        cell(o, 'life_cycle_cost_p10', format.money(o.life_cycle_cost_p10)), cell(o, 'life_cycle_cost_p50', format.money(o.life_cycle_cost_p50)),
        cell(o, 'life_cycle_cost_p90', format.money(o.life_cycle_cost_p90))))))));
    nodes.push(h('p', { class: 'hint', text: 'Each draw multiplies every fuel\'s price by a random factor held over the years; the bars span the 10th to 90th percentile and the tick is the median.' }));
  }
  return h('section', { class: 'chart-card', id: 'uncertainty', dataset: { state: mc?.state ?? 'waiting' } }, nodes);
}

/** Updates the Monte Carlo's progress bar in place (no repaint of the verdict). */
export function showDrawProgress(container, ctx, fraction) {
  const bar = container.querySelector('#mc-progress');
  if (!bar) return;
  container.querySelector('#mc-progress-box').hidden = false;
  const pct = Math.round(100 * fraction);
  bar.style.width = `${pct}%`;
  bar.setAttribute('aria-valuenow', String(pct));
  const status = container.querySelector('#mc-status');
  if (status) status.textContent = `Drawing prices… ${ctx.format.percent(fraction)}`;
}
