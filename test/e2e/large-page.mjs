// The page with a large table (measured, printed, never asserted: tests assert behaviour).
// A 100,000-row document kept in the browser is reopened by a reload: the time to the first
// paint and to the table's first rows on screen, then the frames while the table's grid is
// scrolled through, as a reader would with the wheel.
import { check } from './harness.mjs';
import { openDocument, settled } from './page.mjs';

const ROWS = 100_000;

function longDocument() {
  const lines = ['furrow 1', 'title: A long table', '', '--- formula', 'total = sum(big.y)', '', '--- table big', 'block,treatment,y'];
  for (let i = 0; i < ROWS; i++) lines.push(`${1 + Math.floor(i / 20)},T${(i % 20) + 1},${((i * 37) % 1000) / 10}`);
  lines.push('');
  return lines.join('\n');
}

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const quantile = (xs, q) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(q * xs.length))];

export function largePageTests(measured) {
  return [
    {
      name: 'a 100,000-row document reopens with a first paint and its rows on screen, and its table scrolls (times measured)',
      async run({ context, base }) {
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        await openDocument(page, longDocument(), 'long.furrow');
        await page.locator('section[data-name="big"] furrow-table-cell [role="gridcell"][data-r="0"][data-c="0"]').waitFor({ timeout: 60_000 });
        await settled(page);
        // kept in the browser: written now, then the page is opened again onto it
        await page.evaluate(() => document.querySelector('furrow-app').keeper.flush());
        const paints = [];
        const rowsShown = [];
        for (let k = 0; k < 3; k++) {
          const t0 = Date.now();
          // the address without ?fresh: the page reopens what this tab held
          await page.goto(`${base}/`);
          await page.locator('section[data-name="big"] furrow-table-cell [role="gridcell"][data-r="0"][data-c="0"]').waitFor({ timeout: 60_000 });
          rowsShown.push(Date.now() - t0);
          paints.push(await page.evaluate(() => performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? NaN));
          await settled(page);
        }
        const title = await page.locator('furrow-app textarea.title').inputValue();
        check(title === 'A long table', `the kept document reopened: ${title}`);
        // scrolling: 60 steps of 400 px down the grid, one per frame, each frame's length noted
        const frames = await page.locator('section[data-name="big"] furrow-table-cell .scroller').evaluate(
          (scroller) =>
            new Promise((resolve) => {
              const gaps = [];
              let last = performance.now();
              let step = 0;
              const tick = (now) => {
                gaps.push(now - last);
                last = now;
                if (step++ >= 60) return resolve(gaps.slice(1));
                scroller.scrollTop += 400;
                requestAnimationFrame(tick);
              };
              requestAnimationFrame(tick);
            }),
        );
        const shown = await page.locator('section[data-name="big"] furrow-table-cell [role="gridcell"][data-c="0"]').count();
        check(shown > 0 && shown < 2000, `a window of rows is drawn, not all of them: ${shown}`);
        measured.longTableFirstPaintMs = paints.map((p) => Math.round(p));
        measured.longTableRowsShownMs = rowsShown;
        measured.longTableScrollFrameMs = { median: Math.round(median(frames) * 10) / 10, p95: Math.round(quantile(frames, 0.95) * 10) / 10 };
        console.log(
          `    measured: 100,000-row document reopened: first paint ${paints.map((p) => Math.round(p)).join(', ')} ms (target under 1500); rows on screen after ${rowsShown.join(', ')} ms; ` +
            `scrolling frames median ${median(frames).toFixed(1)} ms, 95th percentile ${quantile(frames, 0.95).toFixed(1)} ms (one frame is 16.7 ms)`,
        );
      },
    },
  ];
}
