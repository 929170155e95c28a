/**
 * Verifying a sealed document: recompute, then compare with what the seal recorded, cell by
 * cell, numbers bit for bit. Pure: the command line and the page give it the document, the
 * engine's states for it and the bytes of the data files, and show the result each in
 * their own way.
 */
import type { Document } from '../doc/document.ts';
import type { CellState } from '../graph/engine.ts';
import { fingerprint, isSealedCell } from './fingerprint.ts';
import { JsonObject, readJson, sameTree, type JsonTree } from './json-tree.ts';
import { claimsJson, claimsOf, namedValues, readSeal, type SealRecord, type SealedClaim } from './section.ts';
import { blockSize } from './sealed-json.ts';
import { ENGINE_NAME } from './version.ts';
import { sealMsg } from '../messages/seal.ts';

/** How one named value compares with its seal. */
export interface ValueCheck {
  readonly name: string;
  /** 1-based position of the cell that defines it now; null when none does. */
  readonly cell: number | null;
  readonly state: 'same' | 'changed' | 'missing' | 'new';
  /** For a changed value: what differs, one plain line each (old and new). */
  readonly details: readonly string[];
}

/** How one claim stands now against its seal. */
export interface ClaimCheck {
  readonly name: string | null;
  readonly statement: string;
  /** 1-based position of its cell now; null when it is gone. */
  readonly cell: number | null;
  /** holds: holds now; fails: does not hold now; gone: sealed, no longer in the document; error: its cell holds an error; new: not in the seal. */
  readonly state: 'holds' | 'fails' | 'gone' | 'error' | 'new';
  /** Whether it held when sealed; null when it was not sealed. */
  readonly heldWhenSealed: boolean | null;
  readonly detail: string | null;
}

/** What differs in the fingerprint. */
export interface FingerprintCheck {
  readonly same: boolean;
  /** Plain lines naming the parts that changed: the cells, or a data file by name. */
  readonly details: readonly string[];
  readonly now: string;
}

/** The whole verdict. */
export interface Verification {
  /** False when the document has no sealed section (nothing else is then filled in). */
  readonly sealed: boolean;
  readonly engine: { readonly sealedBy: string | null; readonly now: string; readonly same: boolean };
  readonly fingerprint: FingerprintCheck;
  readonly values: readonly ValueCheck[];
  readonly claims: readonly ClaimCheck[];
  /** Plain sentences about a sealed section that was edited, damaged or doubled. */
  readonly problems: readonly string[];
  /** True only when everything matches and every claim holds. */
  readonly matches: boolean;
}

/** The most differences listed for one value. */
const MAX_DETAILS = 8;
/** The most differences counted for one value (past it, "more than"). */
const MAX_COUNTED = 10_000;

/** The 1-based line of each cell's marker. */
function markerLines(doc: Document): number[] {
  const count = (s: string): number => s.split('\n').length - 1;
  let line = 1 + (doc.firstEol === '' ? 0 : 1) + count(doc.header);
  return doc.cells.map((c) => {
    const at = line;
    line += (c.eol === '' ? 0 : 1) + count(c.body);
    return at;
  });
}

