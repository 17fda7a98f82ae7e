// Panel 2, fuels and local prices: each fuel available at the site with its
// price in a sale unit the catalog lists (or a custom fuel by composition),
// fixed charges, the heating value on the bill, and emission settings.
import { h } from '../dom.js';
import { checkField, clockField, numberField, radioField, selectField, textField } from '../fields.js';
import { burnsFuelAnywhere, equipmentElectricityPrice } from '../equipment.js';
import { fuelId } from '../scenario.js';
import { SALE_UNITS, unitLabel } from '../units.js';

const VOLUME = ['m3', 'L', 'gal', 'imp_gal', 'ft3', 'ccf', 'Mcf'];

/** The sale units a fuel entry may be priced in. */
export function saleUnitsOf(entry, catalog) {
  if (typeof entry.fuel === 'object') return entry.fuel.sale_unit ? [entry.fuel.sale_unit] : SALE_UNITS;
  return catalog.fuelsById.get(entry.fuel)?.sale_units.map((u) => u.unit) ?? [];
}

/** A fuel entry's display name. */
export function fuelName(entry, catalog) {
  if (!entry) return '';
  if (typeof entry.fuel === 'object') return entry.fuel.name || entry.fuel.id || 'Custom fuel';
  return catalog.fuelsById.get(entry.fuel)?.name ?? entry.fuel;
}

function customFuelFields(ctx, base, fuel) {
  const p = `${base}/fuel`;
  const kind = fuel.kind ?? 'formula';
  const nodes = [
    h('div', { class: 'grid two' },
      textField(ctx, { label: 'Name', path: `${p}/name`, value: fuel.name, maxlength: 120 }),
      textField(ctx, { label: 'Identifier', path: `${p}/id`, value: fuel.id, maxlength: 64, hint: 'Letters, digits and dashes.' })),
    radioField(ctx, { legend: 'Described by', path: `${p}/kind`, value: kind,
      choices: [['formula', 'Chemical formula'], ['mixture', 'Gas analysis'], ['ultimate', 'Ultimate analysis']] }),
  ];
  if (kind === 'formula') {
    nodes.push(h('div', { class: 'grid two' },
      textField(ctx, { label: 'Formula or species', path: `${p}/formula`, value: fuel.formula, placeholder: 'e.g. C2H5OH' }),
      selectField(ctx, { label: 'Phase as burned', path: `${p}/phase`, value: fuel.phase ?? '', choices: [['', 'Catalog default'], 'gas', 'liquid', 'solid'] })));
  } else if (kind === 'mixture') {
    nodes.push(textField(ctx, { label: 'Gas analysis (species:fraction, comma separated)', path: `${p}/mixture`, value: fuel.mixture,
      placeholder: 'CH4:0.60,CO2:0.39,N2:0.01' }));
    nodes.push(h('div', { class: 'grid two' },
      selectField(ctx, { label: 'Fractions are', path: `${p}/fractions`, value: fuel.fractions ?? 'mole', choices: [['mole', 'mole fractions'], ['mass', 'mass fractions']] }),
      checkField(ctx, { label: 'Scale fractions to sum to 1', path: `${p}/normalise`, checked: fuel.normalise })));
  } else {
    nodes.push(textField(ctx, { label: 'Ultimate analysis (element:wt %, comma separated)', path: `${p}/ultimate`, value: fuel.ultimate,
      placeholder: 'C:50.2,H:6.1,O:43.2,N:0.1,S:0,ash:0.4' }));
    nodes.push(h('div', { class: 'grid two' },
      numberField(ctx, { label: 'Moisture as sold', path: `${p}/moisture`, value: fuel.moisture, unit: '%' }),
      selectField(ctx, { label: 'Analysis basis', path: `${p}/basis`, value: fuel.basis ?? 'dry', choices: [['dry', 'dry'], ['as-received', 'as received'], ['daf', 'dry, ash-free']] })));
  }
  const sale = fuel.sale_unit ?? '';
  nodes.push(h('div', { class: 'grid two' },
    selectField(ctx, { label: 'Sold by the', path: `${p}/sale_unit`, value: sale, structural: true, choices: [['', 'Choose…'], ...SALE_UNITS] }),
    VOLUME.includes(sale) && kind !== 'mixture'
      ? numberField(ctx, { label: 'Density', path: `${p}/density_kg_per_l`, value: fuel.density_kg_per_l, unit: 'kg/L' })
      : VOLUME.includes(sale)
        ? selectField(ctx, { label: 'Gas volumes at', path: `${p}/reference`, value: fuel.reference ?? '15C',
          choices: [['15C', '15 °C, 101.325 kPa'], ['0C', '0 °C, 101.325 kPa'], ['60F', '60 °F, 14.696 psia']] })
        : null));
  nodes.push(checkField(ctx, { label: 'Carbon is biogenic (wood, biogas, bio-ethanol)', path: `${p}/biogenic`, checked: fuel.biogenic }));
  return h('div', { class: 'custom-fuel' }, nodes);
}

