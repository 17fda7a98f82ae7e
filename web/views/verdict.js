// Panel 4, the verdict: options ranked by annual cost (or by the core's
// life-cycle ranking), cost per useful unit, CO2e; with costs over the years,
// payback, NPV, levelized cost of heat and CO2e avoided against the existing
// system; the cost-against-price chart from the core's sweep with its exact
// break-even points and a plain-words statement from breakEven; the tornado;
// heat-pump bins; the bills fit; the price Monte Carlo with its progress; the
// cautions. Every number is a button that opens its trace.
import { h } from '../dom.js';
import { billsChart, binsChart, costBars, priceLines, probabilityBars, rangeChart, tornadoChart } from '../charts.js';
import { asSentence, plainUnits } from '../format.js';
import { billsUnitOf, displayValues, equipmentNotes, fuelUsedText, hasLifeCycle, lifeOf, paybackWords, rankedOptions, years } from '../results.js';
import { ENERGY_KWH, POWER_W, UA_W_PER_K, co2In, convertTemperature, unitLabel } from '../units.js';
import { fuelName } from './fuels.js';
import { openTrace } from './trace.js';
import { whatIfCard } from './what-if.js';

const isNum = (v) => typeof v === 'number' && Number.isFinite(v);

function numButton(option, key, value, text, label, extra = {}) {
  return h('button', { type: 'button', class: 'num', dataset: { option: option.id, key, ...(isNum(value) ? { value: String(value) } : {}), ...extra },
    'aria-label': `${label}: ${text}. Show how it was worked out.`, text });
}

/** A button for a value that is not an option's: `trace` names what its dialog shows. */
function traceButton(trace, value, text, label, extra = {}) {
  return h('button', { type: 'button', class: 'num', dataset: { trace, ...(isNum(value) ? { value: String(value) } : {}), ...extra },
    'aria-label': `${label}: ${text}. Show how it was worked out.`, text });
}

const ECONOMIC_LABELS = {
  net_installed_cost: 'Net installed cost', annual_saving: 'Saving a year', simple_payback_years: 'Simple payback',
  discounted_payback_years: 'Discounted payback', npv: 'Net present value of switching', life_cycle_cost: 'Life-cycle cost',
  lcoh: 'Levelized cost of heat', co2e_saved_t: 'CO2e avoided over the period', cost_per_tonne_co2e_avoided: 'Cost per tonne of CO2e avoided',
};

/**
 * The core's full account of one option (or, without an id, of the heat need) for the scenario the verdict
 * shows: the evaluation is lean, so traces, sources and bins are asked for when the user opens one, once per
 * scenario and option. Resolves to null when the core cannot give it.
 */
export function accountOf(state, ctx, optionId = '') {
  if (!state.key) return Promise.resolve(null);
  if (state.accounts?.key !== state.key) state.accounts = { key: state.key, byOption: new Map() };
  const known = state.accounts.byOption.get(optionId);
  if (known) return known;
  const request = { scenario: JSON.parse(state.key), ...(optionId ? { option: optionId } : {}) };
  const promise = ctx.core.explain(request).then((account) => (account?.errors?.length ? null : account), () => null);
  state.accounts.byOption.set(optionId, promise);
  return promise;
}

/** The heat need's trace lines: how the demand and the climate were worked out. */
async function heatNeedTrace(state, ctx) {
  const account = await accountOf(state, ctx);
  return [...(account?.demand?.trace ?? []), ...(account?.climate?.trace ?? [])];
}

async function showOptionTrace(state, option, ctx, key) {
  const account = await accountOf(state, ctx, option.id);
  const full = account?.option ?? option;
  const lines = [];
  if (isNum(option.seasonal_cop)) lines.push(`seasonal COP ${ctx.format.number(option.seasonal_cop, 3)}`);
  const extra = [];
  const reason = key === 'simple_payback_years' ? option.simple_payback_reason : key === 'discounted_payback_years' ? option.discounted_payback_reason : null;
  if (reason) extra.push(h('p', { class: 'lead', id: 'trace-reason', text: `${ECONOMIC_LABELS[key]}: ${reason}.` }));
  openTrace({ title: option.label ?? option.id, subtitle: `${option.fuel_name ?? option.fuel}`, trace: [...(full.trace ?? []), ...lines],
    sources: full.sources ?? [], extra });
}

