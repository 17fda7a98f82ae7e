// The quote sheet: a print-only page (@media print, A4 or US Letter) with the
// customer and site, date, assumptions, the results table, the annual-cost
// chart, what could change the ranking (the break-even price of the two leading
// options, the price draws), the cautions and a disclaimer. Printed or saved as PDF by the browser.
import { h } from './dom.js';
import { costBars } from './charts.js';
import { asSentence, clockTime } from './format.js';
import { fuelName } from './views/fuels.js';
import { KIND_NAMES } from './views/systems.js';
import { equipmentNotes, displayValues, fuelUsedText, lifeOf, paybackWords, rankedOptions } from './results.js';
import { FUEL_BURNING_KINDS, STAGES, auxiliaryDefault, equipmentElectricityPrice, powerText } from './equipment.js';
import { HEAT_PUMP_KINDS } from './scenario.js';
import { optionPrice } from './profile.js';
import { ENERGY_KWH, unitLabel } from './units.js';
import { servicesTable } from './views/verdict-services.js';

const DISCLAIMER = 'This sheet compares running costs and emissions from the figures entered on the day. It is an estimate, '
  + 'not an offer to supply fuel or a guarantee of savings, and not an engineering design. Actual costs depend on weather, '
  + 'prices, the installation and how the house is used.';

function assumptions(ws, result, ctx) {
  const { format } = ctx;
  const items = [];
  const d = ws.demand;
  if (result?.demand && Number.isFinite(result.demand.annual_useful_heat_kwh)) {
    const unit = ws.settings.energy_unit;
    items.push(['Heat the house needs', `${format.number(result.demand.annual_useful_heat_kwh / ENERGY_KWH[unit])} ${unitLabel(unit)} a year (${
      d.method === 'direct' ? 'given' : d.method === 'heat-loss' ? 'from the heat loss of the house' : 'from past bills'})`]);
  }
  const water = d.water_heating;
  if (water?.enabled && result?.demand && Number.isFinite(result.demand.water_heating_kwh)) {
    const unit = ws.settings.energy_unit;
    const heaterWords = (x) => `${x.kind.replaceAll('-', ' ')}${x.fuel ? ` on ${fuelName({ fuel: x.fuel }, ctx.catalog) || x.fuel}` : ''}${
      Number.isFinite(x.uef) ? `, UEF ${format.number(x.uef)}` : ''}${x.location === 'conditioned' ? ', inside the heated space' : ''}`;
    const own = ws.systems.filter((sys) => sys.water_heater?.mode === 'own' && sys.water_heater.kind)
      .map((sys) => `${sys.label || sys.id} comes with its own: ${heaterWords(sys.water_heater)}`);
    const heater = [water.heater?.kind ? `water heater in the house now: ${heaterWords(water.heater)}` : null, ...own].filter(Boolean)
      .map((text) => `; ${text}`).join('');
    items.push(['Hot water', `${format.number(result.demand.water_heating_kwh / ENERGY_KWH[unit])} ${unitLabel(unit)} a year${
      water.mode !== 'annual' && Number.isFinite(water.people) ? ` for ${format.number(water.people)} people` : ''}${heater}`]);
  }
  if (result?.climate && Number.isFinite(result.climate.annual_hdd)) {
    items.push(['Climate', `${format.number(result.climate.annual_hdd)} heating degree-days (${unitLabel(result.climate.unit ?? ws.climate.unit)}·d)`]);
  }
  for (const entry of ws.fuels) {
    const charges = (entry.fixed_charges ?? []).map((c) => (c.amount_per_month !== undefined
      ? `${format.price(c.amount_per_month)} a month` : `${format.price(c.amount_per_year)} a year`)).join(', ');
    const used = ws.systems.some((sys) => sys.fuel_key === entry.key);
    const tou = entry.price?.time_of_use ? (entry.price.schedule ?? []) : null;
    const price = !used ? 'no system here burns it' : tou
      ? `by time of use: ${tou.map((r) => `${r.name} ${format.price(r.amount)} per kWh (${clockTime(r.from)}–${clockTime(r.to)}${r.days && r.days !== 'all' ? `, ${r.days}` : ''}${r.months_text ? `, months ${r.months_text}` : ''})`).join('; ')}`
      : `${format.price(entry.price?.amount)} per ${unitLabel(entry.price?.per ?? '')}`;
    const kept = entry.keep_service ? '; the service is kept for other appliances' : '';
    items.push([fuelName(entry, ctx.catalog), `${price}${charges ? `; fixed ${charges}` : ''}${kept}`]);
  }
  for (const sys of ws.systems) {
    const s = sys.system ?? {};
    const eff = s.efficiency;
    const parts = [`${KIND_NAMES[s.kind] ?? s.kind}${eff?.value !== undefined ? `, ${format.number(eff.value)} ${eff.rating}` : ''}`];
    if (HEAT_PUMP_KINDS.includes(s.kind) && s.stages) parts.push(`${STAGES.find(([id]) => id === s.stages)?.[1]?.toLowerCase() ?? s.stages} compressor`);
    if (FUEL_BURNING_KINDS.includes(s.kind)) {
      if (typeof s.capacity?.value === 'number') parts.push(`output ${powerText(s.capacity, format)}`);
      const entry = ws.fuels.find((f) => f.key === sys.fuel_key);
      const aux = typeof s.auxiliary_electricity?.value === 'number' ? s.auxiliary_electricity
        : auxiliaryDefault(s, typeof entry?.fuel === 'string' ? entry.fuel : '', ctx.catalog);
      if (aux) {
        parts.push(`its own electricity ${format.number(aux.value)} ${aux.unit === 'W' ? 'W while the burner runs' : 'kWh a year'}${
          aux === s.auxiliary_electricity ? '' : ' (typical)'}`);
      }
    }
    items.push([sys.label || sys.id, parts.join(', ')]);
  }
  const electricity = equipmentElectricityPrice(ws);
  if (electricity.from === 'typed' && ws.systems.some((sys) => FUEL_BURNING_KINDS.includes(sys.system?.kind))) {
    items.push(['Electricity for the equipment', `${format.price(electricity.amount)} per kWh`]);
  }
  items.push(['Emissions', `CO2e with IPCC ${ws.settings.gwp ?? 'AR5'} warming potentials; electricity ${
    ws.settings.electricity_co2e_kg_per_kwh ?? result?.settings?.electricity_co2e_kg_per_kwh ?? '—'} kg CO2e/kWh`]);
  return h('dl', { class: 'assumptions' }, items.flatMap(([k, v]) => [h('dt', { text: k }), h('dd', { text: v })]));
}

