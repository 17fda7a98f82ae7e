// Panel 4, the verdict: options ranked by annual cost (or life-cycle cost),
// cost per useful unit, CO2e, payback and NPV when the core gives them, the
// charts and the cautions. Every number is a button that opens its trace.
import { h } from '../dom.js';
import { binsChart, costBars, priceLines, rangeChart } from '../charts.js';
import { ENERGY_KWH, UA_W_PER_K, co2In, convertTemperature, unitLabel } from '../units.js';
import { fuelName } from './fuels.js';
import { openTrace } from './trace.js';

const isNum = (v) => typeof v === 'number' && Number.isFinite(v);

/** The values a verdict row shows, in the display units of `ws.settings`. */
export function displayValues(option, ws) {
  const energyUnit = ws.settings.energy_unit;
  const perUnit = ENERGY_KWH[energyUnit];
  return {
    annual_cost: option.annual_cost,
    energy_cost: option.energy_cost,
    fixed_cost: option.fixed_cost,
    cost_per_useful: option.cost_per_useful_kwh * perUnit,
    useful_heat: option.useful_heat_kwh / perUnit,
    fuel_quantity: option.fuel_quantity?.value,
    co2e: co2In(option.co2e_kg, ws.settings.units),
    lcoh: isNum(option.lcoh_per_kwh) ? option.lcoh_per_kwh * perUnit : undefined,
  };
}

function numButton(option, key, value, text, label) {
  return h('button', { type: 'button', class: 'num', dataset: { option: option.id, key, ...(isNum(value) ? { value: String(value) } : {}) },
    'aria-label': `${label}: ${text}. Show how it was worked out.`, text });
}

function showOptionTrace(option, ctx) {
  const lines = [];
  if (isNum(option.seasonal_cop)) lines.push(`seasonal COP ${ctx.format.number(option.seasonal_cop, 3)}`);
  openTrace({ title: option.label ?? option.id, subtitle: `${option.fuel_name ?? option.fuel}`, trace: [...(option.trace ?? []), ...lines], sources: option.sources ?? [] });
}

/** Rows of the ranked table, in rank order by `by` ('annual' or 'life'). */
export function rankedOptions(result, by) {
  const byId = new Map((result.options ?? []).map((o) => [o.id, o]));
  let list = (result.ranking ?? []).map((r) => byId.get(r.id)).filter(Boolean);
  if (!list.length) list = [...byId.values()];
  if (by === 'life' && list.every((o) => isNum(o.life_cycle_cost))) list = [...list].sort((a, b) => a.life_cycle_cost - b.life_cycle_cost);
  return list;
}

function payback(option, format) {
  if (isNum(option.simple_payback_years)) return `${format.number(option.simple_payback_years, 3)} years`;
  if (option.simple_payback_reason) return option.simple_payback_reason;
  return '—';
}

