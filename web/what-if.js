// The verdict's live what-if, as pure rules: which inputs a slider can move (each fuel's price, each
// option's rated efficiency), over what range, and the request the core's whatIf answers. The core
// works out the costs, the ranking and the savings; nothing here ranks or prices.

/**
 * Ratings given in percent, and the most the slider offers: 100 % of the fuel's HHV for the gross ratings
 * (the core refuses more); a net (LHV-basis) seasonal efficiency may pass 100 % by the fuel's LHV/HHV
 * ratio, which the page does not know here, so its slider stops at 100 % as well.
 */
const PERCENT_LIMITS = { AFUE: 100, thermal: 100, 'seasonal-gcv': 100, 'seasonal-ncv': 100 };

const isNum = (v) => typeof v === 'number' && Number.isFinite(v);

/**
 * The inputs of `scenario` a slider can move: {key, vary, of, label, current, unit, min, max}.
 * `names` maps a fuel id to the name the page shows (from the core's result); prices are the first
 * option's of each fuel, efficiencies each option's own rating value (data-sheet points have none).
 */
export function whatIfInputs(scenario, names = new Map()) {
  const inputs = [];
  const fuels = new Set();
  for (const option of scenario?.options ?? []) {
    const fuel = typeof option.fuel === 'string' ? option.fuel : option.fuel?.id;
    const price = option.price;
    if (fuel && !fuels.has(fuel) && isNum(price?.amount) && price.amount > 0 && !price.tiers) {
      fuels.add(fuel);
      inputs.push(withRange({ key: `price:${fuel}`, vary: 'price', of: fuel, label: `${names.get(fuel) ?? fuel} price`,
        current: price.amount, unit: `per ${price.per}` }));
    }
  }
  for (const option of scenario?.options ?? []) {
    const rated = option.system?.efficiency;
    if (isNum(rated?.value) && rated.value > 0 && !option.system?.ratings) {
      inputs.push(withRange({ key: `efficiency:${option.id}`, vary: 'efficiency', of: option.id,
        label: `${option.label ?? option.id}: ${rated.rating ?? 'efficiency'}`, current: rated.value, unit: rated.rating ?? '',
        limit: PERCENT_LIMITS[rated.rating] }));
    }
  }
  return inputs;
}

/** A slider's range: a price from 0 to twice today's, an efficiency from half to one and a half times (to its rating's limit). */
function withRange({ limit, ...input }) {
  const { vary, current } = input;
  const min = vary === 'price' ? 0 : current / 2;
  const max = vary === 'price' ? current * 2 : Math.max(current, Math.min(current * 1.5, limit ?? Infinity));
  return { ...input, min, max };
}

/** The core's whatIf request for `input` at `value` on the `basis` the verdict ranks by. */
export function whatIfRequest(scenario, input, value, basis = 'annual') {
  return { scenario, vary: input.vary, of: input.of, value, basis };
}

/** A slider position (0..200) for `value` within the input's range, and back. */
export function positionOf(input, value) {
  return Math.round(((value - input.min) / (input.max - input.min)) * 200);
}
export function valueAt(input, position) {
  const value = input.min + (input.max - input.min) * (position / 200);
  // today's value exactly at its own position, so returning to it gives today's verdict
  return position === positionOf(input, input.current) ? input.current : value;
}
