/**
 * The evaluator tells a built-in which table an argument's column was read from
 * (CallContext.sourceTable), for arguments written `t.col` or `t["col"]`, and only those.
 */
import { describe, expect, it } from 'vitest';
import { parseExpression } from '../../src/lang/parser.ts';
import { evaluate, type Scope } from '../../src/lang/evaluate.ts';
import { Registry, type SourceTable } from '../../src/lang/builtins.ts';
import { numberColumn, table, textColumn, type Value } from '../../src/lang/values.ts';

const data = table(['y', 'g'], [numberColumn(Float64Array.from([1, 2]), null, 'y'), textColumn(['a', 'b'], null, 'g')]);

function sources(expr: string): Map<string, SourceTable | null> {
  const seen = new Map<string, SourceTable | null>();
  const registry = new Registry([
    {
      name: 'probe',
      category: 'claims',
      params: [
        { name: 'a', type: 'any', doc: '' },
        { name: 'b', type: 'any', default: 0, doc: '' },
      ],
      returns: '',
      doc: '',
      example: '',
      run: (_args, ctx) => {
        for (const p of ['a', 'b']) seen.set(p, ctx.sourceTable?.(p) ?? null);
        return 0;
      },
    },
  ]);
  const scope: Scope = {
    lookup: (name) => (name === 'data' ? { kind: 'value', value: data as Value } : { kind: 'unknown' }),
    names: () => ['data'],
  };
  evaluate(parseExpression(expr), { scope, registry, warn: () => {}, progress: () => {} });
  return seen;
}

describe('the source table of an argument', () => {
  it('t.col and t["col"] name their table and the name it was read by', () => {
    const s = sources('probe(data.y, b: data["g"])');
    expect(s.get('a')?.table).toBe(data);
    expect(s.get('a')?.name).toBe('data');
    expect(s.get('b')?.table).toBe(data);
  });
  it('a computed column, a literal and a left-out argument have none', () => {
    const s = sources('probe(data.y * 2)');
    expect(s.get('a')).toBeNull();
    expect(s.get('b')).toBeNull();
    expect(sources('probe([1, 2])').get('a')).toBeNull();
  });
});
