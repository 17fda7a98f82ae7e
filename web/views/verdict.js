// Panel 4, the verdict, composed of its sections (one module each): the summary (headline, ranked table,
// costs over the years, equipment, climate), the live what-if, the charts from the core's analyses, the
// heat pumps' cards, the bills fit, the price Monte Carlo; then the notes from the calculation and the
// cautions. Every number is a button that opens its trace (verdict-traces.js).
import { costBars } from '../charts.js';
import { h } from '../dom.js';
import { plainUnits } from '../format.js';
import { hasLifeCycle, rankedOptions } from '../results.js';
import { fuelName } from './fuels.js';
import { sweepSection, tornadoSection } from './verdict-analyses.js';
import { billsSection } from './verdict-bills.js';
import { uncertaintySection } from './verdict-draws.js';
import { binsSection, fillBinsChart } from './verdict-heat-pump.js';
import { climateSummary, economicsSection, equipmentSection, headline, table } from './verdict-summary.js';
import { servicesSection } from './verdict-services.js';
import { billsTrace, binsTrace, openHeatNeedTrace, showOptionTrace, sweepTrace, tornadoTrace, uncertaintyTrace } from './verdict-traces.js';
import { whatIfCard } from './what-if.js';

const TAB_NAMES = { house: 'House', fuels: 'Fuels', systems: 'Systems' };

/** A note from the calculation in words: the option it is about named first, units as people write them. */
export function warningText(w, ws) {
  const message = plainUnits(w?.message ?? String(w));
  // the path's index is the scenario's option (one per system of the workspace), not the result's:
  // an option with an error is left out of the result's list
  const m = /^\/options\/(\d+)(\/|$)/.exec(w?.path ?? '');
  const system = m ? ws?.systems?.[Number(m[1])] : null;
  return system ? `${system.label || system.id}: ${message}` : message;
}

function cautionsBlock(result) {
  const cautions = result.cautions ?? [];
  return h('section', { class: 'cautions', id: 'verdict-cautions', 'aria-labelledby': 'cautions-title' },
    h('h3', { id: 'cautions-title', text: 'Before deciding' }),
    h('ul', {}, cautions.map((c) => h('li', { text: c }))));
}

// Sections that depend only on the analyses, the price draws or the bins are kept
// between repaints while what they show is unchanged, so a price edit repaints
// the verdict without rebuilding every chart (the charts follow when the core's
// new analyses arrive).
const kept = new Map();
function keep(name, key, build) {
  const hit = kept.get(name);
  if (hit && hit.key.length === key.length && hit.key.every((k, i) => k === key[i])) return hit.node;
  const node = build();
  kept.set(name, { key, node });
  return node;
}

/**
 * Renders the verdict from the latest result. `state` = {result, errors (unplaced), fields (listed by showFieldErrors), by,
 * analysis: {state, fuelIndex, sweep, breakEven, pair, tornado}, mc: {state, fraction, uncertainty, stale}}.
 * `options.kiosk` leaves out the file and print actions.
 */
