/**
 * A fit's fitted values, residuals and studentized residuals are columns that share the
 * fit's own arrays (src/functions/fits.ts `spread`, to spare a million-row fit three copies).
 * That is safe only while nothing writes those arrays afterwards: this runs the built-ins
 * that read a fit's residuals and fitted values (checks, charts, summaries), and a comparison,
 * and holds the fit's columns to the values they had before, bit for bit.
 */
import { describe, expect, it } from 'vitest';
import type { NumberColumn, RecordValue, Value } from '../../src/lang/values.ts';
import { doc, run } from '../helpers.ts';

// source: Montgomery, vascular-graft example (docs/references.md section 4): the yields by
// pressure (rows) and batch (columns); invented here only in how the rows are typed
const GRAFT = [
  [90.3, 89.2, 98.2, 93.9, 87.4, 97.9],
  [92.5, 89.5, 90.6, 94.7, 87.0, 95.8],
  [85.5, 90.8, 89.6, 86.2, 88.0, 93.4],
  [82.5, 89.5, 85.6, 87.4, 78.9, 90.7],
];

function column(v: Value | undefined, field: string): NumberColumn {
  const c = (v as RecordValue).fields.get(field) as NumberColumn;
  expect(c.kind).toBe('column');
  return c;
}

describe("a fit's own columns", () => {
  it('are not written by the built-ins that read its residuals', () => {
    const rows = GRAFT.flatMap((ys, p) => ys.map((y, b) => `${8500 + 200 * p},${b + 1},${y}`));
    // first the fit alone, then the same fit followed by every reader of its residuals
    const fitOnly = doc('--- table graft', 'pressure,batch,yield_pct', ...rows, '', '--- formula', 'fit = blocked(graft.yield_pct, graft.pressure, graft.batch)');
    const readers = [
      'checks = residual_checks(fit)',
      'by_fitted = residuals_chart(fit)',
      'by_block = residuals_chart(fit, against: "block")',
      'normal = normal_chart(fit)',
      'pairs = pairwise(fit, method: "tukey")',
      'lowest = min(fit.residuals)',
      'middle = median(fit.residuals)',
      'upper = quantile(fit.studentized, 0.9)',
      'spread_of = sd(abs(fit.residuals))',
    ];
    const before = run(fitOnly).engine.valueOf('fit');
    const { engine, states } = run(doc(fitOnly, ...readers.flatMap((r) => ['--- formula', r])));
    expect(states.filter((s) => s.error !== null).map((s) => s.error?.message)).toEqual([]);
    const after = engine.valueOf('fit');
    for (const field of ['fitted', 'residuals', 'studentized']) {
      const a = column(after, field).values;
      const b = column(before, field).values;
      expect(a.length).toBe(24);
      expect(Array.from(a), field).toEqual(Array.from(b));
    }
    // and the fit's columns are the ones the fit made: the residuals add up to nothing
    expect(Math.abs(column(after, 'residuals').values.reduce((s, x) => s + x, 0))).toBeLessThan(1e-9);
  });
});
