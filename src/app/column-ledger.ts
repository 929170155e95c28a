/**
 * Columns the page already holds are not sent again. A result of the evaluation worker
 * carries every value of the cells that ran; a table of 100,000 rows is megabytes, and an
 * edit of one field changes one element of one column. So both sides keep a ledger of the
 * long columns the page holds, by number: the worker sends a column the page holds as its
 * number, a column that differs from one it holds in a few elements as those elements (a
 * patch), and only a new column whole.
 *
 * The two ledgers stay in step without talking: both see the same result messages in the
 * same order, and after each one both keep exactly the columns that the cells' current
 * values use (`settle`). The worker stages a message's columns in a batch and commits it
 * only once the message is posted, so a failure to post changes nothing.
 *
 * A patched number column's decimal texts stay ranges of a text: the page appends the
 * patched texts to the base column's text and points the changed rows there, so a decimal
 * text reads the same on both sides (`decimalAt`) without a million strings.
 */
import {
  decimalAt,
  isTextRanges,
  sameTexts,
  type Column,
  type DecimalTexts,
  type RecordValue,
  type Table,
  type TextRanges,
  type Value,
} from '../lang/values.ts';
import { columnChangeOf, isWrittenOver } from '../lang/column-changes.ts';

/** Columns shorter than this are sent whole every time: they cost less than keeping them. */
export const LEDGER_MIN_LENGTH = 256;

/** A column that differs from its base in more than this share of elements is sent whole. */
const PATCH_SHARE = 1 / 16;

/** A column the page holds, by number. */
interface HeldColumn {
  readonly kind: 'column-held';
  readonly id: number;
}

/** A column sent whole, with the number it will be held by. */
interface SentColumn {
  readonly kind: 'column-sent';
  readonly id: number;
  readonly column: Column;
}

/** A column made from one the page holds (`base`) by changing the elements at `rows`. */
interface PatchedColumn {
  readonly kind: 'column-patched';
  readonly id: number;
  readonly base: number;
  readonly name: string | null;
  readonly order: readonly string[] | undefined;
  readonly rows: Int32Array;
  /** The new elements at `rows`, in the column's own element type. */
  readonly values: Float64Array | readonly string[] | Uint8Array;
  /** 1 where the new element is missing. */
  readonly missing: Uint8Array;
  /** The new decimal texts at `rows` (number columns with decimal texts only). */
  readonly decimals: readonly string[] | null;
}

type WireColumn = HeldColumn | SentColumn | PatchedColumn;

/** A cell's result as a message brings it: its value and parts with wire columns. */
export interface ArrivingCell {
  readonly id: string;
  readonly value: WireValue;
  readonly parts: readonly WireValue[] | null;
}

/** A value as it travels: a Value whose long columns may be wire columns. */
export type WireValue = Value | WireColumn | { readonly kind: 'table' | 'record'; readonly [k: string]: unknown };

function isColumn(v: Value): v is Column {
  return typeof v === 'object' && v.kind === 'column';
}

function isWireColumn(v: unknown): v is WireColumn {
  if (typeof v !== 'object' || v === null) return false;
  const k = (v as { kind?: unknown }).kind;
  return k === 'column-held' || k === 'column-sent' || k === 'column-patched';
}

const missingAt = (c: Column, i: number): number => (c.missing === null ? 0 : c.missing[i]!);


/** True when decimal text i is the same in a and b, without slicing ranges. */
function sameDecimal(a: DecimalTexts, b: DecimalTexts, i: number): boolean {
  if (isTextRanges(a) && isTextRanges(b)) {
    const af = a.from[i]!;
    const bf = b.from[i]!;
    const n = a.to[i]! - af;
    if (b.to[i]! - bf !== n) return false;
    if (a.source === b.source && af === bf) return true;
    for (let k = 0; k < n; k++) if (a.source.charCodeAt(af + k) !== b.source.charCodeAt(bf + k)) return false;
    return true;
  }
  return decimalAt(a, i) === decimalAt(b, i);
}

/**
 * The rows where `next` differs from `base`, or null when they are not the same kind of
 * column (type, length, name, level order, whether decimal texts are kept) or differ in
 * more than `limit` rows.
 */