function fixedCharges(ctx, base, entry, currency) {
  const rows = (entry.fixed_charges ?? []).map((charge, i) => {
    const p = `${base}/fixed_charges/${i}`;
    const perYear = charge.amount_per_year !== undefined && charge.amount_per_month === undefined;
    const amountPath = `${p}/${perYear ? 'amount_per_year' : 'amount_per_month'}`;
    return h('div', { class: 'row-card' },
      h('div', { class: 'grid charge' },
        textField(ctx, { label: 'Fixed charge', path: `${p}/label`, value: charge.label, placeholder: 'e.g. customer charge' }),
        numberField(ctx, { label: 'Amount', path: amountPath, value: perYear ? charge.amount_per_year : charge.amount_per_month, unit: currency, currency }),
        h('div', { class: 'field' }, h('label', { for: `period-${base.replaceAll('/', '-')}-${i}`, text: 'Per' }),
          h('select', { id: `period-${base.replaceAll('/', '-')}-${i}`, dataset: { action: 'charge-period', fuel: base, index: String(i) } },
            h('option', { value: 'month', text: 'month', selected: !perYear }), h('option', { value: 'year', text: 'year', selected: perYear })))),
      h('button', { type: 'button', class: 'quiet', dataset: { action: 'remove-charge', fuel: base, index: String(i) }, text: 'Remove charge' }));
  });
  return h('div', { class: 'rows' }, rows,
    h('button', { type: 'button', class: 'secondary', dataset: { action: 'add-charge', fuel: base }, text: 'Add a fixed charge' }));
}

