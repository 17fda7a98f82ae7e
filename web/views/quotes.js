// Saved quotes: the list on this device, searchable by customer, site and
// date, each with the verdict it was saved with; open, duplicate, delete (with
// undo), export and import as a scenario JSON file, new quotes. A record saved
// by a newer version is listed as one this version cannot open.
import { h } from '../dom.js';
import { createFormat, isCurrency } from '../format.js';
import { recordProblem } from '../storage.js';

/** The line a saved record's verdict summary shows in the list (money in the record's own currency). */
export function summaryText(summary, locale) {
  if (!summary) return 'No verdict saved yet: open the quote to work it out.';
  const currency = isCurrency(summary.currency) ? summary.currency : null;
  const money = currency ? createFormat({ locale, currency }).money(summary.annual_cost)
    : `${createFormat({ locale, currency: 'USD' }).number(summary.annual_cost)} ${summary.currency ?? ''}`.trim();
  const n = summary.option_count;
  const of = n === 1 ? 'the only option' : `best of ${n} options`;
  return `Lowest yearly cost: ${summary.best_label}, ${money}/yr (${of})`;
}

/** The line of a record this version cannot open. */
export const problemText = (problem) => `Cannot be opened by this version: ${problem}. It is kept unchanged on this device.`;

/** A record's text field, or '' (a record this version cannot read may hold anything). */
const textOf = (value) => (typeof value === 'string' ? value : '');

/** One saved record in the list. */
function quoteItem(r, ctx, state) {
  const problem = recordProblem(r);
  const who = textOf(r.customer) || 'no customer';
  const classes = [r.id === state.currentId ? 'current' : '', problem ? 'unreadable' : ''].filter(Boolean).join(' ');
  return h('li', { class: classes || undefined, dataset: { id: r.id } },
    h('div', { class: 'quote-meta' },
      h('strong', { class: 'q-customer', text: textOf(r.customer) || 'No customer yet' }),
      h('span', { class: 'q-site', text: textOf(r.site) }),
      h('span', { class: 'q-date', text: [textOf(r.date) ? ctx.format.date(r.date) : '', r.id === state.currentId ? 'open now' : ''].filter(Boolean).join(' · ') }),
      problem ? h('span', { class: 'q-problem', text: problemText(problem) }) : h('span', { class: 'q-summary', text: summaryText(r.summary, ctx.locale) })),
    h('div', { class: 'quote-actions' },
      h('button', { type: 'button', class: 'secondary', dataset: { action: 'open-quote', id: r.id }, disabled: r.id === state.currentId || Boolean(problem), 'aria-label': `Open the quote for ${who}`, text: 'Open' }),
      h('button', { type: 'button', class: 'quiet', dataset: { action: 'duplicate-quote', id: r.id }, disabled: Boolean(problem), 'aria-label': `Duplicate the quote for ${who}`, text: 'Duplicate' }),
      h('button', { type: 'button', class: 'quiet danger', dataset: { action: 'delete-quote', id: r.id }, 'aria-label': `Delete the quote for ${who}`, text: 'Delete' })));
}

/**
 * Renders the saved-quotes panel. `state` = {records, currentId, query, storageKind, undo, importMessage: {ok, text, seq}}.
 * The file input is the same node from one paint to the next: a file picked while the list
 * repaints (a save finishing, a search typed) reaches the input that opened the picker.
 */
export function renderQuotes(container, ctx, state) {
  const query = (state.query ?? '').trim().toLowerCase();
  const records = [...state.records].sort((a, b) => textOf(b.updated_at).localeCompare(textOf(a.updated_at)));
  const shown = records.filter((r) => !query || [r.customer, r.site, r.date, r.title, ctx.format.date(textOf(r.date))]
    .some((v) => String(v ?? '').toLowerCase().includes(query)));
  const list = h('ul', { class: 'quote-list', id: 'quote-list' }, shown.map((r) => quoteItem(r, ctx, state)));
  const search = h('div', { class: 'field' }, h('label', { for: 'quote-search', text: 'Find a quote (customer, site or date)' }),
    h('input', { id: 'quote-search', type: 'search', autocomplete: 'off', value: state.query ?? '' }));
  // the contractor's profile (views/profile.js) keeps its own node, and its file input, across repaints
  const profileSlot = container.querySelector('#profile-slot') ?? h('div', { id: 'profile-slot' });
  const fileInput = container.querySelector('#import-file')
    ?? h('input', { id: 'import-file', type: 'file', accept: '.json,application/json', class: 'visually-hidden' });
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
      h('p', { class: 'hint', text: 'A quote file is the scenario in JSON (fuelwright.scenario/1). It stays on this device unless you share it. Import also reads a saved-quote record (fuelwright.saved-quote/1 or /2).' }),
      h('div', { class: 'card-actions start' },
        h('button', { type: 'button', class: 'secondary', dataset: { action: 'export-json' }, text: 'Export this quote (JSON)' }),
        h('label', { class: 'button secondary', for: 'import-file', text: 'Import a quote file' }),
        fileInput),
      h('p', { class: state.importMessage?.ok ? 'field-msg ok' : 'field-msg', id: 'import-msg', role: 'status',
        hidden: !state.importMessage, dataset: { seq: String(state.importMessage?.seq ?? 0) }, text: state.importMessage?.text ?? '' })),
    h('p', { class: 'hint', id: 'storage-kind', text: `Saved automatically on this device (${state.storageKind}).` }),
    profileSlot,
    // the price lists and equipment kept on this device: a node owned by web/template-shelf.js
    ctx.templateTools?.fileNode].filter(Boolean));
  const input = container.querySelector('#quote-search');
  input.addEventListener('input', () => ctx.onSearch(input.value));
}
