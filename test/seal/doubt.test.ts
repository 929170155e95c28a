/**
 * Which live numbers of notes a failing claim reads.
 */
import { describe, expect, it } from 'vitest';
import { notesInDoubt } from '../../src/seal/doubt.ts';
import { doc, run } from '../helpers.ts';

describe('notesInDoubt', () => {
  it('marks the placeholders that read a name a failing claim reads, and only those', () => {
    const { engine, states } = run(
      doc('--- formula', 'gain = 2.5', '', '--- formula', 'base = 7', '', '--- note', 'Gain {gain}, base {base}, both {gain + base}.', '', '--- formula', 'claim(gain > 3, "gain above 3")'),
    );
    const cells = engine.document!.cells;
    const d = notesInDoubt(cells, states, (id) => engine.reads(id));
    expect([...d.keys()]).toEqual([cells[2]!.id]);
    expect([...d.get(cells[2]!.id)!.slots]).toEqual([0, 2]);
    expect(d.get(cells[2]!.id)!.claims).toEqual(['gain above 3']);
  });
  it('marks nothing when every claim holds', () => {
    const { engine, states } = run(doc('--- formula', 'gain = 2.5', '', '--- note', 'Gain {gain}.', '', '--- formula', 'claim(gain > 2, "gain above 2")'));
    expect(notesInDoubt(engine.document!.cells, states, (id) => engine.reads(id)).size).toBe(0);
  });
});
