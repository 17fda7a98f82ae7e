// Serves a folder with Python's http.server on a free loopback port, as
// tools/start does (it serves .mjs as text/javascript and .wasm as application/wasm).
import { spawn } from 'node:child_process';
import { createInterface } from 'node:readline';

const PYTHON = process.env.FUELWRIGHT_PYTHON ?? 'python3';

/**
 * Starts the server; resolves to {url, requests, close()} once it listens.
 * `requests` grows with "GET /path" for every request the server answered.
 */
export function serve(dir, { timeoutMs = 10_000 } = {}) {
  const child = spawn(PYTHON, ['-u', '-m', 'http.server', '0', '--bind', '127.0.0.1', '--directory', dir],
    { stdio: ['ignore', 'pipe', 'pipe'] });
  const requests = [];
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      child.kill();
      reject(new Error('http.server did not start'));
    }, timeoutMs);
    child.once('error', (error) => {
      clearTimeout(timer);
      reject(error);
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`http.server exited with ${code}`));
    });
    // "Serving HTTP on 127.0.0.1 port 40123 (http://127.0.0.1:40123/) ..."
    createInterface({ input: child.stdout }).on('line', (line) => {
      const match = /port (\d+)/.exec(line);
      if (!match) return;
      clearTimeout(timer);
      child.removeAllListeners('exit');
      resolve({
        url: `http://127.0.0.1:${match[1]}/`,
        requests,
        close: () => new Promise((done) => {
          if (child.exitCode !== null) return done();
          child.once('exit', () => done());
          child.kill();
        }),
      });
    });
    // the request log: 127.0.0.1 - - [date] "GET /index.html HTTP/1.1" 200 -
    createInterface({ input: child.stderr }).on('line', (line) => {
      const request = /"([A-Z]+) (\S+) HTTP\/[\d.]+"/.exec(line);
      if (request) requests.push(`${request[1]} ${request[2]}`);
    });
  });
}
