// The verdict's live what-if card: a slider over one fuel's price or one option's rated efficiency.
// At each position the core's whatIf ranks the options again (one request in flight, the newest
// next) and the card repaints its ranking and the saving, nothing else. The quote is not changed.
import { h } from '../dom.js';
import { systemNowWords } from '../results.js';
import { latestWins } from '../runner.js';
import { positionOf, valueAt, whatIfInputs, whatIfRequest } from '../what-if.js';

/** The value as the card says it: a price in money per unit, an efficiency with its rating. */
function valueText(input, value, format) {
  return input.vary === 'price' ? `${format.price(value)} ${input.unit}` : `${format.number(value, 3)} ${input.unit}`;
}

/** The card's sentence about the cheapest option and its saving against the existing system. */
function savingSentence(answer, labels, format, basis) {
  const top = answer.ranking?.[0];
  if (!top) return '';
  const period = basis === 'life-cycle' ? ' over the period' : ' a year';
  const name = labels.get(top.id) ?? top.id;
  const lead = `Cheapest: ${name}, ${format.money(top.cost)}${period}`;
  const existing = answer.existing;
  if (!existing) return `${lead}.`;
  if (existing === top.id) return `${lead}: the system in the house now stays the cheapest.`;
  const saving = answer.options.find((o) => o.id === top.id)?.saving;
  return typeof saving === 'number'
    ? `${lead}, saving ${format.money(saving)}${period} against ${systemNowWords(labels.get(existing) ?? existing)}.` : `${lead}.`;
}

/**
 * The card for the scenario the verdict shows (`state.key`), or null when nothing can be varied.
 * `state.whatIf` keeps the chosen input across repaints; `basis` is 'annual' or 'life-cycle'.
 */
export function whatIfCard(state, result, ctx, basis) {
  const scenario = JSON.parse(state.key);
  const names = new Map((result.options ?? []).map((o) => [o.fuel, o.fuel_name ?? o.fuel]));
  const labels = new Map((result.options ?? []).map((o) => [o.id, o.label ?? o.id]));
  const inputs = whatIfInputs(scenario, names);
  if (!inputs.length) return null;
  const memo = (state.whatIf ??= {});
  // first the price of the cheapest option's fuel, as the cost-against-price chart starts
  const leaderFuel = (result.options ?? []).find((o) => o.id === result.ranking?.[0]?.id)?.fuel;
  let input = inputs.find((i) => i.key === memo.key) ?? inputs.find((i) => i.key === `price:${leaderFuel}`) ?? inputs[0];
  const { format } = ctx;
  const select = h('select', { id: 'what-if-input', 'aria-label': 'The input to try' },
    inputs.map((i) => h('option', { value: i.key, text: i.label, selected: i.key === input.key })));
  const range = h('input', { type: 'range', id: 'what-if-range', min: '0', max: '200', step: '1',
    value: String(positionOf(input, input.current)), 'aria-label': `${input.label}: try another value` });
  const shown = h('output', { id: 'what-if-value', for: 'what-if-range', text: valueText(input, input.current, format) });
  const sentence = h('p', { id: 'what-if-saving', role: 'status', text: 'Move the slider: the options are ranked again at each value.' });
  const list = h('ol', { class: 'what-if-ranking', id: 'what-if-ranking' });
  const reset = h('button', { type: 'button', class: 'quiet', id: 'what-if-reset', text: 'Back to today’s value' });
  const card = h('section', { class: 'chart-card what-if', id: 'what-if', dataset: { paints: '0' } },
    h('h3', { text: 'What if…' }),
    h('div', { class: 'what-if-controls' }, select, h('div', { class: 'what-if-slider' }, range, shown)),
    sentence, list, reset,
    h('p', { class: 'hint', text: 'Tries one value without changing the quote. The figures come from the same calculation as the verdict.' }));
  let paints = 0;
  const paint = (answer) => {
    if (answer.errors?.length) {
      sentence.textContent = answer.errors.map((e) => e.message).join('; ');
      list.replaceChildren();
    } else {
      sentence.textContent = savingSentence(answer, labels, format, basis);
      const savings = new Map(answer.options.map((o) => [o.id, o.saving]));
      list.replaceChildren(...answer.ranking.map((r) => {
        const saving = savings.get(r.id);
        const extra = typeof saving === 'number' && r.id !== answer.existing
          ? (saving >= 0 ? ` (saves ${format.money(saving)})` : ` (costs ${format.money(-saving)} more)`) : '';
        return h('li', { dataset: { option: r.id } }, h('div', { class: 'what-if-row' }, h('span', { class: 'name', text: labels.get(r.id) ?? r.id }),
          h('span', { class: 'cost', text: `${format.money(r.cost)}${basis === 'life-cycle' ? '' : ' a year'}${extra}` })));
      }));
    }
    card.dataset.paints = String(++paints);
  };
  const positions = latestWins((request) => ctx.core.whatIf(request), paint, { onError: (error) => { sentence.textContent = error.message; } });
  const tryValue = (value) => {
    shown.textContent = valueText(input, value, format);
    positions.submit(whatIfRequest(scenario, input, value, basis));
  };
  range.addEventListener('input', () => tryValue(valueAt(input, Number(range.value))));
  select.addEventListener('change', () => {
    input = inputs.find((i) => i.key === select.value) ?? inputs[0];
    memo.key = input.key;
    range.value = String(positionOf(input, input.current));
    range.setAttribute('aria-label', `${input.label}: try another value`);
    tryValue(input.current);
  });
  reset.addEventListener('click', () => {
    range.value = String(positionOf(input, input.current));
    tryValue(input.current);
  });
  return card;
}
