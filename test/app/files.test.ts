/**
 * The page's limit on the files it reads: a document, a report or a data file past it is
 * refused by the size it states, before a byte of it is read.
 */
import { describe, expect, it } from 'vitest';
import { FileTooLargeError, PAGE_FILE_LIMIT_BYTES, checkFileSize, readFileText } from '../../src/app/files.ts';
import { pageMsg } from '../../src/messages/page.ts';

/** A file that says how large it is and counts the times it is read. */
function statedFile(size: number, name: string) {
  const file = {
    name,
    size,
    reads: 0,
    arrayBuffer: async (): Promise<ArrayBuffer> => {
      file.reads++;
      return new TextEncoder().encode('furrow 1\n').buffer as ArrayBuffer;
    },
  };
  return file;
}

describe('the files the page reads', () => {
  it('a file past the limit is refused in words, and never read', async () => {
    const big = statedFile(600 * 1024 * 1024, 'huge.furrow');
    await expect(readFileText(big as unknown as Blob)).rejects.toThrow(new FileTooLargeError('huge.furrow', PAGE_FILE_LIMIT_BYTES));
    expect(big.reads).toBe(0);
    expect(() => checkFileSize(statedFile(PAGE_FILE_LIMIT_BYTES + 1, 'plots.csv'))).toThrow(pageMsg.fileTooLarge('plots.csv', PAGE_FILE_LIMIT_BYTES));
    expect(pageMsg.fileTooLarge('plots.csv', PAGE_FILE_LIMIT_BYTES)).toMatch(/^plots\.csv was not read: it is larger than the 64 MB that the page reads\. Nothing on the page was changed/);
  });
  it('a file at the limit is read', async () => {
    const at = statedFile(PAGE_FILE_LIMIT_BYTES, 'at.furrow');
    expect(await readFileText(at as unknown as Blob)).toBe('furrow 1\n');
    expect(at.reads).toBe(1);
  });
});
