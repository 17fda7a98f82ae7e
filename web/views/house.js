// Panel 1, the house: customer and site, the heat the house needs (direct,
// heat-loss or bills, by the method picker) and the climate.
import { h } from '../dom.js';
import { checkField, numberField, radioField, selectField, textField } from '../fields.js';
import { monthNames } from '../format.js';
import { observedSpan } from '../weather.js';
import { POWER_UNITS, UA_UNITS, unitLabel } from '../units.js';
import { fuelName } from './fuels.js';
import { waterHeaterFields } from './water-heater.js';

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
      textField(ctx, { label: 'Prepared by', path: '/quote/prepared_by', value: q.prepared_by, maxlength: 200 }),
      textField(ctx, { label: 'Quote number', path: '/quote/number', value: q.number, maxlength: 40 }),
      textField(ctx, { label: 'Prices hold until', path: '/quote/valid_until', value: q.valid_until, type: 'date' })),
    textField(ctx, { label: 'Title of this comparison', path: '/title', value: ws.title, maxlength: 200 }),
    textField(ctx, { label: 'Notes for the customer', path: '/quote/notes', value: q.notes, type: 'textarea' }),
    textField(ctx, { label: 'Terms printed above the signatures', path: '/quote/terms', value: q.terms, type: 'textarea',
      hint: 'Your standard terms come from your company profile on the Saved quotes tab.' }));
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
    d.water_heating?.enabled ? null : quantityField(ctx, 'Hot water per year (optional)', '/demand/hot_water', d.hot_water, DEMAND_ENERGY)));
  return nodes;
}

/** The weather the bills are compared with: observed days from a weather file, or what is used without them. */
function billWeather(ctx, d) {
  const span = observedSpan(d.observed);
  const text = d.observed
    ? `${d.observed_label ?? 'Daily temperatures from a weather file'}: ${span
      ? `${ctx.format.number(span.days, 6)} days, ${ctx.format.date(span.first)} to ${ctx.format.date(span.last)}` : 'no days'}.`
    : 'No weather file for the bills: a bill\'s average outdoor temperature is used where it is given, else the climate below.';
  return h('div', { class: 'field', id: 'bill-weather', dataset: { field: '/demand/observed' } },
    h('p', { class: 'label-like', text: 'Weather for these bills' }),
    h('p', { class: 'hint', id: 'bill-weather-text', text }),
    d.observed ? h('button', { type: 'button', class: 'quiet', dataset: { action: 'observed-clear' }, text: 'Stop using this weather for the bills' }) : null,
    h('p', { class: 'field-msg', hidden: true }));
}

/** Bills pasted as a block (web/bills.js): what was pasted and not read stays in the box with its message. */
function pasteBills(ctx) {
  const paste = ctx.billPaste ?? { text: '', message: null };
  const box = h('textarea', { id: 'bills-paste', rows: '4', spellcheck: 'false', 'aria-describedby': 'bills-paste-hint bills-paste-msg',
    placeholder: '11/12/2025  12/11/2025  84\n12/11/2025  1/13/2026  131' });
  box.value = paste.text;
  return h('details', { class: 'more', open: Boolean(paste.text || paste.message) },
    h('summary', { text: 'Paste several bills at once' }),
    h('label', { for: 'bills-paste', text: 'One bill a line: start date, end date, quantity (and its unit if it is not the bills\' unit)' }),
    box,
    h('p', { class: 'hint', id: 'bills-paste-hint', text: 'Copied from the utility\'s statement or a spreadsheet; tabs, commas or spaces between the columns.' }),
    h('button', { type: 'button', class: 'secondary', dataset: { action: 'paste-bills' }, text: 'Add these bills' }),
    // not a .field-msg: those are the fields' own messages, rewritten after every evaluation
    h('p', { class: paste.message?.ok ? 'paste-msg ok' : 'paste-msg', id: 'bills-paste-msg', role: 'status', hidden: !paste.message,
      text: paste.message?.text ?? '' }));
}

