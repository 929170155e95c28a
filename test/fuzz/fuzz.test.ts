/**
 * Fuzzing with fast-check, seeded and bounded: random and mutated formulas into the parser and
 * evaluator, random documents into the reader, random CSV into the table reader, and random
 * Markdown with placeholders into the note renderer. Every input must end in a value or a
 * positioned error, within a time bound, and never in a fault of Furrow ("failed
 * unexpectedly"). The seeds are fixed, so a failure is reproducible; the count of cases run is
 * printed (at least 100,000 in all).
 */
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/doc/csv.ts';
import { CsvError } from '../../src/doc/csv-error.ts';
import { DocumentError, readDocument, writeDocument } from '../../src/doc/format.ts';
import type { Document } from '../../src/doc/document.ts';
import { BUILTINS } from '../../src/functions/index.ts';
import { Engine } from '../../src/graph/engine.ts';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { isError } from '../../src/lang/values.ts';
import { splitNote } from '../../cells/note/model.ts';
import { noteMarkdownHtml } from '../../cells/note/markdown.ts';

/** Longest time one case may take (generous: CI shares two cores). */
const CASE_LIMIT_MS = 2000;
let cases = 0;
const counts = new Map<string, number>();
function counted(what: string): void {
  cases++;
  counts.set(what, (counts.get(what) ?? 0) + 1);
}

afterAll(() => {
  console.log(`fuzzing: ${cases} cases in all (${[...counts].map(([k, v]) => `${k} ${v}`).join(', ')})`);
});

function timed<T>(f: () => T): T {
  const t0 = performance.now();
  const out = f();
  const ms = performance.now() - t0;
  if (ms > CASE_LIMIT_MS) throw new Error(`one case took ${Math.round(ms)} ms`);
  return out;
}

// A document with something to read: a table, a fit, a record, a text.
const CONTEXT = `furrow 1
title: fuzz

--- table t
block,trt,y,ok
1,a,10.5,true
1,b,12.25,false
2,a,,true
2,b,15,true
3,a,11,false
3,b,14.5,true

--- formula
fit = blocked(t.y, t.trt, t.block)

--- formula
word = "text"

--- formula
FORMULA
`;

const base = readDocument(CONTEXT.replace('FORMULA', 'x = 1')).document;
const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
engine.update(base);
const formulaId = base.cells[base.cells.length - 1]!.id;

function withFormula(body: string): Document {
  const cells = base.cells.slice();
  cells[cells.length - 1] = { ...cells[cells.length - 1]!, body };
  return { ...base, cells };
}

/** Evaluates one formula in the context; checks that it ends in a value or a positioned error. */
function checkFormula(body: string): void {
  timed(() => engine.update(withFormula(body)));
  const s = engine.state(formulaId)!;
  const v = s.value;
  if (isError(v)) {
    expect(v.message).not.toMatch(/failed unexpectedly|fault in Furrow/);
    expect(v.from).toBeGreaterThanOrEqual(0);
    expect(v.to).toBeGreaterThanOrEqual(v.from);
    expect(v.to).toBeLessThanOrEqual(body.length + 1);
  }
  for (const p of s.parts ?? []) if (isError(p)) expect(p.message).not.toMatch(/failed unexpectedly/);
}

const TOKENS = [
  '1', '0', '2.5', '-3', '1e3', '1e999', '0.000001', '"a"', '"b\\"c"', '""', 'true', 'false',
  'x', 'y', 't', 't.y', 't.trt', 't.block', 't.ok', 't["y"]', 'fit', 'fit.mse', 'fit.means', 'fit.table.p', 'word', 'nope',
  '(', ')', '[', ']', ',', '.', ' ', '\n', '#', ':', '=', '==', '!=', '<', '<=', '>', '>=',
  '+', '-', '*', '/', '^', 'and', 'or', 'not',
  'mean(', 'sum(', 'sd(', 'count(', 'round(', 'sqrt(', 'ln(', 'levels(', 'quantile(', 'group_stats(',
  'one_way(', 'blocked(', 'difference(', 'pairwise(', 'contrast(', 'residual_checks(', 'two_sample(', 'paired(',
  'kruskal_wallis(', 'friedman(', 't_critical(', 'f_pvalue(', 'range_critical(', 'claim(', 'p_text(',
  'means_chart(', 'residuals_chart(', 'scatter(',
  'level:', 'method:', 'equal_variance:', 'digits:', '"tukey"', '"lsd"', '__proto__', 'constructor', 'toString',
];

const tokenFormula = fc.array(fc.constantFrom(...TOKENS), { maxLength: 24 }).map((ts) => ts.join(''));
const namedFormula = tokenFormula.map((e) => `z = ${e}`);

const VALID = [
  'z = mean(t.y) + 1',
  'z = difference(fit, "a", "b", level: 0.9)',
  'z = pairwise(fit, method: "tukey")',
  'z = round(t.y[t.ok] * 2, 1)',
  'z = claim(fit.table.p[1] < 0.05, "treatments differ")',
  'z = group_stats(t.y, t.trt).mean[2]',
  'z = [1, 2, 3] ^ 2 - -1',
  'z = not (t.y > 11 and t.ok) or false',
  'z = residuals_chart(fit, against: "block")',
  'z = two_sample(t.y, t.trt, equal_variance: false)',
];

