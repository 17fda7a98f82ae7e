// Price lists and equipment kept on this device, the controller: keeps the quote's prices as a named
// price list and a system card as equipment, puts them into any quote in one tap, deletes them, and
// exports and imports them as a file (fuelwright.templates/1). Kept in localStorage (a small shelf,
// read at start); a refused write is said, never silent. It owns one node for each tab, which the
// views place in their panels; views/templates.js renders them. app.js creates it with the store.
import { download, h, onActions } from './dom.js';
import { loadTemplates, newId, saveTemplates } from './storage.js';
import {
  applyEquipment, applyPriceList, emptyShelf, equipmentFrom, normalizeShelf, priceListFrom, priceListSummary,
  readTemplatesFile, shelve, templateNameProblem, templatesFile,
} from './templates.js';
import { KIND_NAMES } from './views/systems.js';
import { fuelName } from './views/fuels.js';
import { renderEquipmentList, renderPriceLists, renderTemplateFiles } from './views/templates.js';

/** Why a write to the device failed, in words. */
const writeFailure = (failure) => (['QuotaExceededError', 'NS_ERROR_DOM_QUOTA_REACHED'].includes(failure?.name)
  ? 'the storage for this page on this device is full' : `the browser refused to store it (${failure?.message || failure?.name || String(failure)})`);

