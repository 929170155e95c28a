/**
 * The chain of cells a value depends on.
 */
import { describe, expect, it } from 'vitest';
import { dependencyChain } from '../../../src/app/handoff/provenance.ts';
import { readDocument } from '../../../src/doc/format.ts';
import { doc } from '../../helpers.ts';

describe('dependencyChain', () => {
  //   plots (table) --> fit --> gain --> note
  //            \----------------/          other (not in the chain)
  const d = readDocument(
    doc(
      '--- table plots',
      'y,g',
      '1,a',
      '',
      '--- formula',
      'fit = one_way(plots.y, plots.g)',
      '',
      '--- formula',
      'gain = fit.mse + mean(plots.y)',
      '',
      '--- formula',
      'other = 3',
      '',
      '--- note',
      'Gain {gain}.',
    ),
  ).document;
  it('lists the cells back to the data, sources first, the cell itself last', () => {
    const chain = dependencyChain(d.cells, d.cells[4]!.id);
    expect(chain.map((s) => [s.name ?? 'note', s.distance, s.position, s.reads])).toEqual([
      ['plots', 2, 1, []],
      ['fit', 2, 2, ['plots']],
      ['gain', 1, 3, ['fit', 'plots']],
      ['note', 0, 5, ['gain']],
    ]);
  });
  it('is the cell alone for data, and empty for an unknown cell', () => {
    expect(dependencyChain(d.cells, d.cells[0]!.id).map((s) => s.name)).toEqual(['plots']);
    expect(dependencyChain(d.cells, 'nope')).toEqual([]);
  });
});

describe('dependencyChain order', () => {
  it('lists a cell after the cells it reads, wherever they stand in the document', () => {
    //   top reads a and b; a reads b; b is written last
    const d = readDocument(doc('--- formula', 'top = a + b', '', '--- formula', 'a = b * 2', '', '--- formula', 'b = 1')).document;
    expect(dependencyChain(d.cells, d.cells[0]!.id).map((s) => s.name)).toEqual(['b', 'a', 'top']);
  });
  it('stops at a cycle instead of walking it forever', () => {
    const d = readDocument(doc('--- formula', 'x = y + 1', '', '--- formula', 'y = x + 1')).document;
    expect(dependencyChain(d.cells, d.cells[0]!.id).map((s) => s.name)).toEqual(['y', 'x']);
  });
});
