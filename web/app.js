// Controller: creates the core client, the store and the views, and wires
// them: typing -> store -> (debounced) evaluate in the worker -> verdict,
// quote sheet and autosave. One role per module; this one only connects them.
import { createClimateTools } from './climates.js';
import { createTemplateTools } from './template-shelf.js';
import { CoreClient } from './core-client.js';
import { download, h } from './dom.js';
import { bindFields, restoreTyped, showFieldErrors } from './fields.js';
import { createFormat, formatInput, isCurrency, isLocale } from './format.js';
import { demoWorkspace } from './demo.js';
import { isKiosk } from './kiosk-scenario.js';
import { registerServiceWorker } from './offline.js';
import { renderQuoteSheet } from './print.js';
import { slipFor } from './slips.js';
import { parseBillLines } from './bills.js';
import { MAX_LOGO_BYTES, companyOf, normalizeProfile, takeQuoteNumber, validUntil } from './profile.js';
import { renderProfile } from './views/profile.js';
import { blankWorkspace, exportDocument, fuelId, newFuelKey, toScenario, today, withoutUncertainty } from './scenario.js';
import {
  currentQuoteId, loadPreferences, loadProfile, migrateRecord, newId, notDeletedMessage, notMigratedMessage, notRestoredMessage, openQuotes,
  recordProblem, savePreferences, saveProfile, setCurrentQuoteId, verdictSummary, workspaceFromFile, workspaceOf,
} from './storage.js';
import { createQuoteKeeper } from './quote-keeper.js';
import { Store, setAt } from './store.js';
import { DISPLAY, unitLabel } from './units.js';
import { renderFuels, fuelName } from './views/fuels.js';
import { renderHouse } from './views/house.js';
import { renderLab } from './views/lab.js';
import { renderQuotes } from './views/quotes.js';
import { renderSystems } from './views/systems.js';
import { billedSystemId, efficiencyFor } from './equipment.js';
import {
  addBill, addPeriod, addRating, appendBills, autoLabel, duplicateSystem, fitSystemToCatalog, newFuelEntry, newSystem, setFuel, switchUnits,
} from './editing.js';
import { rankedOptions, resultsCsv } from './results.js';
import { latestWins } from './runner.js';
import { bindVerdict, renderVerdict } from './views/verdict.js';
import { showDrawProgress } from './views/verdict-draws.js';
import { openHeatNeedTrace } from './views/verdict-traces.js';

const ANALYSIS_DEBOUNCE_MS = 350;
/** The saved record of the demo quote (one, however often it is loaded). */
const DEMO_ID = 'demo-maple-hollow';
const DRAWS_DEBOUNCE_MS = 1200;
const SAVE_DEBOUNCE_MS = 400;
const SWEEP_POINTS = 41;
/** Added to the name of a climate once its values are typed over. */
const CHANGED = ' (changed here)';
const TORNADO_CHANGE = 0.2;
const LOCALES = [['en-US', 'English (US) 1,234.5'], ['en-CA', 'English (Canada)'], ['en-GB', 'English (UK)'], ['fr-CA', 'Français (Canada) 1 234,5'],
  ['de-DE', 'Deutsch 1.234,5'], ['fr-FR', 'Français 1 234,5'], ['nb-NO', 'Norsk 1 234,5'], ['sv-SE', 'Svenska'], ['nl-NL', 'Nederlands'], ['es-ES', 'Español']];

const $ = (selector) => document.querySelector(selector);
// Three workers, so that nothing slow holds up the verdict: the verdict's own
// evaluations and small calls; the charts' sweeps, break-even and tornado; the Monte Carlo.
const core = new CoreClient();
const charts = new CoreClient();
const draws = new CoreClient();
const store = new Store(blankWorkspace());
const localErrors = new Map();
let profile = normalizeProfile(loadProfile());
const panels = {};
const prefs = { locale: 'en-US', tab: 'house', ...loadPreferences() };
if (!isLocale(prefs.locale)) prefs.locale = 'en-US';

// `key`: the scenario (without its draws) that `result` answers, so a saved summary always matches its quote
const verdict = { result: null, key: null, errors: [], analysis: null, mc: { state: 'off' }, by: 'annual', fieldErrorCount: 0, sweepFuel: null };
// knownAt: the updated_at of the open quote's record as this window last read or wrote it (null when it
// has never been stored): a save finding another value was overtaken by another window (saveOnce).
const quotes = { records: [], currentId: null, knownAt: null, query: '', storageKind: '', undo: null };
let storage = null;
/** The persistent message about a write to this device that failed: {kind, text}, or null. */
let storageAlert = null;
let analysisTimer = 0;
let drawsTimer = 0;
let generation = 0;
let undoTimer = 0;
let verdictBody = null;

const ctx = {
  store,
  core,
  catalog: null,
  get locale() { return prefs.locale; },
  format: createFormat({ locale: prefs.locale, currency: 'USD' }),
  onField,
  onLocalError: () => { showErrors(); paintVerdict(); },
  renderLab: (slot) => renderLab(slot, ctx),
  addCustomFuel,
  onSearch: (query) => { quotes.query = query; paintQuotes(); },
};
ctx.climateTools = createClimateTools(ctx);
ctx.templateTools = createTemplateTools(ctx);

// ---------------------------------------------------------------------------
// Rendering

function refreshFormat() {
  const currency = isCurrency(store.state.settings.currency) ? store.state.settings.currency : 'USD';
  ctx.format = createFormat({ locale: prefs.locale, currency });
}

/** Re-renders while keeping the focused control (by id) and its caret. */
function keepingFocus(fn) {
  const active = document.activeElement;
  const id = active?.id;
  const caret = active && 'selectionStart' in active ? [active.selectionStart, active.selectionEnd] : null;
  fn();
  if (id && document.activeElement !== active) {
    const again = document.getElementById(id);
    if (again) {
      again.focus({ preventScroll: true });
      if (caret && 'setSelectionRange' in again) { try { again.setSelectionRange(...caret); } catch { /* not a text input */ } }
    }
  }
}

function paintInputs() {
  keepingFocus(() => {
    renderHouse(panels.house, ctx);
    renderFuels(panels.fuels, ctx);
    renderSystems(panels.systems, ctx);
    restoreTyped([panels.house, panels.fuels, panels.systems], localErrors);
  });
  showErrors();
}

function paintHeader() {
  const ws = store.state;
  $('#units-us').checked = ws.settings.units === 'us';
  $('#units-metric').checked = ws.settings.units === 'metric';
  const energy = $('#energy-unit');
  energy.replaceChildren(...DISPLAY[ws.settings.units].energyChoices.map((u) => h('option', { value: u, text: unitLabel(u), selected: u === ws.settings.energy_unit })));
  const currency = $('#currency');
  if (document.activeElement !== currency) currency.value = ws.settings.currency;
  applyPaper();
}