export function changedRows(base: Column, next: Column, limit: number): Int32Array | null {
  if (base.type !== next.type || base.values.length !== next.values.length || base.name !== next.name || !sameTexts(base.order ?? null, next.order ?? null)) return null;
  // an array an edit wrote in place for `next` (cells/table/model-rows.ts): what `base`
  // held is gone, so its rows cannot be compared
  if (base !== next && base.values === next.values && (isWrittenOver(base) || isWrittenOver(next))) return null;
  const n = next.values.length;
  const rows: number[] = [];
  if (base.type === 'number' && next.type === 'number') {
    if ((base.decimals === null) !== (next.decimals === null)) return null;
    const a = base.values;
    const b = next.values;
    const da = base.decimals;
    const db = next.decimals;
    for (let i = 0; i < n; i++) {
      if (Object.is(a[i], b[i]) && missingAt(base, i) === missingAt(next, i) && (da === null || sameDecimal(da, db!, i))) continue;
      rows.push(i);
      if (rows.length > limit) return null;
    }
  } else {
    const a = base.values as ArrayLike<string | number>;
    const b = next.values as ArrayLike<string | number>;
    for (let i = 0; i < n; i++) {
      if (a[i] === b[i] && missingAt(base, i) === missingAt(next, i)) continue;
      rows.push(i);
      if (rows.length > limit) return null;
    }
  }
  return Int32Array.from(rows);
}

/** The patch that makes `next` from `base` at `rows`. */
function patchOf(id: number, baseId: number, next: Column, rows: Int32Array): PatchedColumn {
  const k = rows.length;
  const missing = new Uint8Array(k);
  for (let j = 0; j < k; j++) missing[j] = missingAt(next, rows[j]!);
  let values: PatchedColumn['values'];
  let decimals: string[] | null = null;
  if (next.type === 'number') {
    const v = new Float64Array(k);
    for (let j = 0; j < k; j++) v[j] = next.values[rows[j]!]!;
    values = v;
    const d = next.decimals;
    // the maker's own reading of the changed texts, when it noted one (a short text)
    const noted = columnChangeOf(next)?.texts;
    if (d !== null) decimals = noted !== undefined && noted.from.length === k && columnChangeOf(next)!.rows === rows ? Array.from(rows, (_, j) => noted.source.slice(noted.from[j]!, noted.to[j]!)) : Array.from(rows, (r) => decimalAt(d, r) ?? '');
  } else if (next.type === 'boolean') {
    const v = new Uint8Array(k);
    for (let j = 0; j < k; j++) v[j] = next.values[rows[j]!]!;
    values = v;
  } else {
    values = Array.from(rows, (r) => next.values[r]!);
  }
  return { kind: 'column-patched', id, base: baseId, name: next.name, order: next.order, rows, values, missing, decimals };
}

/** The arrays a column holds its elements, marks and decimal texts in. */
function arraysOf(c: Column): unknown[] {
  const out: unknown[] = [c.values];
  if (c.missing !== null) out.push(c.missing);
  if (c.type === 'number' && c.decimals !== null) {
    if (isTextRanges(c.decimals)) out.push(c.decimals.from, c.decimals.to);
    else out.push(c.decimals);
  }
  return out;
}

/**
 * A patch applied to the column it was made from (the page's side). `inPlace` when nothing
 * else will read the base again (ColumnReceiver decides): its arrays are written and become
 * the new column's, instead of copied. In a table of 100,000 rows a copy is 1.7 MB of fresh
 * memory at every field edit.
 */
