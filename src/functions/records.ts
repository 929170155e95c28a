/**
 * Turning the plain result objects of src/stats into record values: numbers stay numbers,
 * texts texts, typed arrays become columns, arrays of texts text columns, nested plain
 * objects records. Field order is the object's own order.
 */
import { UsageError } from '../lang/errors.ts';
import { booleanColumn, numberColumn, record, textColumn, type RecordValue, type Value } from '../lang/values.ts';

/** Converts one field of a result object. */
export function fieldValue(x: unknown): Value | undefined {
  if (typeof x === 'number' || typeof x === 'string' || typeof x === 'boolean') return x;
  if (x instanceof Float64Array) return numberColumn(x);
  if (x instanceof Int32Array || x instanceof Uint32Array || x instanceof Float32Array) return numberColumn(Float64Array.from(x));
  if (x instanceof Uint8Array) return booleanColumn(x);
  if (Array.isArray(x)) {
    if (x.every((e) => typeof e === 'string')) return textColumn(x as string[]);
    if (x.every((e) => typeof e === 'number')) return numberColumn(Float64Array.from(x as number[]));
    return undefined;
  }
  if (x !== null && typeof x === 'object' && 'kind' in x) return x as Value;
  if (x !== null && typeof x === 'object') return toRecord(x as Record<string, unknown>);
  return undefined;
}

/** A record from a plain object; fields that have no value form (functions, null) are left out. */
export function toRecord(obj: Record<string, unknown>, tag: string | null = null, internal?: unknown): RecordValue {
  const fields: [string, Value][] = [];
  for (const [k, x] of Object.entries(obj)) {
    const v = fieldValue(x);
    if (v !== undefined) fields.push([k, v]);
  }
  return record(fields, tag, internal);
}

/**
 * Runs a statistics function, turning its input errors (plain-words messages for the user)
 * into usage errors that the evaluator places on the call.
 */
export function guarded<T>(f: () => T): T {
  try {
    return f();
  } catch (err) {
    if (err instanceof Error && (err.name === 'StatsInputError' || err.name === 'DesignError' || err.name === 'DecimalTextError')) {
      throw new UsageError(sentence(err.message));
    }
    throw err;
  }
}

/** A message as a sentence: first letter kept, final full stop added. */
function sentence(s: string): string {
  const t = s.trim();
  return /[.!?]$/.test(t) ? t : `${t}.`;
}
