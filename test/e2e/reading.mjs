// Browser tests of how results read: a comparison cell shows its one-line result with its
// fields one click away, residual checks read as verdicts, and every sample fits a page 800
// pixels wide (no sideways scroll, nothing in the main column running past its edge, the
// last row of a table on screen), with a screenshot of each to look at.
import { readdirSync } from 'node:fs';
import { check } from './harness.mjs';
import { settled } from './page.mjs';

const SAMPLES = readdirSync('samples')
  .filter((f) => f.endsWith('.furrow'))
  .sort();

/** A handle on the shadow root of a formula cell's value element (null when there is none). */
async function valueRoot(page, name) {
  return page.evaluateHandle((n) => {
    const sec = document.querySelector('furrow-app').shadowRoot.querySelector(`section[data-name="${n}"]`);
    return sec?.querySelector('furrow-formula-cell')?.shadowRoot?.querySelector('furrow-value')?.shadowRoot ?? null;
  }, name);
}

/**
 * Everything in the page's main column that runs past its edges: each element (through
 * shadow roots) whose box ends right of the column or starts left of it. A scrolling box
 * (overflow auto or scroll) is measured itself, not its content, since the content scrolls
 * inside it; hidden content (closed details, display none) has no box and is not counted.
 */
function overflowReport() {
  const app = document.querySelector('furrow-app');
  const main = app.shadowRoot.querySelector('main');
  // the column is main's box: its padding holds the cells' margin controls
  const col = main.getBoundingClientRect();
  const left = Math.max(0, col.left) - 0.5;
  const right = Math.min(col.right, document.documentElement.clientWidth) + 0.5;
  const out = [];
  const describe = (el) => {
    const sec = el.closest?.('section.cell');
    const host = el.getRootNode()?.host;
    return `${el.tagName.toLowerCase()}${el.className && typeof el.className === 'string' ? `.${el.className.trim().split(/\s+/).join('.')}` : ''}${host ? ` in ${host.tagName.toLowerCase()}` : ''}${sec ? ` (cell ${sec.dataset.name || sec.dataset.kind})` : ''}`;
  };
  const walk = (node) => {
    for (const el of node.children) {
      const r = el.getBoundingClientRect();
      if (r.width > 0 && r.height > 0 && (r.right > right || r.left < left)) {
        out.push(`${describe(el)}: ${Math.round(r.left)} to ${Math.round(r.right)} (column ${Math.round(left)} to ${Math.round(right)})`);
        continue;
      }
      const cs = getComputedStyle(el);
      if (cs.overflowX === 'auto' || cs.overflowX === 'scroll' || cs.overflowX === 'hidden' || cs.overflowX === 'clip') {
        // a box that scrolls or clips sideways must not need to: its last column shows whole
        // (a formula's editor may scroll a long line, as editors do)
        if (el.scrollWidth > el.clientWidth + 1 && !el.classList.contains('cm-scroller') && !el.classList.contains('cm-editor')) {
          out.push(`${describe(el)} clips its content: ${el.scrollWidth} px in ${el.clientWidth} px`);
        }
        continue;
      }
      if (el.shadowRoot) walk(el.shadowRoot);
      walk(el);
    }
  };
  walk(main);
  // a table of up to 20 rows shows its last row without scrolling
  for (const view of app.shadowRoot.querySelectorAll('section[data-kind="table"] furrow-table-cell')) {
    const scroller = view.shadowRoot?.querySelector('.scroller');
    const rows = view.cell?.body ? view.cell.body.trim().split('\n').length - 1 : 0;
    if (scroller && rows <= 20 && scroller.scrollHeight > scroller.clientHeight + 1) {
      out.push(`table ${view.closest('section').dataset.name}: ${rows} rows, last row hidden (${scroller.scrollHeight} px in ${scroller.clientHeight} px)`);
    }
  }
  // a column name is not cut where the column has room for it
  for (const name of app.shadowRoot.querySelectorAll('section[data-kind="table"] furrow-table-cell')) {
    for (const el of name.shadowRoot?.querySelectorAll('.nm .col-name') ?? []) {
      if (el.scrollWidth > el.clientWidth + 1) out.push(`column name "${el.textContent}" cut: ${el.scrollWidth} px in ${el.clientWidth} px`);
    }
  }
  return out;
}

