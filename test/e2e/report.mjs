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
import { runTests } from './harness.mjs';

const OUT = 'test-output/e2e';
const args = process.argv.slice(2);
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
    await run('the report prints as it shows: the same text, charts and tables kept whole, the carried source hidden, saved as PDF by Chromium', async () => {
      const out = join(DIR, 'adhesive-cure.html');
      report(join('samples', 'adhesive-cure.furrow'), out);
      const context = await browser.newContext({ viewport: { width: 1100, height: 900 }, offline: true });
      const page = await context.newPage();
      await page.goto(pathToFileURL(resolve(out)).href);
      const look = () =>
        page.evaluate(() => ({
          text: document.body.innerText,
          maxWidth: getComputedStyle(document.body).maxWidth,
          charts: [...document.querySelectorAll('figure.chart')].map((f) => getComputedStyle(f).breakInside),
          tables: [...document.querySelectorAll('table')].map((t) => getComputedStyle(t).breakInside),
          source: getComputedStyle(document.getElementById('furrow-source')).display,
          caution: document.querySelector('.caution') !== null && getComputedStyle(document.querySelector('.caution')).display !== 'none',
        }));
      const screen = await look();
      await page.emulateMedia({ media: 'print' });
      const print = await look();
      check(print.text === screen.text, 'printing shows other words than the screen');
      check(screen.maxWidth !== 'none' && print.maxWidth === 'none', `the print stylesheet did not apply: ${screen.maxWidth} then ${print.maxWidth}`);
      check(print.charts.length > 0 && print.charts.every((b) => b === 'avoid'), `charts may break across pages: ${print.charts.join(', ')}`);
      check(print.tables.length > 0 && print.tables.every((b) => b === 'avoid'), `tables may break across pages: ${print.tables.join(', ')}`);
      check(print.source === 'none', `the carried document prints: ${print.source}`);
      check(print.caution, 'the caution line does not print');
      const pdf = await page.pdf({ format: 'A4', printBackground: true });
      const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length;
      check(pdf.subarray(0, 5).toString('latin1') === '%PDF-' && pages >= 2, `PDF: ${pdf.length} bytes, ${pages} pages`);
      writeFileSync(join(OUT, 'report-adhesive-cure.pdf'), pdf);
      await context.close();
    });
  } finally {
    await browser.close();
  }
  writeFileSync(join(OUT, 'report-results.json'), JSON.stringify(results, null, 2));
  console.log(`e2e report: ${results.length - failed} passed, ${failed} failed`);
  process.exitCode = failed > 0 ? 1 : 0;
  return { passed: results.length - failed, failed };
}

/** Waits until the page says every cell is up to date (or has its error). */
async function settled(page) {
  await page.waitForFunction(() => document.querySelector('furrow-app')?.bridge !== undefined);
  await page.evaluate(() => document.querySelector('furrow-app').settled());
  await page.waitForFunction(() => {
    const secs = document.querySelector('furrow-app')?.shadowRoot?.querySelectorAll('section.cell');
    return secs && secs.length > 0 && [...secs].every((s) => s.dataset.status !== 'pending');
  });
}

async function drop(page, text, name) {
  await page.evaluate(
    ({ text, name }) => {
      const dt = new DataTransfer();
      dt.items.add(new File([text], name, { type: 'text/html' }));
      window.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
    },
    { text, name },
  );
}

/** The document text the page keeps in IndexedDB (what a reload or Save gives back). */
async function savedText(page) {
  return page.evaluate(
    () =>
      new Promise((resolve, reject) => {
        // one slot per document; the page notes which slot it wrote last
        const req = indexedDB.open('furrow');
        req.onerror = () => reject(req.error);
        req.onsuccess = () => {
          const db = req.result;
          const done = (f) => {
            db.close();
            f();
          };
          const key = localStorage.getItem('furrow-last');
          if (key === null || !db.objectStoreNames.contains('documents')) return done(() => resolve(null));
          const get = db.transaction('documents', 'readonly').objectStore('documents').get(key);
          get.onsuccess = () => done(() => resolve(get.result?.text ?? null));
          get.onerror = () => done(() => reject(get.error));
        };
      }),
  );
}