/** A valid formula with random edits: inserted, deleted or replaced characters. */
const mutated = fc
  .tuple(
    fc.constantFrom(...VALID),
    fc.array(fc.tuple(fc.nat(), fc.constantFrom('del', 'ins', 'rep'), fc.constantFrom(...'()[],."\\:=+-*/^ #{}0123456789abcxyz\n\u0000\u202E')), { minLength: 1, maxLength: 5 }),
  )
  .map(([text, edits]) => {
    let s = text;
    for (const [at, op, ch] of edits) {
      const i = s.length === 0 ? 0 : at % (s.length + 1);
      if (op === 'del') s = s.slice(0, i) + s.slice(i + 1);
      else if (op === 'ins') s = s.slice(0, i) + ch + s.slice(i);
      else s = s.slice(0, i) + ch + s.slice(i + 1);
    }
    return s;
  });

describe('fuzzing', () => {
  it('token soup into the parser and evaluator', () => {
    fc.assert(
      fc.property(fc.oneof(tokenFormula, namedFormula), (body) => {
        counted('formulas');
        checkFormula(body);
      }),
      { seed: 20261201, numRuns: 20_000 },
    );
  });

  it('mutated formulas into the parser and evaluator', () => {
    fc.assert(
      fc.property(mutated, (body) => {
        counted('mutated formulas');
        checkFormula(body);
      }),
      { seed: 1201, numRuns: 20_000 },
    );
  });

  it('random documents into the reader: read and written back byte for byte, or refused in words', () => {
    const fragment = fc.oneof(
      fc.constantFrom('furrow 1', '--- note', '--- formula', '--- table t', '--- table t from x.csv', '--- ', '\\--- x', 'title: a', 'key:', '\uFEFF', '\r', '{x}', '"', ','),
      fc.string({ maxLength: 10 }),
    );
    const text = fc.array(fc.tuple(fragment, fc.constantFrom('\n', '\r\n', '', ' ')), { maxLength: 30 }).map((ls) => ls.map(([a, b]) => a + b).join(''));
    const withHead = fc.tuple(fc.boolean(), text).map(([head, t]) => (head ? `furrow 1\n${t}` : t));
    fc.assert(
      fc.property(withHead, (t) => {
        counted('documents');
        timed(() => {
          try {
            const d = readDocument(t).document;
            expect(writeDocument(d)).toBe(t);
          } catch (err) {
            if (!(err instanceof DocumentError)) throw err;
            expect(err.message.length).toBeGreaterThan(10);
          }
        });
      }),
      { seed: 7, numRuns: 25_000 },
    );
  });

  it('random CSV into the table reader: a grid or an error with its range', () => {
    const field = fc.oneof(fc.constantFrom('', '1', '2.5', '-0', 'a', '"q"', '"a,b"', '"x""y"', '"', 'true', ' ', '1e3', 'NaN'), fc.string({ maxLength: 6 }));
    const row = fc.array(field, { minLength: 1, maxLength: 5 }).map((fs) => fs.join(','));
    const csv = fc.tuple(fc.array(row, { minLength: 0, maxLength: 12 }), fc.constantFrom('\n', '\r\n')).map(([rows, eol]) => rows.join(eol));
    fc.assert(
      fc.property(csv, (t) => {
        counted('CSV');
        timed(() => {
          try {
            const g = parseCsv(t);
            for (const r of g.rows) expect(r.length).toBe(g.header.length);
          } catch (err) {
            if (!(err instanceof CsvError)) throw err;
            expect(err.from).toBeGreaterThanOrEqual(0);
            expect(err.to).toBeGreaterThanOrEqual(err.from);
            expect(err.to).toBeLessThanOrEqual(t.length + 1);
          }
        });
      }),
      { seed: 99, numRuns: 20_000 },
    );
  });

  it('random Markdown with placeholders into the note renderer', () => {
    const piece = fc.oneof(
      fc.constantFrom('{', '}', '{x}', '{mean(t.y)}', '\\{', '"', '*', '_', '**', '`', '[a](', ')', '![b](data:image/png;base64,AA)', '<img src=x onerror=1>', '<b>', '#', '> ', '- ', '1. ', '|', '---', '\n', '\n\n', '    ', '\uE000', '\uE001', '&amp;', 'javascript:'),
      fc.string({ maxLength: 8 }),
    );
    const note = fc.array(piece, { maxLength: 40 }).map((ps) => ps.join(''));
    fc.assert(
      fc.property(note, (t) => {
        counted('notes');
        timed(() => {
          const pieces = splitNote(t);
          // the pieces cover the text in order
          let at = 0;
          for (const p of pieces) {
            expect(p.from).toBeGreaterThanOrEqual(at);
            at = p.type === 'placeholder' ? p.to : p.from + 1;
          }
          const { html } = noteMarkdownHtml(t);
          expect(html).not.toMatch(/<(img|b|script)\b[^>]*onerror/i);
          expect(html).not.toMatch(/<b>/);
        });
      }),
      { seed: 4242, numRuns: 15_000 },
    );
  });
});
