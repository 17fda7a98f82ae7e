// The verdict's live what-if in Node: the inputs a slider can move and their ranges (web/what-if.js),
// the latest-wins runner that feeds the core (web/runner.js), and the module's whatIf against the CLI's
// `what-if` and against evaluate with the input changed. The scenarios are the invented examples.
import assert from 'node:assert/strict';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { after, before, describe, test } from 'node:test';

import { cliJson, loadCore, siteDir } from './helpers.js';

const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');
const web = (name) => import(pathToFileURL(join(siteDir, name)).href);

let core;
let whatIf;
let runner;
let gasVsHeatPump;
let dir;
before(async () => {
  core = await loadCore();
  whatIf = await web('what-if.js');
  runner = await web('runner.js');
  gasVsHeatPump = JSON.parse(await readFile(join(root, 'data/examples/maple-hollow-gas-vs-heat-pump.json'), 'utf8'));
  dir = await mkdtemp(join(tmpdir(), 'fuelwright-what-if-'));
});
after(async () => { await rm(dir, { recursive: true, force: true }); });

describe('web/what-if.js: the inputs a slider moves', () => {
  test('each fuel\'s price once, each rated efficiency, with ranges that stay within what the core accepts', () => {
    const inputs = whatIf.whatIfInputs(gasVsHeatPump, new Map([['natural-gas', 'Natural gas']]));
    const prices = inputs.filter((i) => i.vary === 'price').map((i) => i.of);
    assert.deepEqual(prices, ['natural-gas', 'electricity', 'propane', 'heating-oil-2']);
    const gas = inputs.find((i) => i.key === 'price:natural-gas');
    assert.deepEqual([gas.label, gas.current, gas.unit, gas.min, gas.max], ['Natural gas price', 1.4, 'per therm', 0, 2.8]);
    // a 95 AFUE furnace: half to the rating's 100 % limit, not 142.5
    const furnace = inputs.find((i) => i.key === 'efficiency:gas-furnace');
    assert.deepEqual([furnace.min, furnace.max, furnace.unit], [47.5, 100, 'AFUE']);
    const heatPump = inputs.find((i) => i.key === 'efficiency:heat-pump');
    assert.deepEqual([heatPump.min, heatPump.max], [4.25, 12.75]);
  });

  test('a net (LHV-basis) seasonal efficiency above 100 % keeps today\'s value in range', () => {
    const boiler = structuredClone(gasVsHeatPump);
    boiler.options[0].system = { kind: 'boiler', efficiency: { value: 104, rating: 'seasonal-ncv' } };
    const input = whatIf.whatIfInputs(boiler).find((i) => i.key === 'efficiency:gas-furnace');
    assert.deepEqual([input.min, input.max], [52, 104]);
    const condensing = structuredClone(gasVsHeatPump);
    condensing.options[0].system = { kind: 'boiler', efficiency: { value: 90, rating: 'seasonal-ncv' } };
    assert.equal(whatIf.whatIfInputs(condensing).find((i) => i.key === 'efficiency:gas-furnace').max, 100);
  });

  test('a slider position maps to a value and back, and today\'s position gives today\'s value exactly', () => {
    const [gas] = whatIf.whatIfInputs(gasVsHeatPump);
    assert.equal(whatIf.positionOf(gas, gas.current), 100);
    assert.equal(whatIf.valueAt(gas, 100), 1.4);
    assert.equal(whatIf.valueAt(gas, 0), 0);
    assert.equal(whatIf.valueAt(gas, 200), 2.8);
    assert.ok(Math.abs(whatIf.valueAt(gas, 37) - 0.518) < 1e-12);
  });

  test('a tiered price or data-sheet points offer no slider for that input', () => {
    const tiered = structuredClone(gasVsHeatPump);
    tiered.options[0].price.tiers = [{ up_to: 50, amount: 1.2 }];
    tiered.options[1].system.ratings = [];
    const keys = whatIf.whatIfInputs(tiered).map((i) => i.key);
    assert.ok(!keys.includes('price:natural-gas'));
    assert.ok(!keys.includes('efficiency:heat-pump'));
  });
});

