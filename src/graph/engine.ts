/**
 * The reactive graph: the heart of the engine.
 *
 *   document text -> cells -> analysis (names defined and read) -> dependency graph
 *     -> evaluation in dependency order -> values -> views
 *
 * 1. Analyse: each cell is parsed once per change of its text (cached by marker and body).
 * 2. Resolve: every name read is matched to the one cell that defines it; names defined
 *    twice and cells in a cycle are found here and marked.
 * 3. Order: cells are sorted so that every cell comes after the cells it reads.
 * 4. Evaluate: a cell runs only when its own text changed or when a value it read has a
 *    new version. Every cell's value carries a version that moves only when the value
 *    really changed (compared structurally), so an edit that gives the same result stops
 *    the wave there. Errors are values and stay where they arise.
 *
 * The engine touches no DOM; it runs in Node, in the page and in a Web Worker.
 */
import type { Cell, Document } from '../doc/document.ts';
import { markerKind } from '../doc/document.ts';
import type { Registry } from '../lang/builtins.ts';
import type { NameUse } from '../lang/ast.ts';
import { LangError } from '../lang/errors.ts';
import type { EvalEnv, Lookup, Scope } from '../lang/evaluate.ts';
import { msg } from '../messages/language.ts';
import { MISSING, errorValue, isError, sameValue, type ErrorValue, type Value } from '../lang/values.ts';
import type { AnalyseEnv, CellAnalysis, CellKind, FileSource } from './cell-kind.ts';
import type { CellKinds } from './kinds.ts';
import { MinHeap, cyclePath, tarjan } from './order.ts';

/** How a cell stands, at a glance. */
export type CellStatus = 'ok' | 'error' | 'upstream' | 'inert';

/** What the engine knows about one cell after an update. */
export interface CellState {
  readonly id: string;
  readonly kind: string;
  /** The name the cell defines, if any. */
  readonly name: string | null;
  readonly value: Value;
  /** For notes: each placeholder's value. */
  readonly parts: readonly Value[] | null;
  readonly warnings: readonly string[];
  readonly status: CellStatus;
  /** The error that decides the status: the value itself, or a note's first failed placeholder. */
  readonly error: ErrorValue | null;
  /** Moves each time the value changes. */
  readonly version: number;
  /** How many times this cell has been evaluated since it was loaded. */
  readonly evaluations: number;
}

/** Options of one update. */
export interface UpdateOptions {
  /** The cells whose text changed since the last update (all others are taken as they were). */
  readonly touched?: ReadonlySet<string>;
  /** Hears, before evaluation starts, the cells that may get a new value, in evaluation order. */
  readonly onPlanned?: (ids: readonly string[]) => void;
}

/** Options of an engine. */
export interface EngineOptions {
  readonly registry: Registry;
  readonly kinds: CellKinds;
  /** Reports progress of a long evaluation: the cell and a fraction from 0 to 1. */
  readonly onProgress?: (cellId: string, fraction: number) => void;
  /**
   * Reports the progress of a long update, cell by cell: called before a cell runs, once
   * the update has taken more than `stepAfterMs` (so quick updates say nothing).
   */
  readonly onStep?: (cellId: string, done: number, total: number) => void;
  readonly stepAfterMs?: number;
}

interface Slot {
  cell: Cell;
  /** The versions of the files the cell reads, when it was last analysed. */
  fileKey: string;
  analysis: CellAnalysis;
  analysisVersion: number;
  value: Value;
  parts: readonly Value[] | null;
  warnings: string[];
  version: number;
  signature: string | null;
  evaluations: number;
  /** Set during resolution. */
  problem: ErrorValue | null;
}

const INERT: CellAnalysis = {
  defines: null,
  reads: [],
  problem: null,
  evaluates: false,
  evaluate: () => ({ value: MISSING }),
};

/** How many cells of a cycle an error names before it says how many there are. */
const CYCLE_NAMES_SHOWN = 6;

/** The evaluation engine for one document. */
export class Engine {
  private readonly registry: Registry;
  private readonly kinds: CellKinds;
  private readonly onProgress: ((cellId: string, fraction: number) => void) | undefined;
  private readonly onStep: ((cellId: string, done: number, total: number) => void) | undefined;
  private readonly stepAfterMs: number;
  private readonly slots = new Map<string, Slot>();
  private order: string[] = [];
  private definers = new Map<string, string[]>();
  /** Cells in a cycle: the one cycle traced through their component, and where they stand on it. */
  private cycleOf = new Map<string, { ring: readonly string[]; at: number; size: number }>();
  private readonly files = new Map<string, { text: string; version: number }>();
  private fileVersion = 0;
  private doc: Document | null = null;
  /** Total evaluations since the engine was made (tests count them). */
  evaluations = 0;

