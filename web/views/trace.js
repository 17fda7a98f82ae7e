// "How was this computed?": a dialog showing an option's (or the demand's)
// trace lines and data sources from the core's result, as plain text.
import { h } from '../dom.js';

let dialog;

function ensureDialog() {
  if (dialog) return dialog;
  dialog = h('dialog', { id: 'trace-dialog', class: 'sheet', 'aria-labelledby': 'trace-title' },
    h('div', { class: 'sheet-head' },
      h('h2', { id: 'trace-title' }),
      h('button', { type: 'button', class: 'quiet', id: 'trace-close', text: 'Close' })),
    h('div', { id: 'trace-body' }));
  dialog.querySelector('#trace-close').addEventListener('click', () => dialog.close());
  dialog.addEventListener('click', (event) => { if (event.target === dialog) dialog.close(); });
  document.body.append(dialog);
  return dialog;
}

/** Opens the dialog: {title, subtitle, trace: [text], sources: [{record, value, citation}], extra: [Node]}. */
export function openTrace({ title, subtitle, trace = [], sources = [], extra = [] }) {
  const d = ensureDialog();
  d.querySelector('#trace-title').textContent = title;
  const body = [];
  if (subtitle) body.push(h('p', { class: 'lead', text: subtitle }));
  body.push(...extra);
  if (trace.length) {
    body.push(h('h3', { text: 'How it was worked out' }),
      h('ol', { class: 'trace', id: 'trace-steps' }, trace.map((line) => h('li', { text: String(line) }))));
  }
  if (sources.length) {
    body.push(h('h3', { text: 'Data used' }),
      h('ul', { class: 'sources', id: 'trace-sources' }, sources.map((src) => h('li', {},
        h('strong', { text: src.record ?? '' }), src.value ? ` — ${src.value}` : '',
        src.citation ? h('span', { class: 'citation', text: src.citation }) : null))));
  }
  d.querySelector('#trace-body').replaceChildren(...body);
  if (!d.open) d.showModal();
  d.querySelector('#trace-close').focus();
}
