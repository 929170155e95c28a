import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/doc/csv.ts';
import { CsvError } from '../../src/doc/csv-error.ts';
import { writeCsv } from '../../src/doc/csv-write.ts';
import { columnFromFields } from '../../cells/table/model.ts';
import { toJson } from '../../src/lang/json.ts';
import { msg } from '../../src/messages/language.ts';

function csvError(text: string): CsvError {
  try {
    parseCsv(text);
  } catch (e) {
    if (e instanceof CsvError) return e;
    throw e;
  }
  throw new Error('expected a CSV error');
}

describe('CSV bodies (RFC 4180)', () => {
  it('reads quoted fields with commas, quotes and line breaks', () => {
    const g = parseCsv('name,note\n"Smith, J.","said ""hi""\nthen left"\nplain,x\n\n');
    expect(g.header).toEqual(['name', 'note']);
    expect(g.rows).toEqual([
      ['Smith, J.', 'said "hi"\nthen left'],
      ['plain', 'x'],
    ]);
  });
  it('reads CRLF line ends', () => {
    expect(parseCsv('a,b\r\n1,2\r\n').rows).toEqual([['1', '2']]);
  });
  it('gives the range of a ragged row, counted from the first data row', () => {
    const text = 'block,trt,y\n1,a,10\n1,b\n2,a,11\n';
    const e = csvError(text);
    expect(e.message).toBe(msg.raggedRow(2, 2, 3));
    expect(text.slice(e.from, e.to)).toBe('1,b');
  });
  it('refuses a header that repeats a name or leaves one empty', () => {
    expect(csvError('y,trt,y\n1,a,2\n').message).toMatch(/names the column "y" twice \(columns 1 and 3\)/);
    expect(csvError('y,,z\n1,2,3\n').message).toMatch(/Column 2 has no name/);
    expect(csvError('\n\n').message).toMatch(/no header row/);
  });
  it('reports an unclosed quote', () => {
    expect(csvError('a,b\n1,"open\n').message).toMatch(/quoted field that is never closed/);
  });
  it('writes what it reads', () => {
    const header = ['name', 'value'];
    const rows = [
      ['a, b', '1'],
      ['q"r', ''],
      ['line\nbreak', '2'],
    ];
    const g = parseCsv(writeCsv(header, rows));
    expect(g.rows).toEqual(rows);
    // one column: an empty field must survive
    expect(parseCsv(writeCsv(['x'], [['1'], [''], ['3']])).rows).toEqual([['1'], [''], ['3']]);
  });
});

describe('column types from fields', () => {
  it('numbers when every non-empty field is a decimal, keeping the text', () => {
    const c = columnFromFields('y', ['1000000000000.4', '', '-2.5e-3', ' 7 ']);
    expect(c.type).toBe('number');
    expect(toJson(c)).toBe('[1000000000000.4,null,-0.0025,7]');
    if (c.type === 'number') expect(c.decimals).toEqual(['1000000000000.4', '', '-2.5e-3', '7']);
  });
  it('text as soon as one field is not a number, never a silent conversion', () => {
    const c = columnFromFields('y', ['1.5', 'n/a', '2']);
    expect(c.type).toBe('text');
    expect(toJson(c)).toBe('["1.5","n/a","2"]');
    expect(columnFromFields('y', ['1,5']).type).toBe('text');
    expect(columnFromFields('y', ['0x10']).type).toBe('text');
    expect(columnFromFields('y', ['NaN']).type).toBe('text');
  });
  it('booleans when every field is true or false', () => {
    expect(toJson(columnFromFields('ok', ['true', '', 'false']))).toBe('[true,null,false]');
  });
});
