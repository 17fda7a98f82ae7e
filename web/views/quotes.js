// Saved quotes: the list on this device, searchable by customer, site and
// date; open, duplicate, delete (with undo), export and import as a scenario
// JSON file, new quotes.
import { h } from '../dom.js';

/** Renders the saved-quotes panel. `state` = {records, currentId, query, storageKind, undo}. */
export function renderQuotes(container, ctx, state) {
  const query = (state.query ?? '').trim().toLowerCase();
  const records = [...state.records].sort((a, b) => (b.updated_at ?? '').localeCompare(a.updated_at ?? ''));
  const shown = records.filter((r) => !query || [r.customer, r.site, r.date, r.title, ctx.format.date(r.date)]
    .some((v) => String(v ?? '').toLowerCase().includes(query)));
  const list = h('ul', { class: 'quote-list', id: 'quote-list' }, shown.map((r) => h('li', { class: r.id === state.currentId ? 'current' : undefined, dataset: { id: r.id } },
    h('div', { class: 'quote-meta' },
      h('strong', { class: 'q-customer', text: r.customer || 'No customer yet' }),
      h('span', { class: 'q-site', text: r.site || '' }),
      h('span', { class: 'q-date', text: [r.date ? ctx.format.date(r.date) : '', r.id === state.currentId ? 'open now' : ''].filter(Boolean).join(' · ') })),
    h('div', { class: 'quote-actions' },
      h('button', { type: 'button', class: 'secondary', dataset: { action: 'open-quote', id: r.id }, disabled: r.id === state.currentId, 'aria-label': `Open the quote for ${r.customer || 'no customer'}`, text: 'Open' }),
      h('button', { type: 'button', class: 'quiet', dataset: { action: 'duplicate-quote', id: r.id }, 'aria-label': `Duplicate the quote for ${r.customer || 'no customer'}`, text: 'Duplicate' }),
      h('button', { type: 'button', class: 'quiet danger', dataset: { action: 'delete-quote', id: r.id }, 'aria-label': `Delete the quote for ${r.customer || 'no customer'}`, text: 'Delete' })))));
  const search = h('div', { class: 'field' }, h('label', { for: 'quote-search', text: 'Find a quote (customer, site or date)' }),
    h('input', { id: 'quote-search', type: 'search', autocomplete: 'off', value: state.query ?? '' }));
  const undo = state.undo ? h('div', { class: 'toast', id: 'undo-toast', role: 'status' },
    h('span', { text: `Deleted the quote for ${state.undo.customer || 'no customer'}.` }),
    h('button', { type: 'button', class: 'secondary', dataset: { action: 'undo-delete' }, text: 'Undo' })) : null;
  container.replaceChildren(...[
    h('div', { class: 'card-actions start' },
      h('button', { type: 'button', class: 'primary', dataset: { action: 'new-quote' }, text: 'New quote' }),
      h('button', { type: 'button', class: 'secondary', dataset: { action: 'new-quote-keep' }, text: 'New quote with these prices and systems' }),
      h('button', { type: 'button', class: 'secondary', dataset: { action: 'load-demo' }, text: 'Load the demo' })),
    search,
    undo,
    shown.length ? list : h('p', { class: 'status', id: 'quote-empty', text: query ? 'No saved quote matches.' : 'No saved quotes yet.' }),
    h('fieldset', { class: 'group' }, h('legend', { text: 'Files' }),
      h('p', { class: 'hint', text: 'A quote file is the scenario in JSON (fuelwright.scenario/1). It stays on this device unless you share it.' }),
      h('div', { class: 'card-actions start' },
        h('button', { type: 'button', class: 'secondary', dataset: { action: 'export-json' }, text: 'Export this quote (JSON)' }),
        h('label', { class: 'button secondary', for: 'import-file', text: 'Import a quote file' }),
        h('input', { id: 'import-file', type: 'file', accept: '.json,application/json', class: 'visually-hidden' })),
      h('p', { class: state.importMessage?.ok ? 'field-msg ok' : 'field-msg', id: 'import-msg', role: 'status',
        hidden: !state.importMessage, text: state.importMessage?.text ?? '' })),
    h('p', { class: 'hint', id: 'storage-kind', text: `Saved automatically on this device (${state.storageKind}).` })].filter(Boolean));
  const input = container.querySelector('#quote-search');
  input.addEventListener('input', () => ctx.onSearch(input.value));
}
