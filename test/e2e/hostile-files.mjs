// Browser tests of hostile files: a document or a data file larger than the page reads is
// refused by its size, in words, before it is read, and nothing on the page is lost; a note
// built to stall the page (a megabyte of unclosed braces) shows in bounded time.
import { check } from './harness.mjs';
import { cellText, openDocument, settled, shownF, statusOf } from './page.mjs';

/** Drops a file of `megabytes` MB (zeros after a first line) on the page. */
async function dropLarge(page, name, megabytes) {
  await page.evaluate(
    ({ name, megabytes }) => {
      const bytes = new Uint8Array(megabytes * 1024 * 1024);
      bytes.set(new TextEncoder().encode('furrow 1\n'));
      const dt = new DataTransfer();
      dt.items.add(new File([bytes], name, { type: 'text/plain' }));
      window.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
    },
    { name, megabytes },
  );
}

export function hostileFileTests() {
  return [
    {
      name: 'a document or a data file past the page limit is refused by its size and nothing on the page is lost',
      async run({ context, base }) {
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        const before = await shownF(page);
        for (const name of ['huge.furrow', 'huge.csv']) {
          await dropLarge(page, name, 70);
          const banner = page.locator('furrow-app .banner.problem');
          await banner.waitFor();
          const text = (await banner.innerText()).replace(/\s+/g, ' ');
          check(text.includes(`${name} was not read: it is larger than the 64 MB that the page reads`), `banner for ${name}: ${text}`);
          check((await shownF(page)) === before, `the document is still there after ${name}`);
          await page.evaluate(() => {
            document.querySelector('furrow-app').banner = null;
          });
        }
      },
    },
    {
      name: 'a note of 1 MB of unclosed braces is one plain error shown with its text, and the page goes on',
      async run({ context, base }) {
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        // 100,000 unclosed braces, each with a source of its own (about 1 MB): far more
        // placeholders than a note may hold (MAX_NOTE_PLACEHOLDERS, 2,000)
        const n = 100_000;
        const note = Array.from({ length: n }, (_, i) => `{"a${i}\n`).join('');
        const started = Date.now();
        await openDocument(page, `furrow 1\ntitle: braces\n\n--- note\n${note}\n--- formula\nx = 2 + 3\n`, 'braces.furrow');
        const line = page.locator('section[data-kind="note"] furrow-note-cell .problems li');
        await line.first().waitFor({ timeout: 60_000 });
        await settled(page);
        const ms = Date.now() - started;
        console.log(`    measured: a note of ${n.toLocaleString('en')} unclosed braces (${note.length.toLocaleString('en')} characters) opened and shown in ${ms} ms`);
        const lines = await line.count();
        const text = (await line.first().innerText()).replace(/\s+/g, ' ');
        check(lines === 1, `one problem line, not ${lines}`);
        check(text.includes(`This note has ${n.toLocaleString('en')} placeholders`) && text.includes('at most 2,000 live values'), `the problem line: ${text.slice(0, 300)}`);
        // the note is its text, in one element, with no slot for a live value
        const shown = await page.locator('section[data-kind="note"] furrow-note-cell').evaluate((el) => ({
          slots: el.shadowRoot.querySelectorAll('[data-slot]').length,
          pre: el.shadowRoot.querySelector('.markdown pre')?.textContent.length ?? 0,
        }));
        check(shown.slots === 0 && shown.pre === note.length - 1, `shown as text: ${JSON.stringify(shown)}`);
        // the page still answers: the formula after the note is evaluated and shown
        const x = await cellText(page, 'x');
        check((await statusOf(page, 'x')) === 'ok' && /(^|\s)5(\s|$)/.test(x ?? ''), `the formula after the note: ${x}`);
        check(ms < 60_000, `shown after ${ms} ms`);
      },
    },
  ];
}