function table(result, ws, ctx, by) {
  const { format } = ctx;
  const energyUnit = unitLabel(ws.settings.energy_unit);
  const massUnit = ws.settings.units === 'us' ? 'lb' : 'kg';
  const list = rankedOptions(result, by);
  const econ = hasLifeCycle(result, ws);
  const head = ['#', 'Option', 'Per year', `Per ${energyUnit} of heat`, 'Fuel used', `CO2e ${massUnit}/yr`];
  if (econ) head.push('Life-cycle cost');
  const rows = list.map((option, i) => {
    const v = displayValues(option, ws);
    const hp = isNum(option.seasonal_cop)
      ? h('span', { class: 'sub', text: `seasonal COP ${format.number(option.seasonal_cop, 3)}${isNum(option.backup_share) ? `, backup ${format.percent(option.backup_share)}` : ''}` }) : null;
    const cells = [
      h('td', { class: 'rank', text: String(i + 1) }),
      h('th', { scope: 'row', class: 'opt' }, h('span', { class: 'swatch', dataset: { i: String(i % 8) } }),
        h('span', { class: 'name', text: option.label ?? option.id }),
        h('span', { class: 'sub', text: option.fuel_name ?? option.fuel }), hp,
        option.id === result.economics?.baseline || option.existing ? h('span', { class: 'badge existing', text: 'existing' }) : null),
      h('td', { dataset: { label: head[2] } }, numButton(option, 'annual_cost', v.annual_cost, format.money(v.annual_cost), 'Annual cost'),
        h('span', { class: 'sub', text: `${format.money(v.energy_cost)} energy + ${format.money(v.fixed_cost)} fixed` })),
      h('td', { dataset: { label: head[3] } }, numButton(option, 'cost_per_useful', v.cost_per_useful, format.price(v.cost_per_useful), `Cost per ${energyUnit} of useful heat`)),
      h('td', { dataset: { label: head[4] } }, numButton(option, 'fuel_quantity', v.fuel_quantity, fuelUsedText(option, v, format), 'Fuel used per year')),
      h('td', { dataset: { label: head[5] } }, numButton(option, 'co2e', v.co2e, format.number(v.co2e, 3), `CO2e ${massUnit} per year`)),
    ];
    if (econ) cells.push(h('td', { dataset: { label: head[6] } }, numButton(option, 'life_cycle_cost', option.life_cycle_cost, format.money(option.life_cycle_cost), 'Life-cycle cost')));
    return h('tr', { dataset: { option: option.id, rank: String(i + 1) } }, cells);
  });
  return h('div', { class: 'table-wrap' }, h('table', { id: 'verdict-table', class: 'ranked' },
    h('caption', { class: 'visually-hidden', text: by === 'life' ? 'Options ranked by life-cycle cost' : 'Options ranked by cost per year' }),
    h('thead', {}, h('tr', {}, head.map((t) => h('th', { scope: 'col', text: t })))),
    h('tbody', {}, rows)));
}