function paintVerdict() {
  keepingFocus(() => renderVerdict(verdictBody, ctx, verdict));
  paintSummary();
}

function paintSummary() {
  const bar = $('#summary-bar');
  const r = verdict.result;
  const best = r?.ranking?.[0] && r.options?.find((o) => o.id === r.ranking[0].id);
  const stale = (verdict.fields ?? []).filter((f) => f.local);
  if (stale.length) {
    $('#summary-text').textContent = stale.length === 1 ? `Out of date: ${stale[0].label} cannot be read.` : `Out of date: ${stale.length} fields cannot be read.`;
  } else if (!best || r.errors?.length) {
    $('#summary-text').textContent = verdict.errors.length || verdict.fieldErrorCount ? 'Some entries need attention.' : '';
  } else {
    // in parts: on a phone the option's name takes one line (cut if it must be) and its cost the next
    $('#summary-text').replaceChildren(h('span', { class: 'what', text: best.label ?? best.id }), h('span', { class: 'sep', text: ': ' }),
      h('span', { class: 'cost', text: `cheapest at ${ctx.format.money(best.annual_cost)} a year` }));
  }
  bar.hidden = !$('#summary-text').textContent;
}

function paintQuotes() {
  keepingFocus(() => renderQuotes(panels.saved, ctx, quotes));
  const slot = panels.saved.querySelector('#profile-slot');
  if (slot && !slot.firstChild) paintProfile();
}

function paintProfile(message) {
  const slot = panels.saved?.querySelector('#profile-slot');
  if (slot) keepingFocus(() => renderProfile(slot, profile, message));
}

/** A profile field typed: kept on the device, and the open quote's company block follows. */
function onProfileInput(event) {
  const key = event.target?.dataset?.profile;
  if (!key) return;
  const raw = event.target.value;
  const before = profile;
  const numeric = key === 'validity_days' || key === 'next_number';
  const number = Number(raw.trim());
  if (numeric && !(Number.isInteger(number) && number >= 1 && number <= (key === 'validity_days' ? 365 : 999999))) {
    // not kept until it reads: said at once, never silently replaced
    const msg = $('#profile-msg');
    msg.className = 'field-msg';
    msg.hidden = false;
    msg.textContent = key === 'validity_days' ? 'Quotes hold for: type a whole number of days from 1 to 365; the last one that read is kept.'
      : 'Next quote number: type a whole number from 1; the last one that read is kept.';
    return;
  }
  if (numeric) $('#profile-msg').hidden = true;
  const next = { ...profile, [key]: numeric ? number : raw };
  profile = normalizeProfile(next);
  saveProfile(profile);
  store.set('/quote/company', companyOf(profile));
  // the open quote's terms follow the profile's unless they were written for this quote
  const terms = store.state.quote.terms ?? '';
  if (key === 'terms' && (!terms || terms === before.terms)) store.set('/quote/terms', profile.terms);
  if (key === 'name' && !store.state.quote.prepared_by) store.set('/quote/prepared_by', profile.name);
}

/** A logo picked: kept as a data URL when small enough. */
function onLogoFile(file) {
  const reader = new FileReader();
  reader.onload = () => {
    const url = String(reader.result ?? '');
    if (!url.startsWith('data:image/') || url.length > MAX_LOGO_BYTES) {
      paintProfile({ ok: false, text: `“${file.name}” was not used: the logo must be an image of at most ${Math.round(MAX_LOGO_BYTES * 0.75 / 1000)} kB.` });
      return;
    }
    profile = normalizeProfile({ ...profile, logo: url });
    saveProfile(profile);
    store.set('/quote/company', companyOf(profile));
    paintProfile({ ok: true, text: `Logo “${file.name}” added.` });
  };
  reader.readAsDataURL(file);
}

/** The paperwork of a new quote from the profile: number, date, valid-until, company, terms. */
function freshQuote(financing) {
  const taken = takeQuoteNumber(profile);
  profile = taken.profile;
  saveProfile(profile);
  const date = today();
  return { customer: '', site: '', date, prepared_by: profile.name, notes: '', number: taken.number,
    valid_until: validUntil(date, profile.validity_days), terms: profile.terms, company: companyOf(profile), financing };
}

/** The quote sheet, with the break-even and the price draws only when they belong to the verdict it shows. */
function paintSheet() {
  const a = verdict.analysis;
  const shown = Number(verdictBody?.dataset.generation);
  const breakEven = a?.state === 'done' && a.gen === shown ? a.breakEven : null;
  const mc = verdict.mc;
  const draws = mc?.state === 'done' && mc.key === drawsKey(store.state) ? mc.uncertainty : null;
  renderQuoteSheet($('#quote-sheet'), ctx, verdict.result, { breakEven, draws });
}

function showErrors() {
  const errors = [...(verdict.result?.errors ?? []), ...(verdict.mc.errors ?? []).filter((e) => e.path?.startsWith('/uncertainty'))];
  const roots = [panels.house, panels.fuels, panels.systems];
  const { unplaced, counts, listed } = showFieldErrors(roots, errors, store.state, localErrors,
    { warnings: verdict.result?.warnings ?? [], slipFor });
  verdict.errors = unplaced;
  verdict.fields = listed;
  verdict.fieldErrorCount = listed.length;
  for (const [name, root] of Object.entries({ house: panels.house, fuels: panels.fuels, systems: panels.systems })) {
    const tab = $(`#tab-${name}`);
    const n = counts.get(root) ?? 0;
    tab.querySelector('.count')?.remove();
    if (n) tab.append(h('span', { class: 'count', 'aria-label': `${n} to fix`, text: String(n) }));
  }
}

function setTab(name) {
  prefs.tab = name;
  savePreferences(prefs);
  for (const tab of document.querySelectorAll('[role="tab"]')) {
    const on = tab.dataset.tab === name;
    tab.setAttribute('aria-selected', String(on));
    tab.tabIndex = on ? 0 : -1;
  }
  for (const [key, panel] of Object.entries(panels)) panel.classList.toggle('active', key === name);
  document.body.dataset.tab = name;
  if (name === 'saved' && panels.saved) paintQuotes();  // saves made meanwhile (a summary, a date) are shown
}

// ---------------------------------------------------------------------------
// Evaluation

function setProgress(state) {
  const box = $('#progress');
  const bar = $('#progress-bar');
  if (!state) {
    box.hidden = true;
    $('#verdict-state').textContent = '';
    return;
  }
  box.hidden = false;
  if (state.total) {
    const pct = Math.round((100 * state.done) / state.total);
    bar.style.width = `${pct}%`;
    bar.setAttribute('aria-valuenow', String(pct));
    bar.classList.remove('indeterminate');
  } else {
    bar.style.width = '';
    bar.removeAttribute('aria-valuenow');
    bar.classList.add('indeterminate');
  }
  $('#verdict-state').textContent = state.label ?? 'Working out…';
}

