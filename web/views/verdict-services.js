// The verdict's split of each option into its two services, space heating and hot water, and its electricity
// by time-of-use period: the same rows on the page and on the quote sheet (web/results.js serviceRows).
import { h } from '../dom.js';
import { madeByWords, serviceRows } from '../results.js';
import { unitLabel } from '../units.js';

const isNum = (v) => typeof v === 'number' && Number.isFinite(v);

function quantityText(part, format) {
  const q = part?.fuel_quantity;
  return q && isNum(q.value) && q.value > 0 ? `${format.number(q.value, 3)} ${unitLabel(q.unit ?? '')}` : '—';
}

function periodsText(row, format) {
  if (!row.periods.length) return '—';
  return row.periods.map((p) => `${p.name} ${format.number(p.kwh, 3)} kWh, ${format.money(p.cost)}`).join('; ');
}

/** The table of the services (null when there is nothing to split), `id` its element id. */
export function servicesTable(result, ctx, by, id = 'services-table') {
  const rows = serviceRows(result, by);
  if (!rows) return null;
  const { format } = ctx;
  const water = rows.some((r) => r.water);
  const periods = rows.some((r) => r.periods.length);
  const head = ['Option', 'Space heating a year', ...(water ? ['Hot water a year'] : []), ...(periods ? ['Electricity by time of use'] : [])];
  return h('table', { id, class: 'ranked services' },
    h('caption', { class: 'visually-hidden', text: 'Each option\'s cost a year for space heating and hot water' }),
    h('thead', {}, h('tr', {}, head.map((t) => h('th', { scope: 'col', text: t })))),
    h('tbody', {}, rows.map((r) => h('tr', { dataset: { option: r.id } },
      h('th', { scope: 'row', class: 'opt', text: r.label }),
      h('td', { dataset: { label: head[1] } }, h('span', { text: format.money(r.space?.annual_cost) }),
        h('span', { class: 'sub', text: quantityText(r.space, format) })),
      water ? h('td', { dataset: { label: 'Hot water a year' } }, h('span', { text: format.money(r.water?.annual_cost) }),
        h('span', { class: 'sub', text: `${quantityText(r.water, format)} by ${madeByWords(r.water?.made_by)}${
          isNum(r.water?.fixed_cost) && r.water.fixed_cost > 0 ? `, with ${format.money(r.water.fixed_cost)} of fixed charges for its fuel's service` : ''}` })) : null,
      periods ? h('td', { dataset: { label: 'Electricity by time of use' } }, h('span', { class: 'sub', text: periodsText(r, format) })) : null))));
}

/** The verdict's section (null when there is nothing to split). */
export function servicesSection(result, ctx, by) {
  const table = servicesTable(result, ctx, by);
  if (!table) return null;
  return h('section', { class: 'chart-card', id: 'services' }, h('h3', { text: 'Space heating and hot water' }),
    h('div', { class: 'table-wrap' }, table),
    h('p', { class: 'hint', text: 'The two add up to each option\'s cost a year above. Time-of-use kWh fall in the hours they are used: heat in the cold hours of each month, hot water by the day\'s draws.' }));
}
