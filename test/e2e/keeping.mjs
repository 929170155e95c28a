// Browser tests of keeping documents in this browser: one slot per document, samples that
// never replace other work, an edited sample offered as the copy or the original, the last
// edit kept through an immediate reload, and two tabs on one document told about each other.
import { check } from './harness.mjs';
import { field, settled } from './page.mjs';

const ADHESIVE = 'adhesive-cure.furrow';
const TREAD = 'tread-wear.furrow';

/** Types a value into a grid field and commits it. */
async function typeInto(page, table, r, c, text) {
  await field(page, table, r, c).click();
  await page.keyboard.type(text);
  await page.keyboard.press('Enter');
  await settled(page);
}

async function fieldValue(page, table, r, c) {
  return (await field(page, table, r, c).innerText()).trim();
}

async function title(page) {
  return page.locator('furrow-app textarea.title').inputValue();
}

/** The options of the "kept in this browser" list: [value, label]. */
async function keptOptions(page) {
  const list = page.locator('furrow-app select.kept');
  await list.waitFor({ timeout: 10_000 });
  return list.evaluate((s) => [...s.options].filter((o) => o.value !== '').map((o) => [o.value, o.textContent.trim()]));
}

async function bannerText(page) {
  const b = page.locator('furrow-app .banner');
  await b.waitFor({ timeout: 10_000 });
  return (await b.innerText()).replace(/\s+/g, ' ');
}