/** Seals a copy of a sample and makes its report; returns the paths. */
function sealedReport(sample) {
  const dir = join(DIR, 'page');
  mkdirSync(dir, { recursive: true });
  const src = join(dir, sample);
  writeFileSync(src, readFileSync(join('samples', sample)));
  const sealed = spawnSync(process.execPath, ['bin/furrow.js', 'seal', src], { encoding: 'utf8' });
  check(sealed.status === 0, sealed.stderr);
  const html = src.replace(/\.furrow$/, '.html');
  report(src, html);
  return { src, html };
}

/** Opens a report in the page by dropping it, and waits for its cells. */
async function openReport(page, base, html, titlePattern) {
  await page.goto(`${base}/`);
  await settled(page);
  await drop(page, readFileSync(html, 'utf8'), html.split('/').pop());
  await page.waitForFunction((p) => new RegExp(p).test(document.querySelector('furrow-app').shadowRoot.querySelector('textarea.title')?.value ?? ''), titlePattern);
  await settled(page);
  await page.locator('furrow-hand-off .verdict').waitFor();
}

const SAMPLES = readdirSync('samples').filter((f) => f.endsWith('.furrow'));

const pageTests = [
  {
    name: 'the page opens the report of every sealed sample back as its document, byte for byte, and makes the same report',
    async run({ context, base, out }) {
      for (const sample of SAMPLES) {
        const { src, html } = sealedReport(sample);
        const page = await context.newPage();
        page.on('dialog', (d) => void d.accept());
        const title = readFileSync(src, 'utf8').match(/^title: (.{0,20})/m)[1].replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
        await openReport(page, base, html, title);
        const original = readFileSync(src, 'utf8');
        let kept = null;
        // a read that fails is tried again, as one that finds the text not yet written is
        // (Chromium has once dropped the page's promise of such a read: "Resulting promise
        // was garbage collected")
        let failed = null;
        for (let i = 0; i < 30 && kept !== original; i++) {
          await page.waitForTimeout(200);
          kept = await savedText(page).catch((err) => {
            failed = err;
            return null;
          });
        }
        check(kept === original, `${sample}: the page's document differs from the file (${kept?.length} vs ${original.length} characters)${failed === null ? '' : `; a read failed: ${failed.message}`}`);
        await page.screenshot({ path: `${out}/report-reopened-${sample.replace(/\.furrow$/, '')}.png` });
        // the page's own report carries the same document and draws the same charts
        const [download] = await Promise.all([page.waitForEvent('download'), page.locator('furrow-hand-off button.report').click()]);
        const made = readFileSync(await download.path(), 'utf8');
        const carried = made.match(/<pre hidden id="furrow-source" data-name="[^"]*">([A-Za-z0-9+/=]*)<\/pre>/);
        check(carried !== null && Buffer.from(carried[1], 'base64').toString('utf8') === original, `${sample}: the page's report does not carry the document`);
        const charts = (original.match(/_chart\(|scatter\(/g) ?? []).length;
        check((made.match(/<figure class="chart"><svg /g) ?? []).length === charts, `${sample}: the page's report lacks charts`);
        check(!/<script/i.test(made), `${sample}: the page's report holds a script element`);
        await page.close();
      }
    },
  },
  {
    name: 'a sealed sample opened in the page verifies there (recomputed in the browser, bit for bit)',
    async run({ context, base }) {
      const verdicts = [];
      for (const sample of SAMPLES) {
        const { src, html } = sealedReport(sample);
        const page = await context.newPage();
        page.on('dialog', (d) => void d.accept());
        const title = readFileSync(src, 'utf8').match(/^title: (.{0,20})/m)[1].replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
        await openReport(page, base, html, title);
        const v = page.locator('furrow-hand-off .verdict');
        const verdict = await v.getAttribute('data-verdict');
        if (verdict !== 'verified') verdicts.push(`${sample}: ${verdict}\n${await v.innerText()}`);
        await page.close();
      }
      check(verdicts.length === 0, `recomputed in the browser, these differ from their seal made in Node:\n${verdicts.join('\n\n')}`);
    },
  },
  {
name: 'any cell shows the chain of cells its value depends on, back to the data, with each value',
    async run({ context, base, out }) {
      const page = await context.newPage();
      await page.goto(`${base}/`);
      await settled(page);
      const section = page.locator('section[data-name="gain"]');
      await section.hover();
      await section.locator('button[aria-label="Where this value comes from"]').click();
      const chain = page.locator('furrow-hand-off .chain');
      await chain.waitFor();
      const steps = await chain.locator('li').allInnerTexts();
      check(steps.length === 3, `steps: ${steps.join(' | ')}`);
      check(/^coupons\s+data\s+\(a table of 24 rows: batch, position, cure, shear_mpa\)/.test(steps[0]), `first step: ${steps[0]}`);
      check(/^fit\s+reads coupons\s+randomized complete block/.test(steps[1]) && /mse 0\.\d+/.test(steps[1]), `second step: ${steps[1]}`);
      check(/^gain\s+reads fit\s+estimate 2\.58333/.test(steps[2]), `last step: ${steps[2]}`);
      await page.screenshot({ path: `${out}/provenance-chain.png` });
    },
  },
  {
    name: 'after an edit the page says what differs from the seal, marks the cells and the notes a failing claim reads',
    async run({ context, base, out }) {
      const { html } = sealedReport('adhesive-cure.furrow');
      const page = await context.newPage();
      page.on('dialog', (d) => void d.accept());
      await openReport(page, base, html, 'Cure temperature');
      const hand = page.locator('furrow-hand-off');
      const strip = await hand.locator('.strip').innerText();
      check(/All 3 claims hold/.test(strip) && /curing at 80C gives stronger joints than at 60C/.test(strip), `claims strip: ${strip}`);
      await page.screenshot({ path: `${out}/report-reopened-top.png` });
      // every 80C coupon 4 MPa weaker: the claim that 80C beats 60C fails
      const table = page.locator('section[data-name="coupons"] furrow-table-cell');
      const rows = await page.evaluate(() => {
        const t = document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="coupons"]');
        return t ? null : 'no coupons table';
      });
      check(rows === null, rows ?? '');
      const cells = table.locator('[role="gridcell"][data-c="2"]', { hasText: /^80C$/ });
      const n = await cells.count();
      check(n >= 5, `${n} coupons at 80C`);
      for (let k = 0; k < n; k++) {
        const r = await cells.nth(k).getAttribute('data-r');
        const shear = table.locator(`[role="gridcell"][data-r="${r}"][data-c="3"]`);
        const old = Number((await shear.innerText()).trim());
        await shear.click();
        await page.keyboard.type((old - 4).toFixed(1));
        await page.keyboard.press('Enter');
      }
      await settled(page);
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('furrow-hand-off')?.shadowRoot?.querySelector('.verdict')?.dataset.verdict === 'differs');
      await page.waitForTimeout(150);
      const marked = await page.evaluate(() => [...document.querySelector('furrow-app').shadowRoot.querySelectorAll('section.cell[data-verify]')].map((s) => s.dataset.name));
      for (const name of ['coupons', 'fit', 'gain', 'stronger']) check(marked.includes(name), `${name} is not marked: ${marked.join(', ')}`);
      const list = await hand.locator('.verdict').innerText();
      check(/coupons\.shear_mpa\[\d+\]: was [\d.]+, now [\d.]+/.test(list), `the banner lists a changed measurement: ${list.slice(0, 400)}`);
      check(/"curing at 80C gives stronger joints than at 60C" \(stronger, cell \d+\) NO LONGER HOLDS/.test(list), `the banner names the failing claim: ${list.slice(0, 600)}`);
      const fails = await hand.locator('.claim.fails').allInnerTexts();
      check(fails.some((t) => /curing at 80C gives stronger joints than at 60C/.test(t)), `the claims strip shows the failing claim: ${fails.join(' | ')}`);
      const doubt = await page.evaluate(() =>
        [...document.querySelector('furrow-app').shadowRoot.querySelectorAll('furrow-note-cell')].flatMap((n) => [...n.shadowRoot.querySelectorAll('.slot[data-doubt]')].map((s) => s.textContent)),
      );
      check(doubt.length > 0, 'no live number of a note is marked as read by the failing claim');
      await page.screenshot({ path: `${out}/report-reopened-edited.png` });
      await page.locator('section[data-name="gain"]').scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${out}/report-reopened-edited-cells.png` });
    },
  },
];

// `--json FILE` writes {passed, failed} of both parts, for the CI's count
const jsonAt = args.indexOf('--json');
const offline = await main();
const total = { passed: offline.passed, failed: offline.failed };
if (!args.includes('--no-page')) {
  const page = await runTests(pageTests, { build: !args.includes('--no-build') });
  total.passed += page.passed;
  total.failed += page.failed;
}
if (total.failed > 0) process.exitCode = 1;
if (jsonAt >= 0) writeFileSync(args[jsonAt + 1], JSON.stringify(total));