function fuelCard(ctx, ws, entry, index) {
  const { catalog } = ctx;
  const base = `/fuels/${index}`;
  const id = fuelId(entry);
  const custom = typeof entry.fuel === 'object';
  const record = custom ? null : catalog.fuelsById.get(entry.fuel);
  const units = saleUnitsOf(entry, catalog);
  const currency = ws.settings.currency;
  const usedBy = ws.systems.filter((s) => s.fuel_key === entry.key).length;
  const fuelChoices = [...catalog.fuels.map((f) => [f.id, f.name]), ['custom', 'Custom fuel (by composition)']];
  const nodes = [
    h('div', { class: 'card-head' },
      h('h3', { text: fuelName(entry, catalog) || 'New fuel' }),
      h('span', { class: 'badge', text: usedBy === 1 ? 'used by 1 system' : `used by ${usedBy} systems` })),
    selectField(ctx, { label: 'Fuel', path: `${base}/fuel`, value: custom ? 'custom' : entry.fuel, choices: fuelChoices, structural: true }),
  ];
  if (custom) nodes.push(customFuelFields(ctx, base, entry.fuel));
  const timeOfUse = id === 'electricity' && Boolean(entry.price?.time_of_use);
  if (!timeOfUse) {
    nodes.push(numberField(ctx, { label: `Price (${currency})`, path: `${base}/price/amount`, value: entry.price?.amount, currency,
      unit: { path: `${base}/price/per`, value: entry.price?.per, choices: units.map((u) => [u, `per ${unitLabel(u)}`]), structural: true },
      hint: 'As paid, with delivery and taxes.' }));
  }
  if (id === 'electricity') nodes.push(timeOfUseFields(ctx, base, entry, currency));
  if (id === 'cordwood') {
    const species = record?.wood_species ?? [];
    nodes.push(h('div', { class: 'grid two' },
      selectField(ctx, { label: 'Wood species', path: `${base}/wood_species`, value: entry.wood_species ?? '',
        choices: [['', 'Catalog default'], ...species.map((w) => [w.id, w.id.replaceAll('-', ' ')])] }),
      numberField(ctx, { label: 'Face cord as a share of a cord', path: `${base}/face_cord_fraction`, value: entry.face_cord_fraction,
        hint: '1/3 (0.333) for 16 in logs.' })));
  }
  if (id === 'cordwood' || id === 'wood-pellets') {
    nodes.push(numberField(ctx, { label: 'Moisture as burned (optional)', path: `${base}/moisture_pct`, value: entry.moisture_pct, unit: '%' }));
  }
  if (id === 'wood-pellets' && entry.price?.per === 'bag') {
    nodes.push(numberField(ctx, { label: 'Mass of one bag', path: `${base}/bag_mass/value`, value: entry.bag_mass?.value,
      unit: { path: `${base}/bag_mass/unit`, value: entry.bag_mass?.unit ?? 'lb', choices: ['lb', 'kg'] } }));
  }
  nodes.push(fixedCharges(ctx, base, entry, currency));
  if (id === 'natural-gas' || entry.keep_service) nodes.push(keptService(ctx, base, entry, usedBy));
  const hv = entry.heating_value ?? {};
  const [hvEnergy, hvPer] = (hv.unit ?? '/').split('/');
  nodes.push(h('details', { class: 'more', open: hv.value !== undefined },
    h('summary', { text: 'Heating value printed on the bill (optional)' }),
    h('div', { class: 'grid three' },
      numberField(ctx, { label: 'Heating value', path: `${base}/heating_value/value`, value: hv.value }),
      h('div', { class: 'field' }, h('label', { for: `hvunit-${index}`, text: 'Unit' }),
        h('div', { class: 'with-unit' },
          h('select', { id: `hvunit-${index}`, 'aria-label': 'Heating value energy unit', dataset: { action: 'hv-unit', fuel: base, part: 'energy' } },
            ['Btu', 'MJ', 'kWh', 'MMBtu', 'therm', 'GJ', 'kJ'].map((u) => h('option', { value: u, text: u, selected: u === (hvEnergy || (ws.settings.units === 'us' ? 'Btu' : 'MJ')) }))),
          h('span', { class: 'unit', text: '/' }),
          h('select', { id: `hvper-${index}`, 'aria-label': 'Heating value per unit', dataset: { action: 'hv-unit', fuel: base, part: 'per' } },
            [...new Set([...units, 'ft3', 'm3'])].map((u) => h('option', { value: u, text: unitLabel(u), selected: u === (hvPer || units[0]) }))))),
      selectField(ctx, { label: 'Basis', path: `${base}/heating_value/basis`, value: hv.basis ?? 'HHV', choices: [['HHV', 'gross (HHV)'], ['LHV', 'net (LHV)']] }))));
  const extras = [];
  if (ws.economics?.enabled) {
    extras.push(numberField(ctx, { label: 'Price rise per year (optional)', path: `${base}/escalation`, value: entry.escalation, scale: 100, unit: '%',
      hint: 'Above or below the general rise set under Systems.' }));
  }
  if (ws.uncertainty?.enabled) {
    const triangular = ws.uncertainty.form === 'triangular';
    extras.push(numberField(ctx, { label: triangular ? 'Price may vary by (±, at most)' : 'Price may vary by (±, one standard deviation)',
      path: `${base}/spread`, value: entry.spread, scale: 100, unit: '%',
      placeholder: formatSpread(ws.uncertainty.spread_default ?? 0.2),
      hint: triangular ? 'Half-width of a triangular spread around today\'s price.' : 'Standard deviation of the logarithm of the price (lognormal, median today\'s price).' }));
  }
  if (extras.length) nodes.push(h('div', { class: 'grid two' }, extras));
  // why the fuel cannot be removed is said in the card, where a finger can read it (a tooltip needs a mouse)
  const whyKept = usedBy > 0 ? `Used by ${usedBy === 1 ? 'a system' : `${usedBy} systems`} (Systems tab): change or remove ${usedBy === 1 ? 'it' : 'them'} first to remove this fuel.` : null;
  nodes.push(h('div', { class: 'card-actions' },
    whyKept ? h('p', { class: 'hint', id: `remove-fuel-why-${index}`, text: whyKept }) : null,
    h('button', { type: 'button', class: 'quiet danger', dataset: { action: 'remove-fuel', index: String(index) },
      disabled: usedBy > 0, 'aria-describedby': whyKept ? `remove-fuel-why-${index}` : undefined,
      text: 'Remove this fuel' })));
  return h('article', { class: 'card fuel-card', dataset: { fuelKey: entry.key, field: base } }, nodes);
}

const DAY_CHOICES = [['all', 'every day'], ['weekdays', 'weekdays'], ['weekends', 'weekends']];

