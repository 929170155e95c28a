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

/**
 * Watches the page's evaluation worker without changing what it does: when each edit is
 * posted (and of what kind), when each result comes back and how long the worker took. The
 * clock of an edit starts at the Enter that commits it (window.__t0, set by the test).
 */
export async function watchEdits(page) {
  await page.evaluate(() => {
    window.__marks = {};
    const w = document.querySelector('furrow-app').bridge.worker;
    const post = w.postMessage.bind(w);
    w.postMessage = (m) => {
      if (m.type === 'edit') {
        window.__marks.post = performance.now();
        window.__marks.editType = m.edit.type;
      }
      post(m);
    };
    w.addEventListener('message', (e) => {
      if (e.data.type === 'result') {
        window.__marks.result = performance.now();
        window.__marks.millis = e.data.millis;
        // the worker's clock and this page's, both since the epoch
        window.__marks.handOver = performance.timeOrigin + performance.now() - e.data.postedAt;
      }
    });
  });
}

/**
 * Arms a clock for the next Enter: from the key's own time stamp to the frame that draws the
 * formula cell `name` showing `expected` (digits compared). The clock watches the page
 * without asking for frames itself: asking for an animation frame from the key's handler
 * changes how Chromium orders the key's work and the worker's answer. Mutation observers
 * note when the text changes (`dom`); an animation frame asked for at that moment gives the
 * frame that draws it (`ms`). Await {@link readEditClock} after pressing Enter.
 */
export function armEditClock(page, name, expected) {
  return page.evaluate(
    ([name, expected]) => {
      const app = document.querySelector('furrow-app').shadowRoot;
      const section = app.querySelector(`section[data-name="${name}"]`);
      const read = () => section?.querySelector('furrow-formula-cell')?.shadowRoot?.querySelector('furrow-value')?.shadowRoot?.textContent ?? '';
      window.__editClock = new Promise((resolve) => {
        let t0 = null;
        let done = false;
        const observers = [];
        const check = () => {
          if (done || t0 === null || read().replace(/[^0-9]/g, '') !== expected) return;
          done = true;
          const dom = performance.now() - t0;
          for (const o of observers) o.disconnect();
          requestAnimationFrame(() => resolve({ ms: performance.now() - t0, dom }));
        };
        // the value's own text, and the elements around it (which a redraw may replace)
        const watch = () => {
          for (const o of observers) o.disconnect();
          observers.length = 0;
          const cell = section?.querySelector('furrow-formula-cell');
          const value = cell?.shadowRoot?.querySelector('furrow-value');
          for (const root of [section, cell?.shadowRoot, value?.shadowRoot]) {
            if (!root) continue;
            const o = new MutationObserver(() => {
              check();
              if (!done) watch();
            });
            o.observe(root, { subtree: true, childList: true, characterData: true });
            observers.push(o);
          }
        };
        watch();
        window.addEventListener(
          'keydown',
          (e) => {
            if (e.key !== 'Enter') return;
            t0 = e.timeStamp;
            // for editParts, which times the edit's parts from the same key
            window.__t0 = t0;
          },
          { capture: true, once: true },
        );
      });
    },
    [name, expected],
  );
}

/** What the armed clock found (see {@link armEditClock}). */
export function readEditClock(page) {
  return page.evaluate(() => window.__editClock);
}

/** When the new value was in the page, and when it was drawn, edit by edit. */
export function clockLine(clocks) {
  const mid = (xs) => [...xs].sort((p, q) => p - q)[Math.floor(xs.length / 2)].toFixed(1);
  return `the new value in the page after ${mid(clocks.map((c) => c.dom))} ms, drawn after ${mid(clocks.map((c) => c.ms))} ms (medians)`;
}

/** Where the last edit's time went: Enter to the edit posted, the worker's own time, Enter to the result back. */
export function editParts(page) {
  return page.evaluate(() => {
    const m = window.__marks;
    return { type: m.editType, post: m.post - window.__t0, worker: m.millis, result: m.result - window.__t0, handOver: m.handOver };
  });
}

/** The medians of several edits' parts, as a line for the measured output. */
export function partsLine(parts) {
  const mid = (key) => [...parts.map((p) => p[key])].sort((a, b) => a - b)[Math.floor(parts.length / 2)].toFixed(1);
  return `of which (medians) Enter to the edit posted ${mid('post')} ms, the worker ${mid('worker')} ms, its result posted to received ${mid('handOver')} ms, Enter to the result back ${mid('result')} ms; edits sent as ${[...new Set(parts.map((p) => p.type))].join(', ')}`;
}
