// Renders core responses into the page. Everything is built with DOM nodes and
// textContent, so text from the user or the core is never parsed as HTML.

/** Six significant digits, without trailing zeros or exponent for everyday values. */
export function formatNumber(value) {
  return typeof value === 'number' && Number.isFinite(value) ? String(Number(value.toPrecision(6))) : '—';
}

function element(tag, props = {}, children = []) {
  const node = document.createElement(tag);
  for (const [key, value] of Object.entries(props)) {
    if (key === 'text') node.textContent = value;
    else if (key === 'className') node.className = value;
    else node.setAttribute(key, value);
  }
  for (const child of children) node.append(child);
  return node;
}

function valueCell(result, key) {
  const value = result[key];
  const cell = element('td', { text: formatNumber(value), 'data-key': key });
  if (typeof value === 'number') cell.dataset.value = String(value);
  return cell;
}

function describe(item) {
  return typeof item === 'string' ? item : JSON.stringify(item);
}

/** Shows a status line ("Computing…") in a result container. */
export function showStatus(container, text) {
  container.dataset.state = 'loading';
  container.replaceChildren(element('p', { className: 'status', text }));
}

/** Shows a heating-value response: the table of values, the equation, reference and warnings. */
export function showHeatingValue(container, result) {
  const rows = [['HHV', 'hhv'], ['LHV', 'lhv']].map(([label, prefix]) =>
    element('tr', { 'data-row': prefix }, [
      element('th', { scope: 'row', text: label }),
      valueCell(result, `${prefix}_kj_per_mol`),
      valueCell(result, `${prefix}_mj_per_kg`),
      valueCell(result, `${prefix}_mj_per_m3`),
    ]));
  const table = element('table', { className: 'values' }, [
    element('thead', {}, [element('tr', {}, [
      element('th', { scope: 'col', text: '' }),
      element('th', { scope: 'col', text: 'kJ/mol' }),
      element('th', { scope: 'col', text: 'MJ/kg' }),
      element('th', { scope: 'col', text: 'MJ/m³' }),
    ])]),
    element('tbody', {}, rows),
  ]);
  const parts = [table];
  if (result.equation) parts.push(element('p', { className: 'equation', 'data-key': 'equation', text: describe(result.equation) }));
  if (result.reference !== undefined) {
    const reference = result.reference?.description ?? describe(result.reference);
    parts.push(element('p', { className: 'meta', 'data-key': 'reference', text: `Volumes at ${reference}` }));
  }
  const warnings = Array.isArray(result.warnings) ? result.warnings : [];
  if (warnings.length) {
    parts.push(element('ul', { className: 'warnings' }, warnings.map((w) => element('li', { text: describe(w.message ?? w) }))));
  }
  container.dataset.state = 'done';
  container.replaceChildren(...parts);
}

/** Clears a result container. */
export function clear(container) {
  container.dataset.state = 'empty';
  container.replaceChildren();
}

/** Shows errors ([{path, message}] or an Error) as plain text; hides the element when there are none. */
export function showErrors(target, errors) {
  const list = errors instanceof Error ? [{ message: errors.message }] : (errors ?? []);
  const lines = list.map((e) => (e.path ? `${e.path}: ${e.message}` : String(e.message ?? e)));
  target.textContent = lines.join('\n');
  target.hidden = lines.length === 0;
}