/**
 * Evaluates after an edit, through runner.js: at once when the core is idle, so a single edit repaints
 * within a few frames; an edit made while a run is under way makes that run's answer stale (not painted)
 * and its entries go next, so a burst of keystrokes costs at most two runs, and the verdict reads
 * 'loading' from the first keystroke to the answer for the last. The charts' runs under way go stale too.
 */
function scheduleEvaluate() {
  if (verdictBody) verdictBody.dataset.state = 'loading';
  const gen = ++generation;
  analyses.drop();
  const ws = store.state;
  if (!ws.systems.length) {
    evaluations.drop();
    setProgress(null);
    showEvaluation(null, { gen });
    return;
  }
  // The verdict never waits for the Monte Carlo: it runs in its own worker (scheduleDraws).
  setProgress({ label: 'Working out…' });
  evaluations.submit({ scenario: withoutUncertainty(toScenario(ws)), gen });
}

/** Paints the verdict's answer for entries `scenario` (none: no system entered yet). */
function showEvaluation(result, { scenario, gen }) {
  warmSideWorkers();
  if (!result) {
    verdict.result = null;
    verdict.key = null;
    verdict.analysis = null;
    showErrors();
    paintVerdict();
    paintSheet();
    verdictBody.dataset.state = 'empty';
    scheduleDraws();
    return;
  }
  verdict.result = result;
  verdict.key = JSON.stringify(scenario);
  showErrors();
  paintVerdict();
  paintSheet();
  verdictBody.dataset.state = result.errors?.length ? 'errors' : 'done';
  verdictBody.dataset.generation = String(gen);
  setProgress(null);
  if (!result.errors?.length) scheduleAnalyses();
  scheduleDraws();
  if (summaryOutdated()) keeper.schedule();
}

/** The core did not answer (its worker failed or timed out): said in the verdict. */
function showEvaluationFailure(failure) {
  warmSideWorkers();
  verdict.result = null;
  verdict.key = null;
  verdict.errors = [{ path: '', message: failure.message }];
  paintVerdict();
  verdictBody.dataset.state = 'failed';
  setProgress(null);
}

const evaluations = latestWins((request) => core.evaluate(request.scenario), showEvaluation,
  { dropStale: true, onError: showEvaluationFailure });

let sideWorkersWarm = false;
/**
 * Starts the charts' and the draws' workers once the first verdict is painted (not before, so their
 * module loads do not compete with the first verdict's): from then on, using them fetches nothing.
 */
function warmSideWorkers() {
  if (sideWorkersWarm) return;
  sideWorkersWarm = true;
  charts.warm();
  draws.warm();
}

// ---------------------------------------------------------------------------
// Analyses: the core's sweep (cost against one price, with its exact
// break-even points), breakEven (one statement in plain words) and tornado,
// in their own worker, debounced after the verdict.

function scheduleAnalyses(delay = ANALYSIS_DEBOUNCE_MS) {
  clearTimeout(analysisTimer);
  analysisTimer = setTimeout(runAnalyses, delay);
}

function defaultSweepFuel(ws, result) {
  if (Number.isInteger(verdict.sweepFuel) && ws.fuels[verdict.sweepFuel]) return verdict.sweepFuel;
  const bestId = result.ranking?.[0]?.id;
  const sys = ws.systems.find((s) => s.id === bestId);
  const index = ws.fuels.findIndex((f) => f.key === sys?.fuel_key);
  return index >= 0 ? index : 0;
}

/** Asks for the charts of the verdict on screen: what to vary (the chosen fuel's price) and the two options to compare. */
function runAnalyses() {
  const ws = store.state;
  const result = verdict.result;
  if (!result?.options?.length || result.errors?.length || !ws.fuels.length) return;
  const gen = generation;
  const fuelIndex = defaultSweepFuel(ws, result);
  const entry = ws.fuels[fuelIndex];
  const name = fuelName(entry, ctx.catalog);
  const users = ws.systems.filter((s) => s.fuel_key === entry?.key).map((s) => s.id);
  // by time of use, today's price is the mean the core worked out over the schedule's hours (every period moves with it)
  const now = entry?.price?.time_of_use ? result.options.find((o) => users.includes(o.id))?.price?.amount : entry?.price?.amount;
  const none = (message) => {
    analyses.drop();
    setProgress(null);
    verdict.analysis = { state: 'none', fuelIndex, message };
    paintVerdict();
    verdictBody.dataset.analysis = String(gen);
  };
  if (!users.length) return none(`No system burns ${name}: choose another fuel.`);
  if (!(typeof now === 'number' && now > 0)) return none(`Enter a price for ${name} to see this chart.`);
  const life = verdict.by === 'life' && result.options.every((o) => Number.isFinite(o.life_cycle_cost));
  const basis = life ? 'life-cycle' : 'annual';
  const ranked = rankedOptions(result, life ? 'life' : 'annual').map((o) => o.id);
  const a = ranked.find((id) => users.includes(id));
  const b = ranked.find((id) => !users.includes(id));
  // a fuel id varies every option burning it; an option id only that option (two entries of one fuel)
  const fid = fuelId(entry);
  const of = fid && ws.fuels.filter((f) => fuelId(f) === fid).length === 1 ? fid : a;
  setProgress({ label: 'Working out the charts…' });
  analyses.submit({ scenario: withoutUncertainty(toScenario(ws)), gen, fuelIndex, name, now, of, basis, a, b, count: result.options.length });
}

/** The charts' three requests to their worker, side by side. */
function askForCharts({ scenario, now, of, basis, a, b, count }) {
  return Promise.all([
    charts.sweep({ scenario, vary: 'price', of, from: 0, to: 2 * now, points: SWEEP_POINTS, basis }),
    b ? charts.breakEven({ scenario, a, b, vary: 'price', of, basis }) : null,
    count >= 2 ? charts.tornado({ scenario, basis, change: TORNADO_CHANGE }) : null,
  ]);
}

function showCharts([sweep, breakEven, tornado], { gen, fuelIndex, name, of, basis, a, b }) {
  verdict.analysis = sweep.errors?.length
    ? { state: 'error', fuelIndex, message: sweep.errors.map((e) => e.message).join('; ') }
    : { state: 'done', gen, fuelIndex, fuelName: name, of, basis, sweep, breakEven, pair: { a, b }, tornado };
  paintVerdict();
  paintSheet();
  verdictBody.dataset.analysis = String(gen);
  verdictBody.dataset.sweep = String(gen);
  setProgress(null);
}

function showChartsFailure(failure, { fuelIndex }) {
  verdict.analysis = { state: 'error', fuelIndex, message: failure.message };
  paintVerdict();
  setProgress(null);
}