/** Verifies a document against its sealed section. */
export function verifyDocument(doc: Document, states: readonly CellState[], files: ReadonlyMap<string, Uint8Array>): Verification {
  const print = fingerprint(doc, files);
  const sealedAt = doc.cells.flatMap((c, i) => (isSealedCell(c.marker) ? [i] : []));
  const noSeal: Verification = {
    sealed: false,
    engine: { sealedBy: null, now: ENGINE_NAME, same: false },
    fingerprint: { same: false, details: [], now: print.whole },
    values: [],
    claims: [],
    problems: [sealMsg.noSection()],
    matches: false,
  };
  const last = sealedAt[sealedAt.length - 1];
  if (last === undefined) return noSeal;
  const problems: string[] = [];
  const lines = markerLines(doc);
  if (sealedAt.length > 1) {
    problems.push(
      sealMsg.manySections(sealedAt.length, sealedAt.map((i) => lines[i]!)),
    );
  }
  const cell = doc.cells[last]!;
  if (cell.marker.trim().split(/[ \t]+/).length > 1) problems.push(sealMsg.markerExtraWords(lines[last]!, cell.marker));
  const seal = readSeal(cell.body, lines[last]! + 1);
  problems.push(...seal.problems);

  const engine = { sealedBy: seal.engine, now: ENGINE_NAME, same: seal.engine === ENGINE_NAME };
  const fp = checkFingerprint(seal, print);
  const values = checkValues(seal, states, problems);
  const claims = checkClaims(seal.claims ?? [], states);
  const claimsAsSealed = claims.every((c) => c.state === 'holds' && c.heldWhenSealed === true);
  if (seal.claims !== null && claimsAsSealed && fp.same && seal.claimsText !== claimsJson(claimsOf(states))) {
    problems.push(sealMsg.claimsEdited());
  }
  const matches =
    problems.length === 0 &&
    engine.same &&
    fp.same &&
    values.every((v) => v.state === 'same') &&
    claims.every((c) => c.state === 'holds' && c.heldWhenSealed === true);
  return { sealed: true, engine, fingerprint: fp, values, claims, problems, matches };
}

function checkFingerprint(seal: SealRecord, print: ReturnType<typeof fingerprint>): FingerprintCheck {
  const details: string[] = [];
  const wholeSame = seal.fingerprint === print.whole;
  if (seal.cells !== null && seal.cells !== print.cells) {
    details.push(wholeSame ? sealMsg.cellsLineEdited() : sealMsg.cellsChanged());
  }
  if (seal.data !== null) {
    for (const [name, d] of print.files) {
      if (!seal.data.has(name)) details.push(sealMsg.dataNotNamed(name));
      else if (d === null) details.push(sealMsg.dataMissing(name));
      else if (seal.data.get(name) !== d) details.push(wholeSame ? sealMsg.dataLineEdited(name) : sealMsg.dataChanged(name));
    }
    for (const name of seal.data.keys()) if (!print.files.has(name)) details.push(sealMsg.dataNoLongerNamed(name));
  }
  if (!wholeSame && details.length === 0) {
    details.push(seal.fingerprint === null ? sealMsg.noFingerprint() : sealMsg.fingerprintEdited());
  }
  // every part must match as well as the whole: a seal whose parts disagree was altered
  const same = wholeSame && details.length === 0 && seal.cells !== null && seal.data !== null;
  return { same, details, now: print.whole };
}

function checkValues(seal: SealRecord, states: readonly CellState[], problems: string[]): ValueCheck[] {
  const now = new Map(namedValues(states).map((v) => [v.name, v] as const));
  const out: ValueCheck[] = [];
  for (const [name, sealed] of seal.values) {
    const current = now.get(name);
    if (current === undefined) {
      out.push({ name, cell: null, state: 'missing', details: [sealMsg.valueGone(name)] });
      continue;
    }
    const tree = readJson(current.json);
    if (sameTree(sealed.json, tree)) {
      out.push({ name, cell: current.cell, state: 'same', details: [] });
      // the same value, written otherwise: a seal writes one canonical text, so this was edited
      if (sealed.text !== current.json) problems.push(sealMsg.valueEdited(sealed.line, name));
    }
    else {
      const details: string[] = [];
      describeDifference(name, sealed.json, tree, details);
      const more = details.length - MAX_DETAILS;
      const tail = more <= 0 ? [] : [sealMsg.moreDifferences(more, details.length >= MAX_COUNTED)];
      out.push({ name, cell: current.cell, state: 'changed', details: details.slice(0, MAX_DETAILS).concat(tail) });
    }
  }
  for (const [name, v] of now) {
    if (!seal.values.has(name)) out.push({ name, cell: v.cell, state: 'new', details: [sealMsg.valueNew(name)] });
  }
  return out;
}

