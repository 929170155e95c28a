import { describe, expect, it } from 'vitest';
import { blockToTsv, detectBlockFormat, readBlock } from '../../../cells/table/grid-paste.ts';
import { gridMsg } from '../../../src/messages/grid.ts';

function rows(text: string): readonly (readonly string[])[] {
  const b = readBlock(text);
  if (!b.ok) throw new Error(b.message);
  return b.rows;
}

describe('what a paste holds', () => {
  it('text with a tab is tab-separated; with line breaks and no tab, CSV; one line, one value', () => {
    expect(detectBlockFormat('7\tvase\t39.0\r\n8\topen\t44,1\r\n')).toBe('tsv');
    expect(detectBlockFormat('a,b\n1,2\n')).toBe('csv');
    expect(detectBlockFormat('12,5')).toBe('field');
    expect(detectBlockFormat('12,5\n')).toBe('field');
    expect(detectBlockFormat('Smith, J.')).toBe('field');
  });
  it('reads a spreadsheet block of three columns as three columns, commas kept inside fields', () => {
    expect(rows('7\tvase\t39.0\r\n8\topen\t44,1\r\n')).toEqual([
      ['7', 'vase', '39.0'],
      ['8', 'open', '44,1'],
    ]);
  });
  it("reads a spreadsheet's quoted field with a line break or a tab", () => {
    expect(rows('a\t"two\nlines"\n"x\ty"\tb')).toEqual([
      ['a', 'two\nlines'],
      ['x\ty', 'b'],
    ]);
    // a quote inside a field is text
    expect(rows('5" pipe\tb\n')).toEqual([['5" pipe', 'b']]);
    // an unclosed quote: read as plain lines and tabs rather than lose anything
    expect(rows('"open\tb\nc\td')).toEqual([
      ['"open', 'b'],
      ['c', 'd'],
    ]);
  });
  it('reads CSV with quotes, and pads short rows to a rectangle', () => {
    expect(rows('a,"b, c"\n1\n')).toEqual([
      ['a', 'b, c'],
      ['1', ''],
    ]);
  });
  it('keeps empty lines inside a block as empty rows', () => {
    expect(rows('a\n\nb\n')).toEqual([['a'], [''], ['b']]);
  });
  it('says why CSV cannot be read, and refuses nothing to paste', () => {
    expect(readBlock('a,b\n1,"open\n')).toEqual({ ok: false, message: gridMsg.pasteQuote(2) });
    expect(readBlock('')).toEqual({ ok: false, message: gridMsg.pasteEmpty() });
    expect(readBlock('\n')).toEqual({ ok: false, message: gridMsg.pasteEmpty() });
  });
  it('takes one quoted value out of its quotes', () => {
    expect(rows('"a ""b"", c"')).toEqual([['a "b", c']]);
  });
});

describe('copying a block', () => {
  it('writes tab-separated text that pastes back as the same fields', () => {
    const blocks = [
      [
        ['1', 'open', '41.2'],
        ['2', 'a\tb', 'say "x"'],
        ['', 'line\nbreak', 'c, d'],
      ],
      [['Smith, J.'], ['12,5'], ['']],
      [['only']],
      [['x, y']],
      [['', ''], ['', '']],
    ];
    for (const b of blocks) expect(rows(blockToTsv(b))).toEqual(b);
    expect(blockToTsv([['1', 'open'], ['2', 'vase']])).toBe('1\topen\n2\tvase');
  });
});