const analyses = latestWins(askForCharts, showCharts, { dropStale: true, onError: showChartsFailure });

// ---------------------------------------------------------------------------
// The price Monte Carlo: evaluateWithProgress in a worker of its own, started
// when asked or once the entries have settled (debounced apart from the
// verdict), with progress and Cancel. A run for entries that have changed since
// is cancelled.

function drawsKey(ws) {
  return JSON.stringify(toScenario(ws));
}

/** Cancels the run under way (its answer is stale: not shown). */
function stopDraws() {
  const run = verdict.mc.run;
  verdict.mc.run = null;
  drawRuns.drop();
  run?.cancel();
}

function scheduleDraws({ now = false } = {}) {
  clearTimeout(drawsTimer);
  const ws = store.state;
  const mc = verdict.mc;
  if (!ws.uncertainty?.enabled || !ws.systems.length) {
    stopDraws();
    verdict.mc = { state: 'off' };
    return;
  }
  const key = drawsKey(ws);
  if (!now && key === mc.key && ['running', 'done', 'cancelled', 'error'].includes(mc.state)) return;
  stopDraws();
  verdict.mc = { ...mc, state: 'waiting', run: null, key: mc.key, stale: Boolean(mc.uncertainty) };
  updateDrawsPanel();
  drawsTimer = setTimeout(runDraws, now ? 0 : DRAWS_DEBOUNCE_MS);
}

function updateDrawsPanel() {
  if (!verdictBody.querySelector('#uncertainty')) return;
  paintVerdict();
}

/** Starts the price draws for the entries now, through runner.js (a run the entries have left behind is cancelled and not shown). */
function runDraws() {
  const ws = store.state;
  if (!ws.uncertainty?.enabled || !ws.systems.length) return;
  const scenario = toScenario(ws);
  const key = JSON.stringify(scenario);
  if (verdict.result?.errors?.length) {
    verdict.mc = { state: 'error', key, message: 'fix the entries the verdict points at first' };
    updateDrawsPanel();
    return;
  }
  drawRuns.submit({ scenario, key });
}

/** The draws' run in their own worker, its progress shown in place while it is the run on screen. */
function startDrawRun({ scenario, key }) {
  const run = draws.evaluateWithProgress(scenario, {
    onProgress: ({ done }) => {
      if (verdict.mc.run !== run) return;
      verdict.mc.fraction = done;
      verdictBody.dataset.drawProgress = String(done);
      showDrawProgress(verdictBody, ctx, done);
    },
  });
  verdict.mc = { ...verdict.mc, state: 'running', fraction: 0, key, run, errors: [] };
  verdictBody.dataset.draws = 'running';
  verdictBody.dataset.drawProgress = '0';
  paintVerdict();
  return run.promise;
}

function showDraws(reply, { key }) {
  if (reply.errors?.length) {
    // shown in the panel and, where they point at a field (draws, seed, a spread), next to it
    verdict.mc = { state: 'error', key, errors: reply.errors, message: reply.errors.map((e) => (e.path ? `${e.path}: ${e.message}` : e.message)).join('; ') };
  } else {
    const u = reply.uncertainty;
    verdict.mc = { state: u?.cancelled ? 'cancelled' : 'done', key, uncertainty: u, analysisYears: reply.economics?.analysis_years,
      options: (reply.options ?? []).map((o) => ({ id: o.id, label: o.label })) };
  }
  drawsShown();
}

function showDrawsFailure(failure, { key }) {
  verdict.mc = failure.cancelled ? { state: 'cancelled', key } : { state: 'error', key, message: failure.message };
  drawsShown();
}

function drawsShown() {
  verdictBody.dataset.draws = verdict.mc.state;
  showErrors();
  paintVerdict();
  paintSheet();
}

const drawRuns = latestWins(startDrawRun, showDraws, { dropStale: true, onError: showDrawsFailure });

// ---------------------------------------------------------------------------
// Saving

/** The save state beside the product name: waiting, saving, saved at a time, or not saved. */
function showSaveState(state, at) {
  const node = $('#save-state');
  if (!node) return;
  node.dataset.state = state;
  node.textContent = state === 'saved' ? `Saved ${new Date(at).toLocaleTimeString(prefs.locale, { hour: '2-digit', minute: '2-digit' })}`
    : state === 'failed' ? 'Not saved' : state === 'saving' ? 'Saving…' : 'Changes not saved yet';
}

/** The summary of the verdict for a scenario: the one on screen if it answers this scenario, else null. */
function summaryFor(scenario) {
  return verdict.key === JSON.stringify(withoutUncertainty(scenario)) ? verdictSummary(verdict.result) : null;
}

/** Whether the saved record of the open quote lacks the summary of the verdict now on screen. */
function summaryOutdated() {
  const saved = quotes.records.find((r) => r.id === quotes.currentId);
  return JSON.stringify(saved?.summary ?? null) !== JSON.stringify(summaryFor(toScenario(store.state)));
}

/** Shows the persistent message about a failed write (or, with null, hides it). */
function setStorageAlert(kind, text) {
  if (storageAlert?.kind === kind && storageAlert?.text === text) return;
  storageAlert = text ? { kind, text } : null;
  const box = $('#storage-alert');
  if (!box) return;
  box.hidden = !text;
  const notSaved = kind === 'not-saved';
  box.replaceChildren(...(text ? [
    h('p', { id: 'storage-alert-text', text }),
    h('div', { class: 'card-actions start' },
      notSaved && h('button', { type: 'button', class: 'secondary', dataset: { action: 'export-json' }, text: 'Export the quote file' }),
      h('button', { type: 'button', class: 'secondary', dataset: { tab: 'saved' }, text: 'Saved quotes' }),
      notSaved && h('button', { type: 'button', class: 'secondary', dataset: { action: 'retry-save' }, text: 'Try saving again' })),
  ] : []));
}

/** Hides the storage message if it is of one of `kinds`. */
function clearStorageAlert(...kinds) {
  if (storageAlert && kinds.includes(storageAlert.kind)) setStorageAlert(null, null);
}

const keeper = createQuoteKeeper({
  quotes,
  workspace: () => store.state,
  summaryFor,
  delayMs: SAVE_DEBOUNCE_MS,
  onState: showSaveState,
  alerts: { set: setStorageAlert, clear: clearStorageAlert },
  onSaved: (written) => {
    document.body.dataset.saved = written.updated_at;
    if (prefs.tab === 'saved') paintQuotes();
  },
});

/** Opens a workspace as the current quote `id`; `knownAt` is the updated_at of its stored record (null for a new quote). */
async function openWorkspace(ws, { id = newId(), save = true, knownAt = null } = {}) {
  await keeper.flush();
  clearStorageAlert('forked');
  quotes.currentId = id;
  quotes.knownAt = knownAt;
  setCurrentQuoteId(id);
  localErrors.clear();
  ctx.billPaste = null;
  verdict.sweepFuel = null;
  verdict.analysis = null;
  stopDraws();
  verdict.mc = { state: 'off' };
  store.replace(ws);
  if (save) await keeper.saveNow();
  paintQuotes();
}