  constructor(options: EngineOptions) {
    this.registry = options.registry;
    this.kinds = options.kinds;
    this.onProgress = options.onProgress;
    this.onStep = options.onStep;
    this.stepAfterMs = options.stepAfterMs ?? 150;
  }

  /** Makes a CSV file available to tables that name it (or removes it with undefined). */
  setFile(name: string, text: string | undefined): void {
    if (text === undefined) this.files.delete(name);
    else if (this.files.get(name)?.text !== text) this.files.set(name, { text, version: ++this.fileVersion });
  }

  /** The current document. */
  get document(): Document | null {
    return this.doc;
  }

  /**
   * Brings the engine to a new version of the document and evaluates what the change
   * touches. Returns the ids of the cells that were evaluated, in the order they ran.
   *
   * `touched` names the cells whose text the change set (src/doc/edits.ts `cellsTouched`):
   * only those are read again; without it, every cell's text is compared with the last.
   * `onPlanned` hears, before evaluation starts, which cells may get a new value.
   */
  update(doc: Document, options: UpdateOptions = {}): string[] {
    this.doc = doc;
    const fileSource: FileSource = { read: (name) => this.files.get(name)?.text };
    const touched = options.touched;
    // 1. analyse changed cells
    const present = new Set<string>();
    const changedNames = new Set<string>();
    const reanalysed: string[] = [];
    for (const cell of doc.cells) {
      present.add(cell.id);
      const slot = this.slots.get(cell.id);
      const kind = this.kinds.of(cell);
      const fileKey = (kind?.filesRead(cell) ?? []).map((f) => `#${this.files.get(f)?.version ?? 'none'}`).join('');
      if (slot !== undefined && slot.fileKey === fileKey) {
        const same = touched !== undefined ? !touched.has(cell.id) : slot.cell.marker === cell.marker && slot.cell.body === cell.body;
        if (same) {
          slot.cell = cell;
          continue;
        }
      }
      const analysis = kind === undefined ? INERT : safeAnalyse(kind, cell, { files: fileSource, previous: slot?.analysis ?? null });
      reanalysed.push(cell.id);
      if (analysis.defines !== null) changedNames.add(analysis.defines.name);
      const before = slot?.analysis.defines;
      if (before != null) changedNames.add(before.name);
      if (slot === undefined) {
        this.slots.set(cell.id, {
          cell,
          fileKey,
          analysis,
          analysisVersion: 1,
          value: MISSING,
          parts: null,
          warnings: [],
          version: 0,
          signature: null,
          evaluations: 0,
          problem: null,
        });
      } else {
        slot.cell = cell;
        slot.fileKey = fileKey;
        slot.analysis = analysis;
        slot.analysisVersion++;
      }
    }
    for (const [id, slot] of [...this.slots]) {
      if (present.has(id)) continue;
      const d = slot.analysis.defines;
      if (d !== null) changedNames.add(d.name);
      this.slots.delete(id);
    }

    // 2. resolve names, 3. order
    this.resolve(doc);
    options.onPlanned?.(this.downstream(reanalysed, changedNames));

    // 4. evaluate what changed
    const ran: string[] = [];
    const started = Date.now();
    const total = this.order.length;
    let done = 0;
    for (const id of this.order) {
      done++;
      const slot = this.slots.get(id)!;
      const sig = this.signature(slot);
      if (sig === slot.signature) continue;
      slot.signature = sig;
      if (this.onStep !== undefined && Date.now() - started > this.stepAfterMs) this.onStep(id, done - 1, total);
      this.evaluate(slot);
      ran.push(id);
    }
    return ran;
  }

  /**
   * The cells that may get a new value: the cells read again, and every cell that defines
   * or reads, directly or not, a name one of them defined before or defines now.
   */
  private downstream(start: readonly string[], names: ReadonlySet<string>): string[] {
    const out = new Set(start);
    const queue = [...names];
    const readersOf = new Map<string, string[]>();
    for (const id of this.order) {
      for (const u of this.slots.get(id)!.analysis.reads) {
        const list = readersOf.get(u.name);
        if (list === undefined) readersOf.set(u.name, [id]);
        else if (list[list.length - 1] !== id) list.push(id);
      }
    }
    const seenNames = new Set<string>();
    while (queue.length > 0) {
      const name = queue.pop()!;
      if (seenNames.has(name)) continue;
      seenNames.add(name);
      // the definers of a name a change gave or took may gain or lose a duplicate
      for (const id of [...(this.definers.get(name) ?? []), ...(readersOf.get(name) ?? [])]) {
        if (out.has(id)) continue;
        out.add(id);
        const d = this.slots.get(id)!.analysis.defines;
        if (d !== null) queue.push(d.name);
      }
    }
    return this.order.filter((id) => out.has(id));
  }

