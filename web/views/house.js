// Panel 1, the house: customer and site, the heat the house needs (direct,
// heat-loss or bills, by the method picker) and the climate.
import { h } from '../dom.js';
import { checkField, numberField, radioField, selectField, textField } from '../fields.js';
import { monthNames } from '../format.js';
import { POWER_UNITS, UA_UNITS } from '../units.js';

const TEMPS = ['degF', 'degC'];
const DEMAND_ENERGY = ['MMBtu', 'therm', 'kWh', 'GJ', 'MJ', 'Btu'];
const BILL_UNITS = ['therm', 'ccf', 'Mcf', 'ft3', 'm3', 'kWh', 'MMBtu', 'GJ', 'gal', 'L', 'kg', 'lb', 'short_ton', 'tonne',
  'bag', 'cord', 'face_cord'];

function quantityField(ctx, label, path, q, units, extra = {}) {
  return numberField(ctx, { label, path: `${path}/value`, value: q?.value, unit: { path: `${path}/unit`, value: q?.unit, choices: units }, ...extra });
}

function quoteFields(ctx, ws) {
  const q = ws.quote;
  return h('fieldset', { class: 'group' }, h('legend', { text: 'Customer and site' }),
    h('div', { class: 'grid two' },
      textField(ctx, { label: 'Customer', path: '/quote/customer', value: q.customer, maxlength: 200 }),
      textField(ctx, { label: 'Site address', path: '/quote/site', value: q.site, maxlength: 300 }),
      textField(ctx, { label: 'Quote date', path: '/quote/date', value: q.date, type: 'date' }),
      textField(ctx, { label: 'Prepared by', path: '/quote/prepared_by', value: q.prepared_by, maxlength: 200 })),
    textField(ctx, { label: 'Title of this comparison', path: '/title', value: ws.title, maxlength: 200 }),
    textField(ctx, { label: 'Notes for the customer', path: '/quote/notes', value: q.notes, type: 'textarea' }));
}

function directFields(ctx, d) {
  return [
    quantityField(ctx, 'Useful heat per year', '/demand/annual_useful_heat', d.annual_useful_heat, DEMAND_ENERGY,
      { hint: 'Heat delivered into the rooms in a year, after the heating system\'s losses.' }),
    quantityField(ctx, 'Balance point (optional)', '/demand/balance_point', d.balance_point, TEMPS,
      { hint: 'Outdoor temperature above which the house needs no heat; used for heat-pump temperature bins.' }),
  ];
}

function heatLossFields(ctx, d) {
  const nodes = [radioField(ctx, { legend: 'Heat loss known as', path: '/demand/ua_mode', value: d.ua_mode ?? 'ua',
    choices: [['ua', 'Heat-loss coefficient (UA)'], ['design', 'Design heat loss']] })];
  if (d.ua_mode === 'design') {
    nodes.push(h('div', { class: 'grid two' },
      quantityField(ctx, 'Design heat loss', '/demand/design_heat_loss', d.design_heat_loss, POWER_UNITS),
      quantityField(ctx, 'Design outdoor temperature (optional)', '/demand/design_outdoor', d.design_outdoor, TEMPS)));
  } else {
    nodes.push(quantityField(ctx, 'Heat-loss coefficient UA', '/demand/ua', d.ua, UA_UNITS));
  }
  nodes.push(quantityField(ctx, 'Indoor temperature', '/demand/indoor', d.indoor, TEMPS));
  nodes.push(radioField(ctx, { legend: 'Free heat from people and appliances as', path: '/demand/gains_mode', value: d.gains_mode ?? 'balance_point',
    choices: [['balance_point', 'Balance-point temperature'], ['internal_gains', 'Internal gains']] }));
  if (d.gains_mode === 'internal_gains') nodes.push(quantityField(ctx, 'Internal gains', '/demand/internal_gains', d.internal_gains, POWER_UNITS));
  else nodes.push(quantityField(ctx, 'Balance point', '/demand/balance_point', d.balance_point, TEMPS));
  nodes.push(h('div', { class: 'grid two' },
    numberField(ctx, { label: 'Degree-day correction C_D (optional)', path: '/demand/degree_day_correction', value: d.degree_day_correction,
      hint: 'Factor on degree-day heat loss, e.g. 0.6 to 1.' }),
    quantityField(ctx, 'Hot water per year (optional)', '/demand/hot_water', d.hot_water, DEMAND_ENERGY)));
  return nodes;
}