// ---------------------------------------------------------------------------
// Editing

/**
 * A value typed beside a unit menu takes the unit the menu shows when the workspace has none yet (the
 * menu was not touched), so what was typed is sent in the unit it was typed in.
 */
function takeShownUnit(path) {
  if (!path.endsWith('/value')) return;
  const unitPath = `${path.slice(0, -'/value'.length)}/unit`;
  if (store.get(unitPath) !== undefined) return;
  const menu = document.querySelector(`select[data-path="${CSS.escape(unitPath)}"]`);
  if (menu?.value) setAt(store.state, unitPath, menu.value);  // written with the value, in one change
}

/** Whether a fuel entry has a fixed charge with an amount (what a kept service adds). */
const hasCharge = (entry) => (entry?.fixed_charges ?? []).some((c) => typeof (c.amount_per_month ?? c.amount_per_year) === 'number');

function onField(path, value, { structural }) {
  const ws = store.state;
  let m;
  takeShownUnit(path);
  if ((m = /^\/fuels\/(\d+)\/fixed_charges\/\d+\/amount_per_(month|year)$/.exec(path)) && ws.fuels[Number(m[1])]?.keep_service) {
    // the kept service's note says whether there is a charge to add: repainted when that changes
    const entry = ws.fuels[Number(m[1])];
    const had = hasCharge(entry);
    setAt(ws, path, value);
    store.set(path, value, { structural: had !== hasCharge(entry) });
    return;
  }
  if ((m = /^\/fuels\/(\d+)\/fuel$/.exec(path))) {
    const entry = ws.fuels[Number(m[1])];
    store.mutate(() => setFuel(ws, entry, value, ctx.catalog));
    return;
  }
  if ((m = /^\/fuels\/(\d+)\/price\/time_of_use$/.exec(path))) {
    // ticked: the tariff starts complete, one period over every hour at today's price
    const entry = ws.fuels[Number(m[1])];
    store.mutate(() => {
      entry.price.time_of_use = value || undefined;
      if (value && !entry.price.schedule?.length) addPeriod(entry);
    });
    return;
  }
  if ((m = /^\/fuels\/(\d+)\/fuel\/sale_unit$/.exec(path))) {
    const entry = ws.fuels[Number(m[1])];
    store.mutate(() => {
      entry.fuel.sale_unit = value || undefined;
      entry.price = { ...entry.price, per: value || undefined };
    });
    return;
  }
  if ((m = /^\/fuels\/(\d+)\/heating_value\/value$/.exec(path))) {
    const card = panels.fuels.querySelectorAll('.fuel-card')[Number(m[1])];
    const entry = ws.fuels[Number(m[1])];
    if (value === undefined) { store.set(`/fuels/${m[1]}/heating_value`, undefined); return; }
    if (!entry.heating_value?.unit) {
      const energy = card?.querySelector('[data-part="energy"]')?.value ?? 'Btu';
      const per = card?.querySelector('[data-part="per"]')?.value ?? entry.price?.per;
      store.set(`/fuels/${m[1]}/heating_value/unit`, `${energy}/${per}`);
    }
    store.set(path, value);
    return;
  }
  if ((m = /^\/systems\/(\d+)\/(fuel_key|system\/kind|system\/catalog)$/.exec(path))) {
    const sys = ws.systems[Number(m[1])];
    store.mutate(() => {
      if (m[2] === 'fuel_key') sys.fuel_key = value;
      else if (m[2] === 'system/kind') sys.system.kind = value;
      else {
        sys.system.catalog = value;
        const model = ctx.catalog.systemsById.get(value);
        if (model) sys.system.efficiency = efficiencyFor(sys.system.efficiency, model);
      }
      if (m[2] !== 'system/catalog') fitSystemToCatalog(ws, sys, ctx.catalog);
      if (sys.label_auto) sys.label = autoLabel(ws, sys, ctx.catalog);
    });
    return;
  }
  if ((m = /^\/systems\/(\d+)\/label$/.exec(path))) {
    ws.systems[Number(m[1])].label_auto = false;
    store.set(path, value);
    const head = panels.systems.querySelectorAll('.system-card h3')[Number(m[1])];
    if (head) head.textContent = value || ws.systems[Number(m[1])].id;
    return;
  }
  if (path === '/demand/method' && value === 'bills') {
    store.mutate(() => {
      ws.demand.method = value;
      ws.demand.bills_option = billedSystemId(ws);
    });
    return;
  }
  if ((m = /^\/systems\/(\d+)\/existing$/.exec(path))) {
    store.mutate(() => {
      if (value) ws.systems.forEach((s, i) => { s.existing = i === Number(m[1]); });
      else ws.systems[Number(m[1])].existing = false;
      for (const s of ws.systems) if (s.label_auto) s.label = autoLabel(ws, s, ctx.catalog);
      // bills are the existing system's: marking it links them (shown on the House tab)
      ws.demand.bills_option = billedSystemId(ws);
    });
    return;
  }
  if ((m = /^\/systems\/(\d+)\/system\/backup$/.exec(path))) {
    const sys = ws.systems[Number(m[1])];
    store.mutate(() => {
      setAt(ws, path, value);
      if (sys.label_auto) sys.label = autoLabel(ws, sys, ctx.catalog);
    });
    return;
  }
  if ((m = /^\/demand\/bills\/(\d+)\/mean_temperature\/value$/.exec(path)) && !ws.demand.bills[Number(m[1])]?.mean_temperature?.unit) {
    // the unit shown beside an empty field is the one the value is typed in
    const select = panels.house.querySelector(`[data-path="/demand/bills/${m[1]}/mean_temperature/unit"]`);
    store.set(`/demand/bills/${m[1]}/mean_temperature/unit`, select?.value || (ws.settings.units === 'metric' ? 'degC' : 'degF'));
  }
  if (path.startsWith('/climate/') && ws.climate.label && !ws.climate.label.endsWith(CHANGED)) {
    // a named climate typed over is no longer the one of that name
    ws.climate.label = `${ws.climate.label}${CHANGED}`;
    panels.house.querySelector('#climate-label')?.replaceChildren(`Climate: ${ws.climate.label}`);
  }
  if (path === '/quote/customer' || path === '/quote/site' || path === '/quote/date') {
    store.set(path, value);
    return;
  }
  if (path.startsWith('/economics/') && path !== '/economics/enabled') ws.economics.emit = true;
  if (path === '/economics/enabled' && value) ws.economics.emit = true;
  store.set(path, value, { structural });
}