/** Switching economics against the existing system: one row per option in life-cycle order. */
function economicsSection(result, ws, ctx) {
  // the system in the house now marked without the costs over the years: the headline's saving a year only
  if (!hasLifeCycle(result, ws)) return null;
  const { format } = ctx;
  const energyUnit = unitLabel(ws.settings.energy_unit);
  const e = result.economics ?? {};
  const baseline = (result.options ?? []).find((o) => o.id === e.baseline);
  const n = e.analysis_years;
  const cell = (option, key, value, text, sub) => h('td', {}, numButton(option, key, value, text, ECONOMIC_LABELS[key]),
    sub ? h('span', { class: 'sub reason', text: sub }) : null);
  const paybackCell = (option, key) => {
    // the full reason is in the trace; the table says it in a few words
    const words = paybackWords(option, { key, lifeYears: lifeOf(ws, option), studyYears: n, baselineId: e.baseline, format });
    if (words === null) return cell(option, key, undefined, '—');
    if (isNum(option[key]) && words === years(option[key], format)) return cell(option, key, option[key], words);
    return cell(option, key, option[key], '—', words);
  };
  const money = (v) => (isNum(v) ? format.money(v) : '—');
  const rows = rankedOptions(result, 'life').map((option, i) => {
    const v = displayValues(option, ws);
    return h('tr', { dataset: { option: option.id, rank: String(i + 1) } },
      h('td', { class: 'rank', text: String(i + 1) }),
      h('th', { scope: 'row', class: 'opt' }, h('span', { class: 'name', text: option.label ?? option.id }),
        option.id === e.baseline ? h('span', { class: 'badge existing', text: 'existing' }) : null),
      cell(option, 'net_installed_cost', option.net_installed_cost, money(option.net_installed_cost)),
      cell(option, 'annual_saving', option.annual_saving, money(option.annual_saving)),
      paybackCell(option, 'simple_payback_years'),
      paybackCell(option, 'discounted_payback_years'),
      cell(option, 'npv', option.npv, money(option.npv)),
      cell(option, 'life_cycle_cost', option.life_cycle_cost, money(option.life_cycle_cost)),
      cell(option, 'lcoh', v.lcoh, isNum(v.lcoh) ? format.price(v.lcoh) : '—'),
      cell(option, 'co2e_saved_t', v.co2e_saved_t, isNum(v.co2e_saved_t) ? format.number(v.co2e_saved_t, 3) : '—'),
      cell(option, 'cost_per_tonne_co2e_avoided', option.cost_per_tonne_co2e_avoided, money(option.cost_per_tonne_co2e_avoided)));
  });
  const head = ['#', 'Option', 'Net installed cost', 'Saving a year', 'Simple payback', 'Discounted payback', 'NPV of switching',
    `Life-cycle cost${isNum(n) ? ` (${n} years)` : ''}`, `Cost of heat per ${energyUnit} over the years`, 'CO2e avoided (t)', 'Cost per tonne CO2e avoided'];
  const basis = e.basis === 'nominal' ? 'future (nominal) money' : 'today\'s (real) money';
  const intro = baseline
    ? `Against ${baseline.label ?? baseline.id} (the system in the house now), over ${n ?? '—'} years at ${isNum(e.discount_rate) ? format.percent(e.discount_rate, 1) : '—'} a year, in ${basis}.`
    : `Over ${n ?? '—'} years at ${isNum(e.discount_rate) ? format.percent(e.discount_rate, 1) : '—'} a year, in ${basis}. Mark the system in the house now as existing to see savings and payback.`;
  return h('section', { class: 'chart-card', id: 'economics' }, h('h3', { text: 'Costs over the years' }),
    h('p', { class: 'hint', text: intro }),
    h('div', { class: 'table-wrap' }, h('table', { id: 'economics-table', class: 'ranked economics' },
      h('caption', { class: 'visually-hidden', text: 'Switching economics, ranked by life-cycle cost' }),
      h('thead', {}, h('tr', {}, head.map((t) => h('th', { scope: 'col', text: t })))),
      h('tbody', {}, rows))),
    e.convention ? h('p', { class: 'hint', text: `Convention: ${e.convention}.` }) : null);
}

