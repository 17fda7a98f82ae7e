// The kiosk's screens: the supplier and the dates of its price file (with a
// banner when it has expired), or the refusal of a price file that cannot be
// shown; the visitor's two questions as big buttons; the prices, locked to the
// file; the ranked answer, every number tappable to its trace.
import { h } from '../dom.js';
import { clockTime } from '../format.js';
import { ENERGY_KWH, unitLabel } from '../units.js';
import { HOUSE_SIZES } from '../kiosk-scenario.js';

const isNum = (v) => typeof v === 'number' && Number.isFinite(v);

/** The refusal of a price file that cannot be used (or could not be read). */
export function renderRefusal(container, { title, problems = [], detail }) {
  container.replaceChildren(h('div', { class: 'banner refused', id: 'kiosk-refused', role: 'alert' },
    h('p', { text: title }),
    problems.length ? h('ul', {}, problems.map((p) => h('li', { text: p.path ? `${p.path}: ${p.message}` : p.message }))) : null,
    detail ? h('p', { class: 'hint', text: detail }) : null));
}

function supplierCard(k, format) {
  const s = k.file?.supplier ?? {};
  const dates = [h('span', {}, 'Prices effective ', h('strong', { id: 'kiosk-effective', dataset: { date: k.check.effective ?? '' }, text: format.date(k.check.effective) }))];
  if (k.check.expires) {
    dates.push(h('span', {}, k.verdict.expired ? ' — expired ' : ' — until ',
      h('strong', { id: 'kiosk-expires', dataset: { date: k.check.expires }, text: format.date(k.check.expires) })));
  }
  return h('header', { class: 'step-card supplier', id: 'kiosk-supplier' },
    h('div', {}, h('h2', { id: 'kiosk-supplier-name', text: s.name ?? k.check.supplier ?? '' }),
      s.contact ? h('p', { class: 'hint', id: 'kiosk-contact', text: s.contact }) : null),
    h('p', {}, dates),
    k.file?.climate ? h('p', { class: 'hint', id: 'kiosk-climate', text: 'Heat-pump figures use the weather of this supplier\'s area.' }) : null);
}

/**
 * The page's header made the supplier's (kiosk mode): its name, its logo (an image on this site, resolved
 * against the price file's address, or a data:image URL; the core has checked it), its contact line and
 * the help element ("Call us: …" and the file's help text, e.g. "Ask at the counter").
 */
export function brandKioskHeader(topbar, supplier, priceUrl) {
  const brand = topbar.querySelector('.brand');
  const logo = brand.querySelector('.logo');
  if (supplier.logo) {
    logo.src = supplier.logo.startsWith('data:') ? supplier.logo : new URL(supplier.logo, priceUrl).href;
    logo.alt = `${supplier.name} logo`;
    logo.classList.add('supplier-logo');
  } else {
    logo.hidden = true;
  }
  const help = [supplier.phone ? `Call us: ${supplier.phone}` : null, supplier.help_text || null].filter(Boolean);
  brand.querySelector('div').replaceChildren(
    h('p', { class: 'name', id: 'kiosk-brand-name', text: supplier.name }),
    supplier.contact ? h('p', { class: 'tag', id: 'kiosk-brand-contact', text: supplier.contact }) : null);
  topbar.querySelector('#kiosk-help')?.remove();
  if (help.length) {
    topbar.append(h('p', { class: 'kiosk-help', id: 'kiosk-help' },
      supplier.phone ? h('span', { class: 'call', text: `Call us: ${supplier.phone}` }) : null,
      supplier.help_text ? h('span', { text: supplier.help_text }) : null));
  }
}

function choice(action, value, pressed, label, detail) {
  return h('button', { type: 'button', dataset: { action, value }, 'aria-pressed': String(pressed) },
    h('span', { text: label }), detail ? h('span', { class: 'sub', text: detail }) : null);
}

/** A fuel's name for a visitor ("Propane"), with the trade grade as a small subtitle ("HD-5"). */
export function plainFuelName(name) {
  const m = /^(.*\S)\s*\(([^)]+)\)$/.exec(name ?? '');
  return m ? { name: m[1], grade: m[2] } : { name: name ?? '', grade: '' };
}

/** Units as a visitor says them: "ton" (US short ton), "million Btu". */
const KIOSK_UNITS = { short_ton: 'ton', MMBtu: 'million Btu' };
const kioskUnit = (unit) => KIOSK_UNITS[unit] ?? unitLabel(unit);

/** A fuel's row heading: the plain name, and the grade beside it in small type. */
const fuelHeading = (entry, suffix) => {
  const { name, grade } = plainFuelName(entry.name);
  return [`${name}${suffix}`, grade ? h('span', { class: 'grade', text: ` ${grade}` }) : null];
};

