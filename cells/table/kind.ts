/**
 * The table kind as the rest of the program sees it: `--- table NAME` with a CSV body, or
 * `--- table NAME from FILE` reading a CSV file beside the document. The name lives on the
 * marker line, so the table's own view renames it (in its header) and a fault in the name
 * or the file points at the marker line.
 */
import { freshBody, type Cell } from '../../src/doc/document.ts';
import type { CellKind } from '../../src/graph/cell-kind.ts';
import { analyseTable, readTableMarker, tableMarker, writeTableMarker } from './model.ts';

export const tableKind: CellKind = {
  kind: 'table',
  label: 'table',
  readMarker: readTableMarker,
  template: (fresh) => ({ marker: writeTableMarker(fresh('table'), null), body: freshBody('block,treatment,response\n1,,\n') }),
  nameOf: (cell: Cell) => tableMarker(cell).name,
  filesRead(cell: Cell) {
    const file = tableMarker(cell).file;
    return file === null ? [] : [file];
  },
  printing: { heading: (name) => `table ${name ?? ''}`, faultsOnMarker: true },
  analyse: analyseTable,
};
