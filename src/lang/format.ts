/**
 * Plain-text display of values: the numbers a note's placeholder shows, the command line's
 * human output. Views in the page format for themselves but use formatNumber for the digits,
 * so a number reads the same everywhere.
 */
import { elementAt, isColumn, type Value } from './values.ts';

/**
 * A number for reading: up to `digits` significant digits, trailing zeros dropped,
 * exponent form only for very large or very small magnitudes. Integers print whole.
 */
export function formatNumber(x: number, digits = 6): string {
  if (Number.isNaN(x)) return 'NaN';
  if (x === Infinity) return '∞';
  if (x === -Infinity) return '-∞';
  if (Number.isInteger(x) && Math.abs(x) < 1e15) return String(x);
  const a = Math.abs(x);
  if (a !== 0 && (a < 1e-4 || a >= 1e15)) {
    const [m, e] = x.toExponential(digits - 1).split('e');
    return `${trimZeros(m!)}e${e}`;
  }
  return trimZeros(x.toPrecision(digits));
}

function trimZeros(s: string): string {
  if (!s.includes('.') || s.includes('e')) return s;
  return s.replace(/\.?0+$/, '');
}

/** A p-value as the trade writes it: 0.0019, or < 0.0001. */
export function formatP(p: number): string {
  if (Number.isNaN(p)) return 'NaN';
  if (p < 0.0001) return '< 0.0001';
  if (p >= 0.9999) return '> 0.9999';
  return p.toFixed(4);
}

/** One value as a short inline text (for a note's placeholder). */
export function formatInline(v: Value): string {
  switch (typeof v) {
    case 'number':
      return formatNumber(v);
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
      for (let i = 0; i < Math.min(n, 6); i++) shown.push(formatInline(elementAt(v, i)));
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