function resultsTable(ws, result, ctx) {
  const { format } = ctx;
  const energyUnit = unitLabel(ws.settings.energy_unit);
  const massUnit = ws.settings.units === 'us' ? 'lb' : 'kg';
  const list = rankedOptions(result, 'annual');
  const econ = Boolean(ws.economics?.enabled) && list.some((o) => Number.isFinite(o.life_cycle_cost));
  const head = ['#', 'Option', 'Per year', `Energy per ${energyUnit}`, 'Fuel used', `CO2e ${massUnit}/yr`, ...(econ ? ['Payback', 'Life-cycle cost'] : [])];
  return h('table', { class: 'print-table' },
    h('thead', {}, h('tr', {}, head.map((t) => h('th', { scope: 'col', text: t })))),
    h('tbody', {}, list.map((o, i) => {
      const v = displayValues(o, ws);
      return h('tr', {}, h('td', { text: String(i + 1) }), h('td', { text: o.label ?? o.id }), h('td', { text: format.money(v.annual_cost) }),
        h('td', { text: format.price(v.cost_per_useful) }), h('td', { text: fuelUsedText(o, v, format) }),
        h('td', { text: format.number(v.co2e, 3) }),
        ...(econ ? [h('td', { text: paybackWords(o, { lifeYears: lifeOf(ws, o), studyYears: result.economics?.analysis_years,
          baselineId: result.economics?.baseline, format }) ?? 'the system now' }),
          h('td', { text: format.money(o.life_cycle_cost) })] : []));
    })),
    h('tfoot', {}, h('tr', {}, h('td', { colspan: String(head.length), class: 'note',
      text: `Energy per ${energyUnit}: the fuel and electricity a unit of heat delivered takes; fixed charges are in the cost per year.` }))));
}

