import { describe, expect, it } from 'vitest';
import { applyEdit, cellsTouched, type Edit } from '../../src/doc/edits.ts';
import type { Document } from '../../src/doc/document.ts';
import { readDocument, writeDocument } from '../../src/doc/format.ts';
import { BUILTINS } from '../../src/functions/index.ts';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { Engine } from '../../src/graph/engine.ts';
import { isError, type ErrorValue } from '../../src/lang/values.ts';
import { doc } from '../helpers.ts';
import { msg } from '../../src/messages/language.ts';

/** An engine on a document made of formula cells, one per line given. */
function setup(...formulas: string[]): { engine: Engine; d: Document; ids: Map<string, string> } {
  const text = doc(...formulas.flatMap((f) => ['--- formula', f]));
  const d = readDocument(text).document;
  const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
  engine.update(d);
  const ids = new Map<string, string>();
  for (const c of d.cells) {
    const name = /^(\w+) =/.exec(c.body)?.[1];
    if (name) ids.set(name, c.id);
  }
  return { engine, d, ids };
}

function edit(engine: Engine, d: Document, e: Edit): { d: Document; ran: string[] } {
  const next = applyEdit(d, e).document;
  return { d: next, ran: engine.update(next) };
}

const error = (engine: Engine, id: string): ErrorValue => {
  const v = engine.state(id)!.value;
  if (!isError(v)) throw new Error(`cell ${id} has no error`);
  return v;
};

describe('evaluation order', () => {
  it('lets a name be used above its definition', () => {
    const { engine } = setup('b = a * 2', 'a = 21');
    expect(engine.valueOf('b')).toBe(42);
  });
  it('evaluates every cell once when loaded', () => {
    const { engine } = setup('a = 1', 'b = a + 1', 'c = a + b', 'd = c * 2');
    expect(engine.evaluations).toBe(4);
    expect(engine.valueOf('d')).toBe(6);
  });
});

describe('incremental re-evaluation, counted', () => {
  //   a -> b -> c -> d       edit b: b, c, d run; a does not
  it('a chain: an edit runs the edited cell and what follows', () => {
    const { engine, d, ids } = setup('a = 1', 'b = a + 1', 'c = b + 1', 'd = c + 1', 'z = 100');
    const before = engine.evaluations;
    const { ran } = edit(engine, d, { type: 'body', id: ids.get('b')!, body: 'b = a + 10\n' });
    expect(ran).toEqual([ids.get('b'), ids.get('c'), ids.get('d')]);
    expect(engine.evaluations - before).toBe(3);
    expect(engine.valueOf('d')).toBe(13);
    expect(engine.state(ids.get('a')!)!.evaluations).toBe(1);
    expect(engine.state(ids.get('z')!)!.evaluations).toBe(1);
  });
  //      a
  //     / \
  //    b   c        edit a: a, b, c, d each run once, d after b and c
  //     \ /
  //      d
  it('a diamond: the join runs once, after both sides', () => {
    const { engine, d, ids } = setup('a = 1', 'b = a * 2', 'c = a * 3', 'd = b + c');
    const { ran } = edit(engine, d, { type: 'body', id: ids.get('a')!, body: 'a = 2\n' });
    expect(ran).toEqual(['a', 'b', 'c', 'd'].map((n) => ids.get(n)));
    expect(engine.valueOf('d')).toBe(10);
    expect(engine.state(ids.get('d')!)!.evaluations).toBe(2);
  });
  //      a
  //     / \
  //    b   c        edit c: c, d, e run; a and b do not
  //     \ /
  //      d - e
  it('a diamond with a tail: only the edited side and below', () => {
    const { engine, d, ids } = setup('a = 1', 'b = a * 2', 'c = a * 3', 'd = b + c', 'e = d - 1');
    const { ran } = edit(engine, d, { type: 'body', id: ids.get('c')!, body: 'c = a * 4\n' });
    expect(ran).toEqual(['c', 'd', 'e'].map((n) => ids.get(n)));
    expect(engine.valueOf('e')).toBe(5);
  });
  it('an edit that gives the same value stops the wave there', () => {
    const { engine, d, ids } = setup('a = 1', 'b = a * 0', 'c = b + 1');
    const { ran } = edit(engine, d, { type: 'body', id: ids.get('a')!, body: 'a = 5\n' });
    // b is recomputed (its input moved) but gives 0 again, so c does not run
    expect(ran).toEqual([ids.get('a'), ids.get('b')]);
  });
  it('a comment-only edit re-runs the cell but not its dependents', () => {
    const { engine, d, ids } = setup('a = 1', 'b = a + 1');
    const { ran } = edit(engine, d, { type: 'body', id: ids.get('a')!, body: 'a = 1 # checked\n' });
    expect(ran).toEqual([ids.get('a')]);
  });
  it('an update with no change runs nothing', () => {
    const { engine, d } = setup('a = 1', 'b = a + 1');
    expect(engine.update(d)).toEqual([]);
  });
  it('a new definition reaches the cells that read the name, and only those', () => {
    const { engine, d, ids } = setup('b = a + 1', 'z = 5');
    expect(error(engine, ids.get('b')!).message).toMatch(/no cell or table called "a"/);
    const { ran, d: d2 } = edit(engine, d, { type: 'insert', index: 0, cell: { id: 'new', marker: 'formula', eol: '\n', body: 'a = 1\n' } });
    expect(ran).toEqual(['new', ids.get('b')]);
    expect(engine.valueOf('b')).toBe(2);
    // deleting it brings the error back
    const r = edit(engine, d2, { type: 'delete', id: 'new' });
    expect(r.ran).toEqual([ids.get('b')]);
    expect(isError(engine.valueOf('b')!)).toBe(true);
  });
});

