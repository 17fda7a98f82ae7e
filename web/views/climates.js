// The House tab's weather file and climate library: a CSV of daily or hourly
// temperatures read by the core (what was read, warnings, problems beside the
// control, and the two ways to use it), and the named climates kept on this
// device (use one in one tap, rename, delete with undo, keep this quote's
// climate, export and import them). The two file inputs are the same nodes
// from paint to paint, so a file picked while the panel repaints is not lost.
import { h } from '../dom.js';
import { NAME_MAX, describeClimate } from '../climate-library.js';

const message = (id, msg) => h('p', { class: msg?.ok ? 'field-msg ok' : 'field-msg', id, role: 'status', hidden: !msg,
  dataset: { seq: String(msg?.seq ?? 0) }, text: msg?.text ?? '' });

function choice(id, label, value, choices) {
  return h('div', { class: 'field' }, h('label', { for: id, text: label }),
    h('select', { id }, choices.map(([v, text]) => h('option', { value: v, text, selected: v === value }))));
}

/** The weather-file group. `w` = {fileName, format, unit, pending, summary, message, applied}; `input` the file input. */
export function renderWeather(node, w, input) {
  const s = w.summary;
  const read = s?.ok ? h('div', { class: 'weather-read', id: 'weather-read' },
    h('h3', { text: `Read from “${w.fileName}”` }),
    h('dl', { class: 'facts' }, s.rows.flatMap(([label, text]) => [h('dt', { text: label }), h('dd', { text })])),
    s.warnings.length ? h('ul', { class: 'warnings', id: 'weather-warnings' }, s.warnings.map((text) => h('li', { text }))) : null,
    s.climateMissing ? h('p', { class: 'hint', id: 'weather-no-climate', text: s.climateMissing }) : null,
    h('div', { class: 'card-actions start' },
      h('button', { type: 'button', class: 'primary', id: 'weather-use-climate', dataset: { action: 'weather-use-climate' }, disabled: !s.climate,
        text: 'Use as this quote\'s climate' }),
      h('button', { type: 'button', class: 'secondary', id: 'weather-use-observed', dataset: { action: 'weather-use-observed' }, disabled: !s.observed,
        text: 'Use for the bills\' weather' }))) : null;
  const problems = s && !s.ok ? h('ul', { class: 'problems', id: 'weather-errors', role: 'alert' }, s.errors.map((text) => h('li', { text }))) : null;
  node.replaceChildren(...[
    h('legend', { text: 'Weather from a file' }),
    h('p', { class: 'hint', text: 'A CSV file of daily or hourly outdoor temperatures from a weather service or your own logger. Whole years give this quote a climate; any stretch of days gives the bills their weather.' }),
    h('div', { class: 'grid two' },
      choice('weather-format', 'The file has', w.format, [['', 'Find out from the file'], ['daily', 'One reading a day'], ['hourly', 'One reading an hour']]),
      choice('weather-unit', 'Temperatures in', w.unit, [['', 'As the file says'], ['degF', '°F'], ['degC', '°C']])),
    h('div', { class: 'card-actions start' },
      h('label', { class: 'button secondary', for: 'weather-file', text: 'Import weather (CSV)' }), input),
    w.pending ? h('p', { class: 'status', id: 'weather-pending', text: `Reading “${w.fileName}”…` }) : null,
    message('weather-msg', w.message),
    problems,
    read].filter(Boolean));
}

