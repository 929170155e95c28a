/**
 * What a grid of columns shows, worked out without a DOM: the text of each cell. A column may
 * hold a million elements, so the text of a cell is made only when its row is drawn (which
 * rows are drawn is the row-window model's job: row-window.ts).
 */
import { decimalAt, isMissingAt, type Column } from '../../lang/values.ts';
import { numberText, quantityOf, type Quantity } from '../../format/digits.ts';
import { fixedText, sharedDecimals } from './digits.ts';

/** How one column is written, decided once per column. */
export interface ColumnPlan {
  /** Numbers align right in tabular figures; texts and booleans align left. */
  readonly align: 'num' | 'text';
  /** Shared decimals for a computed number column (null: each number on its own). */
  readonly decimals: number | null;
  /** The column keeps the decimal text that was typed: show that, not a reformatted double. */
  readonly typed: boolean;
  /**
   * A computed column whose name says what it holds (p, se, mean, f, ...): each number is
   * written by the digits policy for that quantity, as it reads everywhere else. Null for a
   * column of plain numbers, which line up on shared decimals instead.
   */
  readonly quantity: Quantity | null;
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
  const quantity = quantityOf(c.name);
  if (c.type !== 'number') plan = { align: 'text', decimals: null, typed: false, quantity: null };
  else if (c.decimals !== null) plan = { align: 'num', decimals: null, typed: true, quantity: null };
  else if (quantity !== 'plain') plan = { align: 'num', decimals: null, typed: false, quantity };
  else {
    const missing = c.missing;
    const decimals = sharedDecimals(c.values, undefined, missing === null ? undefined : (i) => missing[i] === 1);
    plan = { align: 'num', decimals, typed: false, quantity: null };
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
        const typed = c.decimals === null ? undefined : decimalAt(c.decimals, i);
        if (typed !== undefined && typed !== '') return { text: typed, missing: false };
      }
      if (plan.quantity !== null) return { text: numberText(x, plan.quantity), missing: false };
      return { text: fixedText(x, plan.decimals), missing: false };
    }
  }
}