function tiersText(p, format) {
  const unit = kioskUnit(p.unit);
  return p.tiers.map((t) => (isNum(t.to)
    ? `${format.price(t.amount)} from ${format.number(t.from)} to ${format.number(t.to)} ${unit} a year`
    : `${format.price(t.amount)} above ${format.number(t.from)} ${unit}`)).join('; ');
}

/** A time-of-use tariff in words: each period's price and its hours, days and months. */
function scheduleText(p, format) {
  return p.schedule.map((r) => {
    const spans = Array.isArray(r.hours?.[0]) ? r.hours : [r.hours];
    const when = spans.map(([a, b]) => `${clockTime(a)}–${clockTime(b)}`).join(' and ');
    const days = r.days && r.days !== 'all' ? ` ${r.days}` : '';
    const months = Array.isArray(r.months) ? ` in months ${r.months.join(', ')}` : '';
    return `${r.name} ${format.price(r.amount)} per kWh ${when}${days}${months}`;
  }).join('; ');
}

function priceRows(k, format, visitor) {
  const rows = [];
  k.offer.fuels.forEach((entry, i) => {
    if (!entry.prices.length) {
      const id = `kiosk-price-${entry.fuel}`;
      rows.push(h('tr', { dataset: { fuel: entry.fuel } },
        h('th', { scope: 'row' }, h('label', { for: id }, fuelHeading(entry, ': your price'))),
        h('td', {}, h('div', { class: 'with-unit' },
          h('input', { id, type: 'text', inputmode: 'decimal', autocomplete: 'off', dataset: { action: 'kiosk-price', fuel: entry.fuel },
            value: visitor.priceText?.[entry.fuel] ?? '', placeholder: 'e.g. 0.16' }),
          h('span', { class: 'unit', text: `${k.currency} per ${kioskUnit(entry.unit)}` }))),
        h('td', { class: 'hint', text: 'Not on our price list: enter it from your bill to include it.' })));
      return;
    }
    entry.prices.forEach((p, j) => {
      const id = `kiosk-locked-${i}-${j}`;
      const compared = p === entry.price;
      const notes = [];
      if (p.tiers?.length) notes.push(tiersText(p, format));
      if (p.schedule?.length) notes.push(`by time of use: ${scheduleText(p, format)}`);
      for (const c of p.fixed_charges ?? []) {
        notes.push(isNum(c.amount_per_month) ? `${c.label ?? 'fixed charge'} ${format.price(c.amount_per_month)} a month`
          : `${c.label ?? 'fixed charge'} ${format.price(c.amount_per_year)} a year`);
      }
      if (p.delivery_minimum) notes.push(`smallest delivery ${format.number(p.delivery_minimum.value)} ${kioskUnit(p.delivery_minimum.unit)}`);
      if (p.note) notes.push(p.note);
      if (!compared) notes.push('not used in the comparison');
      const value = p.tiers?.length ? p.tiers.map((t) => format.price(t.amount)).join(' / ')
        : p.schedule?.length ? [...new Set(p.schedule.map((r) => format.price(r.amount)))].join(' / ') : format.price(p.amount);
      rows.push(h('tr', { dataset: { fuel: entry.fuel, unit: p.unit } },
        h('th', { scope: 'row' }, h('label', { for: id }, fuelHeading(entry, `, per ${kioskUnit(p.unit)}`))),
        h('td', {}, h('input', { id, type: 'text', readonly: true, 'aria-readonly': 'true', class: 'locked', value,
          dataset: { fuel: entry.fuel, unit: p.unit, ...(isNum(p.amount) ? { amount: String(p.amount) } : {}) } })),
        h('td', { class: 'hint', text: notes.join('; ') })));
    });
  });
  return h('section', { class: 'step-card', id: 'kiosk-prices' }, h('h2', { text: 'Our prices' }),
    h('p', { class: 'hint', text: 'From the supplier\'s price file; they cannot be changed here.' }),
    h('div', { class: 'table-wrap' }, h('table', { class: 'prices' }, h('tbody', {}, rows))));
}

