// Browser tests of the claims strip at the top of the document: every claim with its state,
// each one a way to its cell.
import { check } from './harness.mjs';
import { settled } from './page.mjs';

/** Whether the cell named `name` lies wholly inside the window. */
async function cellOnScreen(page, name) {
  return page.evaluate((n) => {
    const s = document.querySelector('furrow-app').shadowRoot.querySelector(`section.cell[data-name="${n}"]`);
    if (!s) return false;
    const r = s.getBoundingClientRect();
    return r.top >= 0 && r.bottom <= window.innerHeight && r.height > 0;
  }, name);
}

export function handingTests() {
  return [
    {
      name: 'the claims strip lists every claim with its state at the top, and each claim takes you to its cell',
      async run({ context, base }) {
        const page = await context.newPage();
        await page.goto(`${base}/?fresh`);
        await settled(page);
        const hand = page.locator('furrow-hand-off');
        const strip = hand.locator('.strip');
        await strip.waitFor({ timeout: 10_000 });
        const text = await strip.innerText();
        // the starting sample has three claims, all holding
        check(/All 3 claims hold/.test(text), `strip: ${text}`);
        const claims = await hand.locator('button.claim').allInnerTexts();
        check(claims.length === 3 && claims.every((c) => /^holds/.test(c)), `claims: ${claims.join(' | ')}`);
        // the strip comes before the first cell
        const order = await page.evaluate(() => {
          const root = document.querySelector('furrow-app').shadowRoot;
          const h = root.querySelector('furrow-hand-off');
          const first = root.querySelector('section.cell');
          return h && first ? h.compareDocumentPosition(first) & Node.DOCUMENT_POSITION_FOLLOWING : 0;
        });
        check(order !== 0, 'the claims strip is above the first cell');
        for (const [statement, cell] of [
          ['90C is not shown to differ from 80C', 'no_gain_above_80'],
          ['curing at 80C gives stronger joints than at 60C', 'stronger'],
        ]) {
          await page.evaluate(() => window.scrollTo(0, 0));
          await page.evaluate(() => document.querySelector('furrow-app').shadowRoot.querySelector('furrow-hand-off')?.scrollIntoView());
          check(!(await cellOnScreen(page, cell)), `${cell} is already on screen before the click; the test would prove nothing`);
          await hand.locator('button.claim', { hasText: statement }).click();
          let seen = false;
          for (let i = 0; i < 30 && !seen; i++) {
            await page.waitForTimeout(100);
            seen = await cellOnScreen(page, cell);
          }
          check(seen, `clicking "${statement}" did not bring the cell ${cell} on screen`);
        }
      },
    },
  ];
}