function checkClaims(sealed: readonly SealedClaim[], states: readonly CellState[]): ClaimCheck[] {
  const current = claimsOf(states);
  const key = (c: { name: string | null; statement: string }): string => (c.name !== null ? `name:${c.name}` : `statement:${c.statement}`);
  const sealedByKey = new Map(sealed.map((c) => [key(c), c] as const));
  const out: ClaimCheck[] = [];
  const matched = new Set<string>();
  for (const c of current) {
    const k = key(c);
    const was = sealedByKey.get(k);
    if (was !== undefined) matched.add(k);
    out.push({
      name: c.name,
      statement: c.statement,
      cell: c.cell,
      state: was === undefined ? 'new' : c.holds ? 'holds' : 'fails',
      heldWhenSealed: was?.holds ?? null,
      detail: was === undefined ? sealMsg.claimNotSealed(c.holds) : null,
    });
  }
  for (const c of sealed) {
    if (matched.has(key(c))) continue;
    const i = c.name === null ? -1 : states.findIndex((s) => s.name === c.name);
    const s = i >= 0 ? states[i] : undefined;
    if (s !== undefined && s.error !== null) {
      out.push({ name: c.name, statement: c.statement, cell: i + 1, state: 'error', heldWhenSealed: c.holds, detail: sealMsg.claimCellError(s.error.message) });
    } else {
      out.push({ name: c.name, statement: c.statement, cell: i >= 0 ? i + 1 : null, state: 'gone', heldWhenSealed: c.holds, detail: sealMsg.claimGone() });
    }
  }
  return out;
}

// ---- describing a difference -----------------------------------------------------------

function isStandIn(t: JsonTree): t is JsonObject {
  return t instanceof JsonObject && t.members.size === 3 && typeof t.members.get('length') === 'number' && typeof t.members.get('sha256') === 'string' && Array.isArray(t.members.get('blocks'));
}

function isErrorWrap(t: JsonTree): boolean {
  return t instanceof JsonObject && t.members.size === 1 && t.members.get('error') instanceof JsonObject;
}

/** A JSON tree as a short text for a line of the report. */
export function shortJson(t: JsonTree, room = 70): string {
  let s: string;
  if (isErrorWrap(t)) {
    const m = ((t as JsonObject).members.get('error') as JsonObject).members.get('message');
    s = sealMsg.sealedError(typeof m === 'string' ? m : '?');
  } else if (isStandIn(t)) s = sealMsg.sealedByDigest(t.members.get('length') as number);
  else s = writeShort(t);
  return s.length > room ? `${s.slice(0, room - 1)}…` : s;
}

function writeShort(t: JsonTree): string {
  if (t === null) return 'null';
  if (typeof t === 'number') return String(Object.is(t, -0) ? '-0' : t);
  if (typeof t === 'string') return JSON.stringify(t);
  if (typeof t === 'boolean') return String(t);
  if (t instanceof JsonObject) return `{${[...t.members].map(([k, v]) => `${JSON.stringify(k)}:${writeShort(v)}`).join(',')}}`;
  return `[${(t as readonly JsonTree[]).map(writeShort).join(',')}]`;
}

function memberPath(path: string, key: string): string {
  return /^[A-Za-z_][A-Za-z0-9_]*$/.test(key) ? `${path}.${key}` : `${path}[${JSON.stringify(key)}]`;
}

