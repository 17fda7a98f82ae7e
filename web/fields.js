// Form fields bound to workspace paths. Each input carries data-path (a path
// into the workspace, see store.js) and data-kind; one delegated listener per
// panel turns typing into store.set(). Errors from the core ({path, message},
// a path into the scenario) are shown next to the field they point at.
import { h, idFor } from './dom.js';
import { clockInput, formatInput, parseClock, parseNumber, parsePrice, plainUnits } from './format.js';
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
 * A number field: {label, path, value, unit: {path, value, choices} | text, scale, hint, placeholder, currency, per}.
 * `scale` multiplies the stored value for display (100 shows a fraction as %); with `currency` it is a price,
 * read as a bill prints it ("$1.42/therm", parsePrice), per the unit menu beside it or `per` (a fixed unit).
 */
export function numberField(ctx, { label, path, value, unit, scale = 1, hint, placeholder, className, currency, per }) {
  const input = h('input', {
    id: idFor(path), type: 'text', inputmode: 'decimal', autocomplete: 'off', spellcheck: 'false',
    value: formatInput(typeof value === 'number' ? value * scale : value, ctx.locale),
    placeholder: placeholder ?? undefined,
    dataset: { path, kind: 'number', ...(scale !== 1 ? { scale: String(scale) } : {}), ...(currency ? { currency } : {}), ...(per ? { per } : {}) },
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

/** A time-of-day field: {label, path, value (hours 0-24), placeholder}; reads "16", "16:30", "4:30 pm" (parseClock). */
export function clockField(ctx, { label, path, value, placeholder, hint }) {
  const input = h('input', {
    id: idFor(path), type: 'text', autocomplete: 'off', spellcheck: 'false', value: clockInput(value),
    placeholder: placeholder ?? undefined, dataset: { path, kind: 'clock' },
  });
  describedBy(input, path, hint);
  return wrap(path, h('label', { for: input.id, text: label }), input, hint);
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
  if (kind === 'number' && input.dataset.currency) {
    // a price: its currency sign and its unit as printed are read (the unit must be the menu's beside it)
    const unit = input.closest('.with-unit')?.querySelector('select')?.value ?? input.dataset.per ?? '';
    const price = parsePrice(input.value, locale, { currency: input.dataset.currency, unit });
    if (price.message) return { ok: false, message: price.message };
    return { ok: true, value: price.value ?? undefined };
  }
  if (kind === 'number') {
    const number = parseNumber(input.value, locale);
    if (number === null) return { ok: true, value: undefined };
    if (Number.isNaN(number)) return { ok: false, message: 'Not a number' };
    return { ok: true, value: scale ? number / Number(scale) : number };
  }
  if (kind === 'clock') {
    const hours = parseClock(input.value, locale);
    if (hours === null) return { ok: true, value: undefined };
    if (Number.isNaN(hours)) return { ok: false, message: 'Not a time of day: type it as 16, 16:30 or 4:30 pm' };
    return { ok: true, value: hours };
  }
  if (kind === 'check') return { ok: true, value: input.checked };
  if (kind === 'radio') return { ok: true, value: input.value };
  return { ok: true, value: input.value };
}

/** What was typed into a field that cannot be read, by path: shown again when its panel is drawn anew. */
const typedText = new Map();

/**
 * Puts back into the fields under `roots` what was typed where it could not be read (`localErrors`): a
 * panel drawn anew from the store would otherwise show the last value read ("1" for "1,42").
 */
export function restoreTyped(roots, localErrors) {
  for (const [path, text] of typedText) {
    if (!localErrors.has(path)) {
      typedText.delete(path);
      continue;
    }
    for (const root of roots) {
      const input = root.querySelector(`[data-path="${CSS.escape(path)}"]:not([data-action])`);
      if (input && input.value !== text) input.value = text;
    }
  }
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
    if (event.type === 'change' && (kind === 'number' || kind === 'clock' || kind === 'text')) return;
    if (kind === 'radio' && !input.checked) return;
    const read = readInput(input, ctx.locale);
    if (!read.ok) {
      localErrors.set(path, read.message);
      typedText.set(path, input.value);
      showMessage(root, path, read.message);
      ctx.onLocalError?.();
      return;
    }
    typedText.delete(path);
    if (localErrors.delete(path)) {
      showMessage(root, path, '');
      ctx.onLocalError?.();
    }
    ctx.onField(path, read.value, { structural: input.dataset.structural === '1', input });
  };
  root.addEventListener('input', onEvent);
  root.addEventListener('change', onEvent);
}

/** The field showing `path`: its own, else a quantity's value field (an error at {value, unit} as a whole), else an enclosing one. */
function fieldFor(root, path) {
  const at = (p) => {
    const escaped = CSS.escape(p);
    return root.querySelector(`[data-field="${escaped}"]`) ?? root.querySelector(`[data-path="${escaped}"]`)?.closest('[data-field]');
  };
  const own = path ? at(path) ?? root.querySelector(`[data-field="${CSS.escape(`${path}/value`)}"]`) : null;
  if (own) return own;
  for (let p = path.slice(0, path.lastIndexOf('/')); p; p = p.slice(0, p.lastIndexOf('/'))) {
    const node = at(p);
    if (node) return node;
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

/** The words a person reads for a field: its card's title (a fuel, a system, a bill), then its own label. */
export function fieldLabel(field) {
  const own = field.querySelector(':scope > label, :scope > legend, label')?.textContent?.trim() ?? '';
  const card = field.parentElement?.closest('.card, .row-card');
  const title = card?.querySelector('.card-head h3, h3, h4')?.textContent?.trim();
  return title && title !== own ? `${title}: ${own}` : own;
}

/**
 * Shows the core's errors next to their fields (and the local ones), the core's warnings that point
 * at a field as notes there, and the question about a likely slip (`slipFor`) with its one-tap fix.
 * Returns the errors no field on the page shows, the count per panel, and `listed`: each field that
 * needs attention as {path, label, tab, message, local} in page order (local: it cannot be read, so
 * the verdict is out of date).
 */
export function showFieldErrors(roots, errors, ws, localErrors, { warnings = [], slipFor = () => null } = {}) {
  for (const root of roots) {
    for (const msg of root.querySelectorAll('.field-msg')) {
      msg.replaceChildren();
      msg.hidden = true;
      msg.classList.remove('note');
    }
    for (const input of root.querySelectorAll('[aria-invalid]')) input.removeAttribute('aria-invalid');
  }
  const byField = new Map();
  const unplaced = [];
  const counts = new Map(roots.map((root) => [root, 0]));
  const entry = (field, root) => {
    if (!byField.has(field)) byField.set(field, { root, lines: [], notes: [], local: false, fix: null });
    return byField.get(field);
  };
  const find = (path) => {
    for (const root of roots) {
      const field = fieldFor(root, path);
      if (field) return { field, root };
    }
    return null;
  };
  for (const [path, message] of localErrors) {
    const at = find(path);
    if (at) Object.assign(entry(at.field, at.root), { local: true }).lines.push(message);
  }
  for (const error of errors) {
    const at = error.path ? find(workspacePath(error.path, ws)) : null;
    // a field that cannot be read shows only that: the core's answer is for the value before it
    // a fuel's problem comes once for each option burning it: said once at the fuel's field
    if (at) {
      const lines = byField.get(at.field)?.local ? null : entry(at.field, at.root).lines;
      const text = plainUnits(error.message);
      if (lines && !lines.includes(text)) lines.push(text);
    } else unplaced.push(error);
  }
  for (const warning of warnings) {
    // a note about a field (not the option as a whole, which the verdict's notes name)
    if (!/^\/(options\/\d+\/.+|economics\/.+|demand\/.+|climate\/.+)$/.test(warning.path ?? '')) continue;
    const at = find(workspacePath(warning.path, ws));
    // a fuel's note comes once for each option burning it: said once
    const note = plainUnits(warning.message);
    if (at && !entry(at.field, at.root).notes.includes(note)) entry(at.field, at.root).notes.push(note);
  }
  for (const root of roots) {
    for (const input of root.querySelectorAll('input[data-kind="number"]')) {
      if (localErrors.has(input.dataset.path)) continue;
      const slip = slipFor(input.dataset.path, ws);
      const field = slip && input.closest('[data-field]');
      if (field) {
        const e = entry(field, root);
        e.lines = [slip.message];
        e.fix = slip.fix;
      }
    }
  }
  const listed = [];
  for (const [field, { root, lines, notes, local, fix }] of byField) {
    const msg = field.querySelector('.field-msg');
    const error = lines.length > 0;
    if (msg) {
      msg.textContent = (error ? lines : notes).join('\n');
      msg.classList.toggle('note', !error);
      if (fix) {
        msg.append(' ', h('button', { type: 'button', class: 'fix', dataset: { action: 'apply-fix', path: fix.path, value: String(fix.value) }, text: fix.text }));
      }
      msg.hidden = false;
    }
    if (!error) continue;
    const input = field.querySelector('[data-path]');
    if (input) input.setAttribute('aria-invalid', 'true');
    for (const other of field.querySelectorAll('[data-path]')) other.setAttribute('aria-invalid', 'true');
    counts.set(root, counts.get(root) + 1);
    listed.push({ path: input?.dataset.path ?? field.dataset.field, label: fieldLabel(field), tab: root.dataset.panel, message: lines[0], local, field });
  }
  const order = new Map(roots.map((root, i) => [root, i]));
  listed.sort((a, b) => {
    const byRoot = order.get(a.field.closest('[data-panel]')) - order.get(b.field.closest('[data-panel]'));
    if (byRoot) return byRoot;
    return a.field.compareDocumentPosition(b.field) & Node.DOCUMENT_POSITION_FOLLOWING ? -1 : 1;
  });
  return { unplaced, counts, listed: listed.map(({ field, ...rest }) => rest) };
}
