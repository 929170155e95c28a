/**
 * The JSON a seal keeps for a value: its canonical JSON (src/lang/json.ts), except that
 * parts too large to be worth reading are replaced by a stand-in holding their size and the
 * SHA-256 of their canonical JSON, so a sealed document stays readable and diffs well:
 *
 *   a column of more than SEAL_ELEMENTS_LIMIT elements (alone, in a table, or a field of a
 *   record such as a big fit's fitted values)
 *       -> {"length": N, "sha256": HEX, "blocks": [HEX12, ...]}
 *   a chart's specification (its data are inline, so it is always long)
 *       -> {"vega_lite": {"bytes": N, "sha256": HEX}}
 *
 * `blocks` are the first 12 hex digits of the SHA-256 of consecutive runs of elements (at
 * most SEAL_BLOCKS runs), so a verification can say which elements changed, to the nearest
 * block, without the old values.
 */
import { columnJson, jsonText, plainJson, toJson } from '../lang/json.ts';
import { elementAt, type Column, type Value } from '../lang/values.ts';
import { runningSha256, sha256Text } from './digest.ts';

/** A column longer than this many elements is sealed by its digest. */
export const SEAL_ELEMENTS_LIMIT = 500;
/** The most blocks a digest-sealed column is cut into. */
export const SEAL_BLOCKS = 32;
/** Hex digits kept of each block's digest. */
export const BLOCK_DIGITS = 12;

/** The elements each block of a column of `length` elements holds. */
export function blockSize(length: number): number {
  return Math.max(Math.ceil(SEAL_ELEMENTS_LIMIT / 2), Math.ceil(length / SEAL_BLOCKS));
}

/** The stand-in of a long column: its length, its digest and the digests of its blocks. */
export function columnDigest(c: Column): string {
  const n = c.values.length;
  const size = blockSize(n);
  const whole = runningSha256();
  whole.add('[');
  const blocks: string[] = [];
  for (let from = 0; from < n; from += size) {
    const to = Math.min(n, from + size);
    const inner = columnJson(c, from, to).slice(1, -1);
    if (from > 0) whole.add(',');
    whole.add(inner);
    blocks.push(sha256Text(`[${inner}]`).slice(0, BLOCK_DIGITS));
  }
  whole.add(']');
  return `{"length":${n},"sha256":"${whole.finish()}","blocks":[${blocks.map((b) => `"${b}"`).join(',')}]}`;
}

/** The JSON a seal keeps for a value. */
export function sealedJson(v: Value): string {
  if (typeof v !== 'object') return toJson(v);
  switch (v.kind) {
    case 'column':
      return v.values.length > SEAL_ELEMENTS_LIMIT ? columnDigest(v) : toJson(v);
    case 'table':
      return `{${v.names.map((n, i) => `${jsonText(n)}:${sealedJson(v.columns[i]!)}`).join(',')}}`;
    case 'record':
      return `{${[...v.fields].map(([k, x]) => `${jsonText(k)}:${sealedJson(x)}`).join(',')}}`;
    case 'chart': {
      const spec = plainJson(v.spec);
      return `{"vega_lite":{"bytes":${new TextEncoder().encode(spec).length},"sha256":"${sha256Text(spec)}"}}`;
    }
    case 'error':
      // wrapped, so an error never reads as a record that happens to have these fields
      return `{"error":${toJson(v)}}`;
    default:
      return toJson(v);
  }
}

/** Element i of a column as canonical JSON (for naming the first element that differs). */
export function elementJson(c: Column, i: number): string {
  return toJson(elementAt(c, i));
}