/**
 * Electricity priced by the hour (a time-of-use tariff): one row per span of hours, rows of one name one period;
 * the heat pump's kWh fall in the hours of its temperature bins, hot water by the day's draws.
 */
function timeOfUseFields(ctx, base, entry, currency) {
  const on = Boolean(entry.price?.time_of_use);
  const nodes = [checkField(ctx, { label: 'Priced by time of use (peak and off-peak hours)', path: `${base}/price/time_of_use`, checked: on, structural: true,
    hint: on ? undefined : 'Tick it when the tariff charges by the hour of the day: heat pumps use most in cold nights and mornings.' })];
  if (!on) return h('div', { class: 'time-of-use' }, nodes);
  const rows = (entry.price?.schedule ?? []).map((row, k) => {
    const p = `${base}/price/schedule/${k}`;
    return h('div', { class: 'row-card period-row', dataset: { field: p } },
      h('div', { class: 'grid periods' },
        textField(ctx, { label: `Period ${k + 1}`, path: `${p}/name`, value: row.name, maxlength: 40, placeholder: 'peak' }),
        numberField(ctx, { label: `Price (${currency})`, path: `${p}/amount`, value: row.amount, unit: 'per kWh', currency, per: 'kWh' }),
        selectField(ctx, { label: 'Days', path: `${p}/days`, value: row.days ?? 'all', choices: DAY_CHOICES }),
        clockField(ctx, { label: 'From', path: `${p}/from`, value: row.from, placeholder: '16:00' }),
        clockField(ctx, { label: 'To', path: `${p}/to`, value: row.to, placeholder: '21:00' }),
        textField(ctx, { label: 'Months', path: `${p}/months_text`, value: row.months_text ?? '', maxlength: 40, placeholder: 'all year' })),
      h('button', { type: 'button', class: 'quiet', dataset: { action: 'remove-period', fuel: base, index: String(k) }, text: `Remove period ${k + 1}` }),
      h('p', { class: 'field-msg', hidden: true }));
  });
  // the schedule's own message (a gap or an overlap) first, above the rows
  nodes.push(h('div', { class: 'field rows', id: `${base.slice(1).replace('/', '-')}-schedule`, dataset: { field: `${base}/price/schedule` } },
    h('p', { class: 'field-msg', hidden: true }), rows));
  nodes.push(h('p', { class: 'hint', text: 'Times as the tariff sheet prints them, on the hour or half hour: 16, 16:30 or 4:30 pm (22:00 to 6:00 runs past midnight); months as 6-9, 11-3 or Jun-Sep, empty for the whole year. Every hour of the week must be in one period: give a period two rows under the same name for two spans of hours.' }));
  nodes.push(h('button', { type: 'button', class: 'secondary', dataset: { action: 'add-period', fuel: base }, text: 'Add a period' }));
  return h('div', { class: 'time-of-use' }, nodes);
}

const formatSpread = (fraction) => String(Math.round(fraction * 1000) / 10);

/** The tick for a service the house keeps whatever heats it, and what it does, in words. */
function keptService(ctx, base, entry, usedBy) {
  const gas = fuelId(entry) === 'natural-gas';
  const charges = (entry.fixed_charges ?? []).filter((c) => typeof (c.amount_per_month ?? c.amount_per_year) === 'number');
  let hint;
  if (!entry.keep_service) {
    hint = 'Tick it if a gas range, water heater or dryer stays connected whatever heats the house: its fixed charges above are then added to every option that does not burn gas.';
  } else if (!charges.length) {
    hint = 'No fixed charge is entered above, so nothing is added: enter the gas service\'s monthly charge.';
  } else {
    hint = `The fixed charges above are added to every option that does not burn ${gas ? 'gas' : 'this fuel'}${usedBy ? '' : ' (no system here burns it: it is here for its charges)'}.`;
  }
  return checkField(ctx, { label: gas ? 'The house keeps its gas service for other appliances (range, water heater)'
    : 'The house keeps this service for other appliances', path: `${base}/keep_service`, checked: Boolean(entry.keep_service), structural: true, hint });
}

