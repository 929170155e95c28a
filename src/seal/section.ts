/**
 * The `--- sealed` section (docs/language.md section 6): what it holds and how it reads back.
 *
 *   engine: furrow 0.1.0
 *   fingerprint: sha256:HEX                 over the cells and every data file they name
 *   cells: sha256:HEX                       the document's text without this section
 *   data: {"plots.csv":"sha256:HEX"}        each data file
 *   claims: [{"cell":12,"name":"stronger","holds":true,"statement":"..."}]
 *
 *   NAME: JSON                              every named value, in document order
 *
 * The lines before the first blank line are the section's own; every line after it is a
 * value, so a cell may be called `claims` without confusion. Nothing in the section depends
 * on the time or the machine: sealing the same document twice gives the same bytes.
 */
import type { CellState } from '../graph/engine.ts';
import { jsonText } from '../lang/json.ts';
import type { Claim } from '../lang/values.ts';
import type { Fingerprint } from './fingerprint.ts';
import { JsonObject, JsonSyntaxError, readJson, type JsonTree } from './json-tree.ts';
import { sealedJson } from './sealed-json.ts';
import { ENGINE_NAME } from './version.ts';
import { sealMsg } from '../messages/seal.ts';

/** A claim as sealed. */
export interface SealedClaim {
  /** 1-based position of its cell in the document. */
  readonly cell: number;
  /** The name of its cell, or null for an unnamed formula. */
  readonly name: string | null;
  readonly holds: boolean;
  readonly statement: string;
}

/** The claims of a document's cells, in document order. */
export function claimsOf(states: readonly CellState[]): SealedClaim[] {
  const out: SealedClaim[] = [];
  states.forEach((s, i) => {
    const v = s.value;
    if (typeof v === 'object' && v.kind === 'claim') {
      const c = v as Claim;
      out.push({ cell: i + 1, name: s.name, holds: c.holds, statement: c.statement });
    }
  });
  return out;
}

/** The named values of a document as a seal writes them: name, cell, sealed JSON. */
export function namedValues(states: readonly CellState[]): { name: string; cell: number; json: string; error: boolean }[] {
  const seen = new Set<string>();
  const out: { name: string; cell: number; json: string; error: boolean }[] = [];
  states.forEach((s, i) => {
    if (s.name === null || s.status === 'inert' || seen.has(s.name)) return;
    seen.add(s.name);
    const error = typeof s.value === 'object' && s.value.kind === 'error';
    out.push({ name: s.name, cell: i + 1, json: sealedJson(s.value), error });
  });
  return out;
}

/** The claims line's JSON, as a seal writes it. */
export function claimsJson(claims: readonly SealedClaim[]): string {
  const one = (c: SealedClaim): string =>
    `{"cell":${c.cell},"name":${c.name === null ? 'null' : jsonText(c.name)},"holds":${c.holds},"statement":${jsonText(c.statement)}}`;
  return `[${claims.map(one).join(',')}]`;
}

/** The body of a sealed section for evaluated cells and their fingerprint. */
export function sealBody(states: readonly CellState[], print: Fingerprint, eol = '\n'): string {
  const data = [...print.files].map(([name, d]) => `${jsonText(name)}:${d === null ? 'null' : `"sha256:${d}"`}`);
  const lines = [
    `engine: ${ENGINE_NAME}`,
    `fingerprint: sha256:${print.whole}`,
    `cells: sha256:${print.cells}`,
    `data: {${data.join(',')}}`,
    `claims: ${claimsJson(claimsOf(states))}`,
    '',
    ...namedValues(states).map((v) => `${v.name}: ${v.json}`),
  ];
  return lines.map((l) => l + eol).join('');
}

/** A sealed value as read back. */
export interface SealedValue {
  readonly json: JsonTree;
  /** The JSON as written on the line. */
  readonly text: string;
  /** 1-based line in the file. */
  readonly line: number;
}

/** A sealed section as read back, with whatever in it could not be read. */
export interface SealRecord {
  readonly engine: string | null;
  readonly fingerprint: string | null;
  readonly cells: string | null;
  readonly data: ReadonlyMap<string, string | null> | null;
  readonly claims: readonly SealedClaim[] | null;
  /** The claims line's JSON as written. */
  readonly claimsText: string | null;
  readonly values: ReadonlyMap<string, SealedValue>;
  /** Plain sentences about lines that are missing, altered or out of place. */
  readonly problems: readonly string[];
}

