// Browser tests of data safety: the browser closed in the middle of an edit, then opened
// again on the same profile, still has the edit. Each test launches its own Chromium with a
// profile folder of its own (the harness's contexts start empty every time). The window is
// closed as a person closes it (the page is told it goes away), then the browser quits.
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import { check } from './harness.mjs';
import { field, settled } from './page.mjs';

const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-quic', '--no-first-run'];

function launch(profile) {
  return chromium.launchPersistentContext(profile, { executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium', args: ARGS });
}

/** The formula editor of a cell, made if it is not yet (editors appear as cells scroll into view). */
async function formulaEditor(page, name) {
  const editor = page.locator(`section[data-name="${name}"] furrow-formula-cell`);
  await page.locator(`section[data-name="${name}"]`).scrollIntoViewIfNeeded();
  try {
    await editor.locator('.cm-content').waitFor({ timeout: 5000 });
  } catch {
    await editor.locator('.static').first().click();
    await editor.locator('.cm-content').waitFor();
  }
  return editor.locator('.cm-content');
}

/**
 * Closes the window as a person does (the page hears that it goes away), then quits. The
 * pause stands for the browser's own way out, which writes its storage to disk; the test
 * driver's quit does not wait for that, as a crash would not.
 */
async function closeWindow(page, browser) {
  // with runBeforeUnload the close is only asked for: wait until the page has gone
  const gone = page.waitForEvent('close');
  await page.close({ runBeforeUnload: true });
  await gone;
  await new Promise((resolve) => setTimeout(resolve, 500));
  await browser.close();
}

/**
 * Opens the sample on a profile of its own, does `act` (which ends mid-edit), closes the
 * window at once, opens the browser again on the same profile and runs `verify` on the page.
 */
async function acrossClosing(base, act, verify) {
  const profile = mkdtempSync(join(tmpdir(), 'furrow-profile-'));
  let browser = await launch(profile);
  const page = await browser.newPage();
  await page.goto(`${base}/`);
  await settled(page);
  await act(page);
  // the window is closed at once, before autosave's pause has passed
  await closeWindow(page, browser);
  browser = await launch(profile);
  try {
    const again = await browser.newPage();
    await again.goto(`${base}/`);
    await settled(again);
    await verify(again);
  } finally {
    await browser.close();
  }
}

export const closingTests = [
  {
    name: 'the browser closed in the middle of typing a field, then opened again, keeps the edit',
    run: ({ base }) =>
      acrossClosing(
        base,
        async (page) => {
          await field(page, 'coupons', 3, 3).click();
          await page.keyboard.type('28.4');
          await page.keyboard.press('Enter');
        },
        async (page) => {
          const v = (await field(page, 'coupons', 3, 3).innerText()).trim();
          check(v === '28.4', `the field after the browser was closed and opened again: ${v}`);
        },
      ),
  },
  {
    name: 'the browser closed while a formula is being typed, then opened again, keeps what was typed',
    run: ({ base }) =>
      acrossClosing(
        base,
        async (page) => {
          const content = await formulaEditor(page, 'gain');
          await content.click();
          await page.keyboard.press('End');
          // no pause after typing: the editor has not yet handed its text over
          await page.keyboard.type(' * 2');
        },
        async (page) => {
          const text = await page.evaluate(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="gain"] furrow-formula-cell').cell.body);
          check(/\* 2\s*$/.test(text), `the formula after the browser was closed and opened again: ${JSON.stringify(text)}`);
        },
      ),
  },
  {
    name: 'the browser closed while a table field is being typed (not yet entered) keeps what was typed',
    run: ({ base }) =>
      acrossClosing(
        base,
        async (page) => {
          await field(page, 'coupons', 4, 3).click();
          // no Enter: the field's editor still holds the text when the window goes
          await page.keyboard.type('29.7');
        },
        async (page) => {
          const v = (await field(page, 'coupons', 4, 3).innerText()).trim();
          check(v === '29.7', `the field after the browser was closed and opened again: ${v}`);
        },
      ),
  },
  {
    name: 'the browser closed while a note is being written keeps what was typed',
    run: ({ base }) =>
      acrossClosing(
        base,
        async (page) => {
          const note = page.locator('section[data-kind="note"] furrow-note-cell').first();
          await note.scrollIntoViewIfNeeded();
          await note.locator('.prose').dblclick();
          const ta = note.locator('textarea');
          await ta.waitFor();
          await ta.press('Control+End');
          // no pause and no click outside: the window goes while the note is open for writing
          await page.keyboard.type(' Read again before closing.');
        },
        async (page) => {
          const text = await page.evaluate(() => document.querySelector('furrow-app').shadowRoot.querySelector('section[data-kind="note"] furrow-note-cell').cell.body);
          check(/ Read again before closing\.\s*$/.test(text), `the note after the browser was closed and opened again: ${JSON.stringify(text.slice(-80))}`);
        },
      ),
  },
];