function table(result, ws, ctx, by) {
  const { format } = ctx;
  const energyUnit = unitLabel(ws.settings.energy_unit);
  const massUnit = ws.settings.units === 'us' ? 'lb' : 'kg';
  const list = rankedOptions(result, by);
  const econ = list.some((o) => 'npv' in o || 'life_cycle_cost' in o || 'simple_payback_years' in o);
  const head = ['#', 'Option', 'Per year', `Per ${energyUnit} of heat`, 'Fuel used', `CO2e ${massUnit}/yr`];
  if (econ) head.push('Payback', 'NPV', 'Life-cycle cost');
  const rows = list.map((option, i) => {
    const v = displayValues(option, ws);
    const hp = isNum(option.seasonal_cop)
      ? h('span', { class: 'sub', text: `seasonal COP ${format.number(option.seasonal_cop, 3)}${isNum(option.backup_share) ? `, backup ${format.percent(option.backup_share)}` : ''}` }) : null;
    const cells = [
      h('td', { class: 'rank', text: String(i + 1) }),
      h('th', { scope: 'row', class: 'opt' }, h('span', { class: 'swatch', dataset: { i: String(i % 8) } }),
        h('span', { class: 'name', text: option.label ?? option.id }),
        h('span', { class: 'sub', text: option.fuel_name ?? option.fuel }), hp,
        option.existing ? h('span', { class: 'badge existing', text: 'existing' }) : null),
      h('td', {}, numButton(option, 'annual_cost', v.annual_cost, format.money(v.annual_cost), 'Annual cost'),
        h('span', { class: 'sub', text: `${format.money(v.energy_cost)} energy + ${format.money(v.fixed_cost)} fixed` })),
      h('td', {}, numButton(option, 'cost_per_useful', v.cost_per_useful, format.price(v.cost_per_useful), `Cost per ${energyUnit} of useful heat`)),
      h('td', {}, numButton(option, 'fuel_quantity', v.fuel_quantity,
        `${format.number(v.fuel_quantity)} ${unitLabel(option.fuel_quantity?.unit ?? '')}`, 'Fuel used per year')),
      h('td', {}, numButton(option, 'co2e', v.co2e, format.number(v.co2e, 3), `CO2e ${massUnit} per year`)),
    ];
    if (econ) {
      cells.push(
        h('td', {}, numButton(option, 'simple_payback_years', option.simple_payback_years, payback(option, format), 'Simple payback')),
        h('td', {}, numButton(option, 'npv', option.npv, isNum(option.npv) ? format.money(option.npv) : '—', 'Net present value')),
        h('td', {}, numButton(option, 'life_cycle_cost', option.life_cycle_cost, isNum(option.life_cycle_cost) ? format.money(option.life_cycle_cost) : '—', 'Life-cycle cost')));
    }
    return h('tr', { dataset: { option: option.id, rank: String(i + 1) } }, cells);
  });
  return h('div', { class: 'table-wrap' }, h('table', { id: 'verdict-table', class: 'ranked' },
    h('caption', { class: 'visually-hidden', text: 'Options ranked by cost' }),
    h('thead', {}, h('tr', {}, head.map((t) => h('th', { scope: 'col', text: t })))),
    h('tbody', {}, rows)));
}

