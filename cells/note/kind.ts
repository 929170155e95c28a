/**
 * The note kind as the rest of the program sees it: `--- note`, and Markdown prose whose
 * `{...}` placeholders show live values. A note defines no name.
 */
import { freshBody } from '../../src/doc/document.ts';
import type { CellKind } from '../../src/graph/cell-kind.ts';
import { analyseNote } from './model.ts';

export const noteKind: CellKind = {
  kind: 'note',
  label: 'note',
  readMarker: (rest) => ({ name: null, file: null, extra: rest.split(/[ \t]+/).filter((w) => w.length > 0) }),
  template: () => ({ marker: 'note', body: freshBody('') }),
  nameOf: () => null,
  filesRead: () => [],
  printing: { heading: () => 'note', faultsOnMarker: false },
  analyse: analyseNote,
};
