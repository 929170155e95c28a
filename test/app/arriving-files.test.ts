/**
 * The page's data files when documents are opened one after another: a document's tables
 * must read its own files, never a file of the same name left by the document open before,
 * not even for the moment before the new file's text arrives; and files kept with a
 * document's very text come back when it is opened again from a file that does not carry them.
 */
import { describe, expect, it } from 'vitest';
import { ArrivingFiles, type ArrivalsHost } from '../../src/app/arriving-files.ts';
import { emptyDocument } from '../../src/doc/document.ts';

function host(): ArrivalsHost & { sent: [string, string | undefined][]; touches: number } {
  const h = {
    sent: [] as [string, string | undefined][],
    touches: 0,
    doc: emptyDocument(),
    importing: null,
    say: () => {},
    toWorker: (name: string, text: string | undefined) => void h.sent.push([name, text]),
    touched: () => void h.touches++,
    append: () => {},
  };
  return h;
}

const settle = (): Promise<void> => new Promise((r) => setTimeout(r, 0));

describe('files of the documents opened in the page', () => {
  it('are replaced by the files of the next document, and the worker forgets the others at once', async () => {
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
    // before any text is decoded, the worker has already forgotten both old files
    expect(h.sent).toEqual([
      ['plots.csv', undefined],
      ['doses.csv', undefined],
    ]);
    await settle();
    expect([...files.files]).toEqual([['plots.csv', 'y\n7\n']]);
    expect(h.sent.at(-1)).toEqual(['plots.csv', 'y\n7\n']);
    // the same file again: nothing to forget or send
    h.sent.length = 0;
    files.replaceWith([['plots.csv', 'y\n7\n']]);
    await settle();
    expect(h.sent).toEqual([]);
    // a document that brings no files leaves none behind: its tables say the file is missing
    files.replaceWith([]);
    await settle();
    expect(files.files.size).toBe(0);
    expect(h.sent).toEqual([['plots.csv', undefined]]);
  });

  it('kept with the same text, come back when the document is opened again, without displacing a file it brought', async () => {
    const h = host();
    const files = new ArrivingFiles(h);
    files.replaceWith([['doses.csv', 'd\n9\n']]);
    await settle();
    h.sent.length = 0;
    const taken = files.restore([
      ['plots.csv', 'y\n1\n'],
      ['doses.csv', 'd\n2\n'],
    ]);
    expect(taken).toEqual(['plots.csv']);
    await settle();
    expect(files.files.get('plots.csv')).toBe('y\n1\n');
    expect(files.files.get('doses.csv')).toBe('d\n9\n');
    expect(h.sent).toEqual([['plots.csv', 'y\n1\n']]);
    // the document's kept state changed: it is saved with the file again
    expect(h.touches).toBe(1);
    expect(files.restore([['plots.csv', 'y\n1\n']])).toEqual([]);
    expect(h.touches).toBe(1);
    // left out again at the user's word: the worker forgets them, the document is saved without
    h.sent.length = 0;
    files.drop(['plots.csv', 'never-there.csv']);
    expect(files.files.has('plots.csv')).toBe(false);
    expect(h.sent).toEqual([['plots.csv', undefined]]);
    expect(h.touches).toBe(2);
  });
});
