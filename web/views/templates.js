// Price lists (Fuels tab), equipment (Systems tab) and their file (Saved quotes tab): what is kept on
// this device, each with Use and Delete, and the field to keep the quote's own. The import file input
// is the same node from paint to paint, so a file picked while the tab repaints is not lost.
import { h } from '../dom.js';
import { TEMPLATE_NAME_MAX } from '../templates.js';

const message = (id, msg) => h('p', { class: msg?.ok ? 'paste-msg ok' : 'paste-msg', id, role: 'status', hidden: !msg,
  dataset: { seq: String(msg?.seq ?? 0) }, text: msg?.text ?? '' });

function keepRow({ id, label, value, action, problem, placeholder }) {
  return h('div', { class: 'field' },
    h('label', { for: id, text: label }),
    h('div', { class: 'with-unit' },
      h('input', { id, type: 'text', autocomplete: 'off', maxlength: String(TEMPLATE_NAME_MAX + 20), value, placeholder,
        'aria-invalid': problem ? 'true' : undefined, 'aria-describedby': problem ? `${id}-problem` : undefined }),
      h('button', { type: 'button', class: 'secondary', dataset: { action }, text: 'Keep' })),
    problem ? h('p', { class: 'paste-msg', id: `${id}-problem`, text: problem }) : null);
}

/** The Fuels tab's price lists. `t` is the controller's state; `summary(list)` words a list's prices. */
export function renderPriceLists(node, t, summary) {
  const lists = t.shelf.price_lists;
  node.replaceChildren(
    h('legend', { text: 'Your price lists' }),
    h('p', { class: 'hint', text: 'Prices kept on this device, to use in any quote in one tap (the fuels are added if the quote does not have them yet).' }),
    lists.length ? h('ul', { class: 'template-list', id: 'price-list-items' }, lists.map((list) => h('li', { dataset: { id: list.id } },
      h('div', { class: 'template-meta' }, h('strong', { text: `${list.name} (${list.currency})` }), h('span', { class: 'hint', text: summary(list) })),
      h('div', { class: 'card-actions start' },
        h('button', { type: 'button', class: 'secondary', dataset: { action: 'price-list-use', id: list.id }, 'aria-label': `Use the prices of ${list.name}`, text: 'Use' }),
        h('button', { type: 'button', class: 'quiet danger', dataset: { action: 'price-list-delete', id: list.id }, 'aria-label': `Delete ${list.name}`, text: 'Delete' })))))
      : h('p', { class: 'hint', id: 'price-list-none', text: 'None kept yet.' }),
    keepRow({ id: 'price-list-name', label: 'Keep this quote\'s prices as', value: t.priceName, action: 'price-list-keep', problem: t.priceProblem,
      placeholder: 'e.g. Winter prices' }),
    message('price-list-msg', t.priceMessage));
}

/** The Systems tab's equipment list. */
export function renderEquipmentList(node, t, describe) {
  const items = t.shelf.equipment;
  node.replaceChildren(
    h('legend', { text: 'Your equipment' }),
    h('p', { class: 'hint', text: 'Systems kept on this device with their data sheet and prices, to add to any quote in one tap. Keep one with the button on its card.' }),
    items.length ? h('ul', { class: 'template-list', id: 'equipment-items' }, items.map((e) => h('li', { dataset: { id: e.id } },
      h('div', { class: 'template-meta' }, h('strong', { text: e.name }), h('span', { class: 'hint', text: describe(e) })),
      h('div', { class: 'card-actions start' },
        h('button', { type: 'button', class: 'secondary', dataset: { action: 'equipment-use', id: e.id }, 'aria-label': `Add ${e.name} to this quote`, text: 'Add to this quote' }),
        h('button', { type: 'button', class: 'quiet danger', dataset: { action: 'equipment-delete', id: e.id }, 'aria-label': `Delete ${e.name}`, text: 'Delete' })))))
      : h('p', { class: 'hint', id: 'equipment-none', text: 'None kept yet.' }),
    message('equipment-msg', t.equipmentMessage));
}

/** The Saved quotes tab's file of price lists and equipment. */
export function renderTemplateFiles(node, t, input) {
  const count = t.shelf.price_lists.length + t.shelf.equipment.length;
  node.replaceChildren(
    h('legend', { text: 'Price lists and equipment' }),
    h('p', { class: 'hint', text: `${t.shelf.price_lists.length} price ${t.shelf.price_lists.length === 1 ? 'list' : 'lists'} and ${
      t.shelf.equipment.length} equipment ${t.shelf.equipment.length === 1 ? 'entry' : 'entries'} kept on this device. Export them to move them to another device or keep a copy.` }),
    h('div', { class: 'card-actions start' },
      h('button', { type: 'button', class: 'secondary', dataset: { action: 'templates-export' }, disabled: count === 0, text: 'Export (JSON)' }),
      h('label', { class: 'button secondary', for: 'templates-file', text: 'Import (JSON)' }), input),
    message('templates-msg', t.fileMessage));
}