export function readingTests() {
  return [
    {
      name: 'a difference cell shows its one-line result, with every field one click away',
      async run({ context, base, out }) {
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        await page.locator('section[data-name="gain"]').scrollIntoViewIfNeeded();
        const gain = await valueRoot(page, 'gain');
        const read = await gain.evaluate((root) => {
          if (root === null) return null;
          const headline = root.querySelector('.result .headline')?.textContent.trim() ?? null;
          const raw = root.querySelector('details.raw');
          return { headline, rawOpen: raw?.open ?? null, rawFields: raw ? raw.querySelectorAll('dl.fields dt').length : 0 };
        });
        check(read !== null, 'the gain cell shows a value');
        check(/^80C − 60C: -?\d+\.\d+ \(95% interval -?\d+\.\d+ to -?\d+\.\d+\), p (= \d\.\d+|< 0\.001)$/.test(read.headline ?? ''), `the one-line result: ${read.headline}`);
        check(read.rawOpen === false, 'the fields are folded away');
        check(read.rawFields >= 8, `the folded list holds every field: ${read.rawFields}`);
        await page.locator('section[data-name="gain"]').screenshot({ path: `${out}/difference-result.png` });
        // one click opens the fields
        await gain.evaluate((root) => root.querySelector('details.raw > summary').click());
        check((await gain.evaluate((root) => root.querySelector('details.raw').open)) === true, 'one click shows the fields');
        const checks = await (await valueRoot(page, 'checks')).evaluate((root) => (root ? [...root.querySelectorAll('table.checks tr')].map((tr) => tr.className) : null));
        check(checks !== null && checks.length >= 3 && checks.every((c) => ['flag', 'clear', 'none'].includes(c)), `residual checks as verdicts: ${JSON.stringify(checks)}`);
      },
    },
    {
      name: 'every sample fits a page 800 pixels wide: no sideways scroll, nothing past the column',
      async run({ browser, base, out }) {
        const problems = [];
        for (const sample of SAMPLES) {
          const context = await browser.newContext({ viewport: { width: 800, height: 900 } });
          try {
            const page = await context.newPage();
            await page.goto(`${base}/?sample=${sample}`);
            await settled(page);
            // draw every cell: scroll to the end and back, then wait for charts to settle
            await page.evaluate(async () => {
              const step = Math.max(200, window.innerHeight - 100);
              for (let y = 0; y < document.scrollingElement.scrollHeight; y += step) {
                window.scrollTo(0, y);
                await new Promise((r) => setTimeout(r, 60));
              }
              window.scrollTo(0, 0);
            });
            await page.waitForTimeout(800);
            const widths = await page.evaluate(() => ({ scroll: document.scrollingElement.scrollWidth, client: document.scrollingElement.clientWidth }));
            if (widths.scroll > 800) problems.push(`${sample}: the page is ${widths.scroll} px wide`);
            const over = await page.evaluate(overflowReport);
            for (const o of over.slice(0, 8)) problems.push(`${sample}: ${o}`);
            try {
              await page.screenshot({ path: `${out}/at-800-${sample.replace(/\.furrow$/, '')}.png`, fullPage: true, timeout: 90_000 });
            } catch (err) {
              // a picture to look at, not the check itself: a slow machine may not make one
              console.log(`    no screenshot of ${sample} at 800 px: ${String(err?.message || err).split('\n')[0]}`);
            }
          } finally {
            await context.close();
          }
        }
        check(problems.length === 0, `at 800 px:\n      ${problems.join('\n      ')}`);
      },
    },
  ];
}
