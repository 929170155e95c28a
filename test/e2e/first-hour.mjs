// Browser tests of the first hour in the page: a new cell takes the caret and an empty
// formula is no error, the title and a new note's prompt are placeholders, the help panel
// (search, an example added as a working cell, hover docs and signature hints), the keys
// for cells, and editors on screen at load coloured like editors made later.
import { check } from './harness.mjs';
import { openDocument, settled, statusOf } from './page.mjs';

/** The names of the cells in page order ('' for a cell with no name). */
async function cellNames(page) {
  return page.evaluate(() => [...document.querySelector('furrow-app').shadowRoot.querySelectorAll('section.cell')].map((s) => s.dataset.name));
}

/** The name of the cell that holds the keyboard focus (null when none does). */
async function focusedCell(page) {
  return page.evaluate(() => {
    const inner = document.querySelector('furrow-app').shadowRoot.activeElement;
    const section = inner?.closest('section.cell');
    return section ? section.dataset.name : null;
  });
}

/** The text of a formula cell's editor (or its static text before the editor exists). */
async function formulaText(page, name) {
  return page.evaluate((n) => {
    const el = document.querySelector('furrow-app').shadowRoot.querySelector(`section[data-name="${n}"] furrow-formula-cell`);
    return el?.editorView ? el.editorView.state.doc.toString() : (el?.shadowRoot.querySelector('pre.static')?.textContent ?? null);
  }, name);
}

/** The text a formula cell's value shows. */
async function valueText(page, name) {
  return page.evaluate((n) => {
    const v = document.querySelector('furrow-app').shadowRoot.querySelector(`section[data-name="${n}"] furrow-formula-cell`)?.shadowRoot.querySelector('furrow-value');
    return v ? v.shadowRoot.textContent.replace(/\s+/g, ' ').trim() : null;
  }, name);
}

/** Waits until the worker has sent the built-ins (completion, help and colours read them). */
async function builtinsArrived(page) {
  await page.waitForFunction(() => document.querySelector('furrow-app')?.bridge?.catalogue().builtins.length > 0);
}

const KEYS_DOC = `furrow 1
title: Keys for cells

--- formula
a = 1

--- formula
b = a + 1

--- formula
c = b * 2

`;

// a table whose columns carry the names the example of the blocked analysis reads, under
// another table name; invented figures
const HARVEST_DOC = `furrow 1
title: Oat lines on four terraces

--- table harvest
block,variety,yield
1,brisk,4.1
1,dune,4.6
1,fallow,3.9
2,brisk,4.4
2,dune,4.9
2,fallow,4.0
3,brisk,3.8
3,dune,4.5
3,fallow,3.6
4,brisk,4.2
4,dune,4.8
4,fallow,4.1

`;

