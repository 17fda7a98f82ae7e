// Form fields bound to workspace paths. Each input carries data-path (a path
// into the workspace, see store.js) and data-kind; one delegated listener per
// panel turns typing into store.set(). Errors from the core ({path, message},
// a path into the scenario) are shown next to the field they point at.
import { h, idFor } from './dom.js';
import { formatInput, parseNumber, plainUnits } from './format.js';
import { workspacePath } from './scenario.js';
import { unitLabel } from './units.js';

const choicesOf = (choices) => choices.map((c) => (Array.isArray(c) ? c : [c, unitLabel(c)]));

function select(path, value, choices, { structural = false, label, extraClass = '' } = {}) {
  const list = choicesOf(choices);
  if (value !== undefined && value !== null && value !== '' && !list.some(([v]) => v === value)) list.push([value, unitLabel(value)]);
  return h('select', {
    id: idFor(path), class: extraClass || undefined, dataset: { path, kind: 'select', ...(structural ? { structural: '1' } : {}) },
    'aria-label': label,
  }, list.map(([v, text]) => h('option', { value: v, text, selected: v === (value ?? '') })));
}

function wrap(path, labelNode, control, hint) {
  const msg = h('p', { class: 'field-msg', id: idFor(path, '-msg'), 'aria-live': 'polite', hidden: true });
  const nodes = [labelNode, control];
  if (hint) nodes.push(h('p', { class: 'hint', id: idFor(path, '-hint'), text: hint }));
  nodes.push(msg);
  return h('div', { class: 'field', dataset: { field: path } }, nodes);
}

function describedBy(input, path, hint) {
  input.setAttribute('aria-describedby', [hint ? idFor(path, '-hint') : null, idFor(path, '-msg')].filter(Boolean).join(' '));
}

/**
 * A number field: {label, path, value, unit: {path, value, choices} | text, scale, hint, placeholder}.
 * `scale` multiplies the stored value for display (100 shows a fraction as %).
 */
export function numberField(ctx, { label, path, value, unit, scale = 1, hint, placeholder, className }) {
  const input = h('input', {
    id: idFor(path), type: 'text', inputmode: 'decimal', autocomplete: 'off', spellcheck: 'false',
    value: formatInput(typeof value === 'number' ? value * scale : value, ctx.locale),
    placeholder: placeholder ?? undefined,
    dataset: { path, kind: 'number', ...(scale !== 1 ? { scale: String(scale) } : {}) },
  });
  describedBy(input, path, hint);
  let control = input;
  if (unit && typeof unit === 'object') {
    control = h('div', { class: 'with-unit' }, input,
      select(unit.path, unit.value, unit.choices, { structural: unit.structural, label: `${label}: unit` }));
  } else if (unit) {
    control = h('div', { class: 'with-unit' }, input, h('span', { class: 'unit', text: unit }));
  }
  return h('div', { class: className ?? undefined }, wrap(path, h('label', { for: input.id, text: label }), control, hint));
}

/** A text field: {label, path, value, type ('text'|'date'|'textarea'), hint, placeholder}. */
export function textField(ctx, { label, path, value, type = 'text', hint, placeholder, maxlength }) {
  const input = type === 'textarea'
    ? h('textarea', { id: idFor(path), rows: '2', dataset: { path, kind: 'text' }, placeholder, maxlength })
    : h('input', { id: idFor(path), type, autocomplete: 'off', dataset: { path, kind: 'text' }, placeholder, maxlength });
  input.value = value ?? '';
  describedBy(input, path, hint);
  return wrap(path, h('label', { for: input.id, text: label }), input, hint);
}

/** A select: {label, path, value, choices: [value] | [[value, text]], structural, hint}. */
export function selectField(ctx, { label, path, value, choices, structural = false, hint }) {
  const input = select(path, value, choices, { structural });
  describedBy(input, path, hint);
  return wrap(path, h('label', { for: input.id, text: label }), input, hint);
}

/** A checkbox: {label, path, checked, structural}. */
export function checkField(ctx, { label, path, checked, structural = false, hint }) {
  const input = h('input', { id: idFor(path), type: 'checkbox', checked, dataset: { path, kind: 'check', ...(structural ? { structural: '1' } : {}) } });
  describedBy(input, path, hint);
  return wrap(path, h('label', { class: 'check', for: input.id }, input, h('span', { text: label })), null, hint);
}

