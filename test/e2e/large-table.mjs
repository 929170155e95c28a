// Browser tests of the grids at their limits: a 1,000,000-row table scrolled to its last row
// in the table cell's grid and in the value grid (past the browsers' element-height cap, the
// row-window model maps the scroll onto the rows), and a pasted block whose first row names
// its columns, taken as a new table's names with one click to keep it as data.
import { check } from './harness.mjs';
import { openDocument, settled } from './page.mjs';

const ROWS = 1_000_000;

/** The document: a table of ROWS plots, and a formula that shows it in the value grid. */
function bigDocument() {
  const lines = ['furrow 1', 'title: A long table', '', '--- formula', 'shown = big', '', '--- table big', 'plot,y'];
  for (let i = 1; i <= ROWS; i++) lines.push(`${i},${(i % 97) / 10}`);
  lines.push('');
  return lines.join('\n');
}

/** Where an element lies within its scroll box's visible rows: {inside, top, bottom, boxTop, boxBottom}. */
function shownInBox(el, box, headSelector) {
  const r = el.getBoundingClientRect();
  const b = box.getBoundingClientRect();
  const head = box.querySelector(headSelector);
  const top = b.top + (head ? head.getBoundingClientRect().height : 0);
  const bottom = b.top + box.clientHeight;
  return { inside: r.top >= top - 1 && r.bottom <= bottom + 1 && r.height > 0, top: r.top, bottom: r.bottom, boxTop: top, boxBottom: bottom };
}