/** Lists what differs between a sealed tree and a recomputed one, as plain lines. */
function describeDifference(path: string, was: JsonTree, now: JsonTree, out: string[], rowLabels: readonly string[] | null = null): void {
  if (out.length >= MAX_COUNTED) return;
  if (isStandIn(was) && isStandIn(now)) {
    const n0 = was.members.get('length') as number;
    const n1 = now.members.get('length') as number;
    if (n0 !== n1) {
      out.push(sealMsg.lengthsDiffer(path, n0, n1));
      return;
    }
    const b0 = was.members.get('blocks') as readonly JsonTree[];
    const b1 = now.members.get('blocks') as readonly JsonTree[];
    const size = blockSize(n1);
    const ranges: string[] = [];
    for (let k = 0; k < Math.max(b0.length, b1.length); k++) {
      if (b0[k] === b1[k]) continue;
      const from = k * size + 1;
      const to = Math.min(n1, (k + 1) * size);
      ranges.push(from === to ? `${from}` : `${from} to ${to}`);
    }
    if (ranges.length === 0) out.push(sealMsg.digestDiffers(path, n1));
    else out.push(sealMsg.runsDiffer(path, ranges.slice(0, 6), ranges.length - 6, n1));
    return;
  }
  if (was instanceof JsonObject && now instanceof JsonObject && !isErrorWrap(was) && !isErrorWrap(now)) {
    const k0 = [...was.members.keys()];
    const k1 = [...now.members.keys()];
    if (k0.join('\u0000') !== k1.join('\u0000')) {
      if (was.members.has('sha256') && now.members.has('sha256') && path.endsWith('vega_lite')) {
        out.push(sealMsg.chartDiffers(path));
        return;
      }
      out.push(sealMsg.fieldsDiffer(path, k0, k1));
      return;
    }
    if (path.endsWith('vega_lite') && was.members.has('sha256')) {
      out.push(sealMsg.chartDiffers(path));
      return;
    }
    const labels = tableRowLabels(now);
    for (const k of k0) {
      const a = was.members.get(k)!;
      const b = now.members.get(k)!;
      if (!sameTree(a, b)) describeDifference(memberPath(path, k), a, b, out, labels);
    }
    return;
  }
  if (Array.isArray(was) && Array.isArray(now)) {
    const a = was as readonly JsonTree[];
    const b = now as readonly JsonTree[];
    if (a.length !== b.length) {
      out.push(sealMsg.lengthsDiffer(path, a.length, b.length));
      return;
    }
    for (let i = 0; i < a.length && out.length < MAX_COUNTED; i++) {
      const label = rowLabels?.[i];
      if (!sameTree(a[i]!, b[i]!)) describeDifference(`${path}[${i + 1}]${label === undefined ? '' : ` (${label})`}`, a[i]!, b[i]!, out);
    }
    return;
  }
  const ulps = typeof was === 'number' && typeof now === 'number' ? ulpDistance(was, now) : null;
  out.push(sealMsg.valueWasNow(path, shortJson(was), shortJson(now), ulps !== null && ulps <= NEAR_ULPS ? ulps : null));
}

/**
 * For an object that reads as a table (every member an array of one length) whose first
 * column holds texts (an analysis table's sources, a means table's levels, the two levels of
 * a pair), those texts, to name rows by ("error", "80C - 60C") as well as by number.
 */
function tableRowLabels(t: JsonObject): string[] | null {
  let length = -1;
  for (const v of t.members.values()) {
    if (!Array.isArray(v)) return null;
    if (length >= 0 && v.length !== length) return null;
    length = v.length;
  }
  const a = [...t.members.values()] as (readonly JsonTree[])[];
  const texts = a[0];
  if (texts === undefined || length <= 0 || !texts.every((x) => typeof x === 'string')) return null;
  const second = a.length > 1 && a[1]!.every((x) => typeof x === 'string') ? (a[1] as readonly string[]) : null;
  return (texts as readonly string[]).map((x, i) => (second === null ? x : `${x} - ${second[i]}`));
}

/** Differences up to this many units in the last place are named as such. */
const NEAR_ULPS = 1024;

/**
 * How many doubles lie between two finite numbers of the same sign, counting one end:
 * 1 for neighbours. Null when it does not apply (signs differ, a number is not finite).
 */
export function ulpDistance(a: number, b: number): number | null {
  if (!Number.isFinite(a) || !Number.isFinite(b) || Math.sign(a) !== Math.sign(b) || Object.is(a, -0) !== Object.is(b, -0)) return null;
  const view = new DataView(new ArrayBuffer(8));
  const bits = (x: number): bigint => {
    view.setFloat64(0, Math.abs(x));
    return view.getBigUint64(0);
  };
  const d = bits(a) - bits(b);
  const n = d < 0n ? -d : d;
  return n > BigInt(Number.MAX_SAFE_INTEGER) ? null : Number(n);
}