/** The contractor's block: logo, name, address, phone, e-mail and licence number (from the quote's copy of the profile). */
function companyBlock(q) {
  const c = q.company ?? {};
  const contact = [c.phone, c.email].filter(Boolean).join(' · ');
  return h('div', { class: 'company', id: 'sheet-company' },
    c.logo ? h('img', { class: 'company-logo', src: c.logo, alt: c.name ? `${c.name} logo` : 'Logo' }) : null,
    h('div', {},
      // without a company or a name the sheet's title heads it alone (not twice)
      c.name || q.prepared_by ? h('p', { class: 'company-name', text: c.name || q.prepared_by }) : null,
      c.address ? h('p', { text: c.address }) : null,
      contact ? h('p', { text: contact }) : null,
      c.licence ? h('p', { id: 'sheet-licence', text: `Licence ${c.licence}` }) : null));
}

/** Each option's price as quoted: make and model, installed price, incentives, net price and the monthly payment of the loan offered. */
function pricesSection(ws, result, ctx) {
  const { format } = ctx;
  if (!ws.economics?.enabled) return null;
  const financing = ws.quote?.financing;
  const rows = rankedOptions(result, 'annual').map((o) => {
    const sys = ws.systems.find((s) => s.id === o.id);
    const price = sys && !sys.existing ? optionPrice(sys, financing) : null;
    return price ? { o, sys, price } : null;
  }).filter(Boolean);
  if (!rows.length) return null;
  const loan = rows.some((r) => Number.isFinite(r.price.monthly));
  const head = ['Option', 'Installed price', 'Incentives', 'Net price', ...(loan ? ['Monthly payment'] : [])];
  return h('section', { id: 'sheet-prices' }, h('h2', { text: 'What each option costs to install' }),
    h('table', { class: 'print-table prices' },
      h('thead', {}, h('tr', {}, head.map((t) => h('th', { scope: 'col', text: t })))),
      h('tbody', {}, rows.map(({ o, sys, price }) => h('tr', {},
        h('td', {}, h('span', { text: o.label ?? o.id }), sys.equipment ? h('span', { class: 'model', text: sys.equipment }) : null),
        h('td', { text: format.money(price.installed) }),
        h('td', { text: price.incentives ? `−${format.money(price.incentives)}` : '—' }),
        h('td', { class: 'net', text: format.money(price.net) }),
        ...(loan ? [h('td', { text: Number.isFinite(price.monthly) ? `${format.price(price.monthly)} a month` : '—' })] : []))))),
    loan ? h('p', { class: 'hint', text: `Monthly payment on the net price for a loan at ${format.percent(financing.rate, 2)} a year over `
      + `${format.number(financing.years)} years (standard amortization), subject to the lender's approval.` }) : null);
}

/** The terms and the lines where the customer accepts an option and both sides sign. */
function acceptance(q) {
  const line = (label) => h('div', { class: 'sign-line' }, h('span', { class: 'rule' }), h('span', { class: 'sign-label', text: label }));
  return h('section', { class: 'acceptance', id: 'sheet-acceptance' }, h('h2', { text: 'Acceptance' }),
    q.terms ? h('p', { class: 'terms', text: q.terms }) : null,
    h('div', { class: 'sign-grid' }, line('Option chosen'), line('Date'), line('Customer signature'), line('Date'),
      line(`For ${q.company?.name || q.prepared_by || 'the contractor'}`), line('Date')),
    h('p', { class: 'disclaimer', text: DISCLAIMER }));
}

/** What could change the ranking: the break-even price of the two leading options and the price draws. */
function sensitivity(result, ctx, { breakEven, draws }) {
  const lines = [];
  if (breakEven && !(breakEven.errors ?? []).length) lines.push(asSentence(breakEven.break_even ? breakEven.statement : breakEven.reason));
  const best = draws?.options?.length ? [...draws.options].sort((a, b) => (b.p_cheapest ?? 0) - (a.p_cheapest ?? 0))[0] : null;
  if (best && draws.draws > 0) {
    const label = result.options.find((o) => o.id === best.id)?.label ?? best.id;
    lines.push(`In ${ctx.format.number(draws.draws)} random draws of the fuel prices, ${label} had the lowest life-cycle cost `
      + `${ctx.format.percent(best.p_cheapest, 1)} of the time.`);
  }
  return lines.length ? h('section', { id: 'sheet-sensitivity' }, h('h2', { text: 'What could change the ranking' }),
    h('ul', {}, lines.map((text) => h('li', { text })))) : null;
}

