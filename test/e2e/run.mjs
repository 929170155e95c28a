// The browser tests: the notebook in Debian's Chromium, driven as a user drives it.
//   npm run e2e                 build, serve with vite preview, run every test
//   npm run e2e -- --no-build   reuse dist/
//   npm run e2e -- --json FILE  also write {passed, failed, results} to FILE
import { spawnSync } from 'node:child_process';
import { readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { check, runTests } from './harness.mjs';
import { keepingTests } from './keeping.mjs';
import { closingTests } from './closing.mjs';
import { hostileFileTests } from './hostile-files.mjs';
import { exportTests } from './exports.mjs';
import { importingTests } from './importing.mjs';
import { largeTableTests } from './large-table.mjs';
import { largePageTests } from './large-page.mjs';
import { firstHourTests } from './first-hour.mjs';
import { convertingTests } from './converting.mjs';
import { readingTests } from './reading.mjs';
import { handingTests } from './handing.mjs';
import { strataTests } from './strata.mjs';
import { cellText, noteText, statusOf, settled, shownF, field, openDocument, watchEdits, editParts, partsLine, armEditClock, readEditClock, clockLine } from './page.mjs';

const args = process.argv.slice(2);
const jsonAt = args.indexOf('--json');
const json = jsonAt >= 0 ? args[jsonAt + 1] : null;
const build = !args.includes('--no-build');

/** Figures measured on the way, written to test-output/e2e/measured.json. */
const measured = {};
/** Field edits timed in each series of the two measured edit tests (the first one includes the page's first run of that code). */
const EDITS = 9;
/**
 * The pause between the last digit typed and the Enter that commits it, in the series timed
 * at a typing pace. 50 ms is quicker than anyone types (common practice, no source: a fast
 * typist's keys are about 100 ms apart). Keys closer than a frame apart are timed as a
 * series of their own: the frame that draws the digit is still to come when Enter arrives,
 * and Chromium draws it before it hands the page the worker's answer.
 */
const TYPING_PAUSE_MS = 50;

/**
 * Types values into a field and times each Enter to the frame that shows the formula cell
 * `name` at `expected(value)`: one series at a typing pace, one with Enter right after the
 * digits. Returns both, with where the time went.
 */
async function timeFieldEdits(page, { table, name, values, expected }) {
  const series = {};
  for (const [label, pause] of [['typed', TYPING_PAUSE_MS], ['rushed', 0]]) {
    const clocks = [];
    const parts = [];
    for (const value of values) {
      await field(page, table, 0, 1).click();
      await page.keyboard.type(String(value));
      if (pause > 0) await page.waitForTimeout(pause);
      // the clock starts at the Enter that commits the field (the event's own time stamp)
      await armEditClock(page, name, expected(value));
      await page.keyboard.press('Enter');
      clocks.push(await readEditClock(page));
      parts.push(await editParts(page));
      await settled(page);
    }
    series[label] = { clocks, parts, times: clocks.map((c) => c.ms).sort((a, b) => a - b) };
  }
  return series;
}

/** The measured lines of timeFieldEdits' two series. */
function editLines(what, series) {
  const line = (s) => `${s.times.map((t) => t.toFixed(1)).join(', ')} ms (median ${s.times[Math.floor(s.times.length / 2)].toFixed(1)})`;
  console.log(`    measured: ${what}, Enter ${TYPING_PAUSE_MS} ms after the last digit, edit to visible dependent ${line(series.typed)}; target under 16 ms`);
  console.log(`    measured: ${clockLine(series.typed.clocks)}`);
  console.log(`    measured: ${partsLine(series.typed.parts)}`);
  console.log(`    measured: ${what}, Enter right after the digits (the digits' frame still to come), edit to visible dependent ${line(series.rushed)}`);
  console.log(`    measured: ${clockLine(series.rushed.clocks)}`);
}

const tests = [
  {
    name: 'opens the sample, every cell evaluated, first paint measured, screenshot saved',
    async run({ context, base, out }) {
      const page = await context.newPage();
      const t0 = Date.now();
      await page.goto(`${base}/`);
      await page.locator('section[data-name="fit"] furrow-value').first().waitFor();
      const visibleAt = Date.now() - t0;
      await settled(page);
      const paint = await page.evaluate(() => performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? null);
      const title = await page.locator('furrow-app textarea.title').inputValue();
      check(/lap-shear strength/.test(title), `title: ${title}`);
      const statuses = await page.evaluate(() => [...document.querySelector('furrow-app').shadowRoot.querySelectorAll('section.cell')].map((s) => s.dataset.status));
      check(statuses.length >= 10 && statuses.every((s) => s === 'ok'), `statuses: ${statuses.join(', ')}`);
      check((await shownF(page)) === '18.2', `F shown: ${await shownF(page)}`);
      check(/Caution/i.test(await page.locator('furrow-app .caution').innerText()), 'caution line shown');
      await page.screenshot({ path: `${out}/sample-page.png`, fullPage: true });
      await page.screenshot({ path: `${out}/sample-first-screen.png` });
      // a measurement, printed and recorded, never a failure (tests assert behaviour, not speed)
      measured.firstContentfulPaintMs = paint === null ? null : Math.round(paint);
      measured.analysisVisibleMs = visibleAt;
      console.log(`    measured: first contentful paint ${paint === null ? '?' : Math.round(paint)} ms; analysis visible after ${visibleAt} ms (target: first paint under 1500 ms)`);
    },
  },
  {
    name: 'the sample shows its residual and normal charts, drawn safely',
    async run({ context, base, out }) {
      const page = await context.newPage();
      const requests = [];
      page.on('request', (r) => requests.push(r.url()));
      await page.goto(`${base}/?fresh`);
      await settled(page);
      for (const name of ['residual_plot', 'normal_plot', 'means_plot']) {
        const chart = page.locator(`section[data-name="${name}"] furrow-chart`);
        await chart.scrollIntoViewIfNeeded();
        await chart.locator('svg.marks, svg').first().waitFor({ timeout: 15_000 });
        const marks = await chart.evaluate((el) => el.shadowRoot.querySelectorAll('svg path, svg circle, svg .mark-symbol path').length);
        check(marks > 10, `${name}: ${marks} marks drawn`);
      }
      const caption = await cellText(page, 'normal_plot');
      check(/Shapiro-Wilk W = 0\.969/.test(caption), `the normal chart's caption: ${caption}`);
      await page.locator('section[data-name="residual_plot"]').scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${out}/residual-charts.png` });
      // the page fetched nothing from anywhere but itself
      const foreign = requests.filter((u) => !u.startsWith(base) && !u.startsWith('data:') && !u.startsWith('blob:'));
      check(foreign.length === 0, `requests outside the page: ${foreign.join(', ')}`);
    },
  },
  {
    name: 'a chart spec that points at a URL or a file loads nothing in the page and says so',
    async run({ context, base }) {
      const page = await context.newPage();
      const requests = [];
      page.on('request', (r) => requests.push(r.url()));
      await page.goto(`${base}/?fresh`);
      await settled(page);
      // Specs are built only by Furrow; here one is handed to the chart element directly, as a
      // hostile one would have to be, pointing at a remote URL, a local file and a data URL.
      const warnings = await page.evaluate(async () => {
        const out = [];
        for (const url of ['https://example.invalid/trial.csv', '/etc/passwd', 'file:///etc/passwd', '/index.html']) {
          const el = document.createElement('furrow-chart');
          el.value = {
            kind: 'chart',
            caption: 'hostile',
            spec: { data: { url, format: { type: 'csv' } }, mark: 'point', encoding: { x: { field: 'a', type: 'quantitative' } }, usermeta: { embedOptions: { actions: true } } },
          };
          document.body.append(el);
          const until = performance.now() + 8000;
          while (performance.now() < until && !(el.shadowRoot?.querySelector('.warnings, .failed'))) await new Promise((r) => setTimeout(r, 100));
          out.push({ url, text: el.shadowRoot?.querySelector('.warnings, .failed')?.textContent ?? null, actions: !!el.shadowRoot?.querySelector('.vega-actions, details') });
          el.remove();
        }
        return out;
      });
      for (const w of warnings) {
        check(w.text !== null && /refus|not allowed|no data|load/i.test(w.text), `${w.url}: no visible warning (${w.text})`);
        check(!w.actions, `${w.url}: the actions menu came back`);
      }
      const leaked = requests.filter((u) => /example\.invalid|passwd|index\.html$/.test(u) && !u.endsWith(`${base}/index.html`));
      const htmlFetches = requests.filter((u) => u === `${base}/index.html`);
      check(leaked.length === 0 && htmlFetches.length === 0, `the page fetched: ${[...leaked, ...htmlFetches].join(', ')}`);
    },
  },
  {
    name: 'an edited measurement moves the F value and the note that quotes it',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      const before = await shownF(page);
      const noteBefore = await noteText(page, 'What the coupons say');
      check(Number(/F = ([\d.]+)/.exec(noteBefore)?.[1]).toPrecision(3) === before, `note quotes F: ${noteBefore.slice(0, 120)}`);
      // row 1 of the coupons, the shear_mpa column
      await field(page, 'coupons', 0, 3).click();
      await page.keyboard.type('26.9');
      await page.keyboard.press('Enter');
      await page.waitForFunction((b) => {
        const sec = document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="fit"]');
        return sec.dataset.status === 'ok' && !sec.querySelector('furrow-formula-cell').shadowRoot.querySelector('furrow-value').shadowRoot.textContent.includes(b);
      }, before);
      await settled(page);
      const after = await shownF(page);
      check(after !== before, `F did not change (${before})`);
      const noteAfter = await noteText(page, 'What the coupons say');
      // the note quotes round(F, 2); the table shows F to three significant digits (the digits policy)
      const quotedBefore = /F = ([\d.]+)/.exec(noteBefore)?.[1];
      const quoted = /F = ([\d.]+)/.exec(noteAfter)?.[1];
      check(quoted !== undefined && quoted !== quotedBefore && Number(quoted).toPrecision(3) === after, `note follows (F shown ${after}): ${noteAfter.slice(0, 160)}`);
      const shown = await field(page, 'coupons', 0, 3).innerText();
      check(shown.trim() === '26.9', `field shows ${shown}`);
    },
  },
  {
    name: 'a broken formula errs on its own cell while the rest keeps its values',
    async run({ context, base, out }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      const editor = page.locator('section[data-name="gain"] furrow-formula-cell');
      // the editor is made when the cell comes into view; before that the formula is static text
      await page.locator('section[data-name="gain"]').scrollIntoViewIfNeeded();
      try {
        await editor.locator('.cm-content').waitFor({ timeout: 5000 });
      } catch {
        await editor.locator('.static').first().click();
        await editor.locator('.cm-content').waitFor();
      }
      await editor.locator('.cm-content').click();
      await page.keyboard.press('Control+a');
      // (the editor closes brackets and quotes as they are typed, so the fault is a dangling operator)
      await page.keyboard.type('gain = difference(fit, "80C", "60C") *');
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="gain"]').dataset.status === 'error');
      await settled(page);
      const gain = await cellText(page, 'gain');
      check(/needs a value after it/.test(gain), `the error in words on the cell: ${gain}`);
      // the exact characters are marked in the editor
      const marked = await editor.locator('.cm-lintRange-error, .cm-lintRange').count();
      check(marked > 0, 'the error is underlined in the editor');
      check((await statusOf(page, 'fit')) === 'ok', 'fit still evaluates');
      check((await shownF(page)) === '18.2', 'fit still shows its F');
      check((await statusOf(page, 'stronger')) === 'upstream', `the claim that reads gain says so: ${await statusOf(page, 'stronger')}`);
      check((await statusOf(page, 'warmest')) === 'ok', 'an unrelated comparison still evaluates');
      await page.screenshot({ path: `${out}/broken-formula.png`, fullPage: false });
    },
  },
  {
    name: 'a three-column block pasted from a spreadsheet lands as three columns',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      await page.locator('furrow-app .add button', { hasText: '+ table' }).click();
      const table = page.locator('section[data-kind="table"]').last();
      await table.locator('[role="gridcell"][data-r="0"][data-c="0"]').click();
      await table.locator('[role="grid"]').evaluate((grid) => {
        const dt = new DataTransfer();
        dt.setData('text/plain', '1\tA\t10.5\n1\tB\t11.25\n2\tA\t9.75\n');
        grid.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true, composed: true }));
      });
      await page.waitForTimeout(200);
      const body = await page.evaluate(() => {
        const secs = document.querySelector('furrow-app').shadowRoot.querySelectorAll('section[data-kind="table"]');
        return secs[secs.length - 1].querySelector('furrow-table-cell').cell.body;
      });
      const lines = body.trim().split('\n');
      check(lines[0] === 'block,treatment,response', `header kept: ${lines[0]}`);
      check(lines[1] === '1,A,10.5' && lines[2] === '1,B,11.25' && lines[3] === '2,A,9.75', `pasted rows: ${JSON.stringify(lines)}`);
      const third = await table.locator('[role="gridcell"][data-r="1"][data-c="2"]').innerText();
      check(third.trim() === '11.25', `third column shows ${third}`);
    },
  },
  {
    name: 'edits are still there after a reload',
    async run({ context, base }) {
      const page = await context.newPage();
      // a fresh browser context has nothing saved: the sample opens
      await page.goto(`${base}/`);
      await settled(page);
      await field(page, 'coupons', 1, 3).click();
      await page.keyboard.type('25.1');
      await page.keyboard.press('Enter');
      // a new note, typed
      await page.locator('furrow-app .add button', { hasText: '+ note' }).click();
      const note = page.locator('section[data-kind="note"]').last().locator('furrow-note-cell');
      // a new note opens for writing at once
      await note.locator('textarea').waitFor();
      await note.locator('textarea').fill('Checked by the second shift: {round(fit.mse, 3)}.');
      await note.locator('textarea').blur();
      await settled(page);
      await page.waitForTimeout(600); // autosave is debounced
      await page.reload();
      await settled(page);
      const v = await field(page, 'coupons', 1, 3).innerText();
      check(v.trim() === '25.1', `the edited field after reload: ${v}`);
      const last = await page.evaluate(() => {
        const notes = document.querySelector('furrow-app').shadowRoot.querySelectorAll('furrow-note-cell');
        return notes[notes.length - 1].shadowRoot.textContent.replace(/\s+/g, ' ');
      });
      check(/Checked by the second shift: 0\.\d{3}\./.test(last), `the new note after reload: ${last}`);
    },
  },
  {
    name: 'script payloads in a note, a table and a formula run nothing',
    async run({ context, base, out }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      const hostile = [
        'furrow 1',
        'title: <img src=x onerror="window.__pwned=\'title\'">',
        '',
        '--- note',
        'Hello <img src=x onerror="window.__pwned=\'img\'"> and [a link](javascript:window.__pwned=\'link\') and',
        '<script>window.__pwned = "script"</script> <a href="javascript:window.__pwned=\'a\'">raw link</a>',
        '<svg onload="window.__pwned=\'svg\'"></svg> <iframe src="javascript:window.__pwned=\'iframe\'"></iframe>',
        '<div style="background:url(javascript:window.__pwned=1)" onclick="window.__pwned=\'click\'">click me</div>',
        '',
        'A value: {t.label[1]}, a fake one: <span class="slot" data-slot="0">99</span>,',
        '[a placeholder in an address](https://example.invalid/{t.label[1]}) ![one in a description {t.label[1]}](data:image/png;base64,AAAA)',
        '',
        '--- table t',
        'label,"<img src=x onerror=window.__pwned=\'header\'>"',
        '"<img src=x onerror=window.__pwned=\'field\'>",1',
        '"<script>window.__pwned=\'field2\'</script>",2',
        '',
        '--- formula',
        'x = "<img src=x onerror=window.__pwned=\'formula\'>"',
        '',
      ].join('\n');
      await openDocument(page, hostile, 'hostile.furrow');
      await page.locator('section[data-name="t"] [role="gridcell"]').first().waitFor();
      await settled(page);
      // a user clicks around
      const note = page.locator('section[data-kind="note"] furrow-note-cell .prose');
      for (const text of ['a link', 'raw link', 'click me']) {
        const target = note.getByText(text).first();
        if ((await target.count()) > 0) await target.click({ force: true }).catch(() => {});
      }
      await page.waitForTimeout(500);
      const pwned = await page.evaluate(() => window.__pwned ?? null);
      check(pwned === null, `a payload ran: ${pwned}`);
      const found = await page.evaluate(() => {
        const bad = [];
        const visit = (root) => {
          for (const el of root.querySelectorAll('*')) {
            for (const a of el.attributes) {
              if (/^on/i.test(a.name)) bad.push(`${el.tagName} ${a.name}`);
              if (/^\s*javascript:/i.test(a.value)) bad.push(`${el.tagName} ${a.name}=${a.value}`);
            }
            if (el.tagName === 'SCRIPT' && !el.src) bad.push('inline script');
            if (el.shadowRoot) visit(el.shadowRoot);
          }
        };
        visit(document);
        return bad;
      });
      check(found.length === 0, `dangerous markup in the page: ${found.join('; ')}`);
      // the text is still there, as text
      const shown = await page.evaluate(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="t"] furrow-table-cell').shadowRoot.textContent);
      check(shown.includes('<img src=x onerror='), 'the table shows the label as text');
      // raw HTML in the note reads as text, and the note has exactly its one live value
      const noteShown = await page.evaluate(() => {
        const root = document.querySelector('furrow-app').shadowRoot.querySelector('section[data-kind="note"] furrow-note-cell').shadowRoot;
        const prose = root.querySelector('.prose');
        return {
          text: prose.textContent,
          slots: prose.querySelectorAll('[data-slot]').length,
          html: prose.innerHTML,
          tags: [...new Set(Array.from(prose.querySelectorAll('*'), (e) => e.tagName.toLowerCase()))].sort(),
          attributes: [...new Set(Array.from(prose.querySelectorAll('*'), (e) => e.getAttributeNames().map((a) => `${e.tagName.toLowerCase()} ${a}`)).flat())].sort(),
        };
      });
      // the allow-list (cells/note/markdown.ts), plus what the page itself sets: a link's target
      // and rel, and its own live-value slots and the wrapper's class
      const pageSets = ['a target', 'a rel', 'span class', 'span data-slot', 'span title', 'div class'];
      const allowed = ['a href', 'a title', 'img src', 'img alt', 'img title', 'ol start', 'th align', 'td align', ...pageSets];
      check(noteShown.attributes.every((a) => allowed.includes(a)), `attributes outside the allow-list in the note: ${noteShown.attributes.join(', ')}`);
      check(noteShown.text.includes('<script>window.__pwned = "script"</script>'), `the note shows its raw HTML as text: ${noteShown.text.slice(0, 200)}`);
      check(noteShown.slots === 1, `one live value in the note, not ${noteShown.slots}: ${noteShown.html}`);
      check(noteShown.tags.every((t) => ['a', 'div', 'img', 'p', 'span'].includes(t)), `only Markdown's own elements in the note: ${noteShown.tags.join(' ')}`);
      await page.screenshot({ path: `${out}/hostile.png`, fullPage: true });
    },
  },
  {
    name: 'a file that is not a document is refused and nothing on the page is lost',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      await openDocument(page, 'batch,cure,shear\n1,60C,22\n', 'data.csv.txt');
      await page.locator('furrow-app .banner.problem').waitFor();
      const banner = await page.locator('furrow-app .banner.problem').innerText();
      check(/not a Furrow document/.test(banner) && /Nothing on the page was changed/.test(banner), `banner: ${banner}`);
      check((await shownF(page)) === '18.2', 'the document is still there');
    },
  },
  {
    name: 'undo and redo every edit, structural ones included',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      const count = () => page.evaluate(() => document.querySelector('furrow-app').shadowRoot.querySelectorAll('section.cell').length);
      const n0 = await count();
      await page.locator('section[data-name="by_batch"]').hover();
      await page.locator('section[data-name="by_batch"] .tools button[aria-label="Delete"]').click();
      check((await count()) === n0 - 1, 'deleted');
      await page.locator('furrow-app nav button', { hasText: 'Undo' }).click();
      check((await count()) === n0, 'undo brings the cell back');
      await settled(page);
      check(/24\.3/.test(await cellText(page, 'by_batch')), 'with its value');
      await page.locator('furrow-app nav button', { hasText: 'Redo' }).click();
      check((await count()) === n0 - 1, 'redo deletes it again');
    },
  },
  {
    name: 'in a 200-cell document an edit updates the visible dependents (time measured)',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      const cells = ['--- table base', 'k,y', '1,10', '2,20', '3,30', ''];
      for (let i = 1; i < 200; i++) cells.push('--- formula', i === 1 ? 'f1 = sum(base.y)' : `f${i} = f${i - 1} + 1`, '');
      await openDocument(page, `furrow 1\ntitle: Two hundred cells\n\n${cells.join('\n')}`, 'many.furrow');
      await page.locator('section[data-name="f5"] furrow-value').waitFor();
      await settled(page);
      await watchEdits(page);
      const values = Array.from({ length: EDITS }, (_, k) => 40 + k);
      // f5 = sum(base.y) + 4, and row 1's y was 10
      const series = await timeFieldEdits(page, { table: 'base', name: 'f5', values, expected: (v) => String(v + 50 + 4) });
      measured.editToVisibleDependentMs = series.typed.times.map((t) => Math.round(t * 10) / 10);
      measured.editToVisibleDependentRushedMs = series.rushed.times.map((t) => Math.round(t * 10) / 10);
      editLines('200 cells', series);
      check(await cellText(page, 'f5').then((t) => /102/.test(t ?? '')), `the last value typed is shown: ${await cellText(page, 'f5')}`);
      // a cell far off screen was drawn later, and shows the last value once scrolled to
      // (f199 = sum(base.y) + 198, with 48 in row 1)
      await page.locator('section[data-name="f199"]').scrollIntoViewIfNeeded();
      await page.waitForFunction(
        () => /296/.test(document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="f199"] furrow-formula-cell')?.shadowRoot?.querySelector('furrow-value')?.shadowRoot?.textContent ?? ''),
        null,
        { timeout: 5000 },
      );
    },
  },
  {
    name: 'with a 100,000-row table an edit updates the visible dependent, and autosave costs little per keystroke (measured)',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      const rows = ['k,y'];
      for (let i = 0; i < 100_000; i++) rows.push(`${i + 1},${(i % 10) + 1}`);
      await openDocument(page, `furrow 1\ntitle: A long table\n\n--- formula\ntotal = sum(big.y)\n\n--- table big\n${rows.join('\n')}\n`, 'long.furrow');
      await page.locator('section[data-name="total"] furrow-value').waitFor({ timeout: 60_000 });
      await settled(page);
      const readTotal = () =>
        page.evaluate(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="total"] furrow-formula-cell')?.shadowRoot?.querySelector('furrow-value')?.shadowRoot?.textContent ?? '');
      check(/550,?000/.test(await readTotal()), `the total before: ${await readTotal()}`);
      await watchEdits(page);
      const values = Array.from({ length: EDITS }, (_, k) => 20 + k);
      // row 1's y was 1
      const series = await timeFieldEdits(page, { table: 'big', name: 'total', values, expected: (v) => String(550_000 - 1 + v) });
      // autosave: what a keystroke costs it (marking the document changed), and what one
      // save costs when typing pauses (writing the document's text), on this document
      const cost = await page.evaluate(() => {
        const keeper = document.querySelector('furrow-app').keeper;
        const n = 1000;
        const t0 = performance.now();
        for (let i = 0; i < n; i++) keeper.touch();
        const perTouch = (performance.now() - t0) / n;
        const t1 = performance.now();
        keeper.autosaver.build();
        return { perTouch, build: performance.now() - t1 };
      });
      measured.longTableEditToVisibleDependentMs = series.typed.times.map((t) => Math.round(t * 10) / 10);
      measured.longTableEditToVisibleDependentRushedMs = series.rushed.times.map((t) => Math.round(t * 10) / 10);
      measured.autosavePerKeystrokeMs = Math.round(cost.perTouch * 10000) / 10000;
      measured.autosaveTextPerPauseMs = Math.round(cost.build * 10) / 10;
      editLines('100,000-row table', series);
      const parts = [...series.typed.parts, ...series.rushed.parts];
      check(parts.every((p) => p.type === 'splice'), `a field edit travels as a splice: ${parts.map((p) => p.type).join(', ')}`);
      check(/550,?027/.test(await readTotal()), `the total after the last edit (28 in row 1): ${await readTotal()}`);
      console.log(`    measured: autosave ${cost.perTouch.toFixed(4)} ms per keystroke (target under 1 ms); writing the text when typing pauses ${cost.build.toFixed(1)} ms`);
    },
  },
];

