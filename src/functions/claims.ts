/**
 * Claims: statements about the numbers that are checked on every evaluation, so a
 * conclusion written beside the numbers cannot silently stop being true.
 */
import { UsageError } from '../lang/errors.ts';
import { pPhrase } from '../format/digits.ts';
import { mapNumbers } from '../lang/elementwise.ts';
import { isColumn, isMissing, textColumn, type Claim, type Value } from '../lang/values.ts';
import type { Builtin } from '../lang/builtins.ts';
import { fnMsg } from '../messages/functions.ts';

function holds(v: Value): boolean {
  if (typeof v === 'boolean') return v;
  if (isMissing(v)) throw new UsageError(fnMsg.conditionMissing());
  if (isColumn(v) && v.type === 'boolean') {
    if (v.missing !== null) throw new UsageError(fnMsg.conditionPartlyMissing());
    for (let i = 0; i < v.values.length; i++) if (v.values[i] !== 1) return false;
    return true;
  }
  throw new UsageError(fnMsg.conditionNotBoolean());
}

export const CLAIMS: readonly Builtin[] = [
  {
    name: 'claim',
    category: 'claims',
    params: [
      { name: 'condition', type: 'any', doc: 'true or false, or a column of them (the claim holds when every element is true).' },
      { name: 'statement', type: 'text', doc: 'The claim in words, as a reviewer should read it.' },
    ],
    returns: 'a claim (holds or does not hold, with the statement)',
    doc: 'A statement about the results that is checked every time the document is evaluated: it shows whether it holds, so a conclusion written beside the numbers cannot silently become false when the data change.',
    example: 'claim(gain.low > 0, "curing at 80C is stronger than at 60C")',
    run: (a): Claim => ({ kind: 'claim', holds: holds(a.get('condition')!), statement: a.get('statement') as string }),
  },
  {
    name: 'p_text',
    category: 'claims',
    params: [{ name: 'p', type: 'numeric', doc: 'A p-value, or a column of them.' }],
    returns: 'a text, or a column of texts',
    doc: 'A p-value as a phrase for notes, by the digits rule of p-values: "p = 0.019" with two significant digits, "p < 0.001" for smaller values, "p > 0.99" for those that would round to 1.',
    example: 'p_text(fit.table.p[1])',
    run: (a) => {
      const v = a.get('p')!;
      const text = (x: number): string => pPhrase(x);
      if (typeof v === 'number') return text(v);
      const col = mapNumbers(v, (x) => x);
      if (!isColumn(col) || col.type !== 'number') return text(NaN);
      return textColumn(Array.from(col.values, text), col.missing);
    },
  },
];
