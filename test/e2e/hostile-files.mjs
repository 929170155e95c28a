// Browser tests of files past the page's size limit: a document or a data file larger than
// the page reads is refused by its size, in words, before it is read, and nothing on the page
// is lost.
import { check } from './harness.mjs';
import { settled, shownF } from './page.mjs';

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
  ];
}
