/**
 * Plain-text display of values: the numbers a note's placeholder shows, the command line's
 * human output. Every number goes through the one digits policy (src/format/digits.ts), by
 * the quantity it is, so a number reads the same everywhere.
 */
import { numberText, pValueText, type Quantity } from '../format/digits.ts';
import { elementAt, isColumn, type Value } from './values.ts';

/**
 * A number whose meaning is not known (a formula's own result): six significant digits,
 * by the one digits policy (src/format/digits.ts).
 */
export function formatNumber(x: number): string {
  return numberText(x, 'plain');
}

/** A p-value by the one digits policy: "< 0.001", or two significant digits. */
export function formatP(p: number): string {
  return pValueText(p);
}

/**
 * One value as a short inline text (for a note's placeholder). `quantity`, when known (a
 * placeholder that reads a field of a result, `{fit.mse}`), sets the digits of its numbers.
 */
export function formatInline(v: Value, quantity: Quantity = 'plain'): string {
  switch (typeof v) {
    case 'number':
      return numberText(v, quantity);
    case 'string':
      return v;
    case 'boolean':
      return v ? 'true' : 'false';
  }
  switch (v.kind) {
    case 'missing':
      return 'missing';
    case 'column': {
      const n = v.values.length;
      const shown: string[] = [];
      for (let i = 0; i < Math.min(n, 6); i++) shown.push(formatInline(elementAt(v, i), quantity));
      return `[${shown.join(', ')}${n > 6 ? `, … (${n} in all)` : ''}]`;
    }
    case 'table':
      return `(a table of ${v.rows} rows: ${v.names.join(', ')})`;
    case 'record':
      return `(a record: ${[...v.fields.keys()].join(', ')})`;
    case 'chart':
      return '(a chart)';
    case 'claim':
      return `${v.holds ? 'holds' : 'does not hold'}: ${v.statement}`;
    case 'error':
      return `(error: ${v.message})`;
  }
}

/** True when a value is a column or table (shown as a grid rather than inline). */
export function isTabular(v: Value): boolean {
  return isColumn(v) || (typeof v === 'object' && v.kind === 'table');
}
