// The heating-value lab: a formula, gas analysis or ultimate analysis in,
// HHV and LHV out (heatingValue() of the core), with the combustion equation;
// the result can become a custom fuel of the quote.
import { h } from '../dom.js';
import { parseNumber } from '../format.js';

const KINDS = [['formula', 'Formula'], ['mixture', 'Gas analysis'], ['ultimate', 'Ultimate analysis']];
const PLACEHOLDER = { formula: 'e.g. C3H8, CH4, C2H5OH', mixture: 'CH4:0.95,C2H6:0.03,N2:0.02', ultimate: 'C:50.2,H:6.1,O:43.2,N:0.1,S:0,ash:0.4' };

/** Renders the lab into `slot`; `ctx.core` computes, `ctx.addCustomFuel(fuel)` adopts a result. */
export function renderLab(slot, ctx) {
  let kind = 'formula';
  const kindSelect = h('select', { id: 'lab-kind' }, KINDS.map(([v, t]) => h('option', { value: v, text: t })));
  const input = h('input', { id: 'lab-input', type: 'text', autocomplete: 'off', spellcheck: 'false', autocapitalize: 'off', placeholder: PLACEHOLDER.formula });
  const moisture = h('input', { id: 'lab-moisture', type: 'text', inputmode: 'decimal', autocomplete: 'off' });
  const moistureField = h('div', { class: 'field', hidden: true }, h('label', { for: 'lab-moisture', text: 'Moisture (%, as received)' }), moisture);
  const submit = h('button', { type: 'submit', class: 'primary', id: 'lab-submit', text: 'Work out' });
  const error = h('p', { class: 'field-msg', id: 'lab-error', role: 'alert', hidden: true });
  const out = h('div', { id: 'lab-result', class: 'lab-result', 'aria-live': 'polite', dataset: { state: 'empty' } });
  kindSelect.addEventListener('change', () => {
    kind = kindSelect.value;
    input.placeholder = PLACEHOLDER[kind];
    moistureField.hidden = kind !== 'ultimate';
  });
  const form = h('form', { class: 'lab', id: 'lab-form', autocomplete: 'off' },
    h('div', { class: 'grid two' },
      h('div', { class: 'field' }, h('label', { for: 'lab-kind', text: 'Describe the fuel by' }), kindSelect),
      h('div', { class: 'field' }, h('label', { for: 'lab-input', text: 'Composition' }), input)),
    moistureField, h('div', { class: 'card-actions' }, submit), error, out);
  let last = null;
  form.addEventListener('submit', async (event) => {
    event.preventDefault();
    const text = input.value.trim();
    const request = { [kind]: text };
    if (kind === 'ultimate') {
      const m = parseNumber(moisture.value, ctx.locale);
      if (Number.isFinite(m)) request.moisture = m;
    }
    submit.disabled = true;
    out.dataset.state = 'loading';
    try {
      const result = await ctx.core.heatingValue(request);
      if (result.errors?.length) {
        error.textContent = result.errors.map((e) => e.message).join('\n');
        error.hidden = false;
        out.replaceChildren();
        out.dataset.state = 'error';
        return;
      }
      error.hidden = true;
      last = { kind, text, request, result };
      showResult(out, result, ctx);
      out.dataset.state = 'done';
    } catch (failure) {
      error.textContent = failure.message;
      error.hidden = false;
      out.dataset.state = 'error';
    } finally {
      submit.disabled = false;
    }
  });
  out.addEventListener('click', (event) => {
    if (!event.target.closest('[data-action="lab-adopt"]') || !last) return;
    const fuel = { kind: last.kind, [last.kind]: last.text, name: last.text, id: `custom-${last.text.toLowerCase().replace(/[^a-z0-9]+/g, '-').slice(0, 40)}` };
    if (last.request.moisture !== undefined) fuel.moisture = last.request.moisture;
    fuel.sale_unit = last.kind === 'mixture' ? 'm3' : 'kg';
    ctx.addCustomFuel(fuel);
  });
  slot.replaceChildren(h('fieldset', { class: 'group' }, h('legend', { text: 'Heating-value lab' }),
    h('p', { class: 'hint', text: 'Gross (HHV) and net (LHV) heating values from a composition.' }), form));
}

function showResult(out, r, ctx) {
  const f = (v) => ctx.format.number(v, 5);
  const rows = [['HHV', 'hhv'], ['LHV', 'lhv']].map(([label, p]) => h('tr', { dataset: { row: p } },
    h('th', { scope: 'row', text: label }),
    ...['kj_per_mol', 'mj_per_kg', 'mj_per_m3', 'btu_per_lb', 'btu_per_ft3'].map((unit) => {
      const value = r[`${p}_${unit}`];
      return h('td', { dataset: { key: `${p}_${unit}`, ...(typeof value === 'number' ? { value: String(value) } : {}) }, text: typeof value === 'number' ? f(value) : '—' });
    })));
  out.replaceChildren(
    h('div', { class: 'table-wrap' }, h('table', { class: 'values' },
      h('thead', {}, h('tr', {}, ['', 'kJ/mol', 'MJ/kg', 'MJ/m³', 'Btu/lb', 'Btu/ft³'].map((t) => h('th', { scope: 'col', text: t })))),
      h('tbody', {}, rows))),
    r.equation ? h('p', { class: 'equation', dataset: { key: 'equation' }, text: r.equation }) : null,
    r.reference?.description ? h('p', { class: 'hint', text: `Volumes at ${r.reference.description}.` }) : null,
    r.basis ? h('p', { class: 'hint', text: r.basis }) : null,
    h('button', { type: 'button', class: 'secondary', dataset: { action: 'lab-adopt' }, text: 'Use as a custom fuel' }));
}
