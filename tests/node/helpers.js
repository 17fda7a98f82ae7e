// Shared by the Node tests: the built site's WASM module and the native CLI.
import { execFile } from 'node:child_process';
import { readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { promisify } from 'node:util';

const run = promisify(execFile);
const root = resolve(import.meta.dirname ?? new URL('.', import.meta.url).pathname, '../..');

/** Folder of the assembled site (FUELWRIGHT_SITE, default build/site). */
export const siteDir = resolve(process.env.FUELWRIGHT_SITE ?? join(root, 'build/site'));
/** The native CLI (FUELWRIGHT_CLI, default build/native/fuelwright). */
export const cliPath = resolve(process.env.FUELWRIGHT_CLI ?? join(root, 'build/native/fuelwright'));

/** Instantiates the module as the page does, passing the .wasm bytes (no fetch in Node). */
export async function loadCore() {
  const { default: createFuelwrightCore } = await import(pathToFileURL(join(siteDir, 'fuelwright_core.mjs')).href);
  return createFuelwrightCore({ wasmBinary: await readFile(join(siteDir, 'fuelwright_core.wasm')) });
}

/** Runs the CLI; resolves to {code, stdout, stderr} whatever the exit status. */
export async function cli(...args) {
  try {
    const { stdout, stderr } = await run(cliPath, args, { timeout: 20_000 });
    return { code: 0, stdout, stderr };
  } catch (error) {
    if (typeof error.code !== 'number') throw error;
    return { code: error.code, stdout: error.stdout, stderr: error.stderr };
  }
}

/** Runs the CLI and parses its standard output as JSON. */
export async function cliJson(...args) {
  const { code, stdout, stderr } = await cli(...args);
  try {
    return { code, json: JSON.parse(stdout) };
  } catch {
    throw new Error(`CLI ${args.join(' ')} exited ${code} without JSON on stdout:\n${stdout}\n${stderr}`);
  }
}
