import { describe, expect, it } from 'vitest';
import { builtinInfos } from '../../../src/app/builtin-info.ts';
import { byCategory, exampleNames, fitExample, searchBuiltins } from '../../../src/app/help/help-model.ts';
import { BUILTINS } from '../../../src/functions/index.ts';
import { CATEGORIES } from '../../../src/lang/builtins.ts';
import { parseStatement } from '../../../src/lang/parser.ts';

const ALL = builtinInfos(BUILTINS);

describe('the help panel reads the one registry', () => {
  it('lists every built-in once, each with a signature, a doc and an example', () => {
    expect(ALL.map((b) => b.name).sort()).toEqual(BUILTINS.names().sort());
    for (const b of ALL) {
      expect(b.signature.startsWith(`${b.name}(`), b.name).toBe(true);
      expect(b.doc.length, b.name).toBeGreaterThan(0);
      expect(b.example, b.name).toMatch(new RegExp(`\\b${b.name}\\(`));
    }
  });

  it('has an example that parses for every built-in, so that adding it gives a formula', () => {
    for (const b of ALL) {
      expect(() => parseStatement(b.example!), b.name).not.toThrow();
      expect(exampleNames(b.example!), b.name).not.toBeNull();
    }
  });

  it('groups by the registry categories, in their order, leaving none out', () => {
    const groups = byCategory(ALL);
    expect(groups.map((g) => g.category)).toEqual(CATEGORIES.filter((c) => ALL.some((b) => b.category === c)));
    expect(groups.reduce((n, g) => n + g.builtins.length, 0)).toBe(ALL.length);
  });
});

describe('searching', () => {
  it('puts the built-in of that name first, then names that hold the word', () => {
    const found = searchBuiltins(ALL, 'blocked');
    expect(found[0]?.name).toBe('blocked');
    expect(searchBuiltins(ALL, 'power')[0]?.name.startsWith('power')).toBe(true);
  });

  it('finds by a word of the doc, needs every word, and narrows to a category', () => {
    const found = searchBuiltins(ALL, 'studentized range').map((b) => b.name);
    expect(found).toContain('range_critical');
    expect(searchBuiltins(ALL, 'blocked zzzz')).toEqual([]);
    const designs = searchBuiltins(ALL, '', 'designs');
    expect(designs.length).toBeGreaterThan(0);
    expect(designs.every((b) => b.category === 'designs')).toBe(true);
  });

  it('gives the whole list, in order, for an empty search', () => {
    expect(searchBuiltins(ALL, '  ').map((b) => b.name)).toEqual(ALL.map((b) => b.name));
  });
});

describe('fitting an example to the document', () => {
  const example = 'blocked(plots.yield, plots.variety, plots.block)';

  it('reads the names and the columns an example uses', () => {
    expect(exampleNames(example)).toEqual([{ name: 'plots', members: ['yield', 'variety', 'block'], at: [{ from: 8, to: 13 }, { from: 21, to: 26 }, { from: 36, to: 41 }] }]);
    expect(exampleNames('difference(fit, "open", "spindle")')).toEqual([{ name: 'fit', members: [], at: [{ from: 11, to: 14 }] }]);
    expect(exampleNames('mean(t["yield (kg)"]) + k')?.map((n) => [n.name, n.members])).toEqual([
      ['t', ['yield (kg)']],
      ['k', []],
    ]);
  });

  it('keeps an example whose table the document has', () => {
    const fit = fitExample(example, [{ name: 'plots', type: 'table', members: ['block', 'variety', 'yield'] }]);
    expect(fit).toEqual({ text: example, reads: ['plots (yield, variety, block)'], renamed: [], missing: [] });
  });

  it("reads the document's table that has every column the example names", () => {
    const cells = [
      { name: 'notes_table', type: 'table', members: ['yield'] },
      { name: 'harvest', type: 'table', members: ['block', 'variety', 'yield', 'height'] },
    ];
    const fit = fitExample(example, cells);
    expect(fit.text).toBe('blocked(harvest.yield, harvest.variety, harvest.block)');
    expect(fit.renamed).toEqual([['plots', 'harvest']]);
    expect(fit.missing).toEqual([]);
    expect(fit.reads).toEqual(['harvest (yield, variety, block)']);
  });

  it('guesses no columns: a table that lacks one is said, and the example is kept as written', () => {
    const fit = fitExample(example, [{ name: 'coupons', type: 'table', members: ['batch', 'cure', 'shear_mpa'] }]);
    expect(fit.text).toBe(example);
    expect(fit.missing).toEqual(['plots (yield, variety, block)']);
    const partly = fitExample(example, [{ name: 'plots', type: 'table', members: ['yield', 'block'] }]);
    expect(partly.text).toBe(example);
    expect(partly.missing).toEqual(['variety in plots']);
  });

  it('says which value a record-reading example expects when the document lacks it', () => {
    expect(fitExample('residual_checks(fit)', []).missing).toEqual(['fit']);
    expect(fitExample('residual_checks(fit)', [{ name: 'fit', type: 'fit', members: ['table'] }]).missing).toEqual([]);
  });
});