const HEAD_KEYS = ['engine', 'fingerprint', 'cells', 'data', 'claims'] as const;
const LINE = /^([A-Za-z_][A-Za-z0-9_]*):[ ](.*)$/;
const DIGEST = /^sha256:([0-9a-f]{64})$/;

/**
 * Reads a sealed section's body. Never throws: a line that cannot be read is reported in
 * `problems` with its line number and left out.
 *
 * @param firstLine the file's line number of the body's first line
 */
export function readSeal(body: string, firstLine: number): SealRecord {
  const problems: string[] = [];
  const head = new Map<string, { text: string; line: number }>();
  const values = new Map<string, SealedValue>();
  const lines = body.split('\n');
  if (lines[lines.length - 1] === '') lines.pop();
  let inHead = true;
  lines.forEach((raw, k) => {
    const line = firstLine + k;
    const text = raw.endsWith('\r') ? raw.slice(0, -1) : raw;
    if (text.trim() === '') {
      inHead = false;
      return;
    }
    const m = LINE.exec(text);
    if (m === null) {
      problems.push(sealMsg.notNameValue(line, clip(text)));
      return;
    }
    const key = m[1]!;
    if (inHead && (HEAD_KEYS as readonly string[]).includes(key)) {
      if (head.has(key)) problems.push(sealMsg.keyTwice(line, key));
      else head.set(key, { text: m[2]!, line });
      return;
    }
    inHead = false;
    if (values.has(key)) {
      problems.push(sealMsg.valueTwice(line, key));
      return;
    }
    try {
      values.set(key, { json: readJson(m[2]!), text: m[2]!, line });
    } catch (err) {
      if (!(err instanceof JsonSyntaxError)) throw err;
      problems.push(sealMsg.valueUnreadable(line, key, err.message));
    }
  });
  for (const key of HEAD_KEYS) if (!head.has(key)) problems.push(sealMsg.keyMissing(key));

  const digestOf = (key: string): string | null => {
    const h = head.get(key);
    if (h === undefined) return null;
    const m = DIGEST.exec(h.text.trim());
    if (m === null) {
      problems.push(sealMsg.badDigest(h.line, key));
      return null;
    }
    return m[1]!;
  };
  const engine = head.get('engine')?.text.trim() ?? null;
  const fingerprint = digestOf('fingerprint');
  const cells = digestOf('cells');
  const data = readData(head.get('data'), problems);
  const claims = readClaims(head.get('claims'), problems);
  return { engine, fingerprint, cells, data, claims, claimsText: head.get('claims')?.text ?? null, values, problems };
}

function clip(s: string): string {
  return s.length > 60 ? `${s.slice(0, 57)}...` : s;
}

function readData(h: { text: string; line: number } | undefined, problems: string[]): Map<string, string | null> | null {
  if (h === undefined) return null;
  const bad = (): null => {
    problems.push(sealMsg.badData(h.line));
    return null;
  };
  let tree: JsonTree;
  try {
    tree = readJson(h.text);
  } catch {
    return bad();
  }
  if (!(tree instanceof JsonObject)) return bad();
  const out = new Map<string, string | null>();
  for (const [name, d] of tree.members) {
    if (d === null) out.set(name, null);
    else if (typeof d === 'string' && DIGEST.test(d)) out.set(name, d.slice('sha256:'.length));
    else return bad();
  }
  return out;
}

function readClaims(h: { text: string; line: number } | undefined, problems: string[]): SealedClaim[] | null {
  if (h === undefined) return null;
  const bad = (): null => {
    problems.push(sealMsg.badClaims(h.line));
    return null;
  };
  let tree: JsonTree;
  try {
    tree = readJson(h.text);
  } catch {
    return bad();
  }
  if (!Array.isArray(tree)) return bad();
  const out: SealedClaim[] = [];
  for (const item of tree as readonly JsonTree[]) {
    if (!(item instanceof JsonObject)) return bad();
    const cell = item.members.get('cell');
    const name = item.members.get('name');
    const holds = item.members.get('holds');
    const statement = item.members.get('statement');
    if (typeof cell !== 'number' || (name !== null && typeof name !== 'string') || typeof holds !== 'boolean' || typeof statement !== 'string') {
      return bad();
    }
    out.push({ cell, name: name ?? null, holds, statement });
  }
  return out;
}