/** Creates the controller: {priceNode, equipmentNode, fileNode, paint()}; `ctx` gives store, catalog and format (getters). */
export function createTemplateTools(ctx) {
  const { store } = ctx;
  const priceNode = h('fieldset', { class: 'group', id: 'price-lists' });
  const equipmentNode = h('fieldset', { class: 'group', id: 'equipment-shelf' });
  const fileNode = h('fieldset', { class: 'group', id: 'templates-files' });
  const fileInput = h('input', { id: 'templates-file', type: 'file', accept: '.json,application/json', class: 'visually-hidden' });
  const read = normalizeShelf(loadTemplates() ?? emptyShelf());
  let seq = 0;
  const t = {
    shelf: read.shelf, priceName: '', priceProblem: null, priceMessage: null, equipmentMessage: null,
    fileMessage: read.unreadable ? { ok: false, seq: ++seq, text: `${read.unreadable} kept ${read.unreadable === 1 ? 'entry' : 'entries'} could not be read on this device and ${read.unreadable === 1 ? 'is' : 'are'} not shown.` } : null,
  };
  const say = (key, ok, text) => { t[key] = { ok, text, seq: ++seq }; };
  const nameOf = (entry) => fuelName(entry, ctx.catalog);

  /** Writes the shelf; on a refusal undoes `revert` and says why at `key`. True when kept. */
  function persist(key, revert) {
    try {
      saveTemplates(t.shelf);
      return true;
    } catch (failure) {
      revert();
      say(key, false, `Not kept: ${writeFailure(failure)}.`);
      return false;
    }
  }

  const describe = (e) => {
    const s = e.item.system ?? {};
    const rating = typeof s.efficiency?.value === 'number' ? `, ${s.efficiency.value} ${s.efficiency.rating}` : '';
    const points = s.ratings?.length ? `, ${s.ratings.length} data-sheet ${s.ratings.length === 1 ? 'point' : 'points'}` : '';
    const price = typeof e.item.installed_cost === 'number' ? `, installed ${ctx.format.money(e.item.installed_cost)}` : '';
    const fuel = e.fuel ? ` on ${nameOf({ fuel: e.fuel })}` : '';
    return `${KIND_NAMES[s.kind] ?? s.kind}${fuel}${rating}${points}${price}`;
  };

  function paint() {
    const active = document.activeElement;
    const id = [priceNode, equipmentNode, fileNode].some((n) => n.contains(active)) && active !== fileInput ? active.id : '';
    renderPriceLists(priceNode, t, (list) => priceListSummary(list, { fuelName: nameOf, format: ctx.format }));
    renderEquipmentList(equipmentNode, t, describe);
    renderTemplateFiles(fileNode, t, fileInput);
    if (id) document.getElementById(id)?.focus({ preventScroll: true });
  }

  function keepPrices() {
    const ws = store.state;
    const problem = templateNameProblem(t.priceName, t.shelf.price_lists, 'price list');
    t.priceProblem = problem;
    if (problem) return paint();
    const { list, unpriced } = priceListFrom(ws, t.priceName, newId());
    if (!list.fuels.length) {
      t.priceProblem = 'This quote has no fuel with a price yet: type the prices above first.';
      return paint();
    }
    const kept = shelve(t.shelf, 'price_lists', list);
    if (persist('priceMessage', () => t.shelf.price_lists.pop())) {
      t.priceName = '';
      const left = unpriced.length ? ` Not in it (no price typed): ${unpriced.map(nameOf).join(', ')}.` : '';
      say('priceMessage', true, `Kept “${kept.name}” with ${list.fuels.length} ${list.fuels.length === 1 ? 'price' : 'prices'}.${left}`);
    }
    paint();
  }

  function usePrices(id) {
    const list = t.shelf.price_lists.find((l) => l.id === id);
    if (!list) return;
    let answer;
    store.mutate((ws) => { answer = applyPriceList(ws, list); });
    const added = answer.added.length ? ` Added: ${answer.added.map((f) => nameOf({ fuel: f })).join(', ')}.` : '';
    say('priceMessage', answer.ok, `${answer.message}${added}`);
    paint();
  }

  function deleteEntry(kind, id, key) {
    const index = t.shelf[kind].findIndex((e) => e.id === id);
    if (index < 0) return;
    const [gone] = t.shelf[kind].splice(index, 1);
    if (persist(key, () => t.shelf[kind].splice(index, 0, gone))) say(key, true, `Deleted “${gone.name}” from this device.`);
    paint();
  }

  function keepEquipment(index) {
    const ws = store.state;
    const sys = ws.systems[index];
    if (!sys) return;
    const name = (sys.equipment || sys.label || sys.id).trim();
    const { entry, dropped } = equipmentFrom(ws, sys, name, newId());
    const kept = shelve(t.shelf, 'equipment', entry);
    if (persist('equipmentMessage', () => t.shelf.equipment.pop())) {
      say('equipmentMessage', true, `Kept “${kept.name}” in your equipment${dropped.length ? `, without ${dropped.join(' and ')}` : ''}.`);
    }
    paint();
    equipmentNode.scrollIntoView({ block: 'nearest' });
  }

  function useEquipment(id) {
    const entry = t.shelf.equipment.find((e) => e.id === id);
    if (!entry) return;
    let answer;
    store.mutate((ws) => { answer = applyEquipment(ws, entry); });
    say('equipmentMessage', true, `Added “${entry.name}” to this quote${answer.addedFuel
      ? `, with ${nameOf({ fuel: answer.addedFuel })} added on the Fuels tab: give its price there` : ''}.`);
    paint();
  }

  function exportShelf() {
    const doc = templatesFile(t.shelf);
    download(`fuelwright-price-lists-and-equipment-${doc.exported_at.slice(0, 10)}.json`, 'application/json', JSON.stringify(doc, null, 2));
    say('fileMessage', true, `Exported ${t.shelf.price_lists.length + t.shelf.equipment.length} entries.`);
    paint();
  }

  async function importShelf(file) {
    let doc;
    try {
      doc = readTemplatesFile(JSON.parse(await file.text()));
    } catch (failure) {
      say('fileMessage', false, `Could not import “${file.name}”: ${failure instanceof SyntaxError ? 'it is not a JSON file' : failure.message}.`);
      return paint();
    }
    const before = { price_lists: [...t.shelf.price_lists], equipment: [...t.shelf.equipment] };
    const names = [];
    for (const list of doc.price_lists) names.push(shelve(t.shelf, 'price_lists', { ...list, id: newId() }).name);
    for (const e of doc.equipment) names.push(shelve(t.shelf, 'equipment', { ...e, id: newId() }).name);
    if (!persist('fileMessage', () => { t.shelf = before; })) return paint();
    const head = names.length ? `Imported ${names.length} from “${file.name}”: ${names.map((n) => `“${n}”`).join(', ')}.` : `Nothing was imported from “${file.name}”.`;
    say('fileMessage', names.length > 0 && doc.refused.length === 0, [head, ...doc.refused].join('\n'));
    paint();
  }

  const ACTIONS = {
    'price-list-keep': keepPrices,
    'price-list-use': (d) => usePrices(d.id),
    'price-list-delete': (d) => deleteEntry('price_lists', d.id, 'priceMessage'),
    'equipment-use': (d) => useEquipment(d.id),
    'equipment-delete': (d) => deleteEntry('equipment', d.id, 'equipmentMessage'),
    'templates-export': exportShelf,
  };
  onActions([priceNode, equipmentNode, fileNode], ACTIONS);
  // a system card's "Keep in your equipment" (the cards belong to the Systems tab's view)
  document.addEventListener('click', (event) => {
    const button = event.target.closest?.('button[data-action="equipment-keep"]');
    if (!button) return;
    event.preventDefault();
    keepEquipment(Number(button.dataset.index));
  });
  priceNode.addEventListener('input', (event) => {
    if (event.target.id === 'price-list-name') t.priceName = event.target.value;
  });
  priceNode.addEventListener('keydown', (event) => {
    if (event.key === 'Enter' && event.target.id === 'price-list-name') { event.preventDefault(); keepPrices(); }
  });
  fileInput.addEventListener('change', () => {
    const file = fileInput.files?.[0];
    fileInput.value = '';
    if (file) importShelf(file);
  });
  // the summaries speak the quote's money and the catalog's fuel names: repainted when those change
  store.subscribe((change) => { if (change.reason === 'load' || change.reason === 'display') paint(); });

  return { priceNode, equipmentNode, fileNode, paint };
}
