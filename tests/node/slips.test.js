// Likely slips as questions with a one-tap fix (web/slips.js), pure functions of the workspace:
// a percentage rating typed as a fraction, a rate typed as a fraction in a percent field; and the
// core's plausibility warnings for what the page does not catch, with the option's field named.
// Every house and price here is invented.
import assert from 'node:assert/strict';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { loadCore, siteDir } from './helpers.js';

const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

let slips;
let scenario;
let demo;
let core;
before(async () => {
  slips = await web('slips.js');
  scenario = await web('scenario.js');
  demo = await web('demo.js');
  core = await loadCore();
});

/** The demo workspace with `edit` applied. */
function demoWith(edit) {
  const ws = demo.demoWorkspace();
  edit(ws);
  return ws;
}

describe('slips the page asks about', () => {
  test('an AFUE typed as a fraction is asked about with the percentage as the fix', () => {
    const ws = demoWith((w) => { w.systems[1].system.efficiency.value = 0.95; });
    assert.deepEqual(slips.slipFor('/systems/1/system/efficiency/value', ws), {
      message: '0.95 % is a fraction typed as a percentage: did you mean 95 %?',
      fix: { path: '/systems/1/system/efficiency/value', value: 95, text: 'Use 95 %' },
    });
  });

  test('ratings that are not percentages and plausible values raise no question', () => {
    assert.equal(slips.slipFor('/systems/1/system/efficiency/value', demo.demoWorkspace()), null, '95 AFUE');
    const cop = demoWith((w) => { w.systems[4].system.efficiency = { value: 1, rating: 'COP' }; });
    assert.equal(slips.slipFor('/systems/4/system/efficiency/value', cop), null, 'COP 1 is a COP');
    const hspf = demoWith((w) => { w.systems[2].system.efficiency = { value: 0.9, rating: 'HSPF2' }; });
    assert.equal(slips.slipFor('/systems/2/system/efficiency/value', hspf), null, 'HSPF2 is refused by the core, not a percentage');
    assert.equal(slips.slipFor('/fuels/0/price/amount', demo.demoWorkspace()), null);
  });

  test('a discount rate typed as a fraction in the percent field is asked about', () => {
    // "0.05" typed where the field shows % is stored as 0.0005 a year
    const ws = demoWith((w) => { w.economics.discount_rate = 0.0005; });
    assert.deepEqual(slips.slipFor('/economics/discount_rate', ws), {
      message: '0.05 % a year is very small: did you mean 5 %?',
      fix: { path: '/economics/discount_rate', value: 0.05, text: 'Use 5 %' },
    });
    assert.equal(slips.slipFor('/economics/discount_rate', demoWith((w) => { w.economics.discount_rate = 0.05; })), null);
    const escalation = demoWith((w) => { w.fuels[0].escalation = 0.0003; });
    assert.equal(slips.slipFor('/fuels/0/escalation', escalation).fix.value, 0.03);
    // a loan's interest as a lender's sheet prints it (0.0699 for 6.99 %), which the quote sheet would print as 0.07 %
    const loan = demoWith((w) => { w.quote.financing = { rate: 0.000699, years: 10 }; });
    assert.deepEqual(slips.slipFor('/quote/financing/rate', loan), {
      message: '0.0699 % a year is very small: did you mean 6.99 %?',
      fix: { path: '/quote/financing/rate', value: 0.0699, text: 'Use 6.99 %' },
    });
    assert.equal(slips.slipFor('/quote/financing/rate', demoWith((w) => { w.quote.financing = { rate: 0.0699 }; })), null);
  });

  test('the core questions a price no household pays at the fuel the page shows it on', async () => {
    // 1,000 USD a therm: the core's household band is 0.003-2 USD per kWh (common practice).
    const ws = demoWith((w) => { w.fuels[1].price.amount = 1000; });
    const result = JSON.parse(core.evaluate(JSON.stringify(scenario.toScenario(ws))));
    const warning = result.warnings.find((w) => w.path.endsWith('/price/amount'));
    assert.ok(warning, JSON.stringify(result.warnings));
    assert.equal(scenario.workspacePath(warning.path, ws), '/fuels/1/price/amount');
    assert.match(warning.message, /^1000 USD per therm is above what households pay for Natural gas/);
  });
});
