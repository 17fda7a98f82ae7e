// The contractor's profile and the quote's paperwork (web/profile.js), pure functions: the monthly
// payment against the standard amortization formula's textbook value, net prices, quote numbers
// from the device's counter, the valid-until date, a profile read back from storage; and the
// demo quote, whose invented company and loan reach the core unchanged and are accepted.
import assert from 'node:assert/strict';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { loadCore, siteDir } from './helpers.js';

const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

let profile;
let scenario;
let demo;
let core;
before(async () => {
  profile = await web('profile.js');
  scenario = await web('scenario.js');
  demo = await web('demo.js');
  core = await loadCore();
});

describe('the quote paperwork', () => {
  test('monthly payment by the standard amortization formula', () => {
    // 100,000 at 6 % a year over 30 years: 599.55 a month (the usual textbook mortgage example, from memory).
    assert.ok(Math.abs(profile.monthlyPayment(100000, 0.06, 30) - 599.55) < 0.005);
    // 12,000 at 7.9 % over 10 years: P r / (1 - (1 + r)^-n), r = 0.079/12, n = 120, worked by hand: 144.96.
    assert.ok(Math.abs(profile.monthlyPayment(12000, 0.079, 10) - 144.96) < 0.005);
    assert.equal(profile.monthlyPayment(12000, 0, 10), 100, 'interest-free: the principal over 120 months');
    assert.equal(profile.monthlyPayment(12000, undefined, 10), undefined, 'no rate, no payment');
    assert.equal(profile.monthlyPayment(0, 0.05, 10), undefined, 'nothing to borrow');
  });

  test('net price and payment of an option', () => {
    assert.deepEqual(profile.optionPrice({ installed_cost: 14000, incentives: 2000 }, { rate: 0, years: 10 }),
      { installed: 14000, incentives: 2000, net: 12000, monthly: 100 });
    assert.equal(profile.optionPrice({ life_years: 15 }, null), null, 'no installed price: nothing to print');
  });

  test('quote numbers from the counter, the valid-until date and a profile read back', () => {
    const start = profile.normalizeProfile({ name: 'Invented Heating', next_number: 41, number_prefix: 'IH-', validity_days: '30', extra: 1 });
    assert.equal(start.validity_days, 30, 'a number kept as text is read');
    assert.equal(start.extra, undefined, 'unknown fields dropped');
    const first = profile.takeQuoteNumber(start);
    assert.equal(first.number, 'IH-0041');
    assert.equal(profile.takeQuoteNumber(first.profile).number, 'IH-0042');
    assert.equal(profile.validUntil('2026-12-04', 30), '2027-01-03');
    assert.equal(profile.validUntil('2028-02-15', 14), '2028-02-29', 'a leap day counted');
    assert.equal(profile.normalizeProfile({ logo: 'javascript:alert(1)' }).logo, '', 'only an image kept in the file');
    assert.deepEqual(profile.companyOf(profile.normalizeProfile({})), undefined);
    assert.deepEqual(profile.companyOf(start), { name: 'Invented Heating' });
  });

  test("the demo's invented company, quote number and loan reach the core and are accepted", () => {
    const doc = scenario.toScenario(demo.demoWorkspace());
    assert.equal(doc.quote.number, 'HC-0117');
    assert.equal(doc.quote.company.licence, 'MH-M-00417 (invented)');
    assert.deepEqual(doc.quote.financing, { rate: 0.079, years: 10 });
    assert.equal(doc.options.find((o) => o.id === 'heat-pump').equipment, 'Invented Co. model AH-36 (invented)');
    const result = JSON.parse(core.evaluate(JSON.stringify(doc)));
    assert.deepEqual(result.errors, []);
    assert.deepEqual(result.warnings.filter((w) => w.path.startsWith('/quote') || w.path.endsWith('/equipment')), []);
    const late = JSON.parse(core.evaluate(JSON.stringify({ ...doc, quote: { ...doc.quote, valid_until: '2026-11-01' } })));
    assert.deepEqual(late.errors, [{ path: '/quote/valid_until', message: "is before the quote's date (2026-11-01)" }]);
    const loan = JSON.parse(core.evaluate(JSON.stringify({ ...doc, quote: { ...doc.quote, financing: { rate: 7.9, years: 10 } } })));
    assert.deepEqual(loan.errors, [{ path: '/quote/financing/rate', message: 'must be a fraction a year from 0 to 0.5 (0.079 for 7.9 %), got 7.9' }]);
  });
});