function addCustomFuel(fuel) {
  store.mutate((ws) => {
    ws.fuels.push({ key: newFuelKey(ws), fuel, price: { per: fuel.sale_unit }, fixed_charges: [] });
  });
  setTab('fuels');
  panels.fuels.querySelector('.fuel-card:last-of-type')?.scrollIntoView({ block: 'start' });
}

function addFuel(id) {
  store.mutate((ws) => { ws.fuels.push(newFuelEntry(ws, id, ctx.catalog)); });
  const cards = panels.fuels.querySelectorAll('.fuel-card');
  cards[cards.length - 1]?.querySelector('[data-path$="/price/amount"]')?.focus();
}

function addSystem(choice) {
  store.mutate((ws) => { ws.systems.push(newSystem(ws, choice, ctx.catalog)); });
  const cards = panels.systems.querySelectorAll('.system-card');
  cards[cards.length - 1]?.querySelector('[data-path$="/label"]')?.focus();
}

// ---------------------------------------------------------------------------
// Files

function fileStem(ws) {
  const base = [ws.quote.customer, ws.quote.date].filter(Boolean).join(' ') || 'quote';
  return `fuelwright-${base.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60) || 'quote'}`;
}

let importsStarted = 0;

/** Opens a picked quote file; the message carries the import's number, so the same message twice is told apart. */
async function importFile(file) {
  const seq = ++importsStarted;
  try {
    const doc = JSON.parse(await file.text());
    const ws = workspaceFromFile(doc);
    await openWorkspace(ws);
    quotes.importMessage = { ok: true, text: `Imported “${file.name}”.`, seq };
  } catch (failure) {
    quotes.importMessage = { ok: false, text: `Could not import “${file.name}”: ${failure.message}`, seq };
  }
  paintQuotes();
}

// ---------------------------------------------------------------------------
// Actions

const ACTIONS = {
  'add-fuel': () => addFuel($('#add-fuel-choice').value),
  'remove-fuel': (d) => store.mutate((ws) => { ws.fuels.splice(Number(d.index), 1); verdict.sweepFuel = null; }),
  'add-charge': (d) => store.mutate(() => { const e = store.get(d.fuel); e.fixed_charges = [...(e.fixed_charges ?? []), { label: '', amount_per_month: undefined }]; }),
  'remove-charge': (d) => store.mutate(() => store.get(d.fuel).fixed_charges.splice(Number(d.index), 1)),
  'add-system': () => addSystem($('#add-system-kind').value),
  'remove-system': (d) => store.mutate((ws) => ws.systems.splice(Number(d.index), 1)),
  'duplicate-system': (d) => store.mutate((ws) => duplicateSystem(ws, Number(d.index))),
  'add-rating': (d) => store.mutate((ws) => addRating(ws, Number(d.system))),
  'remove-rating': (d) => store.mutate((ws) => ws.systems[Number(d.system)].system.ratings.splice(Number(d.index), 1)),
  'add-bill': () => store.mutate((ws) => addBill(ws)),
  'add-period': (d) => store.mutate(() => addPeriod(store.get(d.fuel))),
  'remove-period': (d) => store.mutate(() => store.get(d.fuel).price.schedule.splice(Number(d.index), 1)),
  'paste-bills': () => {
    const text = $('#bills-paste')?.value ?? '';
    const { bills, problems } = parseBillLines(text, prefs.locale);
    const lines = [];
    if (bills.length) lines.push(`Added ${bills.length === 1 ? '1 bill' : `${bills.length} bills`}.`);
    for (const p of problems) lines.push(`Line ${p.line} (${p.text}) was not added: ${p.message}.`);
    if (!bills.length && !problems.length) lines.push('Nothing to add: paste one bill a line.');
    // the lines not read stay in the box to be corrected
    ctx.billPaste = { text: problems.map((p) => p.text).join('\n'), message: { ok: !problems.length && bills.length > 0, text: lines.join('\n') } };
    store.mutate((ws) => appendBills(ws, bills));
  },
  'observed-clear': () => store.mutate((ws) => { delete ws.demand.observed; delete ws.demand.observed_label; }),
  'climate-drop': (d) => store.mutate((ws) => {
    if (d.key === 'bins') { delete ws.climate.bins; delete ws.climate.bin_width; }
    else if (d.key === 'monthly_sd') delete ws.climate.monthly_sd;
  }),
  'remove-bill': (d) => store.mutate((ws) => ws.demand.bills.splice(Number(d.index), 1)),
  'rank-by': (d) => { verdict.by = d.by; paintVerdict(); scheduleAnalyses(0); },
  'mc-run': () => scheduleDraws({ now: true }),
  'mc-cancel': () => {
    const run = verdict.mc.run;
    if (!run) return;
    run.cancel();
    if (!run.signalled) {
      drawRuns.drop();  // the worker is stopped: its rejection is not shown over this state
      verdict.mc = { state: 'cancelled', key: verdict.mc.key };
      verdictBody.dataset.draws = 'cancelled';
      paintVerdict();
      $('#mc-run')?.focus();
    }
  },
  'export-csv': () => verdict.result && download(`${fileStem(store.state)}.csv`, 'text/csv', resultsCsv(verdict.result, store.state, verdict.by)),
  'export-json': () => {
    const scenario = toScenario(store.state);
    const answering = verdict.key === JSON.stringify(withoutUncertainty(scenario)) ? verdict.result : null;
    download(`${fileStem(store.state)}.json`, 'application/json', `${JSON.stringify(exportDocument(store.state, answering), null, 2)}\n`);
  },
  print: () => { paintSheet(); window.print(); },
  'climate-trace': () => openHeatNeedTrace(verdict, ctx, 'Climate and heat need', { climateFirst: true }),
  'new-quote': () => {
    const ws = blankWorkspace({ units: store.state.settings.units, currency: store.state.settings.currency });
    ws.quote = freshQuote(undefined);
    openWorkspace(ws).then(() => setTab('house'));
  },
  'remove-logo': () => {
    profile = normalizeProfile({ ...profile, logo: '' });
    saveProfile(profile);
    store.set('/quote/company', companyOf(profile));
    paintProfile();
  },
  'new-quote-keep': () => {
    const ws = structuredClone(store.state);
    ws.quote = freshQuote(ws.quote.financing);
    ws.title = '';
    openWorkspace(ws).then(() => setTab('house'));
  },
  // the demo is one saved quote: loading it again starts it afresh in the same record, never a copy
  'load-demo': () => openWorkspace(demoWorkspace(), { id: DEMO_ID, knownAt: quotes.records.find((r) => r.id === DEMO_ID)?.updated_at ?? null })
    .then(() => setTab('verdict')),
  'save-now': () => keeper.saveNow(),
  'open-quote': async (d) => {
    const record = await storage.get(d.id);
    if (!record || recordProblem(record)) return;
    const ws = workspaceOf(record);
    await openWorkspace(ws, { id: record.id, save: false, knownAt: record.updated_at });
    setTab('verdict');
  },
  'duplicate-quote': async (d) => {
    const record = await storage.get(d.id);
    if (!record || recordProblem(record)) return;
    const ws = structuredClone(workspaceOf(record));
    ws.quote.customer = ws.quote.customer ? `${ws.quote.customer} (copy)` : '(copy)';
    ws.quote.date = today();
    await openWorkspace(ws);
  },
  'delete-quote': async (d) => {
    const record = await storage.get(d.id);
    if (!record) return;
    if (d.id === quotes.currentId) keeper.cancel();
    try {
      await storage.delete(d.id);
    } catch (failure) {
      setStorageAlert('not-deleted', notDeletedMessage(record.customer, failure));
      if (d.id === quotes.currentId) keeper.schedule();
      return;
    }
    clearStorageAlert('not-deleted');
    quotes.records = quotes.records.filter((r) => r.id !== d.id);
    quotes.undo = record;
    clearTimeout(undoTimer);
    undoTimer = setTimeout(() => { quotes.undo = null; paintQuotes(); }, 10_000);
    if (d.id === quotes.currentId) {
      const next = quotes.records.filter((r) => !recordProblem(r)).sort((a, b) => (b.updated_at ?? '').localeCompare(a.updated_at ?? ''))[0];
      if (next) await openWorkspace(workspaceOf(next), { id: next.id, save: false });
      else await openWorkspace(blankWorkspace({ units: store.state.settings.units, currency: store.state.settings.currency }));
    }
    paintQuotes();
    $('#undo-toast button')?.focus();
  },
  'undo-delete': async () => {
    const record = quotes.undo;
    if (!record) return;
    clearTimeout(undoTimer);
    try {
      await storage.put(record);
    } catch (failure) {
      // the deleted record stays in memory with its Undo button until it is written back
      setStorageAlert('not-restored', notRestoredMessage(record.customer, failure));
      paintQuotes();
      return;
    }
    clearStorageAlert('not-restored');
    quotes.undo = null;
    quotes.records.push(record);
    paintQuotes();
  },
  'retry-save': () => keeper.saveNow(),
  'jump-to-field': ({ path }) => jumpToField(path),
  'apply-fix': ({ path, value }) => {
    const input = document.querySelector(`[data-path="${CSS.escape(path)}"]`);
    const scale = Number(input?.dataset.scale ?? 1);
    if (input) input.value = formatInput(Number(value) * scale, prefs.locale);
    onField(path, Number(value), { structural: false });
    input?.focus();
  },
};