describe('errors stay where they arise', () => {
  it('a cycle is marked on every cell in it, naming the cycle; the rest evaluates', () => {
    const { engine, ids } = setup('a = b + 1', 'b = a * 2', 'c = 7', 'd = a + c');
    const ea = error(engine, ids.get('a')!);
    const eb = error(engine, ids.get('b')!);
    expect(ea.message).toMatch(/cycle \(a → b → a\)/);
    expect(eb.message).toMatch(/cycle \(b → a → b\)/);
    // the error points at the name that leads round the cycle
    expect([ea.from, ea.to]).toEqual([4, 5]);
    expect(engine.valueOf('c')).toBe(7);
    const ed = error(engine, ids.get('d')!);
    expect(ed.message).toMatch(/"a" is part of a cycle/);
    expect(engine.state(ids.get('d')!)!.status).toBe('upstream');
  });
  it('a cell that reads itself is a cycle', () => {
    const { engine, ids } = setup('a = a + 1');
    expect(error(engine, ids.get('a')!).message).toMatch(/cycle \(a → a\)/);
  });
  it('a duplicate name is marked on every cell that defines it', () => {
    const { engine, d } = setup('x = 1', 'x = 2', 'y = x + 1', 'w = 3');
    const [c1, c2, c3, c4] = d.cells.map((c) => c.id) as [string, string, string, string];
    expect(error(engine, c1).message).toMatch(/"x" is defined by 2 cells/);
    expect(error(engine, c2).message).toMatch(/"x" is defined by 2 cells/);
    expect(error(engine, c3).message).toMatch(/defined by more than one cell/);
    expect(engine.state(c4)!.value).toBe(3);
  });
  it('an unknown name suggests the closest one', () => {
    const { engine, ids } = setup('fit = 3', 'gain = fitt * 2');
    const e = error(engine, ids.get('gain')!);
    expect(e.message).toBe(msg.unknownName('fitt', 'fit'));
    expect([e.from, e.to]).toEqual([7, 11]);
  });
  it('a cell that reads a failed cell says which name failed', () => {
    const { engine, ids } = setup('a = 1 +', 'b = a * 2', 'c = b + 1');
    expect(engine.state(ids.get('a') ?? 'c1')!.status).toBe('error');
    const e = error(engine, ids.get('b')!);
    expect(e.message).toBe(msg.upstream('a'));
    expect(e.upstream).toBe('a');
    expect(error(engine, ids.get('c')!).message).toBe(msg.upstream('b'));
  });
});

