/**
 * The stairs run one way: reads every import of src/ and cells/ and fails on any arrow
 * against the rules in ./stairs.ts. The rules themselves are checked on made-up arrows
 * first, so a rule that could never fire is caught too.
 */
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { brokenStairs, productArrows, productScreenGlobals, readImports, screenGlobals, STAIR_RULES } from './stairs.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));

describe('reading imports', () => {
  it('reads every import form and resolves relative paths from the repository root', () => {
    const text = [
      "import { a } from '../lang/values.ts';",
      "import type { B } from './b.ts';",
      "export { c } from '../../cells/kinds.ts';",
      "import 'lit';",
      "const v = await import('vega-embed');",
      "// import { nope } from '../app/app.ts';",
      "/* import { nope } from '../app/app.ts'; */",
    ].join('\n');
    expect(readImports('src/graph/engine.ts', text).map((a) => [a.to, a.line])).toEqual([
      ['src/lang/values.ts', 1],
      ['src/graph/b.ts', 2],
      ['cells/kinds.ts', 3],
      ['lit', 4],
      ['vega-embed', 5],
    ]);
  });
});

describe('each rule can fail', () => {
  const wrong: [string, string][] = [
    ['src/stats/linear/fit.ts', 'src/lang/values.ts'],
    ['src/format/digits.ts', 'src/lang/values.ts'],
    ['src/format/digits.ts', 'node:fs'],
    ['src/messages/language.ts', 'src/lang/values.ts'],
    ['src/messages/designs.ts', 'src/stats/designs/types.ts'],
    ['src/lang/evaluate.ts', 'src/functions/index.ts'],
    ['src/graph/engine.ts', 'cells/kinds.ts'],
    ['src/doc/format.ts', 'cells/table/model.ts'],
    ['src/charts/means.ts', 'lit'],
    ['cells/table/model.ts', '@codemirror/view'],
    ['src/functions/charts.ts', 'src/views/values/chart.ts'],
    ['src/cli/main.ts', 'cells/table/view.ts'],
    ['src/cli/main.ts', 'src/views/theme.ts'],
    ['src/views/values/value.ts', 'src/app/app.ts'],
    ['cells/note/view.ts', 'src/app/store.ts'],
  ];
  it.each(wrong)('%s -> %s is refused', (from, to) => {
    expect(brokenStairs([{ from, to, line: 1 }])).not.toEqual([]);
  });
  it('every rule is exercised by a wrong arrow above', () => {
    const fired = new Set(wrong.flatMap(([from, to]) => STAIR_RULES.filter((r) => r.covers(from) && r.forbids(to)).map((r) => r.says)));
    expect([...fired].sort()).toEqual(STAIR_RULES.map((r) => r.says).sort());
  });
  it('allowed arrows pass', () => {
    const right: [string, string][] = [
      ['src/functions/designs.ts', 'src/stats/designs/index.ts'],
      ['src/stats/designs/messages.ts', 'src/format/digits.ts'],
      ['src/messages/charts.ts', 'src/format/digits.ts'],
      ['src/stats/designs/blocked.ts', 'src/messages/designs.ts'],
      ['src/messages/language.ts', 'src/messages/words.ts'],
      ['src/graph/engine.ts', 'src/lang/values.ts'],
      ['cells/table/view.ts', 'src/views/theme.ts'],
      ['cells/table/view.ts', 'lit'],
      ['src/cli/main.ts', 'cells/kinds.ts'],
      ['src/app/app.ts', 'cells/views.ts'],
    ];
    expect(brokenStairs(right.map(([from, to]) => ({ from, to, line: 1 })))).toEqual([]);
  });
});

describe('the product', () => {
  it('has no import against the stairs', () => {
    const arrows = productArrows(root);
    expect(arrows.length).toBeGreaterThan(300);
    expect(brokenStairs(arrows)).toEqual([]);
  });
  it('engine code uses no screen-only global', () => {
    expect(screenGlobals('src/graph/x.ts', 'const w = window.innerWidth;\nconst e = document.createElement("p");')).toHaveLength(2);
    expect(screenGlobals('src/graph/x.ts', '// window\nconst s = "window";\nthis.document.cells;')).toEqual([]);
    expect(screenGlobals('src/app/app.ts', 'window.addEventListener("x", f);')).toEqual([]);
    expect(productScreenGlobals(root)).toEqual([]);
  });
});