function billFields(ctx, ws, d) {
  const rows = (d.bills ?? []).map((bill, i) => {
    const base = `/demand/bills/${i}`;
    return h('div', { class: 'row-card', dataset: { field: base } },
      h('div', { class: 'grid bills' },
        textField(ctx, { label: `Bill ${i + 1} from`, path: `${base}/start`, value: bill.start, type: 'date' }),
        textField(ctx, { label: 'to', path: `${base}/end`, value: bill.end, type: 'date' }),
        numberField(ctx, { label: 'Quantity billed', path: `${base}/quantity`, value: bill.quantity,
          unit: { path: `${base}/unit`, value: bill.unit, choices: BILL_UNITS } }),
        quantityField(ctx, 'Average outdoor temperature (optional)', `${base}/mean_temperature`,
          bill.mean_temperature ?? { unit: ws.settings.units === 'metric' ? 'degC' : 'degF' }, TEMPS)),
      h('button', { type: 'button', class: 'quiet', dataset: { action: 'remove-bill', index: String(i) }, text: `Remove bill ${i + 1}` }),
      h('p', { class: 'field-msg', hidden: true }));
  });
  const systems = ws.systems.map((s) => [s.id, `${s.label || s.id}${s.existing ? ' (in the house now)' : ''}`]);
  const billed = ws.systems.find((s) => s.id === d.bills_option);
  const billedFuel = billed && ws.fuels.find((f) => f.key === billed.fuel_key);
  // the House tab can be filled first: the bills are linked to the system once it is marked as in the house now
  const hint = billed
    ? `Billed fuel: ${billedFuel ? fuelName(billedFuel, ctx.catalog) : 'none chosen yet (Systems tab)'}.`
    : 'Mark the system in the house now on the Systems tab (3): these bills are then linked to it.';
  const billedIndex = ws.systems.indexOf(billed);
  return [
    selectField(ctx, { label: 'These bills are for', path: '/demand/bills_option', value: d.bills_option ?? '',
      choices: [['', ws.systems.length ? 'Choose the existing system…' : 'No system yet (Systems tab)'], ...systems], hint }),
    // the billed system is one tap away: its card on the Systems tab, scrolled into view and focused
    billed ? h('button', { type: 'button', class: 'quiet', id: 'bills-system-link',
      dataset: { action: 'jump-to-field', path: `/systems/${billedIndex}/label` }, text: `Show ${billed.label || billed.id} (Systems tab)` }) : null,
    radioField(ctx, { legend: 'Bill dates are', path: '/demand/bill_dates', value: d.bill_dates,
      choices: [['meter-reads', 'Meter reads (each bill starts on the day the last one ended)'],
        ['inclusive', 'Inclusive (the end date is the bill\'s last day)']] }),
    d.bill_dates === undefined ? h('p', { class: 'hint', id: 'bill-dates-unstated',
      text: 'These bills do not say how their dates are read: when two bills share a day they are read as meter reads, otherwise as inclusive. Choose one to be sure.' }) : null,
    h('div', { class: 'rows' }, rows),
    h('button', { type: 'button', class: 'secondary', dataset: { action: 'add-bill' }, text: 'Add a bill' }),
    pasteBills(ctx),
    billWeather(ctx, d),
  ];
}

/** Hot water as its own service: how much the household uses and the water heater in the house now. */
function waterHeatingFields(ctx, ws) {
  const w = ws.demand.water_heating ?? {};
  const us = ws.settings.units === 'us';
  const nodes = [h('legend', { text: 'Hot water' }),
    checkField(ctx, { label: 'Include hot water in the comparison', path: '/demand/water_heating/enabled', checked: Boolean(w.enabled), structural: true,
      hint: 'Hot water is costed with the water heater that makes it: the one in the house now, or one that comes with an option (Systems tab).' })];
  if (w.enabled) {
    const mode = w.mode ?? 'people';
    nodes.push(radioField(ctx, { legend: 'Hot water known as', path: '/demand/water_heating/mode', value: mode,
      choices: [['people', 'People in the house'], ['annual', 'A yearly amount of heat']] }));
    if (mode === 'annual') {
      nodes.push(quantityField(ctx, 'Heat in the hot water per year', '/demand/water_heating/annual_heat', w.annual_heat ?? { unit: us ? 'MMBtu' : 'kWh' }, DEMAND_ENERGY));
    } else {
      nodes.push(h('div', { class: 'grid three' },
        numberField(ctx, { label: 'People', path: '/demand/water_heating/people', value: w.people }),
        quantityField(ctx, 'Hot water per person a day (optional)', '/demand/water_heating/volume_per_person_day',
          w.volume_per_person_day ?? { unit: us ? 'gal' : 'L' }, ['gal', 'L'], { placeholder: us ? '13.2' : '50' }),
        quantityField(ctx, 'Temperature rise (optional)', '/demand/water_heating/temperature_rise',
          w.temperature_rise ?? { unit: us ? 'degF' : 'K' }, ['degF', 'K'], { placeholder: us ? '67' : '37' })));
    }
    nodes.push(h('fieldset', { class: 'group inner', id: 'house-water-heater' }, h('legend', { text: 'Water heater in the house now' }),
      waterHeaterFields(ctx, '/demand/water_heating/heater', w.heater ?? {})));
    nodes.push(h('p', { class: 'hint', text: 'Gas, propane and oil water heaters need a working vent and combustion air like any burner; have a licensed professional install or change one, to local code.' }));
  }
  return h('fieldset', { class: 'group', id: 'water-heating' }, nodes);
}