export function applyPatch(base: Column, p: PatchedColumn, inPlace = false): Column {
  const n = base.values.length;
  const k = p.rows.length;
  let missing: Uint8Array | null = base.missing === null ? null : inPlace ? base.missing : base.missing.slice();
  for (let j = 0; j < k; j++) {
    if (p.missing[j] === 1 && missing === null) missing = new Uint8Array(n);
    if (missing !== null) missing[p.rows[j]!] = p.missing[j]!;
  }
  if (missing !== null && !missing.includes(1)) missing = null;
  const common = { kind: 'column' as const, missing, name: p.name, ...(p.order === undefined ? {} : { order: p.order }) };
  if (base.type === 'number') {
    const values = inPlace ? base.values : base.values.slice();
    const v = p.values as Float64Array;
    for (let j = 0; j < k; j++) values[p.rows[j]!] = v[j]!;
    return { ...common, type: 'number', values, decimals: patchDecimals(base.decimals, p, inPlace) };
  }
  if (base.type === 'boolean') {
    const values = inPlace ? base.values : base.values.slice();
    const v = p.values as Uint8Array;
    for (let j = 0; j < k; j++) values[p.rows[j]!] = v[j]!;
    return { ...common, type: 'boolean', values };
  }
  const values = inPlace ? (base.values as string[]) : base.values.slice();
  const v = p.values as readonly string[];
  for (let j = 0; j < k; j++) values[p.rows[j]!] = v[j]!;
  return { ...common, type: 'text', values };
}

/** The decimal texts of a patched column: ranges stay ranges, over the old text and the new texts after it. */
function patchDecimals(base: DecimalTexts | null, p: PatchedColumn, inPlace: boolean): DecimalTexts | null {
  if (base === null || p.decimals === null) return null;
  const texts = p.decimals;
  if (!isTextRanges(base)) {
    const out = inPlace ? (base as string[]) : base.slice();
    p.rows.forEach((r, j) => (out[r] = texts[j]!));
    return out;
  }
  const from = inPlace ? base.from : base.from.slice();
  const to = inPlace ? base.to : base.to.slice();
  let at = base.source.length;
  p.rows.forEach((r, j) => {
    from[r] = at;
    at += texts[j]!.length;
    to[r] = at;
  });
  const ranges: TextRanges = { source: base.source + texts.join(''), from, to };
  return ranges;
}

/**
 * Walks a value, replacing each long column by what `column` makes of it, and records
 * losing their `internal` part (which only the engine needs). `previous` is the same
 * place in the cell's previous value, if any: a column there is a candidate base.
 */
function mapValue(v: Value, previous: Value | undefined, column: (c: Column, previous: Value | undefined) => unknown): unknown {
  if (typeof v !== 'object') return v;
  switch (v.kind) {
    case 'column':
      return v.values.length >= LEDGER_MIN_LENGTH ? column(v, previous) : v;
    case 'table': {
      const prev = previous !== undefined && typeof previous === 'object' && previous.kind === 'table' ? previous : undefined;
      const columns = v.columns.map((c, j) => mapValue(c, prev !== undefined && prev.names[j] === v.names[j] ? prev.columns[j] : undefined, column));
      const out: Record<string, unknown> = { kind: 'table', names: v.names, columns, rows: v.rows };
      if (v.drawn !== undefined) out.drawn = mapValue(v.drawn, prev?.drawn, column);
      return out;
    }
    case 'record': {
      const prev = previous !== undefined && typeof previous === 'object' && previous.kind === 'record' ? previous : undefined;
      const fields = new Map<string, unknown>();
      for (const [k, x] of v.fields) fields.set(k, mapValue(x, prev?.fields.get(k), column));
      const out: Record<string, unknown> = { kind: 'record', fields, tag: v.tag };
      if (v.identity !== undefined) out.identity = v.identity;
      return out;
    }
    default:
      return v;
  }
}

/** What one cell's result holds: its value and its parts. */
export interface CellValues {
  readonly value: Value;
  readonly parts: readonly Value[] | null;
}

/** The worker's ledger: what the page holds, and how to send a message's values. */
export class ColumnSender {
  private readonly ids = new WeakMap<Column, number>();
  private nextId = 1;
  /** Columns the page holds, by number. */
  private held = new Set<number>();
  /** The numbers each cell's current value uses, and the values last sent for it. */
  private readonly byCell = new Map<string, { readonly ids: readonly number[]; readonly sent: CellValues }>();

  /** Starts a message: values encoded in it are committed with {@link SendBatch.commit}. */
  batch(): SendBatch {
    return new SendBatch(this);
  }

