// The House tab's weather file and climate library, the controller: reads a
// picked CSV through the core's weather() (in the worker, like every
// computation), keeps what it answered, and puts its climate or its observed
// days into the quote when asked; keeps named climates in the device's store
// (web/climate-store.js) and puts one into the quote in one tap. It owns one
// node for each group, which views/house.js places in the panel; the views
// render them (views/climates.js). app.js creates it and hands it the store,
// the core client and the formatter.
import { download, h, onActions } from './dom.js';
import { keepableClimate, libraryFile, makeEntry, nameProblem, readLibraryFile, uniqueName } from './climate-library.js';
import { openClimates } from './climate-store.js';
import { climateFromScenario } from './scenario.js';
import { newId } from './storage.js';
import { plainUnits } from './format.js';
import { fileProblem, weatherLabel, weatherRequest, weatherSummary } from './weather.js';
import { renderLibrary, renderWeather } from './views/climates.js';

/** Why a write to the device failed, in words. */
const writeFailure = (failure) => (['QuotaExceededError', 'NS_ERROR_DOM_QUOTA_REACHED'].includes(failure?.name)
  ? 'the storage for this page on this device is full' : `the browser refused to store it (${failure?.message || failure?.name || String(failure)})`);

/** Creates the controller: {weatherNode, libraryNode, start(), paint()}; `ctx` gives store, core and format (a getter). */
export function createClimateTools(ctx) {
  const { store, core } = ctx;
  const weatherNode = h('fieldset', { class: 'group', id: 'weather-group' });
  const libraryNode = h('fieldset', { class: 'group', id: 'climate-library' });
  const weatherInput = h('input', { id: 'weather-file', type: 'file', accept: '.csv,.txt,text/csv,text/plain', class: 'visually-hidden' });
  const libraryInput = h('input', { id: 'climate-library-file', type: 'file', accept: '.json,application/json', class: 'visually-hidden' });
  let storage = null;
  let seq = 0;
  let undoTimer = 0;
  const w = { fileName: '', text: null, format: '', unit: '', pending: false, summary: null, answer: null, message: null, run: 0 };
  const lib = { kind: '', entries: [], renaming: null, renameText: '', renameProblem: null, keepName: '', keepProblem: null, message: null, undo: null };
  const say = (target, ok, text) => { target.message = { ok, text, seq: ++seq }; };

  /** Repaints both groups, keeping the focused control of either (by id) and its caret. */
  function paint() {
    const active = document.activeElement;
    const id = (weatherNode.contains(active) || libraryNode.contains(active)) && active !== weatherInput && active !== libraryInput ? active.id : '';
    const caret = id && 'selectionStart' in active ? [active.selectionStart, active.selectionEnd] : null;
    renderWeather(weatherNode, w, weatherInput);
    renderLibrary(libraryNode, lib, store.state.climate?.label ?? '', libraryInput);
    if (id) {
      const again = document.getElementById(id);
      if (again && again !== active) {
        again.focus({ preventScroll: true });
        if (caret && 'setSelectionRange' in again) { try { again.setSelectionRange(...caret); } catch { /* not text */ } }
      }
    }
  }

  // -------------------------------------------------------------------------
  // The weather file

  async function readWeather() {
    const run = ++w.run;
    w.pending = true;
    w.message = null;
    paint();
    let answer = null;
    let failure = null;
    try {
      answer = await core.weather(weatherRequest(w.text, { format: w.format, unit: w.unit }));
    } catch (error) {
      failure = error;
    }
    if (run !== w.run) return;
    w.pending = false;
    if (failure) {
      w.answer = null;
      w.summary = { ok: false, rows: [], warnings: [], errors: [`The calculation core could not read the file: ${failure.message}`] };
      say(w, false, `“${w.fileName}” was not read.`);
    } else {
      w.answer = answer;
      w.summary = weatherSummary(answer, ctx.format);
      say(w, w.summary.ok, w.summary.ok ? `Read “${w.fileName}”.` : `“${w.fileName}” was not read: see why below.`);
    }
    paint();
  }

  async function pickWeather(file) {
    w.fileName = file?.name ?? '';
    const problem = fileProblem(file);
    if (problem) {
      w.text = null;
      w.answer = null;
      w.summary = null;
      w.run++;
      w.pending = false;
      say(w, false, problem);
      paint();
      return;
    }
    try {
      w.text = await file.text();
    } catch (failure) {
      w.text = null;
      w.summary = null;
      say(w, false, `“${file.name}” could not be opened: ${failure.message}`);
      paint();
      return;
    }
    await readWeather();
  }

  function useClimate() {
    const climate = w.summary?.ok ? w.answer?.climate : null;
    if (!climate) return;
    const label = weatherLabel(w.fileName, w.answer, ctx.format);
    store.mutate((ws) => { ws.climate = climateFromScenario(climate, { units: ws.settings.units, label }); });
    lib.keepName = w.answer.station?.trim() || w.fileName.replace(/\.[^.]+$/, '');
    say(w, true, 'This quote\'s climate is now the one from the weather file (see Climate above).');
    paint();
  }

  function useObserved() {
    const observed = w.summary?.ok ? w.answer?.observed : null;
    if (!observed) return;
    const label = weatherLabel(w.fileName, w.answer, ctx.format);
    store.mutate((ws) => {
      ws.demand.observed = structuredClone(observed);
      ws.demand.observed_label = label;
    });
    say(w, true, store.state.demand.method === 'bills'
      ? 'The bills are now compared with the weather of their own days (see Past fuel bills above).'
      : 'Kept as the weather of the bills: it is used when the heat need is worked out from past fuel bills.');
    paint();
  }

  // -------------------------------------------------------------------------
  // The library

  async function loadLibrary() {
    storage = await openClimates();
    lib.kind = storage.kind;
    try {
      lib.entries = (await storage.list()).filter((e) => e && typeof e.id === 'string' && typeof e.name === 'string' && e.climate);
    } catch (failure) {
      say(lib, false, `The climates kept on this device could not be read: ${failure.message}`);
    }
    paint();
  }

  /** The problems the core finds in a climate, as one sentence, or '' when it has none. */
  async function coreProblems(climate) {
    const check = await core.climate(climate);
    return (check.errors ?? []).map((e) => plainUnits(e.message)).join('; ');
  }

  async function keep() {
    const name = lib.keepName.trim();
    const { climate, problem } = keepableClimate(store.state.climate);
    lib.keepProblem = nameProblem(name, lib.entries) ?? problem;
    if (!lib.keepProblem) {
      const problems = await coreProblems(climate).catch((failure) => failure.message);
      if (problems) lib.keepProblem = `This quote's climate cannot be kept until it is fixed: ${problems}`;
    }
    if (lib.keepProblem) { paint(); return; }
    const entry = makeEntry({ id: newId(), name, note: store.state.climate.label ?? '', climate });
    try {
      await storage.put(entry);
    } catch (failure) {
      lib.keepProblem = `“${name}” was NOT kept: ${writeFailure(failure)}.`;
      paint();
      return;
    }
    lib.entries.push(entry);
    lib.keepName = '';
    store.mutate((ws) => { ws.climate.label = entry.name; });
    say(lib, true, `Kept “${entry.name}” on this device.`);
    paint();
  }

  function use(id) {
    const entry = lib.entries.find((e) => e.id === id);
    if (!entry) return;
    store.mutate((ws) => { ws.climate = climateFromScenario(entry.climate, { units: ws.settings.units, label: entry.name }); });
    say(lib, true, `This quote now uses the climate “${entry.name}”.`);
    paint();
  }

  async function rename(id) {
    const entry = lib.entries.find((e) => e.id === id);
    if (!entry) return;
    const name = lib.renameText.trim();
    lib.renameProblem = nameProblem(name, lib.entries, id);
    if (lib.renameProblem) { paint(); return; }
    const renamed = { ...entry, name, updated_at: new Date().toISOString() };
    try {
      await storage.put(renamed);
    } catch (failure) {
      lib.renameProblem = `The new name was NOT kept: ${writeFailure(failure)}.`;
      paint();
      return;
    }
    lib.entries = lib.entries.map((e) => (e.id === id ? renamed : e));
    if (store.state.climate?.label === entry.name) store.mutate((ws) => { ws.climate.label = name; });
    lib.renaming = null;
    say(lib, true, `Renamed “${entry.name}” to “${name}”.`);
    paint();
  }

  async function remove(id) {
    const entry = lib.entries.find((e) => e.id === id);
    if (!entry) return;
    try {
      await storage.delete(id);
    } catch (failure) {
      say(lib, false, `“${entry.name}” was NOT deleted: ${writeFailure(failure)}.`);
      paint();
      return;
    }
    lib.entries = lib.entries.filter((e) => e.id !== id);
    lib.undo = entry;
    lib.message = null;
    clearTimeout(undoTimer);
    undoTimer = setTimeout(() => { lib.undo = null; paint(); }, 10_000);
    paint();
    libraryNode.querySelector('#climate-undo button')?.focus();
  }

  async function undo() {
    const entry = lib.undo;
    if (!entry) return;
    clearTimeout(undoTimer);
    const back = { ...entry, name: uniqueName(entry.name, lib.entries) };
    try {
      await storage.put(back);
    } catch (failure) {
      say(lib, false, `“${entry.name}” was NOT put back: ${writeFailure(failure)}.`);
      paint();
      return;
    }
    lib.entries.push(back);
    lib.undo = null;
    say(lib, true, `Put “${back.name}” back.`);
    paint();
  }

  function exportLibrary() {
    const day = new Date().toISOString().slice(0, 10);
    download(`fuelwright-climates-${day}.json`, 'application/json', `${JSON.stringify(libraryFile(lib.entries), null, 2)}\n`);
  }

  async function importLibrary(file) {
    let read;
    try {
      read = readLibraryFile(JSON.parse(await file.text()));
    } catch (failure) {
      const why = failure instanceof SyntaxError ? 'it is not a JSON file' : failure.message;
      say(lib, false, `Could not import “${file.name}”: ${why}.`);
      paint();
      return;
    }
    const added = [];
    const refused = read.refused.map((r) => r.message);
    for (const item of read.climates) {
      const problems = await coreProblems(item.climate).catch((failure) => failure.message);
      if (problems) {
        refused.push(`Climate “${item.name}” was not kept: ${problems}.`);
        continue;
      }
      const entry = makeEntry({ id: newId(), name: uniqueName(item.name, lib.entries), note: item.note, climate: item.climate });
      try {
        await storage.put(entry);
      } catch (failure) {
        refused.push(`Climate “${item.name}” was NOT kept: ${writeFailure(failure)}.`);
        continue;
      }
      lib.entries.push(entry);
      added.push(entry.name === item.name ? `“${entry.name}”` : `“${item.name}” (kept as “${entry.name}”, the name was taken)`);
    }
    const head = added.length ? `Imported ${added.length === 1 ? '1 climate' : `${added.length} climates`} from “${file.name}”: ${added.join(', ')}.`
      : `No climate was imported from “${file.name}”.`;
    say(lib, refused.length === 0 && added.length > 0, [head, ...refused].join('\n'));
    paint();
  }

  // -------------------------------------------------------------------------
  // Events

  const ACTIONS = {
    'weather-use-climate': useClimate,
    'weather-use-observed': useObserved,
    'library-keep': keep,
    'library-use': (d) => use(d.id),
    'library-rename': (d) => {
      lib.renaming = d.id;
      lib.renameText = lib.entries.find((e) => e.id === d.id)?.name ?? '';
      lib.renameProblem = null;
      paint();
      libraryNode.querySelector('#climate-rename')?.focus();
    },
    'library-rename-save': (d) => rename(d.id),
    'library-rename-cancel': () => { lib.renaming = null; lib.renameProblem = null; paint(); },
    'library-delete': (d) => remove(d.id),
    'library-undo': undo,
    'library-export': exportLibrary,
  };
  onActions([weatherNode, libraryNode], ACTIONS);
  weatherNode.addEventListener('change', (event) => {
    const t = event.target;
    if (t === weatherInput && t.files?.[0]) {
      const file = t.files[0];
      t.value = '';
      pickWeather(file);
    } else if (t.id === 'weather-format' || t.id === 'weather-unit') {
      w[t.id === 'weather-format' ? 'format' : 'unit'] = t.value;
      if (w.text !== null) readWeather();  // the same file again, read as now chosen
    }
  });
  libraryNode.addEventListener('change', (event) => {
    const t = event.target;
    if (t === libraryInput && t.files?.[0]) {
      const file = t.files[0];
      t.value = '';
      importLibrary(file);
    }
  });
  libraryNode.addEventListener('input', (event) => {
    const t = event.target;
    if (t.id === 'climate-keep-name') lib.keepName = t.value;
    else if (t.id === 'climate-rename') lib.renameText = t.value;
  });
  libraryNode.addEventListener('keydown', (event) => {
    if (event.key !== 'Enter') return;
    if (event.target.id === 'climate-keep-name') { event.preventDefault(); keep(); }
    else if (event.target.id === 'climate-rename' && lib.renaming) { event.preventDefault(); rename(lib.renaming); }
  });
  // a quote opened, or its climate changed: the name offered for keeping follows it
  store.subscribe((change) => {
    if (change.reason === 'load') {
      lib.keepName = store.state.climate?.label ?? '';
      lib.keepProblem = null;
      paint();
    } else if (change.reason === 'structure' || change.reason === 'display') {
      paint();
    }
  });

  return { weatherNode, libraryNode, start: loadLibrary, paint };
}