describe('notes', () => {
  it('read names in placeholders and follow their values', () => {
    const text = doc('--- formula', 'x = 2', '--- note', 'x is {x}, twice is {x * 2}, a brace: \\{ok}.', '');
    let d = readDocument(text).document;
    const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
    engine.update(d);
    const note = d.cells[1]!.id;
    expect(engine.state(note)!.value).toBe('x is 2, twice is 4, a brace: \\{ok}.');
    d = applyEdit(d, { type: 'body', id: d.cells[0]!.id, body: 'x = 5\n' }).document;
    expect(engine.update(d)).toEqual([d.cells[0]!.id, note]);
    expect(engine.state(note)!.value).toBe('x is 5, twice is 10, a brace: \\{ok}.');
  });
  it('show a failing placeholder inline and keep the others', () => {
    const { states } = runText(doc('--- note', 'ok {1 + 1}, bad {nothing}, broken {1 +}, open {x', ''));
    const s = states[0]!;
    expect(s.status).toBe('error');
    expect(s.value).toBe('ok 2, bad {nothing}, broken {1 +}, open {x');
    const errs = s.parts!.filter(isError);
    expect(errs.map((e) => e.message)).toEqual([
      msg.unknownName('nothing', null),
      msg.expectedAfterOperator('+'),
      'This { is never closed: end the placeholder with }, or write \\{ for a brace.',
    ]);
    // positions are in the note's text
    expect(errs[0]!.from).toBe('ok {1 + 1}, bad {'.length);
  });
});

function runText(text: string) {
  const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
  engine.update(readDocument(text).document);
  return { engine, states: engine.states() };
}

describe('documents keep every byte through evaluation', () => {
  it('writes back the same text after evaluating a document full of errors', () => {
    const text = doc('--- formula', 'a = b + 1', '--- formula', 'b = a * 2', '--- table t', 'x,x', '1,2', '--- formula', 'c = "open');
    const { engine, states } = runText(text);
    expect(states.every((s) => s.status === 'error' || s.status === 'upstream')).toBe(true);
    expect(writeDocument(engine.document!)).toBe(text);
  });
});

describe('progress of a long update', () => {
  it('reports each cell before it runs once the update is slow, and never for a quick one', () => {
    const text = doc(...Array.from({ length: 30 }, (_, i) => ['--- formula', i === 0 ? 'v0 = 1' : `v${i} = v${i - 1} + 1`]).flat());
    const steps: [string, number, number][] = [];
    // a negative delay: every cell counts as late, so every one is reported
    const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS, onStep: (id, done, total) => steps.push([id, done, total]), stepAfterMs: -1 });
    const d = readDocument(text).document;
    engine.update(d);
    expect(steps).toHaveLength(30);
    expect(steps[0]).toEqual([d.cells[0]!.id, 0, 30]);
    expect(steps[29]).toEqual([d.cells[29]!.id, 29, 30]);
    const quiet: unknown[] = [];
    const e2 = new Engine({ registry: BUILTINS, kinds: CELL_KINDS, onStep: (...a) => quiet.push(a), stepAfterMs: 60_000 });
    e2.update(d);
    expect(quiet).toHaveLength(0);
  });
});

