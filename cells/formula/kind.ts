/**
 * The formula kind as the rest of the program sees it: `--- formula`, and a body that is
 * one statement. Its name is the one before `=`, so a rename from the margin rewrites the
 * start of the body.
 */
import type { Cell } from '../../src/doc/document.ts';
import type { CellKind } from '../../src/graph/cell-kind.ts';
import { analyseFormula } from './model.ts';

/** `name =` at the start of a body (not `name ==`). */
const DEFINES = /^\s*([A-Za-z_][A-Za-z0-9_]*)\s*=(?!=)/;

export const formulaKind: CellKind = {
  kind: 'formula',
  label: 'formula',
  readMarker: (rest) => ({ name: null, file: null, extra: rest.split(/[ \t]+/).filter((w) => w.length > 0) }),
  // the space after "=" stays, ready for typing
  template: (fresh) => ({ marker: 'formula', body: `${fresh('value')} = \n\n` }),
  nameOf: (cell: Cell) => DEFINES.exec(cell.body)?.[1] ?? null,
  rename(cell: Cell, name: string) {
    const body = DEFINES.test(cell.body)
      ? cell.body.replace(/^(\s*)[A-Za-z_][A-Za-z0-9_]*/, `$1${name}`)
      : `${name} = ${cell.body.replace(/^\s+/, '')}`;
    return { marker: cell.marker, body };
  },
  filesRead: () => [],
  printing: { heading: (name) => (name === null ? 'formula' : `formula ${name}`), faultsOnMarker: false },
  analyse: analyseFormula,
};