describe('web/runner.js: latest wins', () => {
  test('one request in flight; the newest of those made meanwhile goes next; every answer is handed on in order', async () => {
    const sent = [];
    const answers = [];
    const pending = [];
    const send = (request) => new Promise((resolveAnswer) => { sent.push(request); pending.push(() => resolveAnswer(request * 10)); });
    const { submit } = runner.latestWins(send, (answer, request) => answers.push([request, answer]));
    submit(1);
    submit(2);
    submit(3);
    assert.deepEqual(sent, [1]);
    pending.shift()();
    await new Promise((r) => setTimeout(r, 0));
    assert.deepEqual(sent, [1, 3]);
    pending.shift()();
    await new Promise((r) => setTimeout(r, 0));
    assert.deepEqual(answers, [[1, 10], [3, 30]]);
    submit(4);
    assert.deepEqual(sent, [1, 3, 4]);
  });

  test('with dropStale only the newest request\'s answer is handed on, and drop makes everything stale', async () => {
    const pending = [];
    const answers = [];
    const send = (request) => new Promise((resolveAnswer) => { pending.push(() => resolveAnswer(request)); });
    const { submit, drop } = runner.latestWins(send, (answer) => answers.push(answer), { dropStale: true });
    submit('a');
    submit('b');
    pending.shift()();  // 'a' answers after 'b' was submitted: stale
    await new Promise((r) => setTimeout(r, 0));
    pending.shift()();  // 'b' is the newest
    await new Promise((r) => setTimeout(r, 0));
    assert.deepEqual(answers, ['b']);
    submit('c');
    drop();
    pending.shift()();
    await new Promise((r) => setTimeout(r, 0));
    assert.deepEqual(answers, ['b'], 'dropped: not handed on');
  });

  test('a handler that throws is logged and never stops the runner', async () => {
    const answers = [];
    const logged = [];
    const original = console.error;
    console.error = (failure) => logged.push(String(failure));
    try {
      const { submit } = runner.latestWins(async (request) => request, (answer) => {
        if (answer === 'boom') throw new Error('paint failed');
        answers.push(answer);
      }, { dropStale: true });
      submit('boom');
      await new Promise((r) => setTimeout(r, 0));
      submit('next');
      await new Promise((r) => setTimeout(r, 0));
      assert.deepEqual(answers, ['next']);
      assert.deepEqual(logged, ['Error: paint failed']);
    } finally {
      console.error = original;
    }
  });

  test('a failed request is reported and the next still goes', async () => {
    const errors = [];
    const answers = [];
    const { submit } = runner.latestWins(async (request) => { if (request === 'bad') throw new Error('no'); return request; },
      (answer) => answers.push(answer), { onError: (error, request) => errors.push([request, error.message]) });
    submit('bad');
    await new Promise((r) => setTimeout(r, 0));
    submit('good');
    await new Promise((r) => setTimeout(r, 0));
    assert.deepEqual(errors, [['bad', 'no']]);
    assert.deepEqual(answers, ['good']);
  });
});

describe('the core\'s whatIf', () => {
  test('equals the CLI\'s what-if, and each cost equals evaluate with the price changed', async () => {
    const [gas] = whatIf.whatIfInputs(gasVsHeatPump);
    const request = whatIf.whatIfRequest(gasVsHeatPump, gas, 1.05);
    const answer = JSON.parse(core.whatIf(JSON.stringify(request)));
    assert.deepEqual(answer.errors, []);
    const file = join(dir, 'gas.json');
    await writeFile(file, JSON.stringify(gasVsHeatPump));
    const { code, json } = await cliJson('what-if', file, '--vary', 'price', '--of', 'natural-gas', '--value', '1.05');
    assert.equal(code, 0);
    assert.deepEqual(answer, json);
    const changed = structuredClone(gasVsHeatPump);
    for (const option of changed.options) if (option.fuel === 'natural-gas') option.price.amount = 1.05;
    const evaluated = JSON.parse(core.evaluate(JSON.stringify(changed)));
    for (const option of evaluated.options) {
      const cost = answer.options.find((o) => o.id === option.id).cost;
      assert.ok(Math.abs(cost - option.annual_cost) <= 1e-9 * option.annual_cost, `${option.id}: ${cost} vs ${option.annual_cost}`);
    }
    assert.deepEqual(answer.ranking.map((r) => r.id), evaluated.ranking.map((r) => r.id));
  });
});