/**
 * Nothing fixed or sticky covers the field being typed in: a field that takes the focus under the summary
 * bar or the sticky tabs is scrolled clear of them (the bars themselves never move, so a tap never lands
 * on a bar that appeared under the finger).
 */
function keepFocusClear(event) {
  const field = event.target;
  if (!(field instanceof HTMLElement) || !field.closest('.inputs') || !field.matches('input, select, textarea')) return;
  const box = field.getBoundingClientRect();
  const bar = $('#summary-bar');
  const barTop = bar && !bar.hidden && getComputedStyle(bar).display !== 'none' ? bar.getBoundingClientRect().top : window.innerHeight;
  const tabsBottom = document.querySelector('.tabs')?.getBoundingClientRect().bottom ?? 0;
  if (box.bottom > barTop - 8) window.scrollBy({ top: box.bottom - barTop + 16 });
  else if (box.top < tabsBottom + 8) window.scrollBy({ top: box.top - tabsBottom - 16 });
}

/** A tab opened from below its panel's top: the panel's top is brought back under the tabs (a new tab starts at its beginning). */
function showPanelTop(name) {
  const panel = panels[name];
  const tabs = document.querySelector('.tabs');
  if (!panel || !tabs) return;
  const under = tabs.getBoundingClientRect().bottom;
  const top = panel.getBoundingClientRect().top;
  if (top < under) window.scrollBy({ top: top - under - 8 });
}

/** Shows the field at workspace `path`: its tab, any closed section around it opened, scrolled into view and focused. */
function jumpToField(path) {
  // the field itself, not a button that jumps to it (those carry the field's path too)
  const find = () => document.querySelector(`.inputs [data-path="${CSS.escape(path)}"]:not([data-action])`)
    ?? document.querySelector(`.inputs [data-field="${CSS.escape(path)}"] [data-path]:not([data-action])`);
  const panel = find()?.closest('[data-panel]');
  if (!panel) return;
  setTab(panel.dataset.panel);
  // opening a tab may paint its panel again: the field is looked up in what is on screen now
  const input = find();
  if (!input) return;
  for (let d = input.closest('details'); d; d = d.parentElement?.closest('details')) d.open = true;
  input.scrollIntoView({ block: 'center' });
  input.focus({ preventScroll: true });
}

function onClick(event) {
  const tabButton = event.target.closest('button[data-tab]');
  if (tabButton) {
    setTab(tabButton.dataset.tab);
    showPanelTop(tabButton.dataset.tab);
    if (tabButton.closest('.summary-bar')) $('#tab-verdict').focus();
    return;
  }
  const button = event.target.closest('button[data-action]');
  if (!button) return;
  const action = ACTIONS[button.dataset.action];
  if (action) {
    event.preventDefault();
    action(button.dataset);
  }
}

function onChange(event) {
  const t = event.target;
  const action = t.dataset?.action;
  if (action === 'charge-period') {
    store.mutate(() => {
      const charge = store.get(t.dataset.fuel).fixed_charges[Number(t.dataset.index)];
      const amount = charge.amount_per_month ?? charge.amount_per_year;
      delete charge.amount_per_month;
      delete charge.amount_per_year;
      charge[t.value === 'year' ? 'amount_per_year' : 'amount_per_month'] = amount;
    });
  } else if (action === 'hv-unit') {
    const card = t.closest('.fuel-card');
    const energy = card.querySelector('[data-part="energy"]').value;
    const per = card.querySelector('[data-part="per"]').value;
    store.set(`${t.dataset.fuel}/heating_value/unit`, `${energy}/${per}`);
  } else if (action === 'sweep-fuel') {
    verdict.sweepFuel = Number(t.value);
    verdict.analysis = { state: 'running', fuelIndex: verdict.sweepFuel };
    paintVerdict();
    runAnalyses();
  } else if (t.id === 'paper') {
    store.state.settings.paper = t.value === 'a4' ? 'a4' : 'letter';
    applyPaper();
    keeper.schedule();
  } else if (t.id === 'logo-file' && t.files?.[0]) {
    onLogoFile(t.files[0]);
    t.value = '';
  } else if (t.id === 'import-file' && t.files?.[0]) {
    importFile(t.files[0]);
    t.value = '';
  }
}

