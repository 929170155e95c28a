// Browser tests of adding data as a table: a workbook dropped on the page (a sheet chosen),
// and a CSV file opened with Open…, each offered as a new table cell that evaluates.
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { check } from './harness.mjs';
import { cellText, openDocument, settled, statusOf } from './page.mjs';

const WORKBOOK = readFileSync(new URL('../app/fixtures/strip-trial.xlsx', import.meta.url)).toString('base64');

async function dropBytes(page, name, base64) {
  await page.evaluate(
    ({ name, base64 }) => {
      const bytes = Uint8Array.from(atob(base64), (ch) => ch.charCodeAt(0));
      const dt = new DataTransfer();
      dt.items.add(new File([bytes], name));
      window.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
    },
    { name, base64 },
  );
}

async function tableBody(page, name) {
  return page.evaluate((n) => document.querySelector('furrow-app').shadowRoot.querySelector(`section[data-name="${n}"] furrow-table-cell`)?.cell.body ?? null, name);
}

const PARQUET = 'test/doc/fixtures/parquet/alltypes_plain.parquet';
const PARQUET_DOC = 'furrow 1\ntitle: Parquet beside the document\n\n--- table types from alltypes.parquet\n\n--- formula\ntotal = sum(types.double_col)\n';

export function importingTests() {
  return [
    {
      name: 'a Parquet file dropped for the table that names it evaluates, and a seal made on the command line verifies in the page',
      async run({ context, base }) {
        const dir = 'test-output/e2e/parquet';
        mkdirSync(dir, { recursive: true });
        writeFileSync(join(dir, 'types.furrow'), PARQUET_DOC);
        copyFileSync(PARQUET, join(dir, 'alltypes.parquet'));
        const sealed = spawnSync(process.execPath, ['bin/furrow.js', 'seal', join(dir, 'types.furrow')], { encoding: 'utf8' });
        check(sealed.status === 0, `sealed on the command line: ${sealed.stderr}`);
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        await openDocument(page, readFileSync(join(dir, 'types.furrow'), 'utf8'), 'types.furrow');
        await page.waitForFunction(() => /Parquet beside/.test(document.querySelector('furrow-app').shadowRoot.querySelector('textarea.title')?.value ?? ''));
        await dropBytes(page, 'alltypes.parquet', readFileSync(PARQUET).toString('base64'));
        await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="types"]')?.dataset.status === 'ok', null, { timeout: 20_000 });
        await settled(page);
        const total = await cellText(page, 'total');
        check(/40\.4/.test(total), `the total of the Parquet column: ${total}`);
        const v = page.locator('furrow-hand-off .verdict');
        await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('furrow-hand-off')?.shadowRoot?.querySelector('.verdict')?.getAttribute('data-verdict') === 'verified', null, { timeout: 20_000 }).catch(() => {});
        const verdict = await v.getAttribute('data-verdict');
        check(verdict === 'verified', `verdict in the page: ${verdict}: ${await v.innerText()}`);
      },
    },
    {
      name: "a document opened after another never reads the other's data file of the same name",
      async run({ context, base }) {
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        const named = (title, total) => `furrow 1\ntitle: ${title}\n\n--- table plots from plots.csv\n\n--- formula\n${total} = sum(plots.y)\n`;
        await openDocument(page, named('First trial', 'first_total'), 'first.furrow');
        await page.waitForFunction(() => /First trial/.test(document.querySelector('furrow-app').shadowRoot.querySelector('textarea.title')?.value ?? ''));
        await dropBytes(page, 'plots.csv', Buffer.from('y\n1.5\n2.5\n').toString('base64'));
        await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="plots"]')?.dataset.status === 'ok', null, { timeout: 20_000 });
        await settled(page);
        check(/\b4\b/.test(await cellText(page, 'first_total')), `the first trial reads its file: ${await cellText(page, 'first_total')}`);
        // the second trial names a file of the same name but brings none
        await openDocument(page, named('Second trial', 'second_total'), 'second.furrow');
        await page.waitForFunction(() => /Second trial/.test(document.querySelector('furrow-app').shadowRoot.querySelector('textarea.title')?.value ?? ''));
        await settled(page);
        const status = await statusOf(page, 'plots');
        check(status === 'error', `the second trial's table has no file to read: ${status}`);
        const banner = await page.locator('furrow-app .banner').innerText().catch(() => '');
        check(/plots\.csv/.test(banner), `the page says which file is missing: ${JSON.stringify(banner)}`);
        check(!/\b4\b/.test(await cellText(page, 'second_total')), `no total from the first trial's file: ${await cellText(page, 'second_total')}`);
        // the first trial opened again from its file, which carries no data: the file attached
        // to it is taken back from the browser's keeping, not lost
        await openDocument(page, named('First trial', 'first_total'), 'first.furrow');
        await page.waitForFunction(() => /First trial/.test(document.querySelector('furrow-app').shadowRoot.querySelector('textarea.title')?.value ?? ''));
        await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="plots"]')?.dataset.status === 'ok', null, { timeout: 20_000 });
        await settled(page);
        check(/\b4\b/.test(await cellText(page, 'first_total')), `the first trial reads its own file again: ${await cellText(page, 'first_total')}`);
        // the page says where the file came from, with one click to leave it out
        const said = await page.locator('furrow-app .banner').innerText();
        check(/plots\.csv as it was kept in this browser/.test(said), `the banner names the file taken back: ${JSON.stringify(said)}`);
        check((await page.locator('furrow-app .banner button.action', { hasText: 'Leave them out' }).count()) === 1, 'one click leaves it out');
        await page.evaluate(() => document.querySelector('furrow-app').keeper.flush());
        const keptFiles = await page.evaluate(() => document.querySelector('furrow-app').files.get('plots.csv') ?? null);
        check(keptFiles === 'y\n1.5\n2.5\n', `the page holds the file again: ${JSON.stringify(keptFiles)}`);
        // the user says the file belongs to another copy: it is left out, and the table says it is missing
        await page.locator('furrow-app .banner button.action', { hasText: 'Leave them out' }).click();
        await page.waitForFunction(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="plots"]')?.dataset.status === 'error', null, { timeout: 20_000 });
        check((await page.evaluate(() => document.querySelector('furrow-app').files.has('plots.csv'))) === false, 'the file is left out');
        await page.close();
      },
    },
    {
      name: 'a workbook dropped on the page is offered as a table, its sheet chosen, numbers exact',
      async run({ context, base, out }) {
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        const cellsBefore = await page.locator('furrow-app section.cell').count();
        await dropBytes(page, 'strip-trial.xlsx', WORKBOOK);
        const offer = page.locator('furrow-app furrow-import-offer');
        await offer.locator('form').waitFor({ timeout: 10_000 });
        check(/strip-trial\.xlsx/.test(await offer.locator('form').innerText()), 'the offer names the file');
        check((await offer.locator('input.name').inputValue()) === 'plots', 'the first sheet names the table');
        await page.screenshot({ path: `${out}/import-offer.png` });
        // the second sheet, then back to the first, and add it
        await offer.locator('select.sheet').selectOption({ label: 'field notes' });
        check((await offer.locator('input.name').inputValue()) === 'field_notes', 'the sheet chosen names the table');
        await offer.locator('select.sheet').selectOption({ label: 'plots' });
        check(/4 rows × 4 columns/.test(await offer.locator('form').innerText()), `the size is shown: ${await offer.locator('form').innerText()}`);
        await offer.locator('button.add').click();
        await settled(page);
        check((await page.locator('furrow-app furrow-import-offer').count()) === 0, 'the offer is gone');
        check((await page.locator('furrow-app section.cell').count()) === cellsBefore + 1, 'one cell added');
        check((await statusOf(page, 'plots')) === 'ok', `the table evaluates: ${await statusOf(page, 'plots')}`);
        const body = await tableBody(page, 'plots');
        check(body.startsWith('strip,width (mm),runoff,sown\nA,250,0.30000000000000004,2026-04-03\nB,500,4.2,2026-04-04\n'), `body: ${JSON.stringify(body)}`);
        // a formula reads it
        const text = await cellText(page, 'plots');
        check(/runoff/.test(text), 'the new table shows its columns');
        // one step of undo takes it away
        await page.locator('furrow-app button', { hasText: 'Undo' }).click();
        await settled(page);
        check((await page.locator('furrow-app section.cell').count()) === cellsBefore, 'undo removes the added table');
      },
    },
    {
      name: 'a CSV file opened with Open… is offered as a table; a name already used is refused',
      async run({ context, base }) {
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        // the browser's file picker, answered by the test
        await page.evaluate(() => {
          window.showOpenFilePicker = async () => [
            { kind: 'file', name: 'coupons.csv', getFile: async () => new File(['plot,shear\n1,24.5\n2,25.25\n'], 'coupons.csv') },
          ];
        });
        await page.locator('furrow-app nav button', { hasText: 'Open…' }).click();
        const offer = page.locator('furrow-app furrow-import-offer');
        await offer.locator('form').waitFor({ timeout: 10_000 });
        // the sample already has a table named coupons: the suggested name avoids it
        const suggested = await offer.locator('input.name').inputValue();
        check(suggested === 'coupons_2', `suggested name: ${suggested}`);
        await offer.locator('input.name').fill('coupons');
        check(/already has a cell named coupons/.test(await offer.locator('form').innerText()), 'a taken name is refused');
        check(await offer.locator('button.add').isDisabled(), 'and cannot be added');
        await offer.locator('input.name').fill('coupon_recheck');
        await offer.locator('button.add').click();
        await settled(page);
        check((await statusOf(page, 'coupon_recheck')) === 'ok', 'the CSV table evaluates');
        check((await tableBody(page, 'coupon_recheck')) === 'plot,shear\n1,24.5\n2,25.25\n\n', `body: ${JSON.stringify(await tableBody(page, 'coupon_recheck'))}`);
        check(/lap-shear/.test(await page.locator('furrow-app textarea.title').inputValue()), 'the open document stays open');
      },
    },
  ];
}