/** One kept climate: name, what it holds, Use / Rename / Delete, or the rename field. */
function entryItem(e, lib, currentName) {
  const current = e.name === currentName;
  if (lib.renaming === e.id) {
    return h('li', { dataset: { id: e.id } },
      h('div', { class: 'field', dataset: { field: 'library-rename' } },
        h('label', { for: 'climate-rename', text: `New name for “${e.name}”` }),
        h('input', { id: 'climate-rename', type: 'text', autocomplete: 'off', maxlength: String(NAME_MAX + 20), value: lib.renameText ?? e.name,
          'aria-invalid': lib.renameProblem ? 'true' : undefined, 'aria-describedby': 'climate-rename-msg' }),
        h('p', { class: 'field-msg', id: 'climate-rename-msg', role: 'status', hidden: !lib.renameProblem, text: lib.renameProblem ?? '' })),
      h('div', { class: 'card-actions start' },
        h('button', { type: 'button', class: 'primary', dataset: { action: 'library-rename-save', id: e.id }, text: 'Save the name' }),
        h('button', { type: 'button', class: 'quiet', dataset: { action: 'library-rename-cancel' }, text: 'Cancel' })));
  }
  return h('li', { class: current ? 'current' : undefined, dataset: { id: e.id } },
    h('div', { class: 'quote-meta' },
      h('strong', { class: 'c-name', text: e.name }),
      h('span', { class: 'c-what', text: describeClimate(e.climate) }),
      e.note ? h('span', { class: 'c-note', text: e.note }) : null,
      current ? h('span', { class: 'c-current', text: 'this quote\'s climate' }) : null),
    h('div', { class: 'quote-actions' },
      h('button', { type: 'button', class: 'secondary', dataset: { action: 'library-use', id: e.id }, 'aria-label': `Use ${e.name} for this quote`, text: 'Use' }),
      h('button', { type: 'button', class: 'quiet', dataset: { action: 'library-rename', id: e.id }, 'aria-label': `Rename ${e.name}`, text: 'Rename' }),
      h('button', { type: 'button', class: 'quiet danger', dataset: { action: 'library-delete', id: e.id }, 'aria-label': `Delete ${e.name}`, text: 'Delete' })));
}

/**
 * The climate-library group. `lib` = {kind, entries, renaming, renameText, renameProblem, keepName, keepProblem,
 * message, undo}; `currentName` the label of this quote's climate; `input` the library file input.
 */
export function renderLibrary(node, lib, currentName, input) {
  const entries = [...lib.entries].sort((a, b) => a.name.localeCompare(b.name));
  node.replaceChildren(...[
    h('legend', { text: 'Climates kept on this device' }),
    h('p', { class: 'hint', text: 'Keep the climates of the places you work in and pick one for a quote in one tap.' }),
    entries.length ? h('ul', { class: 'quote-list climate-list', id: 'climate-list' }, entries.map((e) => entryItem(e, lib, currentName)))
      : h('p', { class: 'status', id: 'climate-empty', text: 'No climates kept yet.' }),
    lib.undo ? h('div', { class: 'toast inline', id: 'climate-undo', role: 'status' },
      h('span', { text: `Deleted “${lib.undo.name}”.` }),
      h('button', { type: 'button', class: 'secondary', dataset: { action: 'library-undo' }, text: 'Undo' })) : null,
    h('div', { class: 'field', dataset: { field: 'library-keep' } },
      h('label', { for: 'climate-keep-name', text: 'Keep this quote\'s climate as' }),
      h('div', { class: 'with-action' },
        h('input', { id: 'climate-keep-name', type: 'text', autocomplete: 'off', maxlength: String(NAME_MAX + 20), value: lib.keepName ?? '',
          placeholder: 'e.g. the town', 'aria-invalid': lib.keepProblem ? 'true' : undefined, 'aria-describedby': 'climate-keep-msg' }),
        h('button', { type: 'button', class: 'secondary', dataset: { action: 'library-keep' }, text: 'Keep' })),
      h('p', { class: 'field-msg', id: 'climate-keep-msg', role: 'status', hidden: !lib.keepProblem, text: lib.keepProblem ?? '' })),
    h('div', { class: 'card-actions start' },
      h('button', { type: 'button', class: 'secondary', dataset: { action: 'library-export' }, disabled: !entries.length, text: 'Export the kept climates (JSON)' }),
      h('label', { class: 'button secondary', for: 'climate-library-file', text: 'Import climates (JSON)' }), input),
    message('library-msg', lib.message),
    h('p', { class: 'hint', id: 'climate-storage-kind', text: `Kept on this device (${lib.kind || 'opening…'}).` })].filter(Boolean));
}