function headline(result, ws, ctx, by) {
  const { format } = ctx;
  const list = rankedOptions(result, by);
  if (!list.length) return null;
  const best = list[0];
  const greenest = [...list].sort((a, b) => a.co2e_kg - b.co2e_kg)[0];
  const massUnit = ws.settings.units === 'us' ? 'lb' : 'kg';
  const n = result.economics?.analysis_years;
  const lines = [h('p', { class: 'big' }, by === 'life' ? `Lowest cost over ${n ?? 'the'} years: ` : 'Cheapest to run: ',
    h('strong', { id: 'best-option', text: best.label ?? best.id }), ' — ',
    h('span', { id: 'best-cost', text: by === 'life' ? format.money(best.life_cycle_cost) : `${format.money(best.annual_cost)} a year` }))];
  const baseline = result.economics?.baseline;
  if (baseline && best.id !== baseline && isNum(best.annual_saving)) {
    const base = list.find((o) => o.id === baseline);
    const words = ws.economics?.enabled ? paybackWords(best, { lifeYears: lifeOf(ws, best), studyYears: n, baselineId: baseline, format }) : null;
    const pay = !words ? '' : isNum(best.simple_payback_years) && words === years(best.simple_payback_years, format)
      ? `, paying back in ${words}` : `, but it ${words}`;
    const baseName = base?.label ?? baseline;
    const now = /^existing\b/i.test(baseName) ? baseName : `${baseName}, the system in the house now`;
    lines.push(h('p', { id: 'switch-line' }, best.annual_saving >= 0
      ? `Against ${now}, it saves ${format.money(best.annual_saving)} a year${pay}.`
      : `It costs ${format.money(-best.annual_saving)} a year more to run than ${now}.`));
  }
  if (greenest && greenest.id !== best.id) {
    lines.push(h('p', {}, 'Lowest emissions: ', h('strong', { text: greenest.label ?? greenest.id }),
      ` (${format.number(co2In(greenest.co2e_kg, ws.settings.units), 3)} ${massUnit} CO2e a year)`));
  }
  const demand = result.demand;
  if (demand && isNum(demand.annual_useful_heat_kwh)) {
    const unit = ws.settings.energy_unit;
    const value = demand.annual_useful_heat_kwh / ENERGY_KWH[unit];
    lines.push(h('p', { class: 'demand-line' }, 'Heat the house needs: ',
      h('button', { type: 'button', class: 'num', id: 'useful-heat', dataset: { key: 'annual_useful_heat', value: String(value) },
        text: `${format.number(value)} ${unitLabel(unit)} a year` })));
  }
  return h('div', { class: 'headline', id: 'verdict-headline' }, lines);
}

/** The equipment section of the verdict: each line's value a button that opens the option's trace. */
function equipmentSection(result, ws, ctx, by) {
  const notes = equipmentNotes(result, ws, ctx, by);
  if (!notes.length) return null;
  const items = notes.map(({ option, lines, sizing, resistance }) => h('li', { dataset: { option: option.id } },
    h('strong', { class: 'name', text: option.label ?? option.id }),
    lines.length ? h('ul', { class: 'plain' }, lines.map((line) => h('li', { dataset: { key: line.key } }, `${line.label}: `,
      numButton(option, line.key, line.value, line.text, line.label)))) : null,
    sizing ? h('p', { class: 'sizing', dataset: { key: 'sizing' } }, sizing,
      resistance ? ' Resistance strips need their own circuit and may need a larger electrical service: a licensed electrician decides, to local code.' : '') : null));
  return h('section', { class: 'chart-card', id: 'equipment' }, h('h3', { text: 'Equipment and charges beside the fuel' }),
    h('ul', { class: 'equipment-list' }, items),
    h('p', { class: 'hint', text: 'These amounts are already in each option\'s cost a year. Sizing needs a load calculation by a professional.' }));
}

function climateSummary(result, ws, ctx) {
  const c = result.climate;
  if (!c) return null;
  const { format } = ctx;
  const unit = c.unit ?? ws.climate.unit;
  const want = ws.settings.units === 'us' ? 'degF' : 'degC';
  const t = (v) => (isNum(v) ? `${format.number(convertTemperature(v, unit, want), 3)} ${unitLabel(want)}` : '—');
  const items = [];
  if (isNum(c.annual_hdd)) {
    const hdd = unit === want ? c.annual_hdd : c.annual_hdd * (want === 'degF' ? 1.8 : 1 / 1.8);
    items.push(['Heating degree-days', `${format.number(hdd)} ${unitLabel(want)}·d`]);
  }
  if (isNum(c.design_temperature_99)) items.push(['Design temperature (99 %)', t(c.design_temperature_99)]);
  if (isNum(c.design_temperature_996)) items.push(['Design temperature (99.6 %)', t(c.design_temperature_996)]);
  const bp = result.demand?.balance_point;
  if (bp && isNum(bp.value)) items.push(['Balance point', t(convertTemperature(bp.value, bp.unit ?? unit, unit))]);
  if (isNum(result.demand?.ua_w_per_k)) {
    items.push(['Heat-loss coefficient', ws.settings.units === 'us'
      ? `${format.number(result.demand.ua_w_per_k / UA_W_PER_K['Btu/h/degF'])} Btu/h·°F` : `${format.number(result.demand.ua_w_per_k)} W/K`]);
  }
  const fit = result.demand?.fit;
  if (fit && isNum(fit.r2)) items.push(['Bills fit R²', format.fixed(fit.r2, 3)]);
  return h('div', { class: 'climate-summary', id: 'climate-summary' },
    h('dl', {}, items.flatMap(([k, v]) => [h('dt', { text: k }), h('dd', { text: v })])),
    h('button', { type: 'button', class: 'quiet', dataset: { action: 'climate-trace' }, text: 'How the climate and heat need were worked out' }));
}

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

