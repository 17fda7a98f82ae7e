// WASM-in-Node and page measurements for tools/bench: the heavy scenario in the WASM module,
// cold page load to the first verdict against a blank page, the gzip size of what the page
// transfers, and a price edit to the repainted verdict (headless Chromium, playwright-core).
import { spawn } from 'node:child_process';
import { createInterface } from 'node:readline';
import { readFile, stat, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { gzipSync } from 'node:zlib';
import { join, dirname } from 'node:path';
import { tmpdir } from 'node:os';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';
import { CHROMIUM, CHROMIUM_ARGS } from '../../tests/browser/chromium-page.js';
import { serve } from '../../tests/browser/server.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '../..');
const site = join(root, 'build/site');
const repeats = Number(process.env.FW_BENCH_REPEATS ?? 9);
const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** {median, min, max} of a list. */
const spread = (xs) => ({ median: median(xs), min: Math.min(...xs), max: Math.max(...xs) });

/**
 * The heavy scenario natively and in WASM, interleaved run by run so that both sides of the ratio see
 * the same machine: each run is one native run (build/native/fuelwright_bench SCENARIO --serve, a process
 * kept for all runs, timing one run a line it reads) and then one WASM run in this process; both sides
 * make two untimed runs first (the engine compiles the module in tiers). Each timed run is the two calls
 * returning their JSON text; the ratio is taken run by run.
 */
async function heavyInterleaved() {
  const { default: create } = await import(join(site, 'fuelwright_core.mjs'));
  const core = await create({ wasmBinary: await readFile(join(site, 'fuelwright_core.wasm')) });
  const file = join(root, 'tools/benchmark/heavy-scenario.json');
  const text = await readFile(file, 'utf8');
  const sweep = JSON.stringify({ scenario: JSON.parse(text), vary: 'price', of: 'gas', from: 0.5, to: 2.0, points: 100 });
  const wasmRun = () => {
    const t0 = performance.now();
    const a = core.evaluate(text);
    const b = core.sweep(sweep);
    const ms = performance.now() - t0;
    if (JSON.parse(a).errors.length || JSON.parse(b).errors.length) throw new Error('the heavy scenario did not evaluate cleanly');
    return ms;
  };
  wasmRun();
  wasmRun();
  const bench = spawn(join(root, 'build/native/fuelwright_bench'), [file, '--serve'], { stdio: ['pipe', 'pipe', 'inherit'] });
  const lines = createInterface({ input: bench.stdout })[Symbol.asyncIterator]();
  const nativeRun = async () => {
    bench.stdin.write('\n');
    const { value, done } = await lines.next();
    const ms = Number(value);
    if (done || !(ms >= 0)) throw new Error('fuelwright_bench: the heavy scenario did not evaluate cleanly');
    return ms;
  };
  const native = [], wasm = [], ratios = [];
  for (let i = 0; i < repeats; i++) {
    const n = await nativeRun();
    const w = wasmRun();
    native.push(n);
    wasm.push(w);
    ratios.push(w / n);
  }
  bench.stdin.end();
  const [n, w, r] = [spread(native), spread(wasm), spread(ratios)];
  return { native_heavy_ms: n.median, native_heavy_range_ms: [n.min, n.max], wasm_heavy_ms: w.median, wasm_heavy_range_ms: [w.min, w.max],
    wasm_native_ratio: r.median, wasm_native_ratio_range: [r.min, r.max], heavy_runs: repeats };
}

/** Sum of the gzip sizes of the files a first visit requested (paths under the site). */
async function transferGzip(paths) {
  let total = 0;
  const files = [];
  for (const path of new Set(paths)) {
    const file = join(site, decodeURIComponent(path).replace(/^\/+/, '') || 'index.html');
    const info = await stat(file).catch(() => null);
    if (!info?.isFile()) continue;
    const bytes = gzipSync(await readFile(file), { level: 9 }).length;
    total += bytes;
    files.push([bytes, path]);
  }
  if (process.env.FW_BENCH_LIST) for (const [bytes, path] of files.sort((x, y) => y[0] - x[0])) process.stderr.write(`${bytes}\t${path}\n`);
  return total;
}

/**
 * A live what-if: the verdict's slider dragged across its range for 2 s, one position an animation
 * frame; {fps: the card's repaints of the ranking and the saving a second, frames: animation frames a second}.
 */
async function dragWhatIf(page) {
  await page.click('#tab-verdict');
  await page.waitForSelector('#what-if-range');
  await page.locator('#what-if').scrollIntoViewIfNeeded();
  await page.waitForTimeout(300);
  return page.evaluate(async () => {
    const range = document.getElementById('what-if-range');
    const card = document.getElementById('what-if');
    const paintsBefore = Number(card.dataset.paints);
    let frames = 0;
    const t0 = performance.now();
    await new Promise((done) => {
      const step = (t) => {
        frames += 1;
        range.value = String(Math.round(20 + 160 * Math.min(1, (t - t0) / 2000)));
        range.dispatchEvent(new Event('input', { bubbles: true }));
        if (t - t0 < 2000) requestAnimationFrame(step);
        else done();
      };
      requestAnimationFrame(step);
    });
    const seconds = (performance.now() - t0) / 1000;
    return { fps: (Number(card.dataset.paints) - paintsBefore) / seconds, frames: frames / seconds };
  });
}

async function pageTimes() {
  const server = await serve(site);
  await writeFile(join(site, 'bench-blank.html'), '<!doctype html><title>blank</title><p>blank</p>');
  const loads = [], blanks = [], edits = [], drags = [];
  const requested = [];
  try {
    for (let i = 0; i < Math.max(3, Math.floor(repeats / 2)); i++) {
      const profile = await mkdtemp(join(tmpdir(), 'fw-bench-'));
      const context = await chromium.launchPersistentContext(profile, { executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS,
        viewport: { width: 820, height: 1180 } });
      const page = context.pages()[0] ?? await context.newPage();
      let t0 = performance.now();
      await page.goto(`${server.url}bench-blank.html`);
      await page.waitForSelector('p');
      blanks.push(performance.now() - t0);
      if (i === 0) page.on('request', (request) => {
        const url = new URL(request.url());
        if (url.origin === new URL(server.url).origin) requested.push(url.pathname.endsWith('/') ? url.pathname + 'index.html' : url.pathname);
      });
      t0 = performance.now();
      await page.goto(server.url);
      await page.waitForFunction(() => document.querySelector('#verdict-body')?.dataset.state === 'done', null, { timeout: 30000 });
      loads.push(performance.now() - t0);
      // A price edit to the repainted verdict: from the input event to the frame after the verdict's next
      // 'done'. Measured once the page has settled (the charts' analyses in, the start-up work over), as a
      // contractor's edit comes; five edits a load.
      const input = await page.$('#f-fuels-0-price-amount');
      if (input) await page.waitForFunction(() => document.querySelector('#verdict-body')?.dataset.analysis, null, { timeout: 30000 });
      if (input) await page.waitForTimeout(1000);
      for (let e = 0; input && e < 5; e++) {
        edits.push(await page.evaluate(() => new Promise((resolve) => {
          const field = document.querySelector('#f-fuels-0-price-amount');
          const body = document.querySelector('#verdict-body');
          const start = performance.now();
          const observer = new MutationObserver(() => {
            if (body.dataset.state === 'done' && performance.now() > start) {
              observer.disconnect();
              requestAnimationFrame(() => resolve(performance.now() - start));
            }
          });
          observer.observe(body, { attributes: true, subtree: true, childList: true });
          field.value = String(Number(field.value.replace(',', '.')) * 1.1).replace('.', field.value.includes(',') ? ',' : '.');
          field.dispatchEvent(new Event('input', { bubbles: true }));
        })));
        await page.waitForTimeout(400);
      }
      if (input) drags.push(await dragWhatIf(page));
      await context.close();
      await rm(profile, { recursive: true, force: true });
    }
  } finally {
    await rm(join(site, 'bench-blank.html'), { force: true });
    await server.close();
  }
  // Let the service worker finish precaching: its requests count too, once each.
  return { load_ms: median(loads), blank_ms: median(blanks), edit_repaint_ms: edits.length ? median(edits) : null,
           drag_fps: drags.length ? median(drags.map((d) => d.fps)) : null,
           drag_frame_rate: drags.length ? median(drags.map((d) => d.frames)) : null,
           transfer_gzip_bytes: await transferGzip(requested) };
}

const out = { ...(await heavyInterleaved()), ...(await pageTimes()) };
process.stdout.write(JSON.stringify(out) + '\n');