/** A group of radio buttons: {legend, path, value, choices: [[value, text]], structural}. */
export function radioField(ctx, { legend, path, value, choices, structural = true }) {
  const name = idFor(path);
  const buttons = choices.map(([v, text]) => {
    const input = h('input', { type: 'radio', name, id: idFor(path, `-${v}`), value: v, checked: v === value,
      dataset: { path, kind: 'radio', ...(structural ? { structural: '1' } : {}) } });
    return h('label', { class: 'choice', for: input.id }, input, h('span', { text }));
  });
  const msg = h('p', { class: 'field-msg', id: idFor(path, '-msg'), 'aria-live': 'polite', hidden: true });
  return h('fieldset', { class: 'field radio-group', dataset: { field: path } }, h('legend', { text: legend }),
    h('div', { class: 'choices' }, buttons), msg);
}

/** Parses an input's value by its data-kind; {ok, value} or {ok: false, message}. */
function readInput(input, locale) {
  const { kind, scale } = input.dataset;
  if (kind === 'number') {
    const number = parseNumber(input.value, locale);
    if (number === null) return { ok: true, value: undefined };
    if (Number.isNaN(number)) return { ok: false, message: 'Not a number' };
    return { ok: true, value: scale ? number / Number(scale) : number };
  }
  if (kind === 'check') return { ok: true, value: input.checked };
  if (kind === 'radio') return { ok: true, value: input.value };
  return { ok: true, value: input.value };
}

/**
 * Binds every data-path input under `root` to the store. `localErrors` (a Map
 * path -> message) holds values that could not be read, shown until fixed.
 */
export function bindFields(root, ctx, localErrors) {
  const onEvent = (event) => {
    const input = event.target;
    const path = input?.dataset?.path;
    if (!path) return;
    const kind = input.dataset.kind;
    if (event.type === 'input' && (kind === 'select' || kind === 'check' || kind === 'radio')) return;
    if (event.type === 'change' && (kind === 'number' || kind === 'text')) return;
    if (kind === 'radio' && !input.checked) return;
    const read = readInput(input, ctx.locale);
    if (!read.ok) {
      localErrors.set(path, read.message);
      showMessage(root, path, read.message);
      ctx.onLocalError?.();
      return;
    }
    if (localErrors.delete(path)) showMessage(root, path, '');
    ctx.onField(path, read.value, { structural: input.dataset.structural === '1', input });
  };
  root.addEventListener('input', onEvent);
  root.addEventListener('change', onEvent);
}

function fieldFor(root, path) {
  let p = path;
  while (p) {
    const escaped = CSS.escape(p);
    const node = root.querySelector(`[data-field="${escaped}"]`) ?? root.querySelector(`[data-path="${escaped}"]`)?.closest('[data-field]');
    if (node) return node;
    p = p.slice(0, p.lastIndexOf('/'));
  }
  return null;
}

function showMessage(root, path, text) {
  const field = fieldFor(root, path);
  if (!field) return false;
  const msg = field.querySelector(':scope > .field-msg, :scope .field-msg');
  const lines = text ? [text] : [];
  if (msg) {
    msg.textContent = lines.join('\n');
    msg.hidden = lines.length === 0;
  }
  for (const input of field.querySelectorAll('[data-path]')) {
    if (text) input.setAttribute('aria-invalid', 'true');
    else input.removeAttribute('aria-invalid');
  }
  return true;
}

/**
 * Shows the core's errors next to their fields (and the local ones); returns the
 * errors no field on the page shows, and the count per panel.
 */
export function showFieldErrors(roots, errors, ws, localErrors) {
  for (const root of roots) {
    for (const msg of root.querySelectorAll('.field-msg')) {
      msg.textContent = '';
      msg.hidden = true;
    }
    for (const input of root.querySelectorAll('[aria-invalid]')) input.removeAttribute('aria-invalid');
  }
  const byField = new Map();
  const unplaced = [];
  const counts = new Map(roots.map((root) => [root, 0]));
  const place = (path, message) => {
    for (const root of roots) {
      const field = fieldFor(root, path);
      if (field) {
        if (!byField.has(field)) byField.set(field, { root, lines: [] });
        byField.get(field).lines.push(message);
        return true;
      }
    }
    return false;
  };
  for (const [path, message] of localErrors) place(path, message);
  for (const error of errors) {
    const path = workspacePath(error.path ?? '', ws);
    if (!error.path || !place(path, plainUnits(error.message))) unplaced.push(error);
  }
  for (const [field, { root, lines }] of byField) {
    const msg = field.querySelector('.field-msg');
    if (msg) {
      msg.textContent = lines.join('\n');
      msg.hidden = false;
    }
    for (const input of field.querySelectorAll('[data-path]')) input.setAttribute('aria-invalid', 'true');
    counts.set(root, counts.get(root) + 1);
  }
  return { unplaced, counts };
}
