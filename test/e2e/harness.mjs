// A small harness for the browser tests: builds the page, serves it with `vite preview`,
// starts Debian's Chromium through playwright-core, runs each test in a fresh browser
// context (so IndexedDB starts empty) and reports one line per test.
import { spawn, spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { createConnection } from 'node:net';
import { chromium } from 'playwright-core';

export const PORT = Number(process.env.E2E_PORT || 4179);
export const BASE = `http://127.0.0.1:${PORT}`;
export const OUT = 'test-output/e2e';

const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-dev-shm-usage',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--disable-quic',
  '--no-first-run',
];

function waitForPort(port, timeoutMs) {
  const until = Date.now() + timeoutMs;
  return new Promise((resolve, reject) => {
    const attempt = () => {
      const s = createConnection({ host: '127.0.0.1', port }, () => {
        s.end();
        resolve();
      });
      s.on('error', () => {
        s.destroy();
        if (Date.now() > until) reject(new Error(`nothing listens on port ${port}`));
        else setTimeout(attempt, 150);
      });
    };
    attempt();
  });
}

/** Runs the tests; returns { passed, failed }. */
export async function runTests(tests, { build = true, json = null } = {}) {
  mkdirSync(OUT, { recursive: true });
  if (build) {
    console.log('building the page (vite build)…');
    const b = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { stdio: 'inherit' });
    if (b.status !== 0) throw new Error('vite build failed');
  }
  const server = spawn('npx', ['vite', 'preview', '--host', '127.0.0.1', '--port', String(PORT), '--strictPort'], { stdio: ['ignore', 'pipe', 'pipe'], detached: true });
  let serverLog = '';
  server.stdout.on('data', (d) => (serverLog += d));
  server.stderr.on('data', (d) => (serverLog += d));
  let browser;
  let passed = 0;
  let failed = 0;
  const results = [];
  try {
    await waitForPort(PORT, 30_000);
    browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium', args: CHROMIUM_ARGS });
    // E2E_ONLY=words runs only the tests whose names hold those words (while working on them)
    const only = process.env.E2E_ONLY;
    for (const t of tests.filter((x) => !only || x.name.includes(only))) {
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
      const problems = [];
      context.on('page', (page) => {
        page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
        page.on('console', (m) => {
          if (m.type() === 'error' && !t.allowConsoleErrors) problems.push(`console error: ${m.text()}`);
        });
      });
      const started = Date.now();
      try {
        await t.run({ context, browser, base: BASE, out: OUT, problems });
        if (problems.length > 0) throw new Error(problems.join('\n'));
        passed++;
        results.push({ name: t.name, ok: true, ms: Date.now() - started });
        console.log(`ok - ${t.name} (${Date.now() - started} ms)`);
      } catch (err) {
        failed++;
        results.push({ name: t.name, ok: false, error: String(err?.stack || err) });
        console.log(`not ok - ${t.name}\n    ${String(err?.message || err).split('\n').join('\n    ')}`);
        try {
          const pages = context.pages();
          if (pages[0]) await pages[0].screenshot({ path: `${OUT}/failed-${t.name.replace(/[^a-z0-9]+/gi, '-')}.png`, fullPage: true });
        } catch {
          // the screenshot of a failure is a help, not a requirement
        }
      } finally {
        await context.close();
      }
    }
  } finally {
    if (browser) await browser.close();
    try {
      process.kill(-server.pid, 'SIGTERM');
    } catch {
      server.kill('SIGTERM');
    }
  }
  console.log(`e2e: ${passed} passed, ${failed} failed`);
  if (json) writeFileSync(json, JSON.stringify({ passed, failed, results }, null, 2));
  if (failed > 0 && serverLog) writeFileSync(`${OUT}/server.log`, serverLog);
  return { passed, failed };
}

/** Throws with a message when a condition is false. */
export function check(condition, message) {
  if (!condition) throw new Error(message);
}
