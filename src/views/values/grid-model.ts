/**
 * What a grid of columns shows, worked out without a DOM: the text of each cell. A column may
 * hold a million elements, so the text of a cell is made only when its row is drawn (which
 * rows are drawn is the row-window model's job: row-window.ts).
 */
import { isMissingAt, type Column } from '../../lang/values.ts';
import { fixedText, pText, sharedDecimals } from './digits.ts';

/** How one column is written, decided once per column. */
export interface ColumnPlan {
  /** Numbers align right in tabular figures; texts and booleans align left. */
  readonly align: 'num' | 'text';
  /** Shared decimals for a computed number column (null: each number on its own). */
  readonly decimals: number | null;
  /** The column keeps the decimal text that was typed: show that, not a reformatted double. */
  readonly typed: boolean;
  /** A column of p-values, written as the trade writes them. */
  readonly asP: boolean;
}

const plans = new WeakMap<Column, ColumnPlan>();

/**
 * The plan for a column. Columns are immutable values, so a plan is worked out once per
 * column object (one pass over the elements) and kept.
 */
export function planColumn(c: Column): ColumnPlan {
  const known = plans.get(c);
  if (known !== undefined) return known;
  let plan: ColumnPlan;
  if (c.type !== 'number') plan = { align: 'text', decimals: null, typed: false, asP: false };
  else if (c.decimals !== null) plan = { align: 'num', decimals: null, typed: true, asP: false };
  else if (c.name === 'p') plan = { align: 'num', decimals: null, typed: false, asP: true };
  else {
    const missing = c.missing;
    const decimals = sharedDecimals(c.values, undefined, missing === null ? undefined : (i) => missing[i] === 1);
    plan = { align: 'num', decimals, typed: false, asP: false };
  }
  plans.set(c, plan);
  return plan;
}

/** The text of one cell of a grid. */
export interface CellText {
  readonly text: string;
  readonly missing: boolean;
}

const MISSING_CELL: CellText = { text: 'missing', missing: true };

/** The text of element i of a column under its plan. */
export function cellText(c: Column, i: number, plan: ColumnPlan = planColumn(c)): CellText {
  if (isMissingAt(c, i)) return MISSING_CELL;
  switch (c.type) {
    case 'text':
      return { text: c.values[i] ?? '', missing: false };
    case 'boolean':
      return { text: c.values[i] === 1 ? 'true' : 'false', missing: false };
    case 'number': {
      const x = c.values[i]!;
      if (plan.typed) {
        const typed = c.decimals?.[i];
        if (typed !== undefined && typed !== '') return { text: typed, missing: false };
      }
      if (plan.asP) return { text: pText(x) || 'NaN', missing: false };
      return { text: fixedText(x, plan.decimals), missing: false };
    }
  }
}
