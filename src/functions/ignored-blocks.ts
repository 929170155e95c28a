/**
 * The design warning: a fit that treats plots as independent (one_way, two_sample,
 * kruskal_wallis, rank_sum) while its data's table holds a column in which every treatment
 * appears exactly once per level (complete blocks, or pairs). Ignoring the blocks is the
 * first mistake a design course warns about: the block-to-block variation then inflates the
 * error and the comparison loses what the layout bought.
 *
 * How the table is known: the evaluator tells a built-in, for an argument written `t.col` or
 * `t["col"]`, the table `t` (CallContext.sourceTable). The warning is given only when the
 * response and the treatment come from the same table; the rule for "exactly once per
 * level", with missing plots, is in src/stats/planning/blocking.ts.
 */
import { planningMsg as m } from '../messages/planning.ts';
import { isCompleteBlocking, type Codes } from '../stats/planning/index.ts';
import { isMissingAt, sameValue, type Column, type Table } from '../lang/values.ts';
import type { CallContext, SourceTable } from '../lang/builtins.ts';

/**
 * The sentence each fit that ignores blocks adds to its doc: the rule, stated for users.
 */
export const IGNORED_BLOCKS_DOC =
  ' When the response and the treatment are columns of one table (`t.y`, `t.treatment`) and that table holds another column in which every treatment appears exactly once per level (complete blocks, or pairs), the fit warns that it ignores them and names the analysis that would use them. The count is over the table’s rows, a plot whose measurement is missing included (it still stands in the field); rows with an empty treatment are left out, and a column with an empty field where the treatment is given is not read as blocks.';

/** Level codes of a column, by the text of each field (-1 where empty). */
function codesOf(c: Column): Codes {
  const at = new Map<string, number>();
  const codes = new Int32Array(c.values.length);
  for (let i = 0; i < codes.length; i++) {
    if (isMissingAt(c, i)) {
      codes[i] = -1;
      continue;
    }
    const key = String(c.values[i]);
    let code = at.get(key);
    if (code === undefined) {
      code = at.size;
      at.set(key, code);
    }
    codes[i] = code;
  }
  return { codes, levels: at.size };
}

const PLAIN = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** How a user writes column `col` of the table read by `name`. */
function written(src: SourceTable, col: string): string {
  // a table reached through an expression (a filter): name the columns alone
  if (src.name === null) return col;
  return PLAIN.test(col) ? `${src.name}.${col}` : `${src.name}[${JSON.stringify(col)}]`;
}

/** The first column of `t` (other than those given) that is a complete-block column for `treatment`. */
export function blockingColumn(t: Table, treatment: Column, others: readonly Column[]): string | null {
  const ti = t.columns.indexOf(treatment);
  if (ti < 0) return null;
  const tc = codesOf(treatment);
  for (let i = 0; i < t.columns.length; i++) {
    const c = t.columns[i]!;
    if (i === ti || others.includes(c)) continue;
    if (isCompleteBlocking(tc, codesOf(c))) return t.names[i]!;
  }
  return null;
}

/** What the better analysis is, given how the response, treatment and block are written. */
export type BetterAnalysis = (y: string, treatment: string, block: string) => string;

/**
 * Warns on the cell when the fit's response and treatment come from one table that holds a
 * complete-block column the fit ignores.
 */
export function warnIgnoredBlocks(ctx: CallContext, yParam: string, treatmentParam: string, y: Column, treatment: Column, better: BetterAnalysis): void {
  const ts = ctx.sourceTable?.(treatmentParam) ?? null;
  const ys = ctx.sourceTable?.(yParam) ?? null;
  if (ts === null || ys === null) return;
  if (ys.table !== ts.table && !sameValue(ys.table, ts.table)) return;
  const block = blockingColumn(ts.table, treatment, [y]);
  if (block === null) return;
  const tName = treatment.name ?? 'treatment';
  const advice = better(written(ys, y.name ?? 'y'), written(ts, tName), written(ts, block));
  ctx.warn(m.ignoredBlocks(ts.name ?? '', block, tName, ctx.fn, advice));
}