function sweepSection(result, ws, ctx, analysis) {
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

function tornadoSection(result, ctx, analysis) {
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

/** The bins worth drawing: an hour or more a year, and a load to meet. */
const heatingBins = (bins) => bins.filter((b) => (b.hours ?? 0) >= 1 && (b.load_kw ?? 0) > 0);

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
async function fillBinsChart(details, state, ctx) {
  const slot = details.querySelector('.bins-chart-body');
  if (!slot || slot.dataset.key === state.key) return;
  slot.dataset.key = state.key;
  const key = state.key;
  const option = (await accountOf(state, ctx, details.dataset.option))?.option;
  if (state.key !== key || !state.result) return;
  slot.replaceChildren(Array.isArray(option?.bins) && option.bins.length
    ? binsChartOf(option, state.result, ctx.store.state, ctx)
    : h('p', { class: 'hint', text: 'The chart could not be worked out for these entries.' }));
}

function binsSection(result, ws, ctx, state) {
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

function billsSection(result, ctx, ws) {
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

/** The price Monte Carlo: inputs live on the Fuels panel; here its progress, Cancel, and results. */
function uncertaintySection(result, ws, ctx, mc) {
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

const TAB_NAMES = { house: 'House', fuels: 'Fuels', systems: 'Systems' };

/** A note from the calculation in words: the option it is about named first, units as people write them. */
export function warningText(w, ws) {
  const message = plainUnits(w?.message ?? String(w));
  // the path's index is the scenario's option (one per system of the workspace), not the result's:
  // an option with an error is left out of the result's list
  const m = /^\/options\/(\d+)(\/|$)/.exec(w?.path ?? '');
  const system = m ? ws?.systems?.[Number(m[1])] : null;
  return system ? `${system.label || system.id}: ${message}` : message;
}

function cautionsBlock(result) {
  const cautions = result.cautions ?? [];
  return h('section', { class: 'cautions', id: 'verdict-cautions', 'aria-labelledby': 'cautions-title' },
    h('h3', { id: 'cautions-title', text: 'Before deciding' }),
    h('ul', {}, cautions.map((c) => h('li', { text: c }))));
}

// Sections that depend only on the analyses, the price draws or the bins are kept
// between repaints while what they show is unchanged, so a price edit repaints
// the verdict without rebuilding every chart (the charts follow when the core's
// new analyses arrive).
const kept = new Map();
function keep(name, key, build) {
  const hit = kept.get(name);
  if (hit && hit.key.length === key.length && hit.key.every((k, i) => k === key[i])) return hit.node;
  const node = build();
  kept.set(name, { key, node });
  return node;
}

/**
 * Renders the verdict from the latest result. `state` = {result, errors (unplaced), fields (listed by showFieldErrors), by,
 * analysis: {state, fuelIndex, sweep, breakEven, pair, tornado}, mc: {state, fraction, uncertainty, stale}}.
 * `options.kiosk` leaves out the file and print actions.
 */
export function renderVerdict(container, ctx, state, { kiosk = false } = {}) {
  const ws = ctx.store.state;
  const { result } = state;
  const parts = [];
  const errors = state.errors ?? [];
  if (errors.length) {
    parts.push(h('div', { class: 'problems', id: 'verdict-errors', role: 'alert' },
      h('p', { text: 'Some entries need attention:' }),
      h('ul', {}, errors.map((e) => h('li', { text: e.path ? `${e.path}: ${e.message}` : e.message })))));
  }
  const fields = state.fields ?? [];
  const stale = fields.filter((f) => f.local);
  container.classList.toggle('stale', stale.length > 0 && Boolean(result));
  if (stale.length && result) {
    parts.push(h('p', { class: 'stale-note', id: 'verdict-stale', role: 'status', text: `Out of date: ${stale.map((f) => f.label).join(', ')} `
      + 'cannot be read, so the figures below are for the earlier entries.' }));
  }
  if (fields.length) {
    parts.push(h('div', { class: 'problems', id: 'verdict-field-errors' },
      h('p', { text: fields.length === 1 ? '1 field needs attention:' : `${fields.length} fields need attention:` }),
      h('ul', {}, fields.map((f) => h('li', {},
        h('button', { type: 'button', class: 'link', dataset: { action: 'jump-to-field', path: f.path },
          text: `${f.label} (${TAB_NAMES[f.tab] ?? f.tab})` }),
        h('span', { text: ` — ${f.message}` }))))));
  }
  if (!result) {
    container.replaceChildren(...parts, h('p', { class: 'status', text: 'Add a fuel and a system to see the verdict.' }));
    return;
  }
  const hasLife = hasLifeCycle(result, ws);
  const by = hasLife ? state.by : 'annual';
  if ((result.options ?? []).length && !(result.errors ?? []).length) {
    parts.push(headline(result, ws, ctx, by));
    if (hasLife) {
      parts.push(h('div', { class: 'segmented', role: 'group', 'aria-label': 'Rank by' },
        h('button', { type: 'button', dataset: { action: 'rank-by', by: 'annual' }, 'aria-pressed': String(by === 'annual'), text: 'Rank by cost per year' }),
        h('button', { type: 'button', dataset: { action: 'rank-by', by: 'life' }, 'aria-pressed': String(by === 'life'), text: 'Rank by life-cycle cost' })));
    }
    parts.push(table(result, ws, ctx, by));
    if (!kiosk && state.key) {
      parts.push(keep('what-if', [state.key, by, ctx.format, result], () => whatIfCard(state, result, ctx, by === 'life' ? 'life-cycle' : 'annual')));
    }
    parts.push(h('p', { class: 'hint', text: 'Tap any number to see how it was worked out and which data it used.' }));
    parts.push(equipmentSection(result, ws, ctx, by));
    parts.push(climateSummary(result, ws, ctx));
    parts.push(economicsSection(result, ws, ctx));
    const costRows = rankedOptions(result, by).map((o) => ({ id: o.id, label: o.label ?? o.id, energy: o.energy_cost, fixed: o.fixed_cost }));
    parts.push(h('section', { class: 'chart-card', id: 'chart-cost' }, h('h3', { text: 'Cost per year' }),
      costBars(costRows, { money: ctx.format.money, title: 'Annual cost: energy and fixed charges' })));
    const labels = (result.options ?? []).map((o) => `${o.id}\u0000${o.label ?? ''}`).join('\u0001');
    const fuels = ws.fuels.map((f) => fuelName(f, ctx.catalog)).join('\u0001');
    const shown = [ctx.format, ws.settings.currency, ws.settings.units, labels];
    if (ws.fuels.length && !kiosk) parts.push(keep('sweep', [state.analysis, fuels, ...shown], () => sweepSection(result, ws, ctx, state.analysis)));
    if (!kiosk) parts.push(keep('tornado', [state.analysis, ...shown], () => tornadoSection(result, ctx, state.analysis)));
    parts.push(keep('bins', [state.key, result, ...shown], () => binsSection(result, ws, ctx, state)));
    parts.push(billsSection(result, ctx, ws));
    if (!kiosk) parts.push(keep('draws', [state.mc, state.mc?.state, ws.uncertainty?.enabled, ...shown], () => uncertaintySection(result, ws, ctx, state.mc)));
  }
  // without the costs over the years the core's economics defaults are not the user's concern
  const warnings = (result.warnings ?? []).filter((w) => ws.economics?.enabled || w.path !== '/economics');
  if (warnings.length) {
    parts.push(h('div', { class: 'warnings', id: 'verdict-warnings' }, h('h3', { text: 'Notes from the calculation' }),
      h('ul', {}, warnings.map((w) => h('li', { text: warningText(w, ws) })))));
  }
  parts.push(cautionsBlock(result));
  if (!kiosk) {
    const paper = ws.settings.paper === 'a4' ? 'a4' : 'letter';
    parts.push(h('div', { class: 'card-actions' },
      h('button', { type: 'button', class: 'secondary', dataset: { action: 'export-csv' }, text: 'Download the table (CSV)' }),
      h('label', { class: 'pref', for: 'paper' }, h('span', { text: 'Paper' }),
        h('select', { id: 'paper' }, h('option', { value: 'letter', text: 'US Letter', selected: paper === 'letter' }),
          h('option', { value: 'a4', text: 'A4', selected: paper === 'a4' }))),
      h('button', { type: 'button', class: 'primary', dataset: { action: 'print' }, text: 'Print the quote sheet' })));
  }
  container.replaceChildren(...parts.filter(Boolean).flat());
  const bar = container.querySelector('#mc-progress');
  if (bar) bar.style.width = `${Math.round(100 * (state.mc?.fraction ?? 0))}%`;
}

// ---------------------------------------------------------------------------
// Traces of the values that are not one option's

function sweepTrace(state, ctx, button) {
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

function tornadoTrace(state, ctx, button) {
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

async function binsTrace(state, ctx, button) {
  const option = (await accountOf(state, ctx, button.dataset.option))?.option;
  if (!option) return;
  const { format } = ctx;
  const ws = ctx.store.state;
  const want = ws.settings.units === 'us' ? 'degF' : 'degC';
  const from = state.result.climate?.unit ?? ws.climate.unit ?? want;
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

function uncertaintyTrace(state, ctx, button) {
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

async function billsTrace(state, ctx) {
  openTrace({ title: 'Heat need from past bills', trace: await heatNeedTrace(state, ctx) });
}

/** Opens the heat need's trace: how the demand and the climate were worked out. */
export async function openHeatNeedTrace(state, ctx, title = 'Heat the house needs') {
  openTrace({ title, trace: await heatNeedTrace(state, ctx) });
}

/** Handles taps on the verdict's numbers, and draws a heat pump's chart when its disclosure opens. */
export function bindVerdict(container, ctx, getState) {
  container.addEventListener('toggle', (event) => {
    const details = event.target;
    if (!(details instanceof HTMLDetailsElement) || !details.classList.contains('bins-chart')) return;
    const state = getState();
    state.binsOpen ??= new Set();
    if (details.open) {
      state.binsOpen.add(details.dataset.option);
      fillBinsChart(details, state, ctx);
    } else {
      state.binsOpen.delete(details.dataset.option);
    }
  }, true);
  container.addEventListener('click', (event) => {
    const traced = event.target.closest('button[data-trace]');
    if (traced) {
      const state = getState();
      const kind = traced.dataset.trace;
      if (kind === 'sweep' || kind === 'sweep-all') sweepTrace(state, ctx, kind === 'sweep' ? traced : null);
      else if (kind === 'tornado') tornadoTrace(state, ctx, traced);
      else if (kind === 'bins') binsTrace(state, ctx, traced);
      else if (kind === 'uncertainty') uncertaintyTrace(state, ctx, traced);
      else if (kind === 'bills') billsTrace(state, ctx);
      return;
    }
    const button = event.target.closest('button.num');
    if (!button) return;
    const state = getState();
    if (button.dataset.key === 'annual_useful_heat') {
      openHeatNeedTrace(state, ctx);
      return;
    }
    const option = state.result?.options?.find((o) => o.id === button.dataset.option);
    if (option) showOptionTrace(state, option, ctx, button.dataset.key);
  });
}

