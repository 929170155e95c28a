/**
 * Drawing a chart without letting it reach anything, in the page and in Node alike. Chart
 * specs are built by the project (src/charts), but a document can come from anyone and its
 * values travel through the worker, so every drawing treats a spec as data:
 *
 * - the spec is copied as plain JSON, and `usermeta` (which vega-embed would merge over the
 *   options given to it, turning menus back on or fetching a config) and `$schema` are
 *   dropped;
 * - the loader refuses every load, link and image, so a `data.url` reads nothing;
 * - warnings go to a logger that the caller shows, not to a console nobody reads;
 * - {@link reachingKeys} finds any key through which a spec could reach outside, so the
 *   tests can hold every builder to "inline data only".
 *
 * Nothing here imports vega at run time: the chart element loads it lazily and passes in
 * what is needed, so the first paint does not wait for it. The page's embedding options
 * stay in src/views/values/chart-safety.ts.
 */
import type { Loader } from 'vega';

/** A plain JSON object. */
export type SpecObject = { [key: string]: unknown };

/** Keys removed from the top of every spec before it is embedded. */
export const STRIPPED_KEYS = ['usermeta', '$schema'] as const;

/**
 * A deep copy of a spec as plain JSON, with {@link STRIPPED_KEYS} removed from the top
 * level and from every view nested in a composition (layer, concat, facet, repeat), where
 * vega-lite would carry them along. Returns null for anything that is not a JSON object
 * (a cycle, a function, an array, a primitive). Functions, symbols and undefined vanish in
 * the copy; NaN becomes null as in any JSON.
 */
export function cleanSpec(spec: unknown): SpecObject | null {
  let copy: unknown;
  try {
    const text = JSON.stringify(spec);
    if (text === undefined) return null;
    copy = JSON.parse(text);
  } catch {
    return null;
  }
  if (!isObject(copy)) return null;
  stripViews(copy, 0);
  return copy;
}

function isObject(v: unknown): v is SpecObject {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

// Where vega-lite nests whole views; data values are never under these keys.
const VIEW_KEYS = ['layer', 'concat', 'hconcat', 'vconcat', 'spec'] as const;

function stripViews(view: SpecObject, depth: number): void {
  for (const k of STRIPPED_KEYS) delete view[k];
  if (depth > 64) return;
  for (const k of VIEW_KEYS) {
    const inner = view[k];
    if (Array.isArray(inner)) {
      for (const v of inner) if (isObject(v)) stripViews(v, depth + 1);
    } else if (isObject(inner)) stripViews(inner, depth + 1);
  }
}

/** The error every refused load rejects with. */
export class LoadRefused extends Error {
  constructor(what: string) {
    super(`charts in Furrow load nothing from outside the document (refused: ${what})`);
    this.name = 'LoadRefused';
  }
}

function describe(uri: unknown): string {
  const s = typeof uri === 'string' ? uri : String(uri);
  return s.length > 80 ? `${s.slice(0, 77)}...` : s;
}

/**
 * A loader that refuses everything: data files, URLs, images and links. Built from a loader
 * that vega made (`vega.loader()`), so it keeps whatever else vega expects of a loader, with
 * every way of reaching outside replaced.
 */
export function lockedLoader(base: Loader): Loader {
  const refuse = (uri: unknown): Promise<never> => Promise.reject(new LoadRefused(describe(uri)));
  const locked: Loader & { fileAccess?: boolean } = Object.assign(Object.create(null) as object, base, {
    load: (uri: string) => refuse(uri),
    sanitize: (uri: string) => refuse(uri),
    http: (uri: string) => refuse(uri),
    file: (name: string) => refuse(name),
    fileAccess: false,
  });
  return Object.freeze(locked);
}

/** The logger interface vega calls (vega-util's LoggerInterface). */
export interface ChartLogger {
  level(): number;
  level(level: number): ChartLogger;
  error(...args: unknown[]): ChartLogger;
  warn(...args: unknown[]): ChartLogger;
  info(...args: unknown[]): ChartLogger;
  debug(...args: unknown[]): ChartLogger;
}

/** A logger that keeps what vega reports, for the chart to show. */
export interface CollectingLogger extends ChartLogger {
  /** Warnings and errors, in order, each as one line of text. */
  readonly messages: readonly string[];
}

/** At most this many messages are kept; a runaway spec must not fill the page. */
export const MAX_MESSAGES = 20;

function lineOf(args: readonly unknown[]): string {
  return args
    .map((a) => (a instanceof Error ? a.message : typeof a === 'string' ? a : safeJson(a)))
    .join(' ')
    .slice(0, 300);
}

function safeJson(a: unknown): string {
  try {
    return JSON.stringify(a) ?? String(a);
  } catch {
    return String(a);
  }
}

/** vega-util's log levels: None 0, Error 1, Warn 2, Info 3, Debug 4; charts log from Warn up. */
export const WARN = 2;

/**
 * A logger that records warnings and errors (info and debug are dropped) and calls
 * `onMessage` after each, so the element can redraw its list.
 */
export function collectingLogger(onMessage: () => void = () => {}): CollectingLogger {
  const messages: string[] = [];
  let level = WARN;
  const keep = (args: unknown[]) => {
    if (messages.length >= MAX_MESSAGES) return;
    const line = lineOf(args);
    if (!messages.includes(line)) {
      messages.push(line);
      onMessage();
    }
  };
  const logger = {
    messages,
    level(value?: number) {
      if (value === undefined) return level;
      level = value;
      return logger;
    },
    error(...args: unknown[]) {
      if (level >= 1) keep(args);
      return logger;
    },
    warn(...args: unknown[]) {
      if (level >= WARN) keep(args);
      return logger;
    },
    info() {
      return logger;
    },
    debug() {
      return logger;
    },
  } as CollectingLogger;
  return logger;
}

/**
 * Keys through which a vega-lite spec can reach outside the document or override the options
 * it is drawn with: `url` (data, images, maps), `href` (links on marks), `usermeta` (merged
 * over vega-embed's options).
 */
export const REACHING_KEYS = ['url', 'href', 'usermeta'] as const;

/**
 * The paths (such as `layer.1.encoding.href`) of every {@link REACHING_KEYS} key anywhere in a
 * spec, inline data included: a builder that keeps to fixed field names of its own never
 * meets them, so any hit is a fault. Walks iteratively; shared sub-objects are visited once.
 */
export function reachingKeys(spec: unknown): string[] {
  const hits: string[] = [];
  const seen = new Set<object>();
  const stack: { v: unknown; path: string }[] = [{ v: spec, path: '' }];
  const reaching = new Set<string>(REACHING_KEYS);
  while (stack.length > 0) {
    const { v, path } = stack.pop()!;
    if (typeof v !== 'object' || v === null || seen.has(v)) continue;
    seen.add(v);
    if (Array.isArray(v)) {
      v.forEach((x, i) => stack.push({ v: x, path: path === '' ? String(i) : `${path}.${i}` }));
      continue;
    }
    for (const [k, x] of Object.entries(v)) {
      const p = path === '' ? k : `${path}.${k}`;
      if (reaching.has(k)) hits.push(p);
      stack.push({ v: x, path: p });
    }
  }
  return hits.sort();
}
