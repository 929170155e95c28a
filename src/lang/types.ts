/**
 * Argument types of the built-ins. Each type says in words what it accepts (for docs,
 * completion and error messages) and checks a value, converting where the language allows
 * (a single number where numbers are expected stays a number; a list literal is a column).
 */
import { msg } from '../messages/language.ts';
import {
  describeType,
  isColumn,
  isMissingAt,
  isRecord,
  isTable,
  type Column,
  type NumberColumn,
  type RecordValue,
  type Table,
  type TextColumn,
  type Value,
} from './values.ts';

/** A check either accepts the value (possibly converted) or says what it is instead. */
export type Checked = { readonly ok: true; readonly value: Value } | { readonly ok: false; readonly got: string };

/** One argument type. */
export interface ArgType {
  /** How the docs and messages name it: "a number", "a column of numbers". */
  readonly description: string;
  readonly check: (v: Value) => Checked;
}

const accept = (value: Value): Checked => ({ ok: true, value });
const reject = (v: Value, detail?: string): Checked => ({ ok: false, got: detail ?? describeType(v) });

/**
 * When a text column reaches a place that needs numbers, say which entry is not a number:
 * a table column turns into text when a single field does not read as a number, and the
 * user needs to find that field.
 */
export function whyNotNumbers(c: TextColumn): string {
  for (let i = 0; i < c.values.length; i++) {
    if (!isMissingAt(c, i)) {
      const s = c.values[i]!;
      if (!/^\s*[-+]?(\d+(?:\.\d*)?|\.\d+)([eE][-+]?\d+)?\s*$/.test(s)) {
        return c.name === null ? msg.notNumbersUnnamed(i + 1, s) : msg.notNumbers(c.name, i + 1, s);
      }
    }
  }
  return 'a column of texts';
}

function numberColumnCheck(v: Value): Checked {
  if (isColumn(v)) {
    if (v.type === 'number') return accept(v);
    if (v.type === 'text') return reject(v, whyNotNumbers(v));
  }
  return reject(v);
}

/** The argument types, by name. */
export const TYPES = {
  any: { description: 'any value', check: accept },
  number: {
    description: 'a number',
    check: (v) => (typeof v === 'number' ? accept(v) : reject(v)),
  },
  integer: {
    description: 'a whole number',
    check: (v) => (typeof v === 'number' && Number.isInteger(v) ? accept(v) : reject(v, typeof v === 'number' ? `${v}, which is not whole` : undefined)),
  },
  count: {
    description: 'a whole number of at least 1',
    check: (v) => (typeof v === 'number' && Number.isInteger(v) && v >= 1 ? accept(v) : reject(v, typeof v === 'number' ? String(v) : undefined)),
  },
  level: {
    description: 'a confidence level between 0 and 1, such as 0.95',
    check: (v) => (typeof v === 'number' && v > 0 && v < 1 ? accept(v) : reject(v, typeof v === 'number' ? String(v) : undefined)),
  },
  probability: {
    description: 'a probability between 0 and 1',
    check: (v) => (typeof v === 'number' && v >= 0 && v <= 1 ? accept(v) : reject(v, typeof v === 'number' ? String(v) : undefined)),
  },
  text: {
    description: 'a text',
    check: (v) => (typeof v === 'string' ? accept(v) : reject(v)),
  },
  boolean: {
    description: 'true or false',
    check: (v) => (typeof v === 'boolean' ? accept(v) : reject(v)),
  },
  numbers: {
    description: 'a column of numbers',
    check: numberColumnCheck,
  },
  numeric: {
    description: 'a number or a column of numbers',
    check: (v) => (typeof v === 'number' ? accept(v) : numberColumnCheck(v)),
  },
  factor: {
    description: 'a column of levels (texts, numbers or booleans)',
    check: (v) => (isColumn(v) ? accept(v) : reject(v)),
  },
  column: {
    description: 'a column',
    check: (v) => (isColumn(v) ? accept(v) : reject(v)),
  },
  factors: {
    description: 'a list of columns of levels, such as [a, b]',
    // a list literal of columns is evaluated by the call itself (see evaluate.ts), so by the
    // time it gets here it is a table of the columns
    check: (v) => (isTable(v) ? accept(v) : isColumn(v) ? accept(v) : reject(v)),
  },
  table: {
    description: 'a table',
    check: (v) => (isTable(v) ? accept(v) : reject(v)),
  },
  record: {
    description: 'a record',
    check: (v) => (isRecord(v) ? accept(v) : reject(v)),
  },
  fit: {
    description: 'a fit (the result of a design function such as one_way, blocked or split_plot)',
    check: (v) => (isRecord(v) && v.tag === 'fit' ? accept(v) : reject(v, isRecord(v) ? `a record that is not a fit` : undefined)),
  },
  pairs: {
    description: 'the result of pairwise',
    check: (v) => (isRecord(v) && v.tag === 'pairs' ? accept(v) : reject(v, isRecord(v) ? `a record that is not the result of pairwise` : undefined)),
  },
  texts: {
    description: 'a column of texts, such as ["a", "b"]',
    check: (v) => (isColumn(v) && v.type === 'text' ? accept(v) : reject(v)),
  },
  level_name: {
    description: 'a level, as text or a number',
    check: (v) => (typeof v === 'string' || typeof v === 'number' ? accept(v) : reject(v)),
  },
  levels: {
    description: 'a list of levels, such as ["a", "b"] or [1, 2]',
    check: (v) => (isColumn(v) && v.type !== 'boolean' ? accept(v) : reject(v)),
  },
} as const satisfies Record<string, ArgType>;

/** The name of an argument type. */
export type TypeKey = keyof typeof TYPES;

/** Narrowing helpers for built-in implementations (types were checked already). */
export const as = {
  numberColumn: (v: Value): NumberColumn => v as NumberColumn,
  column: (v: Value): Column => v as Column,
  table: (v: Value): Table => v as Table,
  record: (v: Value): RecordValue => v as RecordValue,
};