function onTabKeys(event) {
  const tabs = [...document.querySelectorAll('[role="tab"]')].filter((t) => t.offsetParent !== null);
  const i = tabs.indexOf(event.target);
  if (i < 0) return;
  let next = null;
  if (event.key === 'ArrowRight') next = tabs[(i + 1) % tabs.length];
  else if (event.key === 'ArrowLeft') next = tabs[(i - 1 + tabs.length) % tabs.length];
  else if (event.key === 'Home') next = tabs[0];
  else if (event.key === 'End') next = tabs.at(-1);
  if (next) {
    event.preventDefault();
    setTab(next.dataset.tab);
    next.focus();
  }
}

function applyPaper() {
  const paper = store.state.settings.paper === 'a4' ? 'a4' : 'letter';
  // both sheets load with the page; the choice only says which one applies (media), so printing fetches nothing
  $('#paper-letter').media = paper === 'letter' ? 'print' : 'not all';
  $('#paper-a4').media = paper === 'a4' ? 'print' : 'not all';
  document.documentElement.dataset.paper = paper;
}

function wireHeader() {
  for (const id of ['#units-us', '#units-metric']) {
    $(id).addEventListener('change', (event) => { if (event.target.checked) store.mutate((ws) => switchUnits(ws, event.target.value), { reason: 'load' }); });
  }
  $('#energy-unit').addEventListener('change', (event) => store.mutate((ws) => { ws.settings.energy_unit = event.target.value; }, { reason: 'display' }));
  const currency = $('#currency');
  currency.addEventListener('input', () => {
    const code = currency.value.trim().toUpperCase();
    currency.setCustomValidity(isCurrency(code) ? '' : 'Use a three-letter ISO 4217 code, e.g. USD, CAD, EUR');
    if (isCurrency(code) && code !== store.state.settings.currency) {
      store.mutate((ws) => { ws.settings.currency = code; }, { reason: 'display' });
    }
  });
  const locale = $('#locale');
  const list = LOCALES.some(([l]) => l === prefs.locale) ? LOCALES : [[prefs.locale, prefs.locale], ...LOCALES];
  locale.replaceChildren(...list.map(([l, t]) => h('option', { value: l, text: t, selected: l === prefs.locale })));
  locale.addEventListener('change', () => {
    prefs.locale = locale.value;
    savePreferences(prefs);
    document.documentElement.lang = prefs.locale;
    store.mutate(() => {}, { reason: 'display' });
  });
  window.addEventListener('beforeprint', paintSheet);
}

function onStoreChange(change) {
  scheduleEvaluate();
  if (change.reason === 'load' || change.reason === 'display') {
    refreshFormat();
    paintHeader();
    paintInputs();
    paintVerdict();
    paintSheet();
  } else if (change.reason === 'structure') {
    paintInputs();
  }
  // a workspace opened as it was stored is not saved again (openWorkspace saves a new one itself): a
  // quote's updated_at is when it last changed, and a second window opening it overtakes no one
  if (change.reason !== 'load') keeper.schedule();
}

// ---------------------------------------------------------------------------
// Start

function indexCatalog(catalog) {
  catalog.fuelsById = new Map(catalog.fuels.map((f) => [f.id, f]));
  catalog.systemsById = new Map(catalog.systems.map((s) => [s.id, s]));
  return catalog;
}

/** The stored records: earlier versions migrated and written back once; records this version cannot read kept as they are. */
async function loadRecords() {
  const records = (await storage.list()).filter((r) => r && r.id);
  let failed = 0;
  let lastFailure = null;
  for (const [i, record] of records.entries()) {
    let current;
    try {
      current = migrateRecord(record);
    } catch {
      continue;  // listed as not openable with its reason (views/quotes.js), never rewritten
    }
    if (current === record) continue;
    records[i] = current;
    try {
      await storage.put(current);
    } catch (failure) {
      failed += 1;
      lastFailure = failure;
    }
  }
  if (failed) setStorageAlert('not-migrated', notMigratedMessage(failed, lastFailure));
  return records;
}

async function start() {
  for (const panel of document.querySelectorAll('[data-panel]')) panels[panel.dataset.panel] = panel;
  verdictBody = $('#verdict-body');
  const body = verdictBody;
  bindVerdict(body, ctx, () => verdict);
  document.documentElement.lang = prefs.locale;

  document.addEventListener('click', onClick);
  document.addEventListener('change', onChange);
  $('.tabs').addEventListener('keydown', onTabKeys);
  // a tablet may discard a page once it is hidden or left: the waiting autosave is written then
  document.addEventListener('visibilitychange', () => { if (document.visibilityState === 'hidden') keeper.saveBeforeLeaving(); });
  window.addEventListener('pagehide', () => keeper.saveBeforeLeaving());
  for (const name of ['house', 'fuels', 'systems']) bindFields(panels[name], ctx, localErrors);
  panels.saved.addEventListener('input', onProfileInput);
  document.addEventListener('focusin', keepFocusClear);
  wireHeader();
  setTab(['house', 'fuels', 'systems', 'verdict', 'saved'].includes(prefs.tab) ? prefs.tab : 'verdict');

  const opening = openQuotes();  // the device's storage opens while the core starts
  try {
    ctx.catalog = indexCatalog(await core.catalog());
  } catch (failure) {
    body.replaceChildren(h('p', { class: 'problems', role: 'alert', text: `The calculation core could not start: ${failure.message}` }));
    return;
  }
  storage = await opening;
  keeper.attach(storage);
  ctx.climateTools.start();
  ctx.templateTools.paint();
  quotes.storageKind = storage.kind;
  quotes.records = await loadRecords();
  await keeper.restoreUnsaved();
  const id = currentQuoteId();
  const record = id ? quotes.records.find((r) => r.id === id) : null;
  let ws;
  try {
    // a record this version cannot read is never opened, so it is never saved over
    ws = record ? workspaceOf(record) : null;
  } catch {
    ws = null;
  }
  store.subscribe(onStoreChange);
  if (ws) {
    quotes.currentId = record.id;
    quotes.knownAt = record.updated_at;
    store.replace(ws);
  } else {
    await openWorkspace(demoWorkspace(), { id: DEMO_ID, knownAt: quotes.records.find((r) => r.id === DEMO_ID)?.updated_at ?? null });
    if (!prefs.tabChosen) setTab('verdict');
  }
  paintQuotes();
  for (const tab of document.querySelectorAll('[role="tab"]')) tab.addEventListener('click', () => { prefs.tabChosen = true; savePreferences(prefs); });
  registerServiceWorker();
}

// A kiosk (?kiosk=1) runs its own short flow (kiosk.js) instead of the workspace.
if (isKiosk(new URLSearchParams(location.search))) {
  import('./kiosk.js').then(({ startKiosk }) => startKiosk(core)).finally(registerServiceWorker);
} else {
  start();
}