function climateFields(ctx, ws) {
  const c = ws.climate;
  const nodes = [];
  if (c.label && c.mode !== 'none') nodes.push(h('p', { class: 'climate-label', id: 'climate-label', text: `Climate: ${c.label}` }));
  nodes.push(selectField(ctx, { label: 'Climate data', path: '/climate/mode', value: c.mode, structural: true,
    choices: [['none', 'None (heat need given directly)'], ['monthly_mean', 'Monthly mean temperatures'],
      ['monthly_hdd', 'Monthly heating degree-days'], ['annual_hdd', 'Annual heating degree-days and design temperature']] }));
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
    c.mode !== 'annual_hdd' ? quantityField(ctx, 'Design temperature (optional)', '/climate/design_temperature', c.design_temperature, TEMPS,
      { hint: 'The 99 % heating design temperature. Given, it sets how much the days of each month vary; left empty, it is worked out from the months.' }) : null,
    numberField(ctx, { label: 'Mean daily range (optional)', path: '/climate/daily_range', value: c.daily_range,
      unit: c.unit === 'degC' ? '°C' : '°F' })));
  nodes.push(checkField(ctx, { label: 'Leap year (366 days)', path: '/climate/leap_year', checked: c.leap_year }));
  nodes.push(...climateRecords(c));
  return nodes;
}

/** What a climate carries from weather records beyond the fields above (day-to-day spread, hourly bins), each removable. */
function climateRecords(c) {
  const nodes = [];
  if (c.mode === 'monthly_mean' && Array.isArray(c.monthly_sd)) {
    nodes.push(h('div', { class: 'field record-note', id: 'climate-spread', dataset: { field: '/climate/monthly_sd' } },
      h('p', { class: 'hint', text: 'Day-to-day spread of each month: from weather records (used instead of the usual estimate).' }),
      h('button', { type: 'button', class: 'quiet', dataset: { action: 'climate-drop', key: 'monthly_sd' }, text: 'Use the usual estimate instead' }),
      h('p', { class: 'field-msg', hidden: true })));
  }
  if (Array.isArray(c.bins) && c.bins.length) {
    const hours = c.bins.reduce((sum, b) => sum + (typeof b?.hours === 'number' ? b.hours : 0), 0);
    nodes.push(h('div', { class: 'field record-note', id: 'climate-bins', dataset: { field: '/climate/bins' } },
      h('p', { class: 'hint', text: `Hours at each outdoor temperature: ${c.bins.length} temperature bins, ${Math.round(hours)} hours, from an hourly weather file (used instead of the bins worked out from the months).` }),
      h('button', { type: 'button', class: 'quiet', dataset: { action: 'climate-drop', key: 'bins' }, text: 'Work the bins out from the months instead' }),
      h('p', { class: 'field-msg', hidden: true })));
  }
  return nodes;
}

/** The site's elevation and the pressure the gas meter reads at: gas appliances lose output with altitude. */
function siteFields(ctx, ws) {
  const st = ws.settings;
  const given = st.gas_pressure_base_given;
  const choices = [['', 'Standard pressure (corrected)'], ['site', 'Site pressure (not corrected)']];
  if (given) choices.push(['given', `${given.value} ${unitLabel(given.unit)}, as in the imported quote`]);
  return h('fieldset', { class: 'group', id: 'site-elevation' }, h('legend', { text: 'Site elevation' }),
    h('div', { class: 'grid two' },
      quantityField(ctx, 'Elevation above sea level (optional)', '/settings/elevation', st.elevation, ['ft', 'm'],
        { hint: 'Above 2,000 ft gas appliances are derated (fuel gas code, 4 % for each 1,000 ft) unless rated for altitude.' }),
      selectField(ctx, { label: 'Gas meter volumes are at', path: '/settings/gas_pressure_base_mode', value: st.gas_pressure_base_mode ?? '',
        choices, hint: 'At altitude, for gas priced or billed in ccf or m³ without a therm factor: whether the utility corrects the meter\'s volumes to its standard pressure. Its bill or tariff says which.' })),
    h('p', { class: 'hint', text: 'Derating at altitude and burner orifices are set by the installer to the appliance\'s instructions and local code.' }));
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
  const climate = h('fieldset', { class: 'group', id: 'climate-group' }, h('legend', { text: 'Climate' }), climateFields(ctx, ws));
  // the weather file and the climate library: nodes owned by web/climates.js, placed here as they are
  const tools = ctx.climateTools ? [ctx.climateTools.weatherNode, ctx.climateTools.libraryNode] : [];
  container.replaceChildren(quoteFields(ctx, ws), demand, waterHeatingFields(ctx, ws), climate, ...tools, siteFields(ctx, ws));
}

