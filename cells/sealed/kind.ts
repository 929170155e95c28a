/**
 * The closing `--- sealed` section of a sealed document (docs/language.md section 6): known, so
 * it draws no warning, and kept as written; it is read by sealing and verifying, never
 * evaluated, and the page does not offer to add one.
 */
import type { CellKind } from '../../src/graph/cell-kind.ts';
import { MISSING } from '../../src/lang/values.ts';

export const sealedKind: CellKind = {
  kind: 'sealed',
  label: 'sealed',
  readMarker: (rest) => ({ name: null, file: null, extra: rest.split(/[ \t]+/).filter((w) => w.length > 0) }),
  nameOf: () => null,
  filesRead: () => [],
  printing: { heading: () => 'sealed', faultsOnMarker: false },
  analyse: () => ({ defines: null, reads: [], problem: null, evaluates: false, evaluate: () => ({ value: MISSING }) }),
};
