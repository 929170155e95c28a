// Times field edits in the built page: from Enter to the frame that shows a dependent cell
// with its new value, edit by edit, and where the time went. Measured, never asserted.
//
//   npx vite build && npx vite preview --port 4173 &
//   node scripts/field-edit-clock.mjs [--rows 100000 | --cells 2000] [--pause 50] [--edits 15] [--url http://localhost:4173]
//
// --rows N: a table of N rows and a formula that sums its column (the field is in row 1).
// --cells N: a table of 3 rows and N - 1 formula cells in a chain, each reading the one
//   before (every cell depends on the field; the one timed is the fifth).
// --pause: milliseconds between the last digit typed and Enter (0: right after the digits,
//   while the frame that draws them is still to come).
import { hostname } from 'node:os';
import { chromium } from 'playwright-core';
import { armEditClock, editParts, field, openDocument, readEditClock, settled, watchEdits } from '../test/e2e/page.mjs';

const args = process.argv.slice(2);
const opt = (name, fallback) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : fallback;
};
const url = opt('url', 'http://localhost:4173');
const cells = opt('cells', null);
const rows = Number(opt('rows', cells === null ? 100_000 : 0));
const pause = Number(opt('pause', 50));
const edits = Number(opt('edits', 15));

const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM ?? '/usr/bin/chromium',
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage'],
});
try {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await page.goto(`${url}/?fresh`);
  await settled(page);
  let table;
  let name;
  let expected;
  if (cells !== null) {
    const text = ['--- table base', 'k,y', '1,10', '2,20', '3,30', ''];
    for (let i = 1; i < Number(cells); i++) text.push('--- formula', i === 1 ? 'f1 = sum(base.y)' : `f${i} = f${i - 1} + 1`, '');
    await openDocument(page, `furrow 1\ntitle: A chain of cells\n\n${text.join('\n')}`, 'chain.furrow');
    [table, name, expected] = ['base', 'f5', (v) => String(v + 50 + 4)];
  } else {
    const lines = ['k,y'];
    for (let i = 0; i < rows; i++) lines.push(`${i + 1},${(i % 10) + 1}`);
    await openDocument(page, `furrow 1\ntitle: A long table\n\n--- formula\ntotal = sum(big.y)\n\n--- table big\n${lines.join('\n')}\n`, 'long.furrow');
    const total = Array.from({ length: rows }, (_, i) => (i % 10) + 1).reduce((a, b) => a + b, 0);
    [table, name, expected] = ['big', 'total', (v) => String(total - 1 + v)];
  }
  await page.locator(`section[data-name="${name}"] furrow-value`).waitFor({ timeout: 120_000 });
  await settled(page);
  await watchEdits(page);
  const out = [];
  for (let k = 0; k < edits; k++) {
    const value = 20 + k;
    await field(page, table, 0, 1).click();
    await page.keyboard.type(String(value));
    if (pause > 0) await page.waitForTimeout(pause);
    await armEditClock(page, name, expected(value));
    await page.keyboard.press('Enter');
    out.push({ ...(await readEditClock(page)), ...(await editParts(page)) });
    await settled(page);
    await page.waitForTimeout(50 + ((k * 13) % 40));
  }
  const median = (key) => [...out.map((o) => o[key])].sort((a, b) => a - b)[Math.floor(out.length / 2)].toFixed(1);
  const what = cells !== null ? `a chain of ${cells} cells` : `a table of ${rows} rows`;
  console.log(`machine: ${hostname()}, Chromium ${browser.version()}; ${what}, Enter ${pause} ms after the last digit, ${edits} edits`);
  console.log(`medians: Enter to the edit posted ${median('post')} ms, the worker ${median('worker')} ms, Enter to its result handled ${median('result')} ms, to the new value in the page ${median('dom')} ms, to the frame that draws it ${median('ms')} ms (slowest ${Math.max(...out.map((o) => o.ms)).toFixed(1)} ms)`);
} finally {
  await browser.close();
}