function billFields(ctx, ws, d) {
  const rows = (d.bills ?? []).map((bill, i) => {
    const base = `/demand/bills/${i}`;
    return h('div', { class: 'row-card', dataset: { field: base } },
      h('div', { class: 'grid bills' },
        textField(ctx, { label: `Bill ${i + 1} from`, path: `${base}/start`, value: bill.start, type: 'date' }),
        textField(ctx, { label: 'to', path: `${base}/end`, value: bill.end, type: 'date' }),
        numberField(ctx, { label: 'Quantity billed', path: `${base}/quantity`, value: bill.quantity,
          unit: { path: `${base}/unit`, value: bill.unit, choices: BILL_UNITS } })),
      h('button', { type: 'button', class: 'quiet', dataset: { action: 'remove-bill', index: String(i) }, text: `Remove bill ${i + 1}` }),
      h('p', { class: 'field-msg', hidden: true }));
  });
  const systems = ws.systems.map((s) => [s.id, s.label || s.id]);
  return [
    selectField(ctx, { label: 'These bills are for', path: '/demand/bills_option', value: d.bills_option ?? '',
      choices: [['', 'Choose the existing system…'], ...systems] }),
    h('div', { class: 'rows' }, rows),
    h('button', { type: 'button', class: 'secondary', dataset: { action: 'add-bill' }, text: 'Add a bill' }),
  ];
}

function climateFields(ctx, ws) {
  const c = ws.climate;
  const nodes = [selectField(ctx, { label: 'Climate data', path: '/climate/mode', value: c.mode, structural: true,
    choices: [['none', 'None (heat need given directly)'], ['monthly_mean', 'Monthly mean temperatures'],
      ['monthly_hdd', 'Monthly heating degree-days'], ['annual_hdd', 'Annual heating degree-days and design temperature']] })];
  if (c.mode === 'none') return nodes;
  nodes.push(selectField(ctx, { label: c.mode === 'monthly_mean' ? 'Temperatures in' : 'Degree-days in', path: '/climate/unit', value: c.unit,
      choices: [['degF', '°F'], ['degC', '°C']], structural: true }));
  const months = monthNames(ctx.locale);
  if (c.mode === 'monthly_mean' || c.mode === 'monthly_hdd') {
    const key = c.mode;
    const unit = c.mode === 'monthly_mean' ? (c.unit === 'degC' ? '°C' : '°F') : (c.unit === 'degC' ? '°C·d' : '°F·d');
    nodes.push(h('div', { class: 'grid months', role: 'group', 'aria-label': c.mode === 'monthly_mean' ? 'Monthly mean temperatures' : 'Monthly degree-days' },
      months.map((name, m) => numberField(ctx, { label: name, path: `/climate/${key}/${m}`, value: c[key]?.[m], unit }))));
  } else {
    nodes.push(h('div', { class: 'grid two' },
      numberField(ctx, { label: 'Annual heating degree-days', path: '/climate/annual_hdd', value: c.annual_hdd, unit: c.unit === 'degC' ? '°C·d' : '°F·d' }),
      quantityField(ctx, 'Design temperature', '/climate/design_temperature', c.design_temperature, TEMPS)));
  }
  nodes.push(h('div', { class: 'grid two' },
    quantityField(ctx, 'Degree-day base temperature', '/climate/base', c.base, TEMPS),
    c.mode === 'monthly_mean' ? numberField(ctx, { label: 'Mean daily range (optional)', path: '/climate/daily_range', value: c.daily_range,
      unit: c.unit === 'degC' ? '°C' : '°F' }) : null));
  nodes.push(checkField(ctx, { label: 'Leap year (366 days)', path: '/climate/leap_year', checked: c.leap_year }));
  return nodes;
}

/** Renders the house panel from the workspace. */
export function renderHouse(container, ctx) {
  const ws = ctx.store.state;
  const d = ws.demand;
  const method = d.method;
  const demand = h('fieldset', { class: 'group' }, h('legend', { text: 'Heat the house needs' }),
    radioField(ctx, { legend: 'Work it out from', path: '/demand/method', value: method,
      choices: [['direct', 'A known yearly amount'], ['heat-loss', 'The heat loss of the house'], ['bills', 'Past fuel bills']] }),
    h('div', { class: 'method-fields', dataset: { method } },
      method === 'direct' ? directFields(ctx, d) : method === 'heat-loss' ? heatLossFields(ctx, d) : billFields(ctx, ws, d)),
    method !== 'direct' ? h('p', { class: 'hint', text: method === 'heat-loss'
      ? 'Uses the climate below for degree-days.' : 'Uses the climate below to separate weather from base use.' }) : null);
  const climate = h('fieldset', { class: 'group' }, h('legend', { text: 'Climate' }), climateFields(ctx, ws));
  container.replaceChildren(quoteFields(ctx, ws), demand, climate);
}