  /** @internal */ idOf(c: Column): number | undefined {
    return this.ids.get(c);
  }
  /** @internal */ newId(c: Column): number {
    const id = this.nextId++;
    this.ids.set(c, id);
    return id;
  }
  /** @internal */ holds(id: number): boolean {
    return this.held.has(id);
  }
  /** @internal */ previous(cell: string): CellValues | undefined {
    return this.byCell.get(cell)?.sent;
  }
  /** @internal */ settle(cells: ReadonlyMap<string, { ids: number[]; sent: CellValues }>, gone: readonly string[]): void {
    for (const [cell, x] of cells) this.byCell.set(cell, x);
    for (const cell of gone) this.byCell.delete(cell);
    this.held = new Set([...this.byCell.values()].flatMap((x) => x.ids));
  }
  /** How many columns the page holds (for tests). */
  get heldCount(): number {
    return this.held.size;
  }
}

/** The values of one message, encoded against what the page holds. */
export class SendBatch {
  private readonly cells = new Map<string, { ids: number[]; sent: CellValues }>();
  /** Columns sent in this message, which later cells of it may refer to. */
  private readonly sentNow = new Set<number>();
  private readonly ledger: ColumnSender;

  constructor(ledger: ColumnSender) {
    this.ledger = ledger;
  }

  /** A cell's value and parts as they travel. */
  encode(cell: string, values: CellValues): { value: WireValue; parts: WireValue[] | null } {
    const ids: number[] = [];
    const before = this.ledger.previous(cell);
    const column = (c: Column, previous: Value | undefined): WireColumn => {
      const known = this.ledger.idOf(c);
      if (known !== undefined && (this.ledger.holds(known) || this.sentNow.has(known))) {
        ids.push(known);
        return { kind: 'column-held', id: known };
      }
      const id = known ?? this.ledger.newId(c);
      ids.push(id);
      this.sentNow.add(id);
      if (previous !== undefined && isColumn(previous)) {
        const baseId = this.ledger.idOf(previous);
        if (baseId !== undefined && baseId !== id && (this.ledger.holds(baseId) || this.sentNow.has(baseId))) {
          // the maker of the column may have noted which rows it changed
          const noted = columnChangeOf(c);
          const rows = noted !== undefined && noted.base === previous ? noted.rows : changedRows(previous, c, Math.floor(c.values.length * PATCH_SHARE));
          if (rows !== null) return patchOf(id, baseId, c, rows);
        }
      }
      return { kind: 'column-sent', id, column: c };
    };
    const value = mapValue(values.value, before?.value, column) as WireValue;
    const parts = values.parts === null ? null : values.parts.map((p, i) => mapValue(p, before?.parts?.[i], column) as WireValue);
    this.cells.set(cell, { ids, sent: values });
    return { value, parts };
  }

  /** The message was posted: the page now holds what it carried. */
  commit(gone: readonly string[]): void {
    this.ledger.settle(this.cells, gone);
  }
}

/** The page's ledger: the columns it holds, by number. */
export class ColumnReceiver {
  private byId = new Map<number, Column>();
  private readonly byCell = new Map<string, readonly number[]>();
  private pending = new Map<string, number[]>();
  /** Columns that the message being decoded patches and that nothing reads afterwards ({@link decodeAll}). */
  private movable = new Set<number>();

  /**
   * Decodes a message's results, cell after cell, then {@link settle}s. A patched column
   * whose base nothing else will read (no other cell holds it, no other part of the message
   * names it) takes over the base's arrays instead of copying them.
   */
  decodeAll(results: readonly ArrivingCell[], gone: readonly string[]): { value: Value; parts: Value[] | null }[] {
    this.movable = this.soleBases(results);
    try {
      return results.map((r) => ({
        value: this.decode(r.id, r.value),
        parts: r.parts === null ? null : r.parts.map((p) => this.decode(r.id, p)),
      }));
    } finally {
      this.movable = new Set();
      this.settle(gone);
    }
  }

