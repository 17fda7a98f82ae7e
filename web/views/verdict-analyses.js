// The verdict's what-if charts from the core's analyses: cost against one price (the sweep, with its exact
// break-even points and the statement in words) and the tornado of the winner's margin.
import { priceLines, tornadoChart } from '../charts.js';
import { h } from '../dom.js';
import { asSentence } from '../format.js';
import { unitLabel } from '../units.js';
import { fuelName } from './fuels.js';
import { isNum, traceButton } from './verdict-numbers.js';

/** Where the cost line of option `id` is at price `x` (linear between the sweep's points). */
function costAt(sweep, id, x) {
  const series = sweep.series.find((sr) => sr.id === id);
  if (!series) return undefined;
  const xs = sweep.x;
  for (let k = 1; k < xs.length; k++) {
    if (x <= xs[k] || k === xs.length - 1) {
      const f = (x - xs[k - 1]) / (xs[k] - xs[k - 1] || 1);
      return series.cost[k - 1] + f * (series.cost[k] - series.cost[k - 1]);
    }
  }
  return series.cost[0];
}

/** Break-even marks of a core sweep: [{x, y, with, label}] (x exact from the core). */
export function sweepMarks(sweep, labels) {
  return (sweep.break_even ?? []).filter((b) => isNum(b.value)).map((b) => ({
    x: b.value, y: costAt(sweep, b.with, b.value), with: b.with,
    label: `${labels.get(sweep.of) ?? sweep.of} and ${labels.get(b.with) ?? b.with} cost the same at this price`,
  }));
}

export function sweepSection(result, ws, ctx, analysis) {
  const { format } = ctx;
  const fuelIndex = analysis?.fuelIndex;
  const choices = ws.fuels.map((f, i) => h('option', { value: String(i), text: fuelName(f, ctx.catalog), selected: fuelIndex === i }));
  const control = h('div', { class: 'field inline' }, h('label', { for: 'sweep-fuel', text: 'Vary the price of' }),
    h('select', { id: 'sweep-fuel', dataset: { action: 'sweep-fuel' } }, choices));
  const slot = h('div', { class: 'chart-slot', id: 'chart-sweep' });
  const notes = h('ul', { class: 'break-evens', id: 'break-evens' });
  const parts = [h('h3', { text: 'If this price changes' }), control, slot];
  const sweep = analysis?.sweep;
  if (analysis?.state === 'error') {
    slot.append(h('p', { class: 'status', text: `The price chart could not be worked out: ${analysis.message}` }));
  } else if (sweep?.series?.length && sweep.x?.length) {
    const entry = ws.fuels[fuelIndex];
    const per = unitLabel(entry?.price?.per ?? '');
    const labels = new Map((result.options ?? []).map((o) => [o.id, o.label ?? o.id]));
    const swept = new Set(ws.systems.filter((s) => s.fuel_key === entry?.key).map((s) => s.id));
    const series = sweep.series.map((sr) => ({ id: sr.id, label: sr.label ?? labels.get(sr.id), swept: swept.has(sr.id),
      points: sweep.x.map((x, k) => [x, sr.cost[k]]) }));
    const marks = sweepMarks(sweep, labels);
    const life = sweep.basis === 'life-cycle';
    slot.append(priceLines(series, { marks, current: sweep.current, money: format.money, formatX: format.price,
      xLabel: `price of ${fuelName(entry, ctx.catalog)} (${ws.settings.currency} per ${per})`,
      title: life ? 'Life-cycle cost against one price' : 'Annual cost against one price' }));
    slot.append(h('ul', { class: 'legend' }, series.map((sr, i) => h('li', {}, h('span', { class: 'swatch line', dataset: { i: String(i % 8) } }), sr.label))));
    const what = life ? 'over the years' : 'a year';
    if (entry?.price?.time_of_use && isNum(sweep.current)) {
      notes.append(h('li', { class: 'tou-mean', text: `Priced by time of use: the price here is the mean over the tariff's hours, today ${
        format.price(sweep.current)} per ${per}; every period's price moves with it.` }));
    }
    for (const m of marks) {
      notes.append(h('li', { dataset: { with: m.with, value: String(m.x) } },
        traceButton('sweep', m.x, `${format.price(m.x)} per ${per}`, 'Break-even price', { with: m.with }),
        ` ${labels.get(sweep.of) ?? sweep.of} costs the same as ${labels.get(m.with) ?? m.with} (${format.money(m.y)} ${what}).`));
    }
    if (!marks.length) notes.append(h('li', { text: 'No break-even point between 0 and twice today\'s price.' }));
    parts.push(notes);
    const be = analysis.breakEven;
    if (be && !(be.errors ?? []).length) {
      parts.push(h('p', { class: 'statement', id: 'break-even-statement', dataset: { a: analysis.pair?.a ?? '', b: analysis.pair?.b ?? '',
        ...(isNum(be.break_even?.value) ? { value: String(be.break_even.value) } : {}) } },
      be.break_even ? `${be.statement}.` : asSentence(be.reason ?? be.statement ?? '')));
    }
    parts.push(h('button', { type: 'button', class: 'quiet', dataset: { trace: 'sweep-all' }, text: 'How this chart was worked out' }));
  } else if (analysis?.state === 'none') {
    slot.append(h('p', { class: 'status', text: analysis.message }));
  } else {
    slot.append(h('p', { class: 'status', text: 'Working out…' }));
  }
  return h('section', { class: 'chart-card', id: 'sweep' }, parts);
}

export function tornadoSection(result, ctx, analysis) {
  const t = analysis?.tornado;
  if (t?.errors?.length) {
    return h('section', { class: 'chart-card', id: 'chart-tornado' }, h('h3', { text: 'What could change the answer' }),
      h('p', { class: 'status', id: 'tornado-unavailable', text: `Not available for these entries: ${t.errors.map((e) => e.message).join('; ')}.` }));
  }
  if (!t || !Array.isArray(t.inputs) || !t.inputs.length || !isNum(t.margin)) return null;
  const { format } = ctx;
  const labels = new Map((result.options ?? []).map((o) => [o.id, o.label ?? o.id]));
  const rows = t.inputs.slice(0, 8).map((input) => ({ label: input.input, low: input.margin_low, high: input.margin_high }));
  const pct = format.percent(t.change ?? 0.2);
  const life = t.basis === 'life-cycle';
  const winner = labels.get(t.winner) ?? t.winner;
  const runner = labels.get(t.runner_up) ?? t.runner_up;
  return h('section', { class: 'chart-card', id: 'chart-tornado' },
    h('h3', { text: 'What could change the answer' }),
    h('p', { class: 'hint', text: `${winner} leads ${runner} by ${format.money(t.margin)}${life ? ' over the years' : ' a year'}. `
      + `Each bar shows the lead with one input ${pct} lower (light) or higher (dark); a bar past the tie line means the order changes.` }),
    tornadoChart(rows, { margin: t.margin, money: format.money, title: `Lead of ${winner} over ${runner} for ±${pct} on each input`,
      lowLabel: `${pct} lower`, highLabel: `${pct} higher` }),
    h('ul', { class: 'tornado-list', id: 'tornado-list' }, t.inputs.slice(0, 8).map((input, i) => h('li', {},
      h('span', { text: `${input.input}: ` }),
      traceButton('tornado', input.margin_low, format.money(input.margin_low), `Lead with ${input.input} ${pct} lower`, { index: String(i), side: 'low' }),
      ' to ',
      traceButton('tornado', input.margin_high, format.money(input.margin_high), `Lead with ${input.input} ${pct} higher`, { index: String(i), side: 'high' })))));
}