/** The price of the electricity furnaces, boilers and stoves use themselves, or which price the core uses for it. */
function equipmentElectricity(ctx, ws) {
  if (!burnsFuelAnywhere(ws)) return null;
  const used = equipmentElectricityPrice(ws);
  const typed = ws.settings.electricity?.price?.amount;
  const nodes = [h('legend', { text: 'Electricity for the equipment itself' })];
  const what = 'Furnaces, boilers and pellet stoves use electricity of their own (blower, pumps, burner motor).';
  if (used.from === 'option') {
    const name = used.system.label || used.system.id;
    nodes.push(h('p', { class: 'hint', id: 'equipment-electricity-used',
      text: `${what} It is priced per kWh at the price on the ${fuelName(used.entry, ctx.catalog)} card above, since “${name}” runs on it.` }));
    if (typeof typed === 'number') {
      nodes.push(h('p', { class: 'hint', id: 'equipment-electricity-kept', text: `The price typed here before, ${ctx.format.price(typed)} per kWh, is kept and used again if no system here runs on electricity.` }));
    }
  } else {
    nodes.push(numberField(ctx, { label: `Electricity price for the equipment itself (${ws.settings.currency})`, path: '/settings/electricity/price/amount',
      value: typed, unit: 'per kWh', currency: ws.settings.currency, per: 'kWh',
      hint: `${what} No system here runs on electricity, so give the house's price per kWh; without it that electricity is counted but not priced.` }));
  }
  return h('fieldset', { class: 'group', id: 'equipment-electricity' }, nodes);
}

/** Renders the fuels panel. */
export function renderFuels(container, ctx) {
  const ws = ctx.store.state;
  const { catalog } = ctx;
  const cards = ws.fuels.map((entry, i) => fuelCard(ctx, ws, entry, i));
  const add = h('div', { class: 'add-row' },
    h('label', { for: 'add-fuel-choice', text: 'Add a fuel' }),
    h('div', { class: 'with-unit' },
      h('select', { id: 'add-fuel-choice' }, [...catalog.fuels.map((f) => h('option', { value: f.id, text: f.name })),
        h('option', { value: 'custom', text: 'Custom fuel (by composition)' })]),
      h('button', { type: 'button', class: 'primary', dataset: { action: 'add-fuel' }, text: 'Add' })));
  const emissions = h('fieldset', { class: 'group' }, h('legend', { text: 'Emission factors' }),
    h('div', { class: 'grid two' },
      numberField(ctx, { label: 'Electricity emissions (optional)', path: '/settings/electricity_co2e_kg_per_kwh',
        value: ws.settings.electricity_co2e_kg_per_kwh, unit: 'kg CO2e/kWh',
        placeholder: String(catalog.electricity_default?.co2e_kg_per_kwh ?? ''), hint: `Default: ${catalog.electricity_default?.co2e_kg_per_kwh ?? '—'} kg/kWh (${catalog.electricity_default?.year ?? ''}).` }),
      selectField(ctx, { label: 'Global-warming potentials', path: '/settings/gwp', value: ws.settings.gwp ?? 'AR5',
        choices: Object.keys(catalog.gwp_sets ?? { AR5: 1 }).map((k) => [k, `IPCC ${k}`]) })));
  const u = ws.uncertainty;
  const uncertainty = h('fieldset', { class: 'group' }, h('legend', { text: 'Price uncertainty' }),
    checkField(ctx, { label: 'Show how sure the ranking is when prices vary', path: '/uncertainty/enabled', checked: u.enabled, structural: true }),
    u.enabled ? h('div', { class: 'grid two' },
      numberField(ctx, { label: 'Random draws', path: '/uncertainty/draws', value: u.draws, hint: '100 to 200 000; more draws, steadier answers.' }),
      numberField(ctx, { label: 'Seed', path: '/uncertainty/seed', value: u.seed, hint: 'The same seed gives the same draws.' }),
      selectField(ctx, { label: 'Shape of the price spread', path: '/uncertainty/form', value: u.form ?? 'lognormal', structural: true,
        choices: [['lognormal', 'lognormal (median today\'s price)'], ['triangular', 'triangular (± a fixed share)']] }),
      numberField(ctx, { label: 'Spread of fuels without their own', path: '/uncertainty/spread_default', value: u.spread_default, scale: 100, unit: '%',
        placeholder: '20', hint: 'Each fuel\'s own spread is set on its card; the core assumes 20 % when none is given.' })) : null);
  // the price lists kept on this device: a node owned by web/template-shelf.js, placed here as it is
  container.replaceChildren(...[h('div', { class: 'cards' }, cards), add, ctx.templateTools?.priceNode, equipmentElectricity(ctx, ws), emissions, uncertainty,
    h('div', { id: 'lab-slot' })].filter(Boolean));
  ctx.renderLab?.(container.querySelector('#lab-slot'));
}