tests.push({
  name: 'the planning sample opens with its field map drawn, and its layout saves as a run sheet',
  async run({ context, base, out }) {
    const page = await context.newPage();
    await page.goto(`${base}/?sample=goalmouth-turf.furrow&fresh`);
    await settled(page);
    const statuses = await page.evaluate(() => [...document.querySelector('furrow-app').shadowRoot.querySelectorAll('section.cell')].map((s) => s.dataset.status));
    check(statuses.length >= 16 && statuses.every((s) => s === 'ok'), `statuses: ${statuses.join(', ')}`);
    const chart = page.locator('section[data-name="map"] furrow-chart');
    await chart.scrollIntoViewIfNeeded();
    await chart.locator('svg').first().waitFor({ timeout: 15_000 });
    // one labelled rectangle per plot: 7 strips of 4 mixes
    const drawn = await chart.evaluate((el) => {
      const svg = el.shadowRoot.querySelector('svg');
      const texts = [...svg.querySelectorAll('text')].map((t) => t.textContent);
      return { labels: texts.filter((t) => ['hardwear', 'rye_blend', 'fescue_mix', 'quickpatch'].includes(t)).length };
    });
    // 28 plot labels and 4 legend labels
    check(drawn.labels === 32, `treatment labels drawn: ${drawn.labels}`);
    await page.screenshot({ path: `${out}/planning-map.png` });
    const sheetButton = page.locator('section[data-name="plan"] furrow-run-sheet button');
    await sheetButton.scrollIntoViewIfNeeded();
    const drawnLine = await page.locator('section[data-name="plan"] furrow-run-sheet p.drawn').innerText();
    check(/seed 20270312/.test(drawnLine), `how the layout was drawn: ${drawnLine}`);
    const [download] = await Promise.all([page.waitForEvent('download'), sheetButton.click()]);
    check(download.suggestedFilename() === 'plan-run-sheet.csv', `file name: ${download.suggestedFilename()}`);
    const text = readFileSync(await download.path(), 'utf8');
    const lines = text.trimEnd().split('\n');
    check(lines[0] === 'block,plot,treatment,measurement,notes' && lines.length === 29, `run sheet: ${lines.slice(0, 3).join(' | ')} (${lines.length} lines)`);
    // drawn in the browser's worker, the plan is the one the command line draws from the same seed, plot for plot
    const cli = spawnSync(process.execPath, ['bin/furrow.js', 'sheet', 'samples/goalmouth-turf.furrow', 'plan'], { encoding: 'utf8' });
    check(cli.status === 0 && cli.stdout.trimEnd() === text.trimEnd(), `the page's run sheet differs from furrow sheet's: ${cli.stderr}${cli.stdout.slice(0, 120)}`);
  },
});

