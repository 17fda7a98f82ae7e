// The verdict's summary sections: the headline with the saving against the system in the house now, the
// ranked table, the costs over the years, the equipment and charges beside the fuel, the climate in brief.
import { h } from '../dom.js';
import { displayValues, equipmentNotes, fuelUsedText, hasLifeCycle, lifeOf, paybackWords, rankedOptions, systemNowWords, years } from '../results.js';
import { co2In, convertTemperature, ENERGY_KWH, UA_W_PER_K, unitLabel } from '../units.js';
import { ECONOMIC_LABELS, isNum, numButton } from './verdict-numbers.js';

export function table(result, ws, ctx, by) {
  const { format } = ctx;
  const energyUnit = unitLabel(ws.settings.energy_unit);
  const massUnit = ws.settings.units === 'us' ? 'lb' : 'kg';
  const list = rankedOptions(result, by);
  const econ = hasLifeCycle(result, ws);
  const head = ['#', 'Option', 'Per year', `Energy per ${energyUnit} of heat`, 'Fuel used', `CO2e ${massUnit}/yr`];
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
      h('td', { dataset: { label: head[3] } }, numButton(option, 'cost_per_useful', v.cost_per_useful, format.price(v.cost_per_useful), `Energy cost per ${energyUnit} of useful heat (fixed charges are in the cost per year)`)),
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
export function economicsSection(result, ws, ctx) {
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
    ? `Against ${systemNowWords(baseline.label ?? baseline.id)}, over ${n ?? '—'} years at ${isNum(e.discount_rate) ? format.percent(e.discount_rate, 1) : '—'} a year, in ${basis}.`
    : `Over ${n ?? '—'} years at ${isNum(e.discount_rate) ? format.percent(e.discount_rate, 1) : '—'} a year, in ${basis}. Mark the system in the house now as existing to see savings and payback.`;
  return h('section', { class: 'chart-card', id: 'economics' }, h('h3', { text: 'Costs over the years' }),
    h('p', { class: 'hint', text: intro }),
    h('div', { class: 'table-wrap' }, h('table', { id: 'economics-table', class: 'ranked economics' },
      h('caption', { class: 'visually-hidden', text: 'Switching economics, ranked by life-cycle cost' }),
      h('thead', {}, h('tr', {}, head.map((t) => h('th', { scope: 'col', text: t })))),
      h('tbody', {}, rows))),
    e.convention ? h('p', { class: 'hint', text: `Convention: ${e.convention}.` }) : null);
}

export function headline(result, ws, ctx, by) {
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
    const now = systemNowWords(baseName);
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
export function equipmentSection(result, ws, ctx, by) {
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

export function climateSummary(result, ws, ctx) {
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
