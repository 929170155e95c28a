/**
 * The canonical JSON form of values (language.md section 9): the command line's --json
 * output and, later, the sealed values of a document. Written by hand rather than through
 * JSON.stringify of intermediate objects, so that names chosen by a document (a column
 * called "__proto__") are only ever keys of text, and numbers take their shortest
 * round-trip form.
 */
import { elementAt, type Value } from './values.ts';

/** A number in the contract's JSON: shortest round-trip form, non-finite as text. */
export function jsonNumber(x: number): string {
  if (Number.isNaN(x)) return '"NaN"';
  if (x === Infinity) return '"Infinity"';
  if (x === -Infinity) return '"-Infinity"';
  if (Object.is(x, -0)) return '0';
  return String(x);
}

/** The JSON text of a value. */
export function toJson(v: Value): string {
  switch (typeof v) {
    case 'number':
      return jsonNumber(v);
    case 'string':
      return JSON.stringify(v);
    case 'boolean':
      return v ? 'true' : 'false';
  }
  switch (v.kind) {
    case 'missing':
      return 'null';
    case 'column': {
      const parts: string[] = new Array<string>(v.values.length);
      for (let i = 0; i < v.values.length; i++) parts[i] = toJson(elementAt(v, i));
      return `[${parts.join(',')}]`;
    }
    case 'table':
      return `{${v.names.map((n, i) => `${JSON.stringify(n)}:${toJson(v.columns[i]!)}`).join(',')}}`;
    case 'record':
      return `{${[...v.fields].map(([k, x]) => `${JSON.stringify(k)}:${toJson(x)}`).join(',')}}`;
    case 'chart':
      return `{"vega_lite":${JSON.stringify(v.spec)}}`;
    case 'claim':
      return `{"holds":${v.holds ? 'true' : 'false'},"statement":${JSON.stringify(v.statement)}}`;
    case 'error':
      return `{"message":${JSON.stringify(v.message)},"from":${v.from},"to":${v.to}}`;
  }
}