export const firstHourTests = [
  {
    name: 'first hour: typing after "+ formula" lands in one new cell, which is empty and not an error until typed into',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?sample=adhesive-cure.furrow`);
      await settled(page);
      await builtinsArrived(page);
      const before = await cellNames(page);
      await page.locator('furrow-app main > .add button', { hasText: '+ formula' }).click();
      await page.waitForFunction((n) => document.querySelector('furrow-app').shadowRoot.querySelectorAll('section.cell').length === n + 1, before.length);
      await settled(page);
      const added = (await cellNames(page)).at(-1);
      check(added === 'value1', `the new cell is value1: ${added}`);
      check((await focusedCell(page)) === 'value1', `the new cell has the caret: ${await focusedCell(page)}`);
      check((await statusOf(page, 'value1')) === 'ok', `an empty formula is not an error: ${await statusOf(page, 'value1')}`);
      const shown = await page.locator('section[data-name="value1"] furrow-formula-cell p.empty').innerText();
      check(/^empty/.test(shown), `the empty formula says it is empty: ${shown}`);
      const problems = await page.locator('section[data-name="value1"] furrow-formula-cell .problem').count();
      check(problems === 0, `the empty formula shows no problem: ${problems}`);
      // spaces first: they used to press the button again and make more cells
      await page.keyboard.type('  2 + 3');
      await page.waitForTimeout(400);
      await settled(page);
      const after = await cellNames(page);
      check(after.length === before.length + 1, `one cell was added, not more: ${after.length - before.length}`);
      const text = await formulaText(page, 'value1');
      check(text === 'value1 =   2 + 3', `the typed text is in the new cell: ${JSON.stringify(text)}`);
      const value = await valueText(page, 'value1');
      check(value === '5', `the cell evaluates: ${value}`);
    },
  },
  {
    name: 'first hour: a name typed after the offered one gets a one-click fix that keeps the typed name',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      await builtinsArrived(page);
      await page.locator('furrow-app main > .add button', { hasText: '+ formula' }).click();
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="value1"]') !== null);
      await settled(page);
      // a user who names the cell themselves types the name after the offered one
      await page.keyboard.type('my_total = 2 + 3');
      await page.waitForTimeout(400);
      await settled(page);
      const fix = page.locator('section[data-name="value1"] furrow-formula-cell .problem button.fix');
      await fix.waitFor({ timeout: 10_000 });
      check((await fix.innerText()) === 'Name the cell my_total', `the fix says what it does: ${await fix.innerText()}`);
      // nothing changed on its own: the text is as typed until the fix is chosen
      check((await formulaText(page, 'value1')) === 'value1 = my_total = 2 + 3', `the text as typed: ${JSON.stringify(await formulaText(page, 'value1'))}`);
      await fix.click();
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="my_total"]') !== null, null, { timeout: 10_000 });
      await settled(page);
      check((await formulaText(page, 'my_total')) === 'my_total = 2 + 3', `the fixed text: ${JSON.stringify(await formulaText(page, 'my_total'))}`);
      check((await valueText(page, 'my_total')) === '5', `the cell evaluates: ${await valueText(page, 'my_total')}`);
      check((await page.locator('section[data-name="my_total"] furrow-formula-cell .problem').count()) === 0, 'no problem is left');
      // one undo step takes the fix back
      await page.keyboard.press('Control+z');
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="value1"]') !== null, null, { timeout: 10_000 });
      check((await formulaText(page, 'value1')) === 'value1 = my_total = 2 + 3', `undo brings the typed text back: ${JSON.stringify(await formulaText(page, 'value1'))}`);
      await page.close();
    },
  },
  {
    name: 'under every document, caution declared or not, the page says that a statistical result does not replace qualified judgement',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      await openDocument(page, 'furrow 1\ntitle: No caution declared\n\n--- formula\nx = 1\n', 'plain.furrow');
      await page.waitForFunction(() => /No caution declared/.test(document.querySelector('furrow-app').shadowRoot.querySelector('textarea.title')?.value ?? ''));
      const line = await page.locator('furrow-app main p.judgement').innerText();
      check(/supports, and does not replace, the judgement of qualified people/.test(line), `the line under the document: ${JSON.stringify(line)}`);
      check((await page.locator('furrow-app header .caution').count()) === 0, 'no caution box without a caution header');
      await page.close();
    },
  },
  {
    name: 'first hour: a cell reading an empty formula sees a missing value, not an error',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?sample=adhesive-cure.furrow`);
      await settled(page);
      await openDocument(page, 'furrow 1\ntitle: Empty first\n\n--- formula\nstart = \n\n--- formula\nnext = start + 1\n\n', 'empty-first.furrow');
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="next"]') !== null);
      await settled(page);
      check((await statusOf(page, 'start')) === 'ok', `the empty formula is ok: ${await statusOf(page, 'start')}`);
      check((await statusOf(page, 'next')) === 'ok', `the cell reading it is not failed: ${await statusOf(page, 'next')}`);
      const value = await valueText(page, 'next');
      check(value === 'missing', `the cell reading it sees a missing value: ${value}`);
    },
  },
  {
    name: 'first hour: a new note and a new table take the caret',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?sample=adhesive-cure.furrow`);
      await settled(page);
      await page.locator('furrow-app main > .add button', { hasText: '+ note' }).click();
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-kind="note"]:last-of-type furrow-note-cell')?.shadowRoot.activeElement?.tagName === 'TEXTAREA');
      await page.keyboard.type('Two batches were re-cut.');
      await page.keyboard.press('Escape');
      await settled(page);
      const note = await page.evaluate(() => {
        const notes = [...document.querySelector('furrow-app').shadowRoot.querySelectorAll('section[data-kind="note"] furrow-note-cell')];
        return notes.at(-1).shadowRoot.textContent.replace(/\s+/g, ' ').trim();
      });
      check(note.includes('Two batches were re-cut.'), `the note holds what was typed: ${note}`);
      await page.locator('furrow-app main > .add button', { hasText: '+ table' }).click();
      await page.waitForFunction(() => {
        const t = [...document.querySelector('furrow-app').shadowRoot.querySelectorAll('section[data-kind="table"] furrow-table-cell')].at(-1);
        return t?.shadowRoot.activeElement?.getAttribute('role') === 'grid';
      });
    },
  },
  {
    name: 'first hour: the title and the first note of a new document are placeholders, and typing replaces nothing',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?sample=adhesive-cure.furrow`);
      await settled(page);
      await page.locator('furrow-app nav button', { hasText: 'New' }).click();
      await settled(page);
      const title = page.locator('furrow-app textarea.title');
      check((await title.inputValue()) === '', `the title starts empty: ${JSON.stringify(await title.inputValue())}`);
      check((await title.getAttribute('placeholder')) === 'Untitled trial', `the title's placeholder: ${await title.getAttribute('placeholder')}`);
      await title.click();
      await page.keyboard.type('Rye under two mowing heights');
      await page.keyboard.press('Enter');
      await settled(page);
      check((await title.inputValue()) === 'Rye under two mowing heights', `typing replaced nothing: ${JSON.stringify(await title.inputValue())}`);
      const text = await page.evaluate(() => document.querySelector('furrow-app').store.document.header);
      check(/^title: Rye under two mowing heights$/m.test(text), `the header holds the typed title: ${JSON.stringify(text)}`);
      // the first note: its prompt shows but is not text
      const body = await page.evaluate(() => document.querySelector('furrow-app').store.document.cells[0]?.body);
      check(body === '\n', `the first note's text is empty: ${JSON.stringify(body)}`);
      const prose = page.locator('section[data-kind="note"] furrow-note-cell .prose');
      check((await prose.innerText()).includes('What is compared, on what, and why.'), 'the note shows its prompt');
      await prose.dblclick();
      const area = page.locator('section[data-kind="note"] furrow-note-cell textarea');
      check((await area.inputValue()) === '', `the note's editor starts empty: ${JSON.stringify(await area.inputValue())}`);
      check((await area.getAttribute('placeholder')) === 'What is compared, on what, and why.', 'the prompt is the placeholder');
    },
  },
  {
    name: 'first hour: the help panel opens, finds blocked, and its example becomes a working cell on the open document',
    async run({ context, base, out }) {
      const page = await context.newPage();
      await page.goto(`${base}/?sample=adhesive-cure.furrow`);
      await settled(page);
      await openDocument(page, HARVEST_DOC, 'oat-lines.furrow');
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="harvest"]') !== null);
      await settled(page);
      await builtinsArrived(page);
      await page.locator('furrow-app nav button.help-toggle').click();
      const search = page.locator('furrow-help input[type="search"]');
      await search.waitFor();
      check(await search.evaluate((el) => el.getRootNode().activeElement === el), 'the search box has the caret');
      await page.screenshot({ path: `${out}/help-panel.png` });
      await page.keyboard.type('blocked');
      const entries = await page.locator('furrow-help details').evaluateAll((ds) => ds.map((d) => d.dataset.builtin));
      check(entries[0] === 'blocked', `the search finds blocked first: ${entries.join(', ')}`);
      const entry = page.locator('furrow-help details[data-builtin="blocked"]');
      await entry.locator('summary').click();
      const sig = (await entry.locator('.signature').innerText()).trim();
      check(sig === 'blocked(y, treatment, block, covariate?)', `the signature: ${sig}`);
      const example = (await entry.locator('.example code').innerText()).trim();
      check(example === 'blocked(harvest.yield, harvest.variety, harvest.block)', `the example reads the document's table: ${example}`);
      await page.screenshot({ path: `${out}/help-panel-entry.png` });
      await entry.locator('.example button').click();
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="blocked1"]') !== null);
      await settled(page);
      check((await statusOf(page, 'blocked1')) === 'ok', `the added cell works: ${await statusOf(page, 'blocked1')}`);
      const heads = await page.locator('section[data-name="blocked1"] furrow-value table th').allInnerTexts();
      check(heads.map((h) => h.trim()).includes('F'), `the added cell shows an analysis of variance: ${heads.join('|')}`);
      // an example whose table the document lacks says so before it is added
      await search.fill('paired');
      const pairedEntry = page.locator('furrow-help details[data-builtin="paired"]');
      if (!(await pairedEntry.evaluate((d) => d.open))) await pairedEntry.locator('summary').click();
      const fit = (await pairedEntry.locator('.example .fit').innerText()).replace(/\s+/g, ' ');
      check(/has no sleep \(drug_1, drug_2\)/.test(fit), `the panel names the table the example expects: ${fit}`);
      // at 800 px the panel lies over the sheet and fits the window
      await page.setViewportSize({ width: 800, height: 900 });
      await page.waitForTimeout(200);
      const box = await page.locator('furrow-app aside.help').boundingBox();
      check(box !== null && box.x >= 0 && box.x + box.width <= 800, `the panel fits at 800 px: ${JSON.stringify(box)}`);
      await page.screenshot({ path: `${out}/help-panel-800.png` });
      // Escape clears the search, then closes the panel
      await search.click();
      await page.keyboard.press('Escape');
      check((await search.inputValue()) === '', `the first Escape clears the search: ${await search.inputValue()}`);
      await page.keyboard.press('Escape');
      await page.locator('furrow-app aside.help').waitFor({ state: 'detached', timeout: 5000 });
    },
  },
  {
    name: 'first hour: hover docs on a built-in name and a signature hint after ( and ,',
    async run({ context, base, out }) {
      const page = await context.newPage();
      await page.goto(`${base}/?sample=adhesive-cure.furrow`);
      await settled(page);
      await builtinsArrived(page);
      await page.locator('furrow-app main > .add button', { hasText: '+ formula' }).click();
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="value1"]') !== null);
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.activeElement?.closest('section')?.dataset.name === 'value1');
      await page.keyboard.type('blocked(');
      const hint = page.locator('section[data-name="value1"] .furrow-signature');
      await hint.waitFor({ timeout: 5000 });
      let current = (await hint.locator('.furrow-current-param').innerText()).trim();
      check(current === 'y', `after ( the first parameter is marked: ${current}`);
      await page.keyboard.type('coupons.shear_mpa, ');
      await page.waitForTimeout(100);
      current = (await hint.locator('.furrow-current-param').innerText()).trim();
      check(current === 'treatment', `after , the second parameter is marked: ${current}`);
      const doc = (await hint.locator('.furrow-param-doc').innerText()).trim();
      check(doc.startsWith('treatment:'), `the marked parameter's doc is shown: ${doc}`);
      await page.screenshot({ path: `${out}/signature-hint.png` });
      // the hint leaves with the caret
      await page.keyboard.press('Escape');
      await page.locator('furrow-app textarea.title').click();
      await page.waitForTimeout(100);
      check((await hint.count()) === 0, 'the hint is gone when the editor loses focus');
      // hover over the name in the fit cell's editor
      const fitEditor = page.locator('section[data-name="fit"] furrow-formula-cell');
      await fitEditor.evaluate((el) => el.ensureEditor());
      const word = fitEditor.locator('.cm-content span', { hasText: /^blocked$/ });
      await word.hover();
      const hover = page.locator('section[data-name="fit"] .furrow-hover');
      await hover.waitFor({ timeout: 5000 });
      const text = (await hover.innerText()).replace(/\s+/g, ' ');
      await page.screenshot({ path: `${out}/hover-doc.png` });
      check(text.startsWith('blocked(y, treatment, block, covariate?)'), `the hover shows the signature: ${text}`);
      check(/Returns /.test(text) && /e\.g\. blocked\(/.test(text), `the hover shows what it returns and an example: ${text}`);
    },
  },
  {
    name: 'first hour: keys add a cell below, go to the cells above and below, move a cell and delete it (undoable)',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?sample=adhesive-cure.furrow`);
      await settled(page);
      await openDocument(page, KEYS_DOC, 'keys.furrow');
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="c"]') !== null);
      await settled(page);
      await page.locator('section[data-name="a"] furrow-formula-cell').evaluate((el) => el.focusEditor());
      check((await focusedCell(page)) === 'a', `start in a: ${await focusedCell(page)}`);
      const names = () => cellNames(page);
      const waitFocus = (n) => page.waitForFunction((x) => document.querySelector('furrow-app').shadowRoot.activeElement?.closest('section')?.dataset.name === x, n, { timeout: 5000 });

      await page.keyboard.press('Alt+PageDown');
      await waitFocus('b');
      await page.keyboard.press('Alt+PageDown');
      await waitFocus('c');
      await page.keyboard.press('Alt+PageUp');
      await waitFocus('b');

      await page.keyboard.press('Alt+Shift+PageUp');
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section.cell')?.dataset.name === 'b');
      check(JSON.stringify(await names()) === '["b","a","c"]', `b moved up: ${await names()}`);
      await waitFocus('b');
      await page.keyboard.press('Alt+Shift+PageDown');
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section.cell')?.dataset.name === 'a');
      check(JSON.stringify(await names()) === '["a","b","c"]', `b moved back down: ${await names()}`);
      await waitFocus('b');

      await page.keyboard.press('Control+Shift+Enter');
      await waitFocus('value1');
      check(JSON.stringify(await names()) === '["a","b","value1","c"]', `a formula cell below b: ${await names()}`);
      await page.keyboard.type('b * 10');
      await page.waitForTimeout(400);
      await settled(page);
      check((await formulaText(page, 'value1')) === 'value1 = b * 10', `typed into the new cell: ${await formulaText(page, 'value1')}`);

      await page.keyboard.press('Alt+Shift+Delete');
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelectorAll('section.cell').length === 3);
      check(JSON.stringify(await names()) === '["a","b","c"]', `value1 deleted: ${await names()}`);
      await waitFocus('c');
      await page.keyboard.press('Control+z');
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelectorAll('section.cell').length === 4);
      check(JSON.stringify(await names()) === '["a","b","value1","c"]', `the delete was undone: ${await names()}`);
      check((await formulaText(page, 'value1')) === 'value1 = b * 10', `with its text: ${await formulaText(page, 'value1')}`);

      // the keys are listed in the help panel
      await page.keyboard.press('Alt+Shift+F1');
      const listed = (await page.locator('furrow-help table.keys').innerText()).replace(/\s+/g, ' ');
      for (const k of ['Ctrl+Shift+Enter', 'Alt+Page Up', 'Alt+Page Down', 'Alt+Shift+Page Up', 'Alt+Shift+Page Down', 'Alt+Shift+Delete']) {
        check(listed.includes(k), `the help lists ${k}: ${listed}`);
      }
    },
  },
  {
    name: 'first hour: editors on screen at load colour built-in names like editors made later',
    async run({ context, base }) {
      const page = await context.newPage();
      // a window tall enough that the fit cell, under the 24-row table, is on screen at load
      await page.setViewportSize({ width: 1280, height: 1600 });
      await page.goto(`${base}/?sample=adhesive-cure.furrow`);
      await settled(page);
      await builtinsArrived(page);
      const colourOf = (cell) =>
        page.evaluate((n) => {
          const el = document.querySelector('furrow-app').shadowRoot.querySelector(`section[data-name="${n}"] furrow-formula-cell`);
          // the innermost span: an underline may wrap the coloured one
          const span = [...el.shadowRoot.querySelectorAll('.cm-content span')].find((s) => s.textContent === 'blocked' && s.children.length === 0);
          return span ? getComputedStyle(span).color : null;
        }, cell);
      // the fit cell is on screen at load: its editor was made then
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="fit"] furrow-formula-cell')?.editorView != null);
      const atLoad = await colourOf('fit');
      await page.locator('furrow-app main > .add button', { hasText: '+ formula' }).click();
      await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.activeElement?.closest('section')?.dataset.name === 'value1');
      await page.keyboard.type('blocked');
      await page.keyboard.press('Escape');
      await page.waitForTimeout(300);
      const later = await colourOf('value1');
      check(later !== null && later === atLoad, `the same colour at load and later: ${atLoad} and ${later}`);
      const accent = await page.evaluate(() => getComputedStyle(document.documentElement).getPropertyValue('--accent').trim());
      check(later === 'rgb(45, 106, 87)' && accent === '#2d6a57', `built-ins in the accent colour: ${later} (accent ${accent})`);
    },
  },
];
