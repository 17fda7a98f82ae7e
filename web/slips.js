// Likely slips in what a person types, as questions with a one-tap fix: pure functions of the
// workspace, tested in Node (tests/node/slips.test.js). The core refuses what cannot be and warns
// about what no house has; these catch the typing habits behind most of those messages.

/** Ratings entered in percent (95 for 95 %). */
export const PERCENT_RATINGS = ['AFUE', 'thermal', 'seasonal-gcv', 'seasonal-ncv'];

const plain = (n) => String(Math.round(n * 1e6) / 1e6);
/** x 100 without the binary fraction's tail (0.000699 x 100 is 0.0699, not 0.06989999999999999). */
const hundredfold = (n) => Number((n * 100).toPrecision(12));

/**
 * The question to ask about the value at workspace `path`, or null: a percentage rating typed as a
 * fraction (0.95 for 95 %) and a discount rate, price rise or loan interest typed as a fraction where the
 * field shows percent (0.05 for 5 %). Returns {message, fix: {path, value}} with `value` in the stored form.
 */
export function slipFor(path, ws) {
  let m;
  if ((m = /^\/systems\/(\d+)\/system\/efficiency\/value$/.exec(path))) {
    const efficiency = ws.systems?.[Number(m[1])]?.system?.efficiency;
    const value = efficiency?.value;
    if (!PERCENT_RATINGS.includes(efficiency?.rating) || !(typeof value === 'number' && value > 0 && value <= 1)) return null;
    return {
      message: `${plain(value)} % is a fraction typed as a percentage: did you mean ${plain(value * 100)} %?`,
      fix: { path, value: hundredfold(value), text: `Use ${plain(value * 100)} %` },
    };
  }
  if (path === '/economics/discount_rate' || path === '/economics/escalation_default' || /^\/fuels\/\d+\/escalation$/.test(path)
    || path === '/quote/financing/rate') {
    const value = path === '/quote/financing/rate' ? ws.quote?.financing?.rate
      : path.startsWith('/economics/') ? ws.economics?.[path.slice('/economics/'.length)]
        : ws.fuels?.[Number(path.split('/')[2])]?.escalation;
    // stored as a fraction of a year, shown in %: 0.05 typed in the % field is stored 0.0005
    if (!(typeof value === 'number' && value > 0 && value <= 0.001)) return null;
    return {
      message: `${plain(value * 100)} % a year is very small: did you mean ${plain(value * 1e4)} %?`,
      fix: { path, value: hundredfold(value), text: `Use ${plain(value * 1e4)} %` },
    };
  }
  return null;
}
