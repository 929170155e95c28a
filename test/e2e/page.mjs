// Helpers that drive and read the page, shared by the browser tests.

/** The text a cell shows, through shadow roots. */
export async function cellText(page, name) {
  return page.evaluate((n) => {
    const sec = document.querySelector('furrow-app').shadowRoot.querySelector(`section[data-name="${n}"]`);
    if (!sec) return null;
    const walk = (node) => {
      let out = '';
      for (const child of node.childNodes) {
        if (child.nodeType === 3) out += child.textContent;
        else if (child.nodeType === 1) {
          if (child.shadowRoot) out += walk(child.shadowRoot);
          out += walk(child);
          if (/^(DIV|P|LI|TR|H\d|SECTION)$/.test(child.tagName)) out += '\n';
          if (/^(TD|TH)$/.test(child.tagName)) out += ' ';
        }
      }
      return out;
    };
    return walk(sec).replace(/[ \t]+/g, ' ');
  }, name);
}

/** The text of the note that holds a heading or phrase, through shadow roots. */
export async function noteText(page, holding) {
  return page.evaluate((h) => {
    const notes = document.querySelector('furrow-app').shadowRoot.querySelectorAll('section[data-kind="note"] furrow-note-cell');
    for (const el of notes) {
      const t = el.shadowRoot.textContent.replace(/\s+/g, ' ');
      if (t.includes(h)) return t;
    }
    return null;
  }, holding);
}

export async function statusOf(page, name) {
  return page.evaluate((n) => document.querySelector('furrow-app').shadowRoot.querySelector(`section[data-name="${n}"]`)?.dataset.status ?? null, name);
}

/** Waits until the page says every cell is up to date (or has its error). */
export async function settled(page) {
  await page.waitForFunction(() => document.querySelector('furrow-app')?.bridge !== undefined);
  await page.evaluate(() => document.querySelector('furrow-app').settled());
  await page.waitForFunction(() => {
    const app = document.querySelector('furrow-app');
    const secs = app?.shadowRoot?.querySelectorAll('section.cell');
    return secs && secs.length > 0 && [...secs].every((s) => s.dataset.status !== 'pending');
  });
}

/** The analysis-of-variance F of the first row, as shown in the fit cell. */
export async function shownF(page) {
  return page.evaluate(() => {
    const sec = document.querySelector('furrow-app').shadowRoot.querySelector('section[data-name="fit"]');
    const value = sec.querySelector('furrow-formula-cell').shadowRoot.querySelector('furrow-value');
    const tables = value.shadowRoot.querySelectorAll('table');
    for (const t of tables) {
      const head = [...t.querySelectorAll('th')].map((th) => th.textContent.trim());
      const fi = head.indexOf('F');
      if (fi >= 0) return t.querySelector('tbody tr').children[fi].textContent.trim();
    }
    return null;
  });
}

/** A grid field of a table cell. */
export function field(page, table, r, c) {
  return page.locator(`section[data-name="${table}"] furrow-table-cell [role="gridcell"][data-r="${r}"][data-c="${c}"]`);
}

export async function openDocument(page, text, name = 'dropped.furrow') {
  await page.evaluate(
    ({ text, name }) => {
      const dt = new DataTransfer();
      dt.items.add(new File([text], name, { type: 'text/plain' }));
      window.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
    },
    { text, name },
  );
}