function resultsCard(k, state, format) {
  const r = state.result;
  const energyUnit = k.units === 'us' ? 'MMBtu' : 'kWh';
  const nodes = [h('h2', { text: 'What it would cost you a year' })];
  if (state.errors?.length) {
    nodes.push(h('div', { class: 'problems', role: 'alert' }, h('ul', {}, state.errors.map((e) => h('li', { text: e.message })))));
  }
  if (r?.options?.length && !(r.errors ?? []).length) {
    const byId = new Map(r.options.map((o) => [o.id, o]));
    const list = (r.ranking ?? []).map((x) => byId.get(x.id)).filter(Boolean);
    const baseline = r.economics?.baseline;
    nodes.push(h('ol', { class: 'kiosk-results', id: 'kiosk-results' }, list.map((o, i) => {
      const perUseful = o.cost_per_useful_kwh * ENERGY_KWH[energyUnit];
      const subs = [`${plainFuelName(o.fuel_name).name}: ${format.number(o.fuel_quantity?.value, 3)} ${kioskUnit(o.fuel_quantity?.unit ?? '')} a year, ${format.price(perUseful)} per ${kioskUnit(energyUnit)} of heat`];
      if (baseline && o.id === baseline) subs.push('what you have now');
      else if (baseline && isNum(o.annual_saving)) {
        subs.push(o.annual_saving >= 0 ? `saves ${format.money(o.annual_saving)} a year against what you have now`
          : `${format.money(-o.annual_saving)} a year more than what you have now`);
      }
      return h('li', { dataset: { option: o.id, rank: String(i + 1) } },
        h('span', { class: 'rank', text: String(i + 1) }),
        h('div', {}, h('strong', { text: o.label ?? o.id }), subs.map((t) => h('span', { class: 'sub', text: t }))),
        h('div', { class: 'cost' }, h('button', { type: 'button', class: 'num', dataset: { option: o.id, key: 'annual_cost', value: String(o.annual_cost) },
          'aria-label': `${o.label ?? o.id}: ${format.money(o.annual_cost)} a year. Show how it was worked out.`, text: format.money(o.annual_cost) })));
    })));
    nodes.push(h('p', { class: 'hint', text: 'Tap a cost to see how it was worked out. A rough estimate from the size of the house: ask us for a quote worked out for your home.' }));
  } else if (!state.pending) {
    nodes.push(h('p', { class: 'status', text: 'Choose the size of your house above.' }));
  } else {
    nodes.push(h('p', { class: 'status', text: 'Working out…' }));
  }
  if (state.missing?.length) {
    nodes.push(h('p', { class: 'hint', id: 'kiosk-missing', text: `Enter a price above to include: ${state.missing.map((o) => o.label).join(', ')}.` }));
  }
  if (r?.cautions?.length) {
    nodes.push(h('section', { class: 'cautions', id: 'kiosk-cautions' }, h('h3', { text: 'Before deciding' }), h('ul', {}, r.cautions.map((c) => h('li', { text: c })))));
  }
  return h('section', { class: 'step-card', id: 'kiosk-answer', dataset: { state: state.result ? 'done' : state.pending ? 'loading' : 'empty' } }, nodes);
}

/** Renders the kiosk from its setup `k` and the visitor's `state`. */
export function renderKiosk(container, k, state, format) {
  const sizes = HOUSE_SIZES[k.units];
  const v = state.visitor;
  const parts = [];
  if (k.verdict.expired) {
    parts.push(h('div', { class: 'banner expired', id: 'kiosk-expired', role: 'alert',
      text: `These prices expired on ${format.date(k.check.expires)}. Please ask at the counter for today's prices before deciding.` }));
  }
  parts.push(supplierCard(k, format));
  parts.push(h('section', { class: 'step-card', id: 'kiosk-size' }, h('h2', { text: '1. How big is your house?' }),
    h('div', { class: 'big-choices' }, sizes.map((s) => choice('kiosk-size', s.id, v.size === s.id, s.label, s.detail)))));
  parts.push(h('section', { class: 'step-card', id: 'kiosk-current' }, h('h2', { text: '2. What heats it now? (optional)' }),
    h('div', { class: 'big-choices' }, [...k.offer.options.map((o) => choice('kiosk-current', o.id, v.current === o.id, o.label)),
      choice('kiosk-current', '', !v.current, 'Something else, or not sure')])));
  parts.push(priceRows(k, format, v));
  parts.push(resultsCard(k, state, format));
  parts.push(h('div', { class: 'actions' },
    h('p', { class: 'idle-note', id: 'kiosk-idle-note', text: `This page starts over after ${format.number(k.idleSeconds)} seconds without a touch, and forgets what was entered.` }),
    h('button', { type: 'button', class: 'primary', id: 'kiosk-restart', dataset: { action: 'kiosk-restart' }, text: 'Start over' })));
  if (k.file?.supplier?.quote_text) parts.push(h('p', { class: 'hint', id: 'kiosk-quote-text', text: k.file.supplier.quote_text }));
  container.replaceChildren(...parts);
}