export function largeTableTests(measured) {
  return [
    {
      name: 'a 1,000,000-row table scrolls to its last row, in the table cell and in the value grid (time measured)',
      async run({ context, base, out }) {
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        await openDocument(page, bigDocument(), 'long.furrow');
        const table = page.locator('section[data-name="big"] furrow-table-cell');
        await table.locator('[role="gridcell"][data-r="0"][data-c="0"]').waitFor({ timeout: 120_000 });
        await settled(page);
        const counts = await table.locator('.counts').innerText();
        check(/1,000,000 rows/.test(counts), `the table's size: ${counts}`);
        const heights = await table.locator('.scroller').evaluate((s) => ({ scroll: s.scrollHeight, body: s.querySelector('.body').offsetHeight }));
        // 1,000,000 rows of 26 px would be 26,000,000 px, past what some browsers allow
        check(heights.body < 20_000_000, `the rows' box is kept under the cap: ${heights.body} px`);

        // the keyboard: Ctrl+End from the first field, timed to the frame that shows the last row
        await table.locator('[role="gridcell"][data-r="0"][data-c="0"]').click();
        await page.evaluate(() => {
          window.__t0 = null;
          // Control goes down first: the clock starts at the End that follows
          const start = (e) => {
            if (e.key !== 'End') return;
            window.__t0 = e.timeStamp;
            window.removeEventListener('keydown', start, { capture: true });
          };
          window.addEventListener('keydown', start, { capture: true });
        });
        const shownAfter = page.waitForFunction(
          (last) => {
            const cell = document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="big"] furrow-table-cell');
            const f = cell?.shadowRoot?.querySelector(`[role="gridcell"][data-r="${last}"][data-c="0"]`);
            return window.__t0 !== null && f !== null && f !== undefined ? performance.now() - window.__t0 : false;
          },
          ROWS - 1,
          { polling: 'raf', timeout: 30_000 },
        );
        await page.keyboard.press('Control+End');
        const keyMs = await (await shownAfter).jsonValue();
        await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r))));
        const last = await table.locator(`[role="gridcell"][data-r="${ROWS - 1}"][data-c="0"]`).evaluate(
          (f, fn) => ({ text: f.textContent.trim(), at: new Function(`return (${fn})`)()(f, f.closest('.scroller'), '.head') }),
          shownInBox.toString(),
        );
        check(last.text === String(ROWS), `the last row's plot after Ctrl+End: ${last.text}`);
        check(last.at.inside, `the last row lies inside the grid's window: ${JSON.stringify(last.at)}`);
        const rowNumber = await table.locator(`[role="rowheader"][data-r="${ROWS - 1}"]`).innerText();
        check(rowNumber.trim() === String(ROWS), `its row number: ${rowNumber}`);
        await table.screenshot({ path: `${out}/large-table-end.png` });

        // Ctrl+Home, then the scroll bar dragged to its end
        await page.keyboard.press('Control+Home');
        await table.locator('[role="gridcell"][data-r="0"][data-c="0"]').waitFor();
        const t1 = Date.now();
        await table.locator('.scroller').evaluate((s) => {
          s.scrollTop = s.scrollHeight;
        });
        await table.locator(`[role="gridcell"][data-r="${ROWS - 1}"][data-c="0"]`).waitFor({ timeout: 30_000 });
        const scrollMs = Date.now() - t1;
        const byBar = await table.locator(`[role="gridcell"][data-r="${ROWS - 1}"][data-c="0"]`).evaluate(
          (f, fn) => new Function(`return (${fn})`)()(f, f.closest('.scroller'), '.head'),
          shownInBox.toString(),
        );
        check(byBar.inside, `scrolled to the end, the last row lies inside the window: ${JSON.stringify(byBar)}`);
        // half way down the bar, the rows are about half way through the table
        const mid = await table.locator('.scroller').evaluate(async (s) => {
          s.scrollTop = (s.scrollHeight - s.clientHeight) / 2;
          await new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
          const rows = [...s.querySelectorAll('[role="rowheader"]')].map((e) => Number(e.textContent));
          return { min: Math.min(...rows), max: Math.max(...rows) };
        });
        check(mid.min > 480_000 && mid.max < 520_000, `half way down, rows ${mid.min} to ${mid.max}`);

        // the value grid of the formula that shows the table
        const grid = page.locator('section[data-name="shown"] furrow-grid');
        await grid.scrollIntoViewIfNeeded();
        await grid.locator('tbody tr.row').first().waitFor({ timeout: 60_000 });
        const t2 = Date.now();
        await grid.locator('.box').evaluate((b) => {
          b.scrollTop = b.scrollHeight;
        });
        const lastRow = grid.locator('tbody tr.row').last();
        await page.waitForFunction(
          (n) => {
            const g = document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="shown"] furrow-formula-cell')?.shadowRoot?.querySelector('furrow-value')?.shadowRoot?.querySelector('furrow-grid');
            const rows = g?.shadowRoot?.querySelectorAll('tbody tr.row');
            return rows && rows.length > 0 && rows[rows.length - 1].querySelector('th').textContent.trim() === String(n);
          },
          ROWS,
          { polling: 'raf', timeout: 30_000 },
        );
        const gridMs = Date.now() - t2;
        const valueLast = await lastRow.evaluate(
          (tr, fn) => ({ plot: tr.querySelector('td').textContent.trim(), at: new Function(`return (${fn})`)()(tr, tr.closest('.box'), 'thead') }),
          shownInBox.toString(),
        );
        check(valueLast.plot === String(ROWS), `the value grid's last plot: ${valueLast.plot}`);
        check(valueLast.at.inside, `the value grid's last row lies inside its box: ${JSON.stringify(valueLast.at)}`);
        await grid.screenshot({ path: `${out}/large-table-value-grid-end.png` });

        measured.millionRowsCtrlEndToPaintMs = Math.round(keyMs * 10) / 10;
        measured.millionRowsScrollToEndMs = scrollMs;
        measured.millionRowsValueGridScrollToEndMs = gridMs;
        console.log(
          `    measured: 1,000,000 rows, Ctrl+End to the frame showing the last row ${keyMs.toFixed(1)} ms; scroll bar to the end ${scrollMs} ms (table cell), ${gridMs} ms (value grid, polled by the test)`,
        );
      },
    },
    {
      name: 'a block pasted into a new table with a first row of names over numbers takes them as column names, and one click keeps the row as data',
      async run({ context, base }) {
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        await page.locator('furrow-app .add button', { hasText: '+ table' }).click();
        const table = page.locator('section[data-kind="table"]').last();
        await table.locator('[role="gridcell"][data-r="0"][data-c="0"]').click();
        await table.locator('[role="grid"]').evaluate((grid) => {
          const dt = new DataTransfer();
          dt.setData('text/plain', 'variety,block,yield\nA,1,4.2\nB,1,3.9');
          grid.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true, composed: true }));
        });
        const body = () =>
          page.evaluate(() => {
            const secs = document.querySelector('furrow-app').shadowRoot.querySelectorAll('section[data-kind="table"]');
            return secs[secs.length - 1].querySelector('furrow-table-cell').cell.body;
          });
        await page.waitForTimeout(200);
        const named = (await body()).trim().split('\n');
        check(named.join('|') === 'variety,block,yield|A,1,4.2|B,1,3.9', `the first row became the names: ${JSON.stringify(named)}`);
        const names = await table.locator('.col-name').allInnerTexts();
        check(names.join(',') === 'variety,block,yield', `names shown: ${names.join(',')}`);
        const reads = await table.locator('.col-reads').allInnerTexts();
        check(reads.map((t) => t.trim()).join(',') === 'text,numbers,numbers', `the columns read as: ${reads.join(',')}`);
        check((await table.locator('[aria-invalid="true"][role="gridcell"]').count()) === 0, 'no field is marked as not a number');
        await settled(page);
        const state = await table.evaluate((s) => s.dataset.status);
        check(state === 'ok', `the table evaluates: ${state}`);

        await table.locator('button.names-as-data').click();
        await page.waitForTimeout(200);
        const asData = (await body()).trim().split('\n');
        check(asData.join('|') === 'block,treatment,response|variety,block,yield|A,1,4.2|B,1,3.9', `the first row is data again: ${JSON.stringify(asData)}`);
        const first = await table.locator('[role="gridcell"][data-r="0"][data-c="0"]').innerText();
        check(first.trim() === 'variety', `the first data field: ${first}`);
        check((await table.locator('button.names-as-data').count()) === 0, 'the offer is gone once taken');
      },
    },
  ];
}