export function renderVerdict(container, ctx, state, { kiosk = false } = {}) {
  const ws = ctx.store.state;
  const { result } = state;
  const parts = [];
  const errors = state.errors ?? [];
  if (errors.length) {
    parts.push(h('div', { class: 'problems', id: 'verdict-errors', role: 'alert' },
      h('p', { text: 'Some entries need attention:' }),
      h('ul', {}, errors.map((e) => h('li', { text: e.path ? `${e.path}: ${e.message}` : e.message })))));
  }
  const fields = state.fields ?? [];
  const stale = fields.filter((f) => f.local);
  container.classList.toggle('stale', stale.length > 0 && Boolean(result));
  if (stale.length && result) {
    parts.push(h('p', { class: 'stale-note', id: 'verdict-stale', role: 'status', text: `Out of date: ${stale.map((f) => f.label).join(', ')} `
      + 'cannot be read, so the figures below are for the earlier entries.' }));
  }
  if (fields.length) {
    parts.push(h('div', { class: 'problems', id: 'verdict-field-errors' },
      h('p', { text: fields.length === 1 ? '1 field needs attention:' : `${fields.length} fields need attention:` }),
      h('ul', {}, fields.map((f) => h('li', {},
        h('button', { type: 'button', class: 'link', dataset: { action: 'jump-to-field', path: f.path },
          text: `${f.label} (${TAB_NAMES[f.tab] ?? f.tab})` }),
        h('span', { text: ` — ${f.message}` }))))));
  }
  if (!result) {
    container.replaceChildren(...parts, h('p', { class: 'status', text: 'Add a fuel and a system to see the verdict.' }));
    return;
  }
  const hasLife = hasLifeCycle(result, ws);
  const by = hasLife ? state.by : 'annual';
  if ((result.options ?? []).length && !(result.errors ?? []).length) {
    parts.push(headline(result, ws, ctx, by));
    if (hasLife) {
      parts.push(h('div', { class: 'segmented', role: 'group', 'aria-label': 'Rank by' },
        h('button', { type: 'button', dataset: { action: 'rank-by', by: 'annual' }, 'aria-pressed': String(by === 'annual'), text: 'Rank by cost per year' }),
        h('button', { type: 'button', dataset: { action: 'rank-by', by: 'life' }, 'aria-pressed': String(by === 'life'), text: 'Rank by life-cycle cost' })));
    }
    parts.push(table(result, ws, ctx, by));
    if (!kiosk && state.key) {
      parts.push(keep('what-if', [state.key, by, ctx.format, result], () => whatIfCard(state, result, ctx, by === 'life' ? 'life-cycle' : 'annual')));
    }
    parts.push(h('p', { class: 'hint', text: 'Tap any number to see how it was worked out and which data it used.' }));
    parts.push(servicesSection(result, ctx, by));
    parts.push(equipmentSection(result, ws, ctx, by));
    parts.push(climateSummary(result, ws, ctx));
    parts.push(economicsSection(result, ws, ctx));
    const costRows = rankedOptions(result, by).map((o) => ({ id: o.id, label: o.label ?? o.id, energy: o.energy_cost, fixed: o.fixed_cost }));
    parts.push(h('section', { class: 'chart-card', id: 'chart-cost' }, h('h3', { text: 'Cost per year' }),
      costBars(costRows, { money: ctx.format.money, title: 'Annual cost: energy and fixed charges' })));
    const labels = (result.options ?? []).map((o) => `${o.id}\u0000${o.label ?? ''}`).join('\u0001');
    const fuels = ws.fuels.map((f) => fuelName(f, ctx.catalog)).join('\u0001');
    const shown = [ctx.format, ws.settings.currency, ws.settings.units, labels];
    if (ws.fuels.length && !kiosk) parts.push(keep('sweep', [state.analysis, fuels, ...shown], () => sweepSection(result, ws, ctx, state.analysis)));
    if (!kiosk) parts.push(keep('tornado', [state.analysis, ...shown], () => tornadoSection(result, ctx, state.analysis)));
    parts.push(keep('bins', [state.key, result, ...shown], () => binsSection(result, ws, ctx, state)));
    parts.push(billsSection(result, ctx, ws));
    if (!kiosk) parts.push(keep('draws', [state.mc, state.mc?.state, ws.uncertainty?.enabled, ...shown], () => uncertaintySection(result, ws, ctx, state.mc)));
  }
  // without the costs over the years the core's economics defaults are not the user's concern
  const warnings = (result.warnings ?? []).filter((w) => ws.economics?.enabled || w.path !== '/economics');
  if (warnings.length) {
    parts.push(h('div', { class: 'warnings', id: 'verdict-warnings' }, h('h3', { text: 'Notes from the calculation' }),
      h('ul', {}, warnings.map((w) => h('li', { text: warningText(w, ws) })))));
  }
  parts.push(cautionsBlock(result));
  if (!kiosk) {
    const paper = ws.settings.paper === 'a4' ? 'a4' : 'letter';
    parts.push(h('div', { class: 'card-actions' },
      h('button', { type: 'button', class: 'secondary', dataset: { action: 'export-csv' }, text: 'Download the table (CSV)' }),
      h('label', { class: 'pref', for: 'paper' }, h('span', { text: 'Paper' }),
        h('select', { id: 'paper' }, h('option', { value: 'letter', text: 'US Letter', selected: paper === 'letter' }),
          h('option', { value: 'a4', text: 'A4', selected: paper === 'a4' }))),
      h('button', { type: 'button', class: 'primary', dataset: { action: 'print' }, text: 'Print the quote sheet' })));
  }
  container.replaceChildren(...parts.filter(Boolean).flat());
  const bar = container.querySelector('#mc-progress');
  if (bar) bar.style.width = `${Math.round(100 * (state.mc?.fraction ?? 0))}%`;
}

// ---------------------------------------------------------------------------
// Traces of the values that are not one option's
/** Handles taps on the verdict's numbers, and draws a heat pump's chart when its disclosure opens. */
export function bindVerdict(container, ctx, getState) {
  container.addEventListener('toggle', (event) => {
    const details = event.target;
    if (!(details instanceof HTMLDetailsElement) || !details.classList.contains('bins-chart')) return;
    const state = getState();
    state.binsOpen ??= new Set();
    if (details.open) {
      state.binsOpen.add(details.dataset.option);
      fillBinsChart(details, state, ctx);
    } else {
      state.binsOpen.delete(details.dataset.option);
    }
  }, true);
  container.addEventListener('click', (event) => {
    const traced = event.target.closest('button[data-trace]');
    if (traced) {
      const state = getState();
      const kind = traced.dataset.trace;
      if (kind === 'sweep' || kind === 'sweep-all') sweepTrace(state, ctx, kind === 'sweep' ? traced : null);
      else if (kind === 'tornado') tornadoTrace(state, ctx, traced);
      else if (kind === 'bins') binsTrace(state, ctx, traced);
      else if (kind === 'uncertainty') uncertaintyTrace(state, ctx, traced);
      else if (kind === 'bills') billsTrace(state, ctx);
      return;
    }
    const button = event.target.closest('button.num');
    if (!button) return;
    const state = getState();
    if (button.dataset.key === 'annual_useful_heat') {
      openHeatNeedTrace(state, ctx);
      return;
    }
    const option = state.result?.options?.find((o) => o.id === button.dataset.option);
    if (option) showOptionTrace(state, option, ctx, button.dataset.key);
  });
}