export function keepingTests() {
  return [
    {
      name: 'opening a sample never replaces the document open before, which stays in the kept list',
      async run({ context, base }) {
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        await typeInto(page, 'coupons', 1, 3, '25.1');
        await page.goto(`${base}/?sample=${TREAD}`);
        await settled(page);
        check(/tread compounds/.test(await title(page)), `the sample opened: ${await title(page)}`);
        const options = await keptOptions(page);
        const mine = options.find(([, label]) => /lap-shear/.test(label) && /new document/.test(label));
        check(mine !== undefined, `the earlier document is kept: ${JSON.stringify(options)}`);
        await page.locator('furrow-app select.kept').selectOption(mine[0]);
        await settled(page);
        check(/lap-shear/.test(await title(page)), `the kept document reopened: ${await title(page)}`);
        const v = await fieldValue(page, 'coupons', 1, 3);
        check(v === '25.1', `its edit is there: ${v}`);
      },
    },
    {
      name: 'typing in a sample, then choosing that sample again at once, opens the edited copy: the typing is kept',
      async run({ context, base }) {
        const page = await context.newPage();
        await page.goto(`${base}/?sample=${ADHESIVE}`);
        await settled(page);
        const formula = () =>
          page.evaluate(() => {
            const el = document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="gain"] furrow-formula-cell');
            return el?.editorView ? el.editorView.state.doc.toString() : (el?.shadowRoot.querySelector('pre.static')?.textContent ?? null);
          });
        const before = await formula();
        // typing in a formula becomes an edit after a short pause, and is written to the
        // browser's keeping 400 ms after that; the sample is chosen again in between
        await page.locator('section[data-name="gain"] furrow-formula-cell pre.static, section[data-name="gain"] furrow-formula-cell .cm-content').first().click();
        await page.keyboard.press('Control+End');
        await page.keyboard.type(' # checked');
        await page.waitForTimeout(250);
        await page.locator('furrow-app select[aria-label="Open a sample"]').selectOption(ADHESIVE);
        await settled(page);
        const offer = await bannerText(page);
        check(/edited copy is open/.test(offer), `the edited copy opens, with the original one click away: ${offer}`);
        const after = await formula();
        check(after === `${before} # checked`, `the typing is kept: ${JSON.stringify(after)}`);
      },
    },
    {
      name: 'an edited sample reopens as the edited copy, with the original one click away and the copy kept',
      async run({ context, base }) {
        const page = await context.newPage();
        await page.goto(`${base}/?sample=${ADHESIVE}`);
        await settled(page);
        const original = await fieldValue(page, 'coupons', 1, 3);
        await typeInto(page, 'coupons', 1, 3, '26.3');
        await page.goto(`${base}/?sample=${TREAD}`);
        await settled(page);
        await page.goto(`${base}/?sample=${ADHESIVE}`);
        await settled(page);
        const edited = await fieldValue(page, 'coupons', 1, 3);
        check(edited === '26.3', `the edited copy opens: ${edited}`);
        const offer = await bannerText(page);
        check(/edited copy is open/.test(offer), `the offer: ${offer}`);
        await page.locator('furrow-app .banner button.action').click();
        await settled(page);
        await page.waitForFunction(
          (o) => {
            const cell = document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="coupons"] furrow-table-cell');
            return cell?.shadowRoot?.querySelector('[role="gridcell"][data-r="1"][data-c="3"]')?.textContent.trim() === o;
          },
          original,
          { timeout: 10_000 },
        );
        const after = await bannerText(page);
        check(/original .* is open/.test(after) && /kept as/.test(after), `after choosing the original: ${after}`);
        const options = await keptOptions(page);
        const copy = options.find(([, label]) => /lap-shear/.test(label));
        check(copy !== undefined, `the edited copy is kept: ${JSON.stringify(options)}`);
        // the copy still holds the edit
        await page.locator('furrow-app select.kept').selectOption(copy[0]);
        await settled(page);
        const kept = await fieldValue(page, 'coupons', 1, 3);
        check(kept === '26.3', `the kept copy: ${kept}`);
        // and asking for the sample again opens the original, with no offer
        await page.goto(`${base}/?sample=${ADHESIVE}`);
        await settled(page);
        const again = await fieldValue(page, 'coupons', 1, 3);
        check(again === original, `the sample again: ${again}`);
      },
    },
    {
      name: 'the last edit survives a reload made at once, before autosave would have written',
      async run({ context, base }) {
        const page = await context.newPage();
        await page.goto(`${base}/`);
        await settled(page);
        await field(page, 'coupons', 2, 3).click();
        await page.keyboard.type('27.9');
        await page.keyboard.press('Enter');
        // no wait for the pause autosave waits for: the page goes away now
        await page.reload();
        await settled(page);
        const v = await fieldValue(page, 'coupons', 2, 3);
        check(v === '27.9', `the edit after an immediate reload: ${v}`);
      },
    },
    {
      name: 'two tabs on one document are told about each other, and about a save in the other',
      async run({ context, base }) {
        const first = await context.newPage();
        await first.goto(`${base}/?sample=${TREAD}`);
        await settled(first);
        const second = await context.newPage();
        await second.goto(`${base}/?sample=${TREAD}`);
        await settled(second);
        const b1 = await bannerText(first);
        const b2 = await bannerText(second);
        check(/open in another tab/.test(b1), `the first tab is told: ${b1}`);
        check(/open in another tab/.test(b2), `the second tab is told: ${b2}`);
        await first.locator('furrow-app textarea.title').fill('Tread compounds, second look');
        await first.locator('furrow-app textarea.title').press('Enter');
        await second.waitForFunction(() => /Another tab saved/.test(document.querySelector('furrow-app').shadowRoot.querySelector('.banner')?.textContent ?? ''), null, { timeout: 10_000 });
        await second.locator('furrow-app .banner button.action').click();
        await settled(second);
        await second.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('textarea.title').value === 'Tread compounds, second look', null, { timeout: 10_000 });
        // a tab on another document hears nothing
        const third = await context.newPage();
        await third.goto(`${base}/?sample=${ADHESIVE}`);
        await settled(third);
        const b3 = await third.locator('furrow-app .banner').count();
        check(b3 === 0, `a tab on another document shows no banner (${b3})`);
      },
    },
  ];
}
