// Kiosk mode (index.html?kiosk=1&prices=URL, or ?kiosk=1 with a kiosk.json
// beside the site): a short flow for visitors at a fuel supplier's counter.
// The price file is fetched from this site only, checked by the core's
// checkPrices against today's date and refused when it has problems (an
// expired file is shown with a warning); its prices are locked. Nothing is
// saved, nothing is exported, no link leads away, and after an idle time the
// page starts over with the visitor's answers cleared.
import { h } from './dom.js';
import { createFormat, isCurrency, isLocale, parseNumber } from './format.js';
import { kioskOffer, kioskScenario, kioskSettings, priceFileVerdict, sameOriginUrl, unitsOf } from './kiosk-scenario.js';
import { today } from './scenario.js';
import { showOptionTrace } from './views/verdict-traces.js';
import { brandKioskHeader, renderKiosk, renderRefusal } from './views/kiosk.js';

const EVALUATE_DEBOUNCE_MS = 150;

const blankVisitor = () => ({ size: '', current: '', prices: {}, priceText: {} });

/** Reads kiosk.json beside the page when the query names no price file. */
async function fileSettings(query) {
  if (query.get('prices')) return {};
  const response = await fetch(new URL('kiosk.json', location.href), { cache: 'no-cache' });
  if (!response.ok) throw new Error('no price file: open the kiosk as index.html?kiosk=1&prices=<file on this site>, or place a kiosk.json beside the site');
  return response.json();
}

/** Stops every way out of the page: links elsewhere, form submissions, new windows. */
function blockNavigation() {
  document.addEventListener('click', (event) => {
    const link = event.target.closest?.('a[href]');
    if (!link) return;
    const url = new URL(link.getAttribute('href'), location.href);
    const samePage = url.origin === location.origin && url.pathname === location.pathname && url.search === location.search;
    if (!samePage || link.target || link.hasAttribute('download')) {
      event.preventDefault();
      event.stopPropagation();
    }
  }, true);
  document.addEventListener('submit', (event) => event.preventDefault(), true);
  document.addEventListener('auxclick', (event) => { if (event.target.closest?.('a[href]')) event.preventDefault(); }, true);
  window.open = () => null;
}