tests.push({
  name: 'a fit that ignores the pairing of its data shows the design warning on its cell',
  async run({ context, base }) {
    const page = await context.newPage();
    await page.goto(`${base}/?sample=tread-wear.furrow&fresh`);
    await settled(page);
    const warned = await cellText(page, 'as_groups');
    check(/column "van" in which every compound appears exactly once per level/.test(warned ?? ''), `as_groups shows: ${(warned ?? '').slice(0, 300)}`);
    const blocks = await cellText(page, 'as_blocks');
    check(blocks !== null && !/exactly once per level/.test(blocks), 'the blocked fit carries no such warning');
  },
});

/** JavaScript needed for first paint: the entry and what it imports statically (gzipped). */
function firstPaintBytes() {
  const html = readFileSync('dist/index.html', 'utf8');
  const files = [...html.matchAll(/(?:src|href)="\/(assets\/[^"]+\.js)"/g)].map((m) => m[1]);
  const seen = new Set();
  const queue = [...files];
  let total = 0;
  while (queue.length > 0) {
    const f = queue.shift();
    if (seen.has(f)) continue;
    seen.add(f);
    const code = readFileSync(join('dist', f));
    total += gzipSync(code).length;
    // static imports only: `import ... from "./x.js"` (dynamic import() chunks load later)
    for (const m of code.toString('utf8').matchAll(/(?:^|[;\n}])\s*import\s*(?:[^'"()]*?from\s*)?["']\.\/([^"']+\.js)["']/g)) queue.push(`assets/${m[1]}`);
  }
  const all = readdirSync('dist/assets').filter((f) => f.endsWith('.js'));
  return { total, files: [...seen], all: all.map((f) => `${f} ${(gzipSync(readFileSync(join('dist/assets', f))).length / 1024).toFixed(1)} kB`) };
}

tests.push({
  name: 'the JavaScript for first paint is under 300 kB gzipped (vega and the worker load later)',
  async run() {
    const { total, files, all } = firstPaintBytes();
    measured.firstPaintJsGzipKb = Math.round(total / 102.4) / 10;
    console.log(`    first paint: ${(total / 1024).toFixed(1)} kB gzipped in ${files.join(', ')}; all chunks: ${all.join('; ')}`);
    check(total < 300 * 1024, `${(total / 1024).toFixed(1)} kB`);
    check(!files.some((f) => /embed|vega/.test(f)), 'vega is not in the first paint');
    statSync('dist/index.html');
  },
});

tests.push(...keepingTests(measured));
tests.push(...closingTests);
tests.push(...hostileFileTests());
tests.push(...exportTests);
tests.push(...importingTests());
tests.push(...largeTableTests(measured));
tests.push(...largePageTests(measured));
tests.push(...firstHourTests);
tests.push(...convertingTests);
tests.push(...readingTests());
tests.push(...handingTests());
tests.push(...strataTests());

const { failed } = await runTests(tests, { build, json });
writeFileSync(`test-output/e2e/measured.json`, `${JSON.stringify({ machine: cpus()[0]?.model ?? 'unknown', ...measured }, null, 2)}\n`);
process.exit(failed === 0 ? 0 : 1);
