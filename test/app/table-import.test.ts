// Opening a CSV file or a workbook as a table. The workbook is test/app/fixtures/strip-trial.xlsx,
// written by openpyxl 3.0.9 (strip-trial.py beside it), with two numbers stored the 17-digit
// way some spreadsheet writers store them.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readDocument, writeDocument } from '../../src/doc/format.ts';
import { CELL_KINDS } from '../../cells/kinds.ts';
import {
  csvSource,
  importedTableCell,
  namesTaken,
  sheetOf,
  tableNameFor,
  workbookSource,
} from '../../src/app/table-import.ts';
import { isoDateText, shortestNumberText } from '../../src/doc/field-text.ts';
import { Engine } from '../../src/graph/engine.ts';
import { BUILTINS } from '../../src/functions/index.ts';
import type { Table } from '../../src/lang/values.ts';

const WORKBOOK = new Uint8Array(readFileSync(new URL('./fixtures/strip-trial.xlsx', import.meta.url)));

describe('numbers and dates of a sheet', () => {
  it('a stored number becomes the shortest text that reads back as the same double', () => {
    expect(shortestNumberText('4.2000000000000002')).toBe('4.2');
    expect(shortestNumberText('0.30000000000000004')).toBe('0.30000000000000004');
    expect(shortestNumberText('1e-07')).toBe('1e-7');
    expect(shortestNumberText('250')).toBe('250');
    for (const t of ['4.2000000000000002', '0.30000000000000004', '1e-07', '123456789.12345679']) {
      expect(Number(shortestNumberText(t))).toBe(Number(t));
    }
  });

  it('dates as ISO text, with the time only when it is not midnight', () => {
    expect(isoDateText(new Date(Date.UTC(2026, 3, 3)))).toBe('2026-04-03');
    expect(isoDateText(new Date(Date.UTC(2026, 3, 3, 14, 5, 9)))).toBe('2026-04-03T14:05:09');
  });

  it('a sheet: empty rows dropped, short rows padded, empty names named', () => {
    const s = sheetOf('x', [[], ['a', null, 'c'], [1, 2], [null, null, null], ['u', 'v', 'w', '']]);
    expect(s.header).toEqual(['a', 'column_2', 'c']);
    expect(s.rows).toEqual([['1', '2', ''], ['u', 'v', 'w']]);
  });
});

describe('a workbook', () => {
  it('reads every sheet, numbers exact, dates as ISO dates', async () => {
    const src = await workbookSource('strip-trial.xlsx', WORKBOOK);
    expect(src.sheets.map((s) => s.label)).toEqual(['plots', 'field notes']);
    const plots = src.sheets[0]!;
    expect(plots.header).toEqual(['strip', 'width (mm)', 'runoff', 'sown']);
    expect(plots.rows).toEqual([
      ['A', '250', '0.30000000000000004', '2026-04-03'],
      ['B', '500', '4.2', '2026-04-04'],
      ['C', '750', '', '2026-04-05'],
      ['D', '1000', '1e-7', ''],
    ]);
    expect(src.sheets[1]!.rows).toEqual([['1', 'rain, 12 mm'], ['2', 'said "dry"']]);
  });

  it('refuses bytes that are not a workbook with a plain message', async () => {
    await expect(workbookSource('broken.xlsx', new TextEncoder().encode('plot,y\n1,2\n'))).rejects.toThrow(/broken\.xlsx could not be read as a workbook/);
  });
});

describe('adding a sheet as a table cell', () => {
  it('names the table from the sheet, unique in the document', () => {
    expect(tableNameFor('Field notes 2026.xlsx', new Set())).toBe('field_notes_2026');
    expect(tableNameFor('plots', new Set(['plots']))).toBe('plots_2');
    expect(tableNameFor('2026 plots.csv', new Set())).toBe('table_2026_plots');
    expect(tableNameFor('Überdüngung.csv', new Set())).toBe('uberdungung');
    expect(tableNameFor('True', new Set())).toBe('true_table');
  });

  it('the new cell is written, read back and evaluated as a table, fields quoted where needed', async () => {
    const doc = readDocument('furrow 1\ntitle: Strips\n\n', { kinds: CELL_KINDS }).document;
    const src = await workbookSource('strip-trial.xlsx', WORKBOOK);
    const notes = src.sheets[1]!;
    const cell = importedTableCell(doc, tableNameFor(notes.label, namesTaken(doc)), notes);
    const plots = src.sheets[0]!;
    const withNotes = { ...doc, cells: [cell] };
    const cell2 = importedTableCell(withNotes, tableNameFor(plots.label, namesTaken(withNotes)), plots);
    const text = writeDocument({ ...doc, cells: [cell, cell2] });
    expect(text).toContain('--- table field_notes\nday,remark\n1,"rain, 12 mm"\n2,"said ""dry"""\n');
    const again = readDocument(text, { kinds: CELL_KINDS }).document;
    const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
    engine.update(again);
    const states = engine.states();
    expect(states.map((s) => [s.name, s.status])).toEqual([['field_notes', 'ok'], ['plots', 'ok']]);
    const plotsValue = states[1]!.value as Table;
    expect(plotsValue.kind).toBe('table');
    const runoff = plotsValue.columns[plotsValue.names.indexOf('runoff')];
    expect(runoff?.type).toBe('number');
    if (runoff?.type !== 'number') return;
    expect([...runoff.values].slice(0, 2)).toEqual([0.1 + 0.2, 4.2]);
    expect(runoff.missing?.[2]).toBe(1);
  });

  it('a CSV file is one sheet; bytes that are not UTF-8 are refused', () => {
    const src = csvSource('plots.csv', new TextEncoder().encode('plot,y\n1,2.5\n2,3\n'));
    expect(src.sheets).toEqual([{ label: 'plots.csv', header: ['plot', 'y'], rows: [['1', '2.5'], ['2', '3']] }]);
    expect(() => csvSource('bad.csv', new Uint8Array([0x70, 0xff, 0x0a]))).toThrow();
  });
});