  private resolve(doc: Document): void {
    const definers = new Map<string, string[]>();
    for (const cell of doc.cells) {
      const d = this.slots.get(cell.id)!.analysis.defines;
      if (d === null) continue;
      const list = definers.get(d.name);
      if (list === undefined) definers.set(d.name, [cell.id]);
      else list.push(cell.id);
    }
    this.definers = definers;
    // edges: definer -> reader, for names with exactly one definer
    const ids = doc.cells.map((c) => c.id);
    const index = new Map<string, number>();
    ids.forEach((id, i) => index.set(id, i));
    const succ: number[][] = ids.map(() => []);
    const pred: number[][] = ids.map(() => []);
    ids.forEach((id, i) => {
      const seen = new Set<string>();
      for (const use of this.slots.get(id)!.analysis.reads) {
        if (seen.has(use.name)) continue;
        seen.add(use.name);
        const defs = definers.get(use.name);
        if (defs === undefined || defs.length !== 1) continue;
        const j = index.get(defs[0]!)!;
        succ[j]!.push(i);
        pred[i]!.push(j);
      }
    });
    // cycles: strongly connected components with more than one cell, or a cell reading itself
    const comp = tarjan(succ);
    const members = new Map<number, number[]>();
    comp.forEach((c, i) => {
      const list = members.get(c);
      if (list === undefined) members.set(c, [i]);
      else list.push(i);
    });
    // one cycle is traced per component, and each cell of it names a few cells of that cycle
    // from itself on: reporting a cycle of N cells costs time and words in proportion to N
    this.cycleOf = new Map();
    for (const list of members.values()) {
      const self = list.length === 1 && succ[list[0]!]!.includes(list[0]!);
      if (list.length > 1 || self) {
        const set = new Set(list);
        let first = list[0]!;
        for (const i of list) if (i < first) first = i;
        const ring = cyclePath(first, succ, set).slice(0, -1).map((k) => ids[k]!);
        const at = new Map<string, number>();
        ring.forEach((id, k) => at.set(id, k));
        for (const i of list) this.cycleOf.set(ids[i]!, { ring, at: at.get(ids[i]!) ?? 0, size: list.length });
      }
    }
    // order: Kahn's algorithm, stable in document order, cycle cells last
    const indeg = pred.map((p) => p.length);
    const order: number[] = [];
    const ready: number[] = [];
    for (let i = 0; i < ids.length; i++) if (indeg[i] === 0) ready.push(i);
    // a binary heap keeps document order among ready cells without sorting each time
    const heap = new MinHeap(ready);
    while (heap.size > 0) {
      const i = heap.pop();
      order.push(i);
      for (const j of succ[i]!) if (--indeg[j]! === 0) heap.push(j);
    }
    const placed = new Set(order);
    for (let i = 0; i < ids.length; i++) if (!placed.has(i)) order.push(i);
    this.order = order.map((i) => ids[i]!);
    // problems found by resolution
    for (const id of ids) {
      const slot = this.slots.get(id)!;
      const d = slot.analysis.defines;
      slot.problem = null;
      if (d !== null && (definers.get(d.name)?.length ?? 0) > 1) {
        slot.problem = errorValue(msg.duplicateDefinition(d.name, definers.get(d.name)!.length), Math.max(0, d.from), Math.max(0, d.to));
      } else if (this.cycleOf.has(id)) {
        const { ring, at, size } = this.cycleOf.get(id)!;
        const shown = Math.min(ring.length, CYCLE_NAMES_SHOWN);
        const names: string[] = [];
        for (let k = 0; k < shown; k++) names.push(this.nameOf(ring[(at + k) % ring.length]!));
        const closed = ring.length <= CYCLE_NAMES_SHOWN;
        if (closed) names.push(this.nameOf(ring[at]!));
        // the underline: the name this cell reads that leads on round the cycle
        const next = ring[at] === id ? this.nameOf(ring[(at + 1) % ring.length]!) : null;
        const use = slot.analysis.reads.find((u) => (next !== null ? u.name === next : this.inCycle(u.name)));
        slot.problem = errorValue(msg.cycle(names, closed ? null : size), use?.from ?? 0, use?.to ?? 0);
      }
    }
  }

  /** The name a cell defines, or its id. */
  private nameOf(id: string): string {
    return this.slots.get(id)!.analysis.defines?.name ?? id;
  }