  /** The bases patched once in this message, named nowhere else in it, held by no other cell. */
  private soleBases(results: readonly ArrivingCell[]): Set<number> {
    const patched = new Map<number, { cell: string; times: number }>();
    const named = new Set<number>();
    const walk = (cell: string, w: unknown): void => {
      if (typeof w !== 'object' || w === null) return;
      if (isWireColumn(w)) {
        if (w.kind === 'column-patched') {
          const seen = patched.get(w.base);
          patched.set(w.base, { cell, times: (seen?.times ?? 0) + 1 });
        } else if (w.kind === 'column-held') named.add(w.id);
        return;
      }
      const k = (w as { kind?: unknown }).kind;
      if (k === 'table') for (const c of (w as { columns: unknown[] }).columns) walk(cell, c);
      else if (k === 'record') for (const x of (w as { fields: Map<string, unknown> }).fields.values()) walk(cell, x);
      if (k === 'table' && (w as { drawn?: unknown }).drawn !== undefined) walk(cell, (w as { drawn?: unknown }).drawn);
    };
    for (const r of results) {
      walk(r.id, r.value);
      for (const p of r.parts ?? []) walk(r.id, p);
    }
    // Two columns may share arrays under two numbers (a column with its levels put in order
    // is the same values under another name, and a message carries them as one): such
    // arrays are never taken over, whichever cell holds them.
    const shared = new Set<unknown>();
    const once = new Set<unknown>();
    for (const c of this.byId.values()) {
      for (const a of arraysOf(c)) {
        if (once.has(a)) shared.add(a);
        once.add(a);
      }
    }
    const sole = new Set<number>();
    for (const [base, { cell, times }] of patched) {
      if (times !== 1 || named.has(base)) continue;
      let elsewhere = false;
      for (const [other, ids] of this.byCell) if (other !== cell && ids.includes(base)) elsewhere = true;
      const column = this.byId.get(base);
      if (column !== undefined && arraysOf(column).some((a) => shared.has(a))) elsewhere = true;
      if (!elsewhere) sole.add(base);
    }
    return sole;
  }

  /** A cell's value as it arrived, with its columns put back. Call {@link settle} after the message. */
  decode(cell: string, wire: WireValue, ids: number[] = this.usesOf(cell)): Value {
    if (typeof wire !== 'object') return wire;
    if (isWireColumn(wire)) {
      ids.push(wire.id);
      if (wire.kind === 'column-sent') {
        this.byId.set(wire.id, wire.column);
        return wire.column;
      }
      if (wire.kind === 'column-held') return this.column(wire.id);
      const made = applyPatch(this.column(wire.base), wire, this.movable.has(wire.base));
      this.byId.set(wire.id, made);
      return made;
    }
    switch (wire.kind) {
      case 'table': {
        const t = wire as unknown as Table & { columns: WireValue[]; drawn?: WireValue };
        const columns = t.columns.map((c) => this.decode(cell, c, ids) as Column);
        const drawn = t.drawn === undefined ? undefined : (this.decode(cell, t.drawn, ids) as RecordValue);
        return drawn === undefined ? { kind: 'table', names: t.names, columns, rows: t.rows } : { kind: 'table', names: t.names, columns, rows: t.rows, drawn };
      }
      case 'record': {
        const r = wire as unknown as RecordValue & { fields: Map<string, WireValue> };
        const fields = new Map<string, Value>();
        for (const [k, x] of r.fields) fields.set(k, this.decode(cell, x, ids));
        return r.identity === undefined ? { kind: 'record', fields, tag: r.tag } : { kind: 'record', fields, tag: r.tag, identity: r.identity };
      }
      default:
        return wire as Value;
    }
  }

  /** After a message: keep the columns the cells' current values use, drop the rest. */
  settle(gone: readonly string[]): void {
    for (const [cell, ids] of this.pending) this.byCell.set(cell, ids);
    for (const cell of gone) this.byCell.delete(cell);
    this.pending = new Map();
    const keep = new Map<number, Column>();
    for (const ids of this.byCell.values()) for (const id of ids) keep.set(id, this.column(id));
    this.byId = keep;
  }

  /** How many columns the page holds (for tests). */
  get heldCount(): number {
    return this.byId.size;
  }

  private usesOf(cell: string): number[] {
    let ids = this.pending.get(cell);
    if (ids === undefined) this.pending.set(cell, (ids = []));
    return ids;
  }

  private column(id: number): Column {
    const c = this.byId.get(id);
    // the two ledgers follow the same messages; a number the page does not hold is a fault
    if (c === undefined) throw new Error(`column ${id} is not held by the page`);
    return c;
  }
}