function headline(result, ws, ctx, by) {
  const { format } = ctx;
  const list = rankedOptions(result, by);
  if (!list.length) return null;
  const best = list[0];
  const greenest = [...list].sort((a, b) => a.co2e_kg - b.co2e_kg)[0];
  const massUnit = ws.settings.units === 'us' ? 'lb' : 'kg';
  const lines = [h('p', { class: 'big' }, by === 'life' ? 'Lowest cost over the years: ' : 'Cheapest to run: ',
    h('strong', { id: 'best-option', text: best.label ?? best.id }), ' — ',
    h('span', { id: 'best-cost', text: by === 'life' ? format.money(best.life_cycle_cost) : `${format.money(best.annual_cost)} a year` }))];
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

/** Break-even points between options using the swept fuel and the others. */
export function breakEvens(sweep, result, ws, catalog) {
  const labels = new Map((result.options ?? []).map((o) => [o.id, o.label ?? o.id]));
  const marks = [];
  const swept = new Set(sweep.optionIds);
  const ids = Object.keys(sweep.points[0]?.annual_cost ?? {});
  for (const a of ids.filter((id) => swept.has(id))) {
    for (const b of ids.filter((id) => !swept.has(id))) {
      for (let k = 1; k < sweep.points.length; k++) {
        const p0 = sweep.points[k - 1];
        const p1 = sweep.points[k];
        const d0 = p0.annual_cost[a] - p0.annual_cost[b];
        const d1 = p1.annual_cost[a] - p1.annual_cost[b];
        if (d0 === 0 || d0 * d1 < 0) {
          const f = d0 === 0 ? 0 : d0 / (d0 - d1);
          const x = p0.price + f * (p1.price - p0.price);
          const y = p0.annual_cost[a] + f * (p1.annual_cost[a] - p0.annual_cost[a]);
          marks.push({ a, b, x, y, label: `${labels.get(a)} and ${labels.get(b)} cost the same at this price` });
          break;
        }
      }
    }
  }
  return marks;
}

function sweepSection(result, ws, ctx, sweep) {
  const { format } = ctx;
  const choices = ws.fuels.map((f, i) => h('option', { value: String(i), text: fuelName(f, ctx.catalog), selected: sweep && sweep.fuelIndex === i }));
  const control = h('div', { class: 'field inline' }, h('label', { for: 'sweep-fuel', text: 'Vary the price of' }),
    h('select', { id: 'sweep-fuel', dataset: { action: 'sweep-fuel' } }, choices));
  const slot = h('div', { class: 'chart-slot', id: 'chart-sweep' });
  const notes = h('ul', { class: 'break-evens', id: 'break-evens' });
  if (sweep?.points?.length) {
    const entry = ws.fuels[sweep.fuelIndex];
    const per = unitLabel(entry?.price?.per ?? '');
    const labels = new Map((result.options ?? []).map((o) => [o.id, o.label ?? o.id]));
    const order = (result.options ?? []).map((o) => o.id);
    const series = order.map((id) => ({ id, label: labels.get(id), swept: sweep.optionIds.includes(id),
      points: sweep.points.map((p) => [p.price, p.annual_cost[id]]) }));
    const marks = breakEvens(sweep, result, ws, ctx.catalog);
    slot.append(priceLines(series, { marks, current: entry?.price?.amount, money: format.money, formatX: format.price,
      xLabel: `price of ${fuelName(entry, ctx.catalog)} (${ws.settings.currency} per ${per})`, title: 'Annual cost against one price' }));
    const legend = h('ul', { class: 'legend' }, series.map((sr, i) => h('li', {}, h('span', { class: 'swatch line', dataset: { i: String(i % 8) } }), sr.label)));
    slot.append(legend);
    for (const m of marks) {
      notes.append(h('li', { dataset: { a: m.a, b: m.b, price: String(m.x) } },
        `${labels.get(m.a)} costs the same as ${labels.get(m.b)} at ${format.price(m.x)} per ${per} (${format.money(m.y)} a year).`));
    }
    if (!marks.length) notes.append(h('li', { text: 'No break-even point between 0 and twice today\'s price.' }));
  } else {
    slot.append(h('p', { class: 'status', text: 'Working out…' }));
  }
  return h('section', { class: 'chart-card' }, h('h3', { text: 'If this price changes' }), control, slot, notes);
}

function binsSection(result, ws, ctx) {
  const hp = (result.options ?? []).filter((o) => Array.isArray(o.bins) && o.bins.length);
  if (!hp.length) return null;
  const want = ws.settings.units === 'us' ? 'degF' : 'degC';
  const from = result.climate?.unit ?? ws.climate.unit ?? want;
  return hp.map((o) => h('section', { class: 'chart-card', id: `bins-${o.id}` },
    h('h3', { text: `${o.label ?? o.id}: performance by outdoor temperature` }),
    binsChart(o.bins, { tempLabel: unitLabel(want), toTemp: (t) => convertTemperature(t, from, want), number: (v) => ctx.format.number(v, 3),
      title: `Heat pump ${o.label ?? o.id} over temperature bins` }),
    h('p', { class: 'hint', text: [
      isNum(o.seasonal_cop) ? `Seasonal COP ${ctx.format.number(o.seasonal_cop, 3)}.` : '',
      isNum(o.backup_share) ? `Backup supplies ${ctx.format.percent(o.backup_share)} of the heat.` : '',
      isNum(o.hours_below_balance_point) ? `${ctx.format.number(o.hours_below_balance_point)} hours a year below the balance point.` : '',
      o.changeover !== undefined && o.changeover !== null
        ? `Changeover: ${typeof o.changeover === 'object' ? `${ctx.format.number(o.changeover.value, 3)} ${unitLabel(o.changeover.unit ?? '')}` : o.changeover}.` : '',
    ].filter(Boolean).join(' ') })));
}

function uncertaintySection(result, ctx) {
  const u = result.uncertainty;
  if (!u || !Array.isArray(u.options) || !u.options.length) return null;
  const labels = new Map((result.options ?? []).map((o) => [o.id, o.label ?? o.id]));
  const rows = u.options.filter((o) => isNum(o.annual_cost_p10)).map((o) => ({ label: labels.get(o.id) ?? o.id,
    p10: o.annual_cost_p10, p50: o.annual_cost_p50, p90: o.annual_cost_p90,
    note: isNum(o.p_cheapest) ? `cheapest ${ctx.format.percent(o.p_cheapest)}` : '' }));
  if (!rows.length) return null;
  return h('section', { class: 'chart-card', id: 'chart-uncertainty' },
    h('h3', { text: 'How sure is the ranking?' }),
    rangeChart(rows, { money: ctx.format.money, title: 'Annual cost, 10th to 90th percentile' }),
    h('p', { class: 'hint', text: `Bars span the 10th to 90th percentile of ${ctx.format.number(u.draws)} random price draws; the tick is the median.` }));
}

function cautionsBlock(result) {
  const cautions = result.cautions ?? [];
  return h('section', { class: 'cautions', id: 'verdict-cautions', 'aria-labelledby': 'cautions-title' },
    h('h3', { id: 'cautions-title', text: 'Before deciding' }),
    h('ul', {}, cautions.map((c) => h('li', { text: c }))));
}

/** Renders the verdict from the latest result. `state` = {result, errors (unplaced), sweep, by}. */
export function renderVerdict(container, ctx, state) {
  const ws = ctx.store.state;
  const { result } = state;
  const parts = [];
  const errors = state.errors ?? [];
  if (errors.length) {
    parts.push(h('div', { class: 'problems', id: 'verdict-errors', role: 'alert' },
      h('p', { text: 'Some entries need attention:' }),
      h('ul', {}, errors.map((e) => h('li', { text: e.path ? `${e.path}: ${e.message}` : e.message })))));
  }
  if (state.fieldErrorCount) {
    parts.push(h('p', { class: 'problems', id: 'verdict-field-errors', text: state.fieldErrorCount === 1
      ? '1 field needs attention: see the message next to it.' : `${state.fieldErrorCount} fields need attention: see the messages next to them.` }));
  }
  if (!result) {
    container.replaceChildren(...parts, h('p', { class: 'status', text: 'Add a fuel and a system to see the verdict.' }));
    return;
  }
  const hasLife = (result.options ?? []).length > 0 && (result.options ?? []).every((o) => isNum(o.life_cycle_cost));
  const by = hasLife ? state.by : 'annual';
  if ((result.options ?? []).length && !(result.errors ?? []).length) {
    parts.push(headline(result, ws, ctx, by));
    if (hasLife) {
      parts.push(h('div', { class: 'segmented', role: 'group', 'aria-label': 'Rank by' },
        h('button', { type: 'button', dataset: { action: 'rank-by', by: 'annual' }, 'aria-pressed': String(by === 'annual'), text: 'Rank by cost per year' }),
        h('button', { type: 'button', dataset: { action: 'rank-by', by: 'life' }, 'aria-pressed': String(by === 'life'), text: 'Rank by life-cycle cost' })));
    }
    parts.push(table(result, ws, ctx, by));
    parts.push(h('p', { class: 'hint', text: 'Tap any number to see how it was worked out and which data it used.' }));
    parts.push(climateSummary(result, ws, ctx));
    const costRows = rankedOptions(result, by).map((o) => ({ id: o.id, label: o.label ?? o.id, energy: o.energy_cost, fixed: o.fixed_cost }));
    parts.push(h('section', { class: 'chart-card', id: 'chart-cost' }, h('h3', { text: 'Cost per year' }),
      costBars(costRows, { money: ctx.format.money, title: 'Annual cost: energy and fixed charges' })));
    if (ws.fuels.length) parts.push(sweepSection(result, ws, ctx, state.sweep));
    parts.push(binsSection(result, ws, ctx));
    parts.push(uncertaintySection(result, ctx));
  }
  const warnings = result.warnings ?? [];
  if (warnings.length) {
    parts.push(h('div', { class: 'warnings', id: 'verdict-warnings' }, h('h3', { text: 'Notes from the calculation' }),
      h('ul', {}, warnings.map((w) => h('li', { text: w.message ?? String(w) })))));
  }
  parts.push(cautionsBlock(result));
  const paper = ws.settings.paper === 'a4' ? 'a4' : 'letter';
  parts.push(h('div', { class: 'card-actions' },
    h('button', { type: 'button', class: 'secondary', dataset: { action: 'export-csv' }, text: 'Download the table (CSV)' }),
    h('label', { class: 'pref', for: 'paper' }, h('span', { text: 'Paper' }),
      h('select', { id: 'paper' }, h('option', { value: 'letter', text: 'US Letter', selected: paper === 'letter' }),
        h('option', { value: 'a4', text: 'A4', selected: paper === 'a4' }))),
    h('button', { type: 'button', class: 'primary', dataset: { action: 'print' }, text: 'Print the quote sheet' })));
  container.replaceChildren(...parts.filter(Boolean).flat());
}

/** Handles taps on the verdict's numbers. */
export function bindVerdict(container, ctx, getState) {
  container.addEventListener('click', (event) => {
    const button = event.target.closest('button.num');
    if (!button) return;
    const { result } = getState();
    if (button.dataset.key === 'annual_useful_heat') {
      openTrace({ title: 'Heat the house needs', trace: [...(result?.demand?.trace ?? []), ...(result?.climate?.trace ?? [])] });
      return;
    }
    const option = result?.options?.find((o) => o.id === button.dataset.option);
    if (option) showOptionTrace(option, ctx);
  });
}

/** The results table as CSV text (numbers with a point, in the display units). */
export function resultsCsv(result, ws, by = 'annual') {
  const energyUnit = ws.settings.energy_unit;
  const massUnit = ws.settings.units === 'us' ? 'lb' : 'kg';
  const currency = ws.settings.currency;
  const list = rankedOptions(result, by);
  const econ = list.some((o) => 'npv' in o || 'life_cycle_cost' in o);
  const header = ['rank', 'id', 'option', 'fuel', `annual cost (${currency})`, `energy cost (${currency})`, `fixed cost (${currency})`,
    `cost per useful ${energyUnit} (${currency})`, 'fuel used', 'fuel unit', `CO2e (${massUnit}/year)`];
  if (econ) header.push('simple payback (years)', `NPV (${currency})`, `life-cycle cost (${currency})`);
  const quote = (v) => {
    const text = v === undefined || v === null ? '' : String(v);
    return /[",\n\r]/.test(text) || /^[=+\-@]/.test(text) ? `"${(/^[=+\-@]/.test(text) && !/^-?\d/.test(text) ? `'${text}` : text).replaceAll('"', '""')}"` : text;
  };
  const lines = [header.map(quote).join(',')];
  list.forEach((o, i) => {
    const v = displayValues(o, ws);
    const row = [i + 1, o.id, o.label ?? o.id, o.fuel_name ?? o.fuel, v.annual_cost, v.energy_cost, v.fixed_cost, v.cost_per_useful,
      v.fuel_quantity, o.fuel_quantity?.unit, v.co2e];
    if (econ) row.push(o.simple_payback_years ?? '', o.npv ?? '', o.life_cycle_cost ?? '');
    lines.push(row.map(quote).join(','));
  });
  return `${lines.join('\r\n')}\r\n`;
}