/** Starts the kiosk in the page; `core` is the page's CoreClient. */
export async function startKiosk(core) {
  document.body.dataset.mode = 'kiosk';
  blockNavigation();
  const main = document.querySelector('#workspace');
  const container = h('section', { class: 'kiosk', id: 'kiosk', 'aria-live': 'polite' }, h('p', { class: 'status', text: 'Loading the prices…' }));
  main.append(container);
  const query = new URLSearchParams(location.search);
  let format = createFormat({ locale: 'en-US', currency: 'USD' });

  let k;
  try {
    const settings = kioskSettings(query, await fileSettings(query));
    if (!settings.prices) throw new Error('no price file: give prices=<file on this site> or a kiosk.json naming one');
    const url = sameOriginUrl(settings.prices, location.href);
    if (!url) {
      renderRefusal(container, { title: 'This price file cannot be used: it must come from this site.', detail: settings.prices });
      document.body.dataset.kiosk = 'refused';
      return;
    }
    const response = await fetch(url, { cache: 'no-cache' });
    if (!response.ok) throw new Error(`the price file ${url.pathname} could not be read (HTTP ${response.status})`);
    const text = await response.text();
    const [check, catalog] = await Promise.all([core.checkPrices(text, today()), core.catalog()]);
    const verdict = priceFileVerdict(check);
    if (!verdict.ok) {
      renderRefusal(container, { title: 'These prices cannot be shown: the price file has problems. Please ask at the counter.',
        problems: verdict.problems, detail: url.pathname });
      document.body.dataset.kiosk = 'refused';
      return;
    }
    const file = JSON.parse(text);
    brandKioskHeader(document.querySelector('.topbar'), file.supplier, url.href);
    const currency = isCurrency(check.currency) ? check.currency : 'USD';
    const locale = isLocale(settings.locale) && settings.locale ? settings.locale : 'en-US';
    format = createFormat({ locale, currency });
    document.documentElement.lang = locale;
    k = { settings, check, file, verdict, currency, units: unitsOf(check.prices, settings.units), idleSeconds: settings.idleSeconds,
      offer: kioskOffer(check, file, catalog) };
  } catch (failure) {
    renderRefusal(container, { title: `The kiosk could not start: ${failure.message}.` });
    document.body.dataset.kiosk = 'failed';
    return;
  }

  let state = { visitor: blankVisitor(), result: null, errors: [], missing: [], pending: false };
  // a tap on a question brings its answer into view once it arrives (typing a price does not move the page)
  let showAnswer = false;
  let timer = 0;
  let generation = 0;
  let idleTimer = 0;

  const paint = () => {
    const active = document.activeElement;
    const id = active?.id;
    const caret = active && 'selectionStart' in active ? [active.selectionStart, active.selectionEnd] : null;
    renderKiosk(container, k, state, format);
    if (id && container.contains(document.getElementById(id)) && document.activeElement !== document.getElementById(id)) {
      const again = document.getElementById(id);
      again.focus({ preventScroll: true });
      if (caret && 'setSelectionRange' in again) { try { again.setSelectionRange(...caret); } catch { /* not text */ } }
    }
    container.dataset.state = state.result ? 'done' : state.pending ? 'loading' : 'empty';
  };

  const evaluate = async () => {
    const gen = ++generation;
    const { scenario, missing } = kioskScenario(k.offer, state.visitor, { units: k.units, currency: k.currency, climate: k.file.climate ?? null });
    state.missing = missing;
    if (!scenario) {
      state = { ...state, result: null, errors: [], pending: false };
      paint();
      return;
    }
    state.pending = true;
    try {
      const result = await core.evaluate(scenario);
      if (gen !== generation) return;
      state = { ...state, result, key: JSON.stringify(scenario), errors: result.errors ?? [], pending: false };
    } catch (failure) {
      if (gen !== generation) return;
      state = { ...state, result: null, errors: [{ message: failure.message }], pending: false };
    }
    paint();
    if (showAnswer) {
      showAnswer = false;
      const answer = container.querySelector('#kiosk-answer');
      const box = answer?.getBoundingClientRect();
      if (box && (box.top < 0 || box.top > window.innerHeight * 0.6)) answer.scrollIntoView({ block: 'start', behavior: 'smooth' });
    }
  };
  const schedule = () => {
    clearTimeout(timer);
    timer = setTimeout(evaluate, EVALUATE_DEBOUNCE_MS);
  };

  const restart = () => {
    clearTimeout(timer);
    generation++;
    // a kiosk runs for days: a file that has expired since it was read now carries the banner
    if (k.check.expires && k.check.expires < today() && !k.verdict.expired) {
      k.verdict = { ...k.verdict, expired: true };
      document.body.dataset.kiosk = 'expired';
    }
    state = { visitor: blankVisitor(), result: null, errors: [], missing: [], pending: false };
    document.querySelector('#trace-dialog')?.close();
    if (document.activeElement instanceof HTMLElement) document.activeElement.blur();
    paint();
    window.scrollTo(0, 0);
    document.body.dataset.kioskReset = String(Number(document.body.dataset.kioskReset ?? 0) + 1);
  };
  const touched = () => {
    clearTimeout(idleTimer);
    idleTimer = setTimeout(restart, k.idleSeconds * 1000);
  };
  for (const type of ['pointerdown', 'keydown', 'input', 'touchstart', 'wheel']) document.addEventListener(type, touched, { capture: true, passive: true });

  container.addEventListener('click', (event) => {
    const num = event.target.closest('button.num');
    if (num) {
      const option = state.result?.options?.find((o) => o.id === num.dataset.option);
      // the answer is lean: the option's trace and sources are asked of the core as the verdict does
      if (option) showOptionTrace(state, option, { core, format });
      return;
    }
    const button = event.target.closest('button[data-action]');
    if (!button) return;
    const { action, value } = button.dataset;
    if (action === 'kiosk-size') state.visitor.size = value;
    else if (action === 'kiosk-current') state.visitor.current = value;
    if (action === 'kiosk-size' || action === 'kiosk-current') showAnswer = true;
    else if (action === 'kiosk-restart') { restart(); return; }
    else return;
    paint();
    schedule();
  });
  container.addEventListener('input', (event) => {
    const input = event.target;
    if (input.dataset?.action !== 'kiosk-price') return;
    const fuel = input.dataset.fuel;
    state.visitor.priceText[fuel] = input.value;
    const value = parseNumber(input.value, format.locale);
    if (typeof value === 'number' && Number.isFinite(value) && value > 0) state.visitor.prices[fuel] = value;
    else delete state.visitor.prices[fuel];
    schedule();
  });

  paint();
  touched();
  document.body.dataset.kiosk = k.verdict.expired ? 'expired' : 'ready';
}
