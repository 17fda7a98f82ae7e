// Bills pasted as a block (web/bills.js), as a contractor copies them from a utility's statement or a
// spreadsheet: US and day-first dates, tabs, commas and spaces, group separators, a unit after the
// quantity; every line that is not a bill named with the reason. The bills here are invented.
import assert from 'node:assert/strict';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { before, describe, test } from 'node:test';

import { siteDir } from './helpers.js';

let bills;
before(async () => { bills = await import(pathToFileURL(join(siteDir, 'bills.js')).href); });

describe('bills pasted as a block', () => {
  test('a US statement: meter-read dates, a tab or two spaces between columns, therms', () => {
    const { bills: read, problems } = bills.parseBillLines('11/12/2025\t12/11/2025\t84\n12/11/2025  1/13/2026  131 therms\n1/13/2026, 2/11/2026, 1,042', 'en-US');
    assert.deepEqual(problems, []);
    assert.deepEqual(read, [
      { start: '2025-11-12', end: '2025-12-11', quantity: 84 },
      { start: '2025-12-11', end: '2026-01-13', quantity: 131, unit: 'therm' },
      { start: '2026-01-13', end: '2026-02-11', quantity: 1042 },
    ]);
  });

  test('day-first dates and a decimal comma where the locale writes them', () => {
    const { bills: read, problems } = bills.parseBillLines('12.11.2025; 11.12.2025; 1 234,5 kWh\n2025-12-11 2026-01-13 987,25', 'de-DE');
    assert.deepEqual(problems, []);
    assert.deepEqual(read, [
      { start: '2025-11-12', end: '2025-12-11', quantity: 1234.5, unit: 'kWh' },
      { start: '2025-12-11', end: '2026-01-13', quantity: 987.25 },
    ]);
  });

  test('every line that is not a bill is named, with the reason', () => {
    const { bills: read, problems } = bills.parseBillLines('Period,Usage\n11/12/2025 12/11/2025 abc\n2/30/2026 3/30/2026 50\n3/11/2026 2/11/2026 60\n4/1/2026 5/1/2026 70 barrels\n\n5/1/2026 6/1/2026 12', 'en-US');
    assert.deepEqual(read, [{ start: '2026-05-01', end: '2026-06-01', quantity: 12 }]);
    assert.deepEqual(problems.map((p) => [p.line, p.message]), [
      [1, 'needs a start date, an end date and the quantity billed'],
      [2, '"abc" is not a quantity'],
      [3, '"2/30/2026" is not a date'],
      [4, 'the end date 2026-02-11 is not after the start date 2026-03-11'],
      [5, '"barrels" is not a unit a bill is read in (therm, kWh, ccf, m3, gal, L…)'],
    ]);
  });
});