describe('a long cycle', () => {
  // a cycle of N cells was reported with the whole cycle on each of them: N^2 time and words
  it('is reported in time and words linear in its size', () => {
    const n = 10_000;
    const texts = Array.from({ length: n }, (_, i) => `v${i} = v${(i + 1) % n} + 1`);
    const t0 = performance.now();
    const { engine } = setup(...texts);
    const states = engine.states();
    const ms = performance.now() - t0;
    expect(states.every((s) => s.status === 'error')).toBe(true);
    const words = states.reduce((a, s) => a + s.error!.message.length, 0);
    expect(words).toBeLessThan(n * 300);
    expect(states[0]!.error!.message).toMatch(/cycle \(v0 → v1 → v2 → v3 → v4 → v5 → … 10000 cells in all\)/);
    expect(states[9_999]!.error!.message).toMatch(/cycle \(v9999 → v0 → v1 /);
    expect(ms).toBeLessThan(10_000);
  });
});

describe('told which cells an edit touched', () => {
  /** Applies an edit and tells the engine what it touched, as the worker does. */
  function told(engine: Engine, d: Document, e: Edit): { d: Document; ran: string[]; planned: readonly string[] } {
    const next = applyEdit(d, e).document;
    let planned: readonly string[] = [];
    const ran = engine.update(next, { touched: cellsTouched(e), onPlanned: (ids) => (planned = ids) });
    return { d: next, ran, planned };
  }

  //   a -> b -> c      z alone      edit b: plan b, c; run b, c
  it('plans and runs the touched cell and what reads it, nothing else', () => {
    const { engine, d, ids } = setup('a = 1', 'b = a + 1', 'c = b + 1', 'z = 100');
    const r = told(engine, d, { type: 'body', id: ids.get('b')!, body: 'b = a + 5\n' });
    expect(r.planned).toEqual([ids.get('b'), ids.get('c')]);
    expect(r.ran).toEqual([ids.get('b'), ids.get('c')]);
    expect(engine.valueOf('c')).toBe(7);
  });
  it('reads again only the touched cells, even when another text changed unseen', () => {
    const { engine, d, ids } = setup('a = 1', 'b = a + 1');
    // a change the engine is not told about is not looked at: the worker always tells
    const sneaky = { ...d, cells: d.cells.map((c) => (c.id === ids.get('a') ? { ...c, body: 'a = 50\n' } : c)) };
    engine.update(sneaky, { touched: new Set() });
    expect(engine.valueOf('a')).toBe(1);
    engine.update(sneaky, { touched: new Set([ids.get('a')!]) });
    expect(engine.valueOf('b')).toBe(51);
    // without `touched`, texts are compared and a change is found
    const again = { ...sneaky, cells: sneaky.cells.map((c) => (c.id === ids.get('a') ? { ...c, body: 'a = 7\n' } : c)) };
    engine.update(again);
    expect(engine.valueOf('b')).toBe(8);
  });
  it('a deleted definer plans its readers, which then say the name is gone', () => {
    const { engine, d, ids } = setup('a = 1', 'b = a + 1', 'c = b * 2');
    const r = told(engine, d, { type: 'delete', id: ids.get('a')! });
    expect(r.planned).toEqual([ids.get('b'), ids.get('c')]);
    expect(engine.state(ids.get('b')!)!.status).toBe('error');
    expect(engine.state(ids.get('c')!)!.status).toBe('upstream');
  });
  it('a renamed definer plans the readers of the old name and of the new', () => {
    const { engine, d, ids } = setup('a = 1', 'b = a + 1', 'x = 3', 'y = x + 1');
    const r = told(engine, d, { type: 'body', id: ids.get('a')!, body: 'x = 1\n' });
    expect(new Set(r.planned)).toEqual(new Set([ids.get('a'), ids.get('b'), ids.get('x'), ids.get('y')]));
  });
  it('a header edit touches no cell and runs nothing', () => {
    const { engine, d } = setup('a = 1', 'b = a + 1');
    const r = told(engine, d, { type: 'header', header: 'title: other\n\n' });
    expect(r.planned).toEqual([]);
    expect(r.ran).toEqual([]);
  });
  it('cellsTouched lists the cells of every kind of edit', () => {
    const cell = { id: 'n9', marker: 'note', eol: '\n', body: 'x\n' };
    const e: Edit = {
      type: 'batch',
      edits: [
        { type: 'body', id: 'c1', body: '' },
        { type: 'marker', id: 'c2', marker: 'note' },
        { type: 'insert', index: 0, cell },
        { type: 'move', id: 'c3', index: 0 },
        { type: 'delete', id: 'c4' },
        { type: 'header', header: '' },
      ],
    };
    expect([...cellsTouched(e)].sort()).toEqual(['c1', 'c2', 'c3', 'c4', 'n9']);
  });
});

describe("a record's identity", () => {
  // table -> fit -> chart: renaming the response column changes no number of the fit, yet
  // the chart prints the response's name, so the chart must be drawn again
  it('includes what its charts read: renaming the response column re-titles the chart', () => {
    const text = doc(
      '--- table plots',
      'block,treatment,strength',
      '1,a,10.1', '1,b,11.9', '2,a,10.4', '2,b,12.3', '3,a,9.8', '3,b,11.6',
      '',
      '--- formula',
      'fit = blocked(plots.strength, plots.treatment, plots.block)',
      '--- formula',
      'c = means_chart(fit)',
    );
    let d = readDocument(text).document;
    const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
    engine.update(d);
    const spec = (name: string): string => {
      const v = engine.valueOf(name);
      if (v === undefined || typeof v !== 'object' || v.kind !== 'chart') throw new Error(`${name} is not a chart: ${JSON.stringify(v)}`);
      return JSON.stringify(v.spec);
    };
    expect(spec('c')).toContain('strength');
    const [table, fit] = [d.cells[0]!, d.cells[1]!];
    // the column renamed, and the fit's formula with it: one step, as a user makes it
    const e: Edit = {
      type: 'batch',
      edits: [
        { type: 'body', id: table.id, body: table.body.replace('strength', 'shear_mpa') },
        { type: 'body', id: fit.id, body: fit.body.replace('strength', 'shear_mpa') },
      ],
    };
    d = applyEdit(d, e).document;
    const ran = engine.update(d, { touched: cellsTouched(e) });
    expect(ran).toContain(d.cells[2]!.id);
    expect(spec('c')).toContain('Mean shear');
    expect(spec('c')).not.toContain('strength');
  });
});
