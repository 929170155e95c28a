// Browser tests of the report (furrow report FILE -o OUT.html): every sample's report opens
// in Chromium with the network cut off, shows its charts, and holds no script; a document
// whose notes, tables and level names carry script payloads gives a report that runs
// nothing. Screenshots land in test-output/e2e/report-*.png.
//
// Run: node test/e2e/report.mjs   (no page server is needed: reports open from file://)
import { spawnSync } from 'node:child_process';
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium } from 'playwright-core';

const OUT = 'test-output/e2e';
const DIR = join(OUT, 'reports');
mkdirSync(DIR, { recursive: true });

const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-quic', '--no-first-run'];

function check(condition, message) {
  if (!condition) throw new Error(message);
}

function report(source, out) {
  const r = spawnSync(process.execPath, ['bin/furrow.js', 'report', source, '-o', out], { encoding: 'utf8' });
  check(r.status === 0, `furrow report ${source}: ${r.stderr}`);
}

/** Opens a report with every request but its own file refused; returns what it saw. */
async function openOffline(browser, file, shot) {
  const context = await browser.newContext({ viewport: { width: 1100, height: 900 }, offline: true, javaScriptEnabled: true });
  const requests = [];
  const problems = [];
  const own = pathToFileURL(resolve(file)).href;
  await context.route('**/*', (route) => {
    const url = route.request().url();
    if (url === own) return route.continue();
    requests.push(url);
    return route.abort();
  });
  const page = await context.newPage();
  page.on('console', (m) => problems.push(`console ${m.type()}: ${m.text()}`));
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  page.on('dialog', (d) => {
    problems.push(`a dialog opened: ${d.message()}`);
    void d.dismiss();
  });
  await page.goto(own);
  await page.waitForLoadState('load');
  const seen = await page.evaluate(() => {
    const bad = [];
    for (const el of document.querySelectorAll('*')) {
      for (const a of el.attributes) {
        if (/^on/i.test(a.name)) bad.push(`${el.tagName} ${a.name}`);
        if (/^\s*(javascript|vbscript|data:text\/html)/i.test(a.value)) bad.push(`${el.tagName} ${a.name}=${a.value}`);
        if (/^(href|src|xlink:href|action|formaction)$/i.test(a.name) && /^\s*(https?:|\/\/|file:)/i.test(a.value)) bad.push(`${el.tagName} ${a.name}=${a.value}`);
      }
    }
    return {
      scripts: document.querySelectorAll('script').length,
      svgs: document.querySelectorAll('figure.chart svg').length,
      figures: document.querySelectorAll('figure.chart').length,
      csp: document.querySelector('meta[http-equiv="Content-Security-Policy"]')?.getAttribute('content') ?? '',
      bad,
      pwned: window.pwned === true,
      title: document.title,
      caution: document.querySelector('.caution')?.textContent ?? null,
      claims: document.querySelectorAll('.claims li').length,
      styled: getComputedStyle(document.body).maxWidth,
    };
  });
  if (shot) {
    await page.screenshot({ path: shot, fullPage: true });
    await page.screenshot({ path: shot.replace(/\.png$/, '-top.png') });
  }
  await context.close();
  return { ...seen, requests, problems };
}

const HOSTILE = `furrow 1
title: A trial <script>window.pwned = true</script> title
caution: Hostile text <img src=x onerror="window.pwned=true"> in the caution

--- note
<script>window.pwned = true</script>
<img src="x" onerror="window.pwned = true">
[click](javascript:window.pwned=true) and [away](https://example.invalid/x) and ![remote](https://example.invalid/p.png)
<iframe src="https://example.invalid"></iframe> <svg onload="window.pwned=true"></svg>
A value in a link: [{t.g[1]}](javascript:{t.g[1]}) and a live value {t.g[1]}.

--- table t
g,y
"<script>window.pwned=true</script>",1.2
"<img src=x onerror=window.pwned=true>",2.4
"<script>window.pwned=true</script>",1.9
"<img src=x onerror=window.pwned=true>",2.8

--- formula
fit = one_way(t.y, t.g)

--- formula
means_plot = means_chart(fit)

--- formula
bad = claim(fit.table.p[1] < 0.0001, "</p><script>window.pwned=true</script>")
`;

async function main() {
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium', args: ARGS });
  let failed = 0;
  const results = [];
  const run = async (name, fn) => {
    try {
      await fn();
      console.log(`ok - ${name}`);
      results.push({ name, ok: true });
    } catch (err) {
      failed++;
      console.log(`not ok - ${name}\n    ${String(err?.message || err).split('\n').join('\n    ')}`);
      results.push({ name, ok: false, error: String(err?.message || err) });
    }
  };
  try {
    for (const sample of readdirSync('samples').filter((f) => f.endsWith('.furrow'))) {
      await run(`the report of ${sample} opens offline, shows its charts and holds no script`, async () => {
        const out = join(DIR, sample.replace(/\.furrow$/, '.html'));
        report(join('samples', sample), out);
        const charts = (readFileSync(join('samples', sample), 'utf8').match(/_chart\(|scatter\(/g) ?? []).length;
        const seen = await openOffline(browser, out, join(OUT, `report-${sample.replace(/\.furrow$/, '')}.png`));
        check(seen.problems.length === 0, seen.problems.join('\n'));
        check(seen.requests.length === 0, `requests: ${seen.requests.join(', ')}`);
        check(seen.scripts === 0, `${seen.scripts} script elements`);
        check(seen.bad.length === 0, `unsafe attributes: ${seen.bad.join(', ')}`);
        check(seen.svgs === charts && seen.figures === charts, `${seen.svgs} charts drawn of ${charts}`);
        check(/default-src 'none'/.test(seen.csp) && !/script-src/.test(seen.csp), `policy: ${seen.csp}`);
        check(seen.styled !== 'none', 'the stylesheet applied under the policy');
        check(seen.claims > 0, 'the claims are listed');
      });
    }
    await run('a report of a document with script payloads runs nothing and loads nothing', async () => {
      const src = join(DIR, 'hostile.furrow');
      writeFileSync(src, HOSTILE);
      const out = join(DIR, 'hostile.html');
      report(src, out);
      const seen = await openOffline(browser, out, join(OUT, 'report-hostile.png'));
      check(!seen.pwned, 'a payload ran');
      check(seen.problems.length === 0, seen.problems.join('\n'));
      check(seen.requests.length === 0, `requests: ${seen.requests.join(', ')}`);
      check(seen.scripts === 0, `${seen.scripts} script elements`);
      check(seen.bad.length === 0, `unsafe attributes: ${seen.bad.join(', ')}`);
      check(seen.svgs === 1, `${seen.svgs} charts drawn`);
      check(/<script>window\.pwned/.test(seen.title), `the title shows its text as text: ${seen.title}`);
      check(seen.caution !== null && /onerror/.test(seen.caution), `the caution shows its text: ${seen.caution}`);
    });
  } finally {
    await browser.close();
  }
  writeFileSync(join(OUT, 'report-results.json'), JSON.stringify(results, null, 2));
  console.log(`e2e report: ${results.length - failed} passed, ${failed} failed`);
  process.exitCode = failed > 0 ? 1 : 0;
}

await main();