/**
 * Rebuilds the quote sheet into `sheet` from the workspace and the latest result; `extra` carries the
 * break-even answer and the price draws when they belong to that result.
 */
export function renderQuoteSheet(sheet, ctx, result, extra = {}) {
  const ws = ctx.store.state;
  const { format } = ctx;
  const q = ws.quote;
  const parts = [
    h('header', { class: 'sheet-header' }, companyBlock(q),
      h('dl', { class: 'who', id: 'sheet-quote' },
        q.number ? [h('dt', { text: 'Quote' }), h('dd', { id: 'sheet-number', text: q.number })] : null,
        h('dt', { text: 'Date' }), h('dd', { text: q.date ? format.date(q.date) : '—' }),
        q.valid_until ? [h('dt', { text: 'Prices hold until' }), h('dd', { id: 'sheet-valid-until', text: format.date(q.valid_until) })] : null,
        h('dt', { text: 'Prepared by' }), h('dd', { text: q.prepared_by || '—' }))),
    h('section', { class: 'sheet-customer' },
      h('h1', { text: ws.title || 'Heating cost comparison' }),
      h('dl', { class: 'who' },
        h('dt', { text: 'Customer' }), h('dd', { id: 'sheet-customer', text: q.customer || '—' }),
        h('dt', { text: 'Site' }), h('dd', { id: 'sheet-site', text: q.site || '—' }))),
  ];
  if (result?.options?.length && !(result.errors ?? []).length) {
    parts.push(h('section', {}, h('h2', { text: 'Results' }), resultsTable(ws, result, ctx)));
    const services = servicesTable(result, ctx, 'annual', 'sheet-services-table');
    if (services) {
      services.classList.add('print-table');
      parts.push(h('section', { id: 'sheet-services' }, h('h2', { text: 'Space heating and hot water' }), services));
    }
    const prices = pricesSection(ws, result, ctx);
    if (prices) parts.push(prices);
    const rows = rankedOptions(result, 'annual').map((o) => ({ id: o.id, label: o.label ?? o.id, energy: o.energy_cost, fixed: o.fixed_cost }));
    parts.push(h('section', { class: 'sheet-chart' }, h('h2', { text: 'Cost per year' }), costBars(rows, { money: format.money, title: 'Annual cost: energy and fixed charges' })));
    const notes = equipmentNotes(result, ws, ctx);
    if (notes.length) {
      parts.push(h('section', { id: 'sheet-equipment' }, h('h2', { text: 'Equipment and charges beside the fuel' }),
        h('ul', {}, notes.map(({ option, lines, sizing, resistance }) => h('li', {}, h('strong', { text: `${option.label ?? option.id}: ` }),
          [...lines.map((line) => `${line.label}: ${line.text}.`), sizing,
            resistance ? 'Resistance strips need their own circuit: a licensed electrician decides, to local code.' : null].filter(Boolean).join(' ')))),
        h('p', { text: 'These amounts are already in each option\'s cost a year. Sizing needs a load calculation by a professional.' })));
    }
    const changes = sensitivity(result, ctx, extra);
    if (changes) parts.push(changes);
  } else {
    parts.push(h('p', { text: 'The comparison is not complete: see the workspace for the entries that need attention.' }));
  }
  parts.push(h('section', {}, h('h2', { text: 'Assumptions' }), assumptions(ws, result, ctx)));
  if (q.notes) parts.push(h('section', {}, h('h2', { text: 'Notes' }), h('p', { class: 'notes', text: q.notes })));
  parts.push(h('section', { class: 'sheet-cautions', id: 'sheet-cautions' }, h('h2', { text: 'Please read' }),
    h('ul', {}, (result?.cautions ?? []).map((c) => h('li', { text: c })))));
  parts.push(acceptance(q));
  sheet.replaceChildren(...parts.flat().filter(Boolean));
}
