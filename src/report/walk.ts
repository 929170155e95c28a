/**
 * Finding the charts inside values (a chart may sit in a record's field).
 */
import type { Value } from '../lang/values.ts';

/** Adds every chart in `v`, however deep in records, to `out`. */
export function collectCharts(v: Value, out: Value[], depth = 0): void {
  if (typeof v !== 'object' || depth > 8) return;
  if (v.kind === 'chart') out.push(v);
  else if (v.kind === 'record') for (const x of v.fields.values()) collectCharts(x, out, depth + 1);
}