  /** True when the one cell that defines a name is in a cycle. */
  private inCycle(name: string): boolean {
    const defs = this.definers.get(name);
    return defs !== undefined && defs.length === 1 && this.cycleOf.has(defs[0]!);
  }

  /** What a cell's value depends on, as one string: its text and the versions it reads. */
  private signature(slot: Slot): string {
    let sig = `${slot.analysisVersion}`;
    if (slot.problem !== null) sig += `|!${slot.problem.message}`;
    const seen = new Set<string>();
    for (const use of slot.analysis.reads) {
      if (seen.has(use.name)) continue;
      seen.add(use.name);
      sig += `|${use.name}=${this.resolution(use.name)}`;
    }
    return sig;
  }

  private resolution(name: string): string {
    const defs = this.definers.get(name);
    if (defs === undefined) return '?';
    if (defs.length > 1) return '*';
    const id = defs[0]!;
    if (this.cycleOf.has(id)) return '@';
    return `${id}#${this.slots.get(id)!.version}`;
  }

  private scopeFor(): Scope {
    return {
      lookup: (name: string): Lookup => {
        const defs = this.definers.get(name);
        if (defs === undefined) return { kind: 'unknown' };
        if (defs.length > 1) return { kind: 'problem', message: msg.duplicateUpstream(name) };
        if (this.cycleOf.has(defs[0]!)) return { kind: 'problem', message: msg.cycleUpstream(name) };
        return { kind: 'value', value: this.slots.get(defs[0]!)!.value };
      },
      names: () => this.definers.keys(),
    };
  }

  private evaluate(slot: Slot): void {
    slot.evaluations++;
    this.evaluations++;
    const warnings: string[] = [];
    let value: Value;
    let parts: readonly Value[] | null = null;
    if (!slot.analysis.evaluates) value = MISSING;
    else if (slot.problem !== null) value = slot.problem;
    else if (slot.analysis.problem !== null) value = slot.analysis.problem;
    else {
      const env: EvalEnv = {
        scope: this.scopeFor(),
        registry: this.registry,
        warn: (m) => {
          if (!warnings.includes(m)) warnings.push(m);
        },
        progress: (f) => this.onProgress?.(slot.cell.id, f),
      };
      try {
        const out = slot.analysis.evaluate(env);
        value = out.value;
        parts = out.parts ?? null;
      } catch (err) {
        value = toErrorValue(err);
      }
    }
    if (!sameValue(value, slot.value)) slot.version++;
    slot.value = value;
    slot.parts = parts;
    slot.warnings = warnings;
  }

  /** The state of one cell. */
  state(id: string): CellState | undefined {
    const slot = this.slots.get(id);
    if (slot === undefined) return undefined;
    const v = slot.value;
    const failure = isError(v) ? v : (slot.parts?.find(isError) as ErrorValue | undefined);
    const status: CellStatus = !slot.analysis.evaluates
      ? 'inert'
      : failure === undefined
        ? 'ok'
        : failure.upstream !== null
          ? 'upstream'
          : 'error';
    return {
      id,
      kind: markerKind(slot.cell.marker),
      name: slot.analysis.defines?.name ?? null,
      value: v,
      parts: slot.parts,
      warnings: slot.warnings,
      status,
      error: failure ?? null,
      version: slot.version,
      evaluations: slot.evaluations,
    };
  }

  /** The states of every cell, in document order. */
  states(): CellState[] {
    return (this.doc?.cells ?? []).map((c) => this.state(c.id)!);
  }

  /** The names a cell reads (for the page's dependency display and completion). */
  reads(id: string): readonly NameUse[] {
    return this.slots.get(id)?.analysis.reads ?? [];
  }

  /** Every name defined in the document. */
  definedNames(): string[] {
    return [...this.definers.keys()];
  }

  /** The current value of a name, if exactly one cell defines it. */
  valueOf(name: string): Value | undefined {
    const defs = this.definers.get(name);
    if (defs === undefined || defs.length !== 1) return undefined;
    return this.slots.get(defs[0]!)!.value;
  }
}

function safeAnalyse(kind: CellKind, cell: Cell, env: AnalyseEnv): CellAnalysis {
  try {
    return kind.analyse(cell, env);
  } catch (err) {
    return { ...INERT, evaluates: true, problem: toErrorValue(err) };
  }
}

function toErrorValue(err: unknown): ErrorValue {
  if (err instanceof LangError) return errorValue(err.message, err.from, err.to, err.upstream);
  const detail = err instanceof Error ? err.message : String(err);
  return errorValue(msg.internal('evaluation', detail), 0, 0);
}
