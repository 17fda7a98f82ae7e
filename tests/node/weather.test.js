// Weather files: the WebAssembly module's weather() gives exactly what `fuelwright weather FILE`
// prints, for an invented daily file and an invented hourly (TMY3-layout) year.
import assert from 'node:assert/strict';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { after, before, describe, test } from 'node:test';

import { cliJson, loadCore } from './helpers.js';

/** An invented year of daily highs and lows [degF] at an invented station, as a daily summary prints it. */
function inventedDaily() {
  const lines = ['DATE,TMAX,TMIN'];
  const first = Date.UTC(2023, 0, 1);
  for (let d = 0; d < 365; d += 1) {
    const date = new Date(first + d * 86400000).toISOString().slice(0, 10);
    const mean = 52 - 22 * Math.cos((2 * Math.PI * (d - 20)) / 365) + 7 * Math.sin(0.9 * d);
    lines.push(`${date},${Math.round(mean + 8)},${Math.round(mean - 8)}`);
  }
  return `${lines.join('\n')}\n`;
}

/** An invented typical year in the two-header-line TMY3 layout, dry-bulb in degC. */
function inventedHourly() {
  const lines = ['999999,"INVENTED CAPE",ZZ,-5.0,40.000,-70.000,10', 'Date (MM/DD/YYYY),Time (HH:MM),Dry-bulb (C)'];
  const first = Date.UTC(2001, 0, 1);
  for (let d = 0; d < 365; d += 1) {
    const iso = new Date(first + d * 86400000).toISOString();
    const us = `${iso.slice(5, 7)}/${iso.slice(8, 10)}/${iso.slice(0, 4)}`;
    for (let h = 1; h <= 24; h += 1) {
      const t = 8 - 9 * Math.cos((2 * Math.PI * (d - 20)) / 365) + 4 * Math.sin((2 * Math.PI * (h - 9)) / 24);
      lines.push(`${us},${String(h).padStart(2, '0')}:00,${t.toFixed(1)}`);
    }
  }
  return `${lines.join('\n')}\n`;
}

let core;
let dir;
before(async () => {
  core = await loadCore();
  dir = await mkdtemp(join(tmpdir(), 'fw-weather-'));
});
after(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe('weather matches the CLI', () => {
  for (const [name, text, unit] of [['daily', inventedDaily(), 'degF'], ['hourly', inventedHourly(), null]]) {
    test(name, async () => {
      const path = join(dir, `${name}.csv`);
      await writeFile(path, text);
      const { code, json } = await cliJson('weather', path, ...(unit ? ['--unit', unit] : []));
      assert.equal(code, 0, JSON.stringify(json.errors));
      const wasm = JSON.parse(core.weather(JSON.stringify({ text, ...(unit ? { unit } : {}) })));
      assert.deepEqual(wasm, json);
      assert.equal(wasm.format, name);
      assert.ok(wasm.climate, 'a whole year gives a climate');
    });
  }

  test('a file that does not say its unit gets a message at the unit', () => {
    const answer = JSON.parse(core.weather(JSON.stringify({ text: 'DATE,TAVG\n2024-01-01,30\n' })));
    assert.deepEqual(answer.errors, [{ path: '/unit', message: 'the file does not say whether its temperatures are in degC or degF; choose the unit' }]);
  });
});
