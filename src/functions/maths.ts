/**
 * Elementwise maths: each works on a number or on every element of a column of numbers,
 * leaving missing elements missing.
 */
import { decimalDigits, decimalsText } from '../format/digits.ts';
import { mapNumbers } from '../lang/elementwise.ts';
import { UsageError } from '../lang/errors.ts';
import { MISSING, isMissing, textColumn, type NumberColumn, type Value } from '../lang/values.ts';
import type { Builtin } from '../lang/builtins.ts';
import * as pm from '../stats/math/portable.ts';

function unary(name: string, f: (x: number) => number, doc: string, example: string): Builtin {
  return {
    name,
    category: 'maths',
    params: [{ name: 'x', type: 'numeric', doc: 'A number or a column of numbers.' }],
    returns: 'a number, or a column of the same length',
    doc,
    example,
    run: (args) => mapNumbers(args.get('x')!, f),
  };
}

/** Rounds half away from zero at `digits` decimals, on the decimal digits of the shortest text. */
export function roundDecimal(x: number, digits: number): number {
  if (!Number.isFinite(x)) return x;
  // Round on the shortest decimal text of x, so that 2.675 rounds to 2.68 as it reads,
  // not to 2.67 as its binary value (2.67499999...) would.
  const { negative: neg, digits: digitsOnly, pointAt: pointPos } = decimalDigits(x);
  if (digitsOnly === '') return x; // zero
  // value = 0.d1d2d3... * 10^pointPos
  const keep = pointPos + digits; // how many leading digits to keep
  if (keep < 0) return neg ? -0 : 0;
  if (keep >= digitsOnly.length) return x;
  const head = digitsOnly.slice(0, keep) || '0';
  const next = digitsOnly.charCodeAt(keep) - 48;
  let n = BigInt(head);
  if (next >= 5) n += 1n;
  const text = `${neg ? '-' : ''}${n.toString()}e${pointPos - keep}`;
  return Number(text);
}

/** The most decimals `fixed` shows (a double carries about 17 significant digits). */
export const MAX_FIXED_DECIMALS = 20;

export const MATHS: readonly Builtin[] = [
  unary('sqrt', Math.sqrt, 'Square root. The square root of a negative number is NaN.', 'sqrt(fit.mse)'),
  unary('ln', pm.log, 'Natural logarithm (base e). ln(0) is -∞; negative numbers give NaN.', 'ln(plots.count + 1)'),
  unary('log10', pm.log10, 'Logarithm to base 10; log10(0) is -∞ and negative numbers give NaN.', 'log10(plots.colonies)'),
  unary('exp', pm.exp, 'The exponential function, e to the power x.', 'exp(fit.means.mean)'),
  unary('abs', Math.abs, 'Absolute value: the number without its sign.', 'abs(fit.residuals)'),
  {
    name: 'round',
    category: 'maths',
    params: [
      { name: 'x', type: 'numeric', doc: 'A number or a column of numbers.' },
      { name: 'digits', type: 'integer', default: 0, doc: 'Decimal places to keep; negative values round to tens, hundreds, ...' },
    ],
    returns: 'a number, or a column of the same length',
    doc: 'Rounds to a number of decimal places, half away from zero, on the number as it reads in decimal (so 2.675 rounds to 2.68).',
    example: 'round(gain.estimate, 1)',
    run: (args) => {
      const d = args.get('digits') as number;
      return mapNumbers(args.get('x')!, (x) => roundDecimal(x, d));
    },
  },
  {
    name: 'fixed',
    category: 'maths',
    params: [
      { name: 'x', type: 'numeric', doc: 'A number or a column of numbers.' },
      { name: 'decimals', type: 'integer', doc: `Decimal places to show, 0 to ${MAX_FIXED_DECIMALS}; trailing zeros are kept.` },
    ],
    returns: 'a text, or a column of texts of the same length (missing stays missing)',
    doc: 'A number as text with a fixed count of decimals, trailing zeros kept, for a note that must read "0.60 to 1.20 t/ha" (round drops the zeros; a placeholder otherwise shows a result by the digits rule of its quantity). Rounds half away from zero on the number as it reads in decimal, as round does.',
    example: 'fixed(gain.low, 2)',
    run: (args) => {
      const d = args.get('decimals') as number;
      if (d < 0 || d > MAX_FIXED_DECIMALS) throw new UsageError(`fixed shows 0 to ${MAX_FIXED_DECIMALS} decimals; ${d} was asked for.`);
      return fixedDecimals(args.get('x')!, d);
    },
  },
];


function fixedDecimals(v: Value, d: number): Value {
  if (typeof v === 'number') return decimalsText(v, d);
  if (isMissing(v)) return MISSING;
  const c = v as NumberColumn;
  const m = c.missing;
  const out: string[] = [];
  for (let i = 0; i < c.values.length; i++) out.push(m !== null && m[i] === 1 ? '' : decimalsText(c.values[i]!, d));
  return textColumn(out, m, c.name);
}
