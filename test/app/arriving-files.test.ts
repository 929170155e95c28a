/**
 * The page's data files when documents are opened one after another: a document's tables
 * must read its own files, never a file of the same name left by the document open before.
 */
import { describe, expect, it } from 'vitest';
import { ArrivingFiles, type ArrivalsHost } from '../../src/app/arriving-files.ts';
import { emptyDocument } from '../../src/doc/document.ts';

function host(): ArrivalsHost & { sent: [string, string | undefined][] } {
  const sent: [string, string | undefined][] = [];
  return {
    sent,
    doc: emptyDocument(),
    importing: null,
    say: () => {},
    toWorker: (name, text) => sent.push([name, text]),
    touched: () => {},
    append: () => {},
  };
}

const settle = (): Promise<void> => new Promise((r) => setTimeout(r, 0));

describe('files of the documents opened in the page', () => {
  it('are replaced by the files of the next document, and the worker forgets the others', async () => {
    const h = host();
    const files = new ArrivingFiles(h);
    files.replaceWith([
      ['plots.csv', 'y\n1\n'],
      ['doses.csv', 'd\n2\n'],
    ]);
    await settle();
    expect([...files.files.keys()].sort()).toEqual(['doses.csv', 'plots.csv']);
    h.sent.length = 0;
    // the next document brings its own plots.csv and nothing else
    files.replaceWith([['plots.csv', 'y\n7\n']]);
    await settle();
    expect([...files.files]).toEqual([['plots.csv', 'y\n7\n']]);
    expect(h.sent).toEqual([
      ['doses.csv', undefined],
      ['plots.csv', 'y\n7\n'],
    ]);
    // a document that brings no files leaves none behind: its tables say the file is missing
    h.sent.length = 0;
    files.replaceWith([]);
    await settle();
    expect(files.files.size).toBe(0);
    expect(h.sent).toEqual([['plots.csv', undefined]]);
  });
});
