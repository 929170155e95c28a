/**
 * What a result record says, in words: a comparison as one line (the difference, its
 * interval and p), a rank test as its statistic and p with what it was computed on, the
 * residual checks as one verdict per check with its numbers, a power record as the plan it
 * describes. Worked out from the record's fields (not from the name of the function that
 * made it), without a DOM, so the page and the report say the same and the tests run in
 * Node. A record this module does not recognise gets null, and is shown field by field.
 *
 * Every number goes through the one digits policy (src/format/digits.ts).
 */
import { numberText, percentText, pPhrase, type Quantity } from '../../format/digits.ts';
import { isColumn, isMissingAt, isRecord, type Column, type RecordValue, type Value } from '../../lang/values.ts';

/** One check of a fit's residuals, with its verdict. */
export interface CheckLine {
  /** What is checked, in words ("spread equal across treatments"). */
  readonly check: string;
  /** The method and its numbers ("Brown-Forsythe F(3, 16) 0.412, p = 0.75"). */
  readonly numbers: string;
  /** 'flag': the check points at a problem; 'clear': it does not; 'none': not made. */
  readonly verdict: 'flag' | 'clear' | 'none';
  /** The verdict in a few words. */
  readonly words: string;
  /** The field of the record it reads. */
  readonly field: string;
}

/** A record read as a result. */
export interface RecordSummary {
  /** The kind of result, for the look and for assistive technology ("comparison of two means"). */
  readonly kind: string;
  /** The one line that says the result. */
  readonly headline: string;
  /** Lines of detail under it (how it was computed, the groups it compared). */
  readonly details: readonly string[];
  /** For residual checks: one line per check. */
  readonly checks: readonly CheckLine[];
  /** Notes the record carries (what was assumed, dropped or flagged). */
  readonly notes: readonly string[];
}

/**
 * A p-value below this flags a residual check (common practice, no source: the usual 5%
 * level; a check is a prompt to look, not a decision).
 */
export const CHECK_FLAG_P = 0.05;

/** The summary of a record, or null when it is not a result this module reads. */
export function recordSummary(r: RecordValue): RecordSummary | null {
  if (r.tag === 'checks') return checksSummary(r);
  const f = r.fields;
  if (has(f, 'estimate') && f.has('low') && f.has('high') && f.has('p')) return comparisonSummary(r);
  if (r.tag === 'test') return testSummary(r);
  if (r.tag === 'power' && typeof f.get('power') === 'number') return powerSummary(r);
  return null;
}

// ---- comparisons: difference, contrast, two_sample, paired -------------------------------

function comparisonSummary(r: RecordValue): RecordSummary {
  const f = r.fields;
  const estimate = num(f, 'estimate');
  const low = num(f, 'low');
  const high = num(f, 'high');
  const p = num(f, 'p');
  const level = num(f, 'level');
  const what = comparisonLabel(f);
  const est = numberText(estimate, 'estimate');
  const interval = Number.isFinite(low) && Number.isFinite(high);
  const pct = level > 0 && level < 1 ? `${percentText(level)} interval` : 'interval';
  const headline = interval ? `${what}: ${est} (${pct} ${numberText(low, 'estimate')} to ${numberText(high, 'estimate')}), ${pPhrase(p)}` : `${what}: ${est} (no interval or p: see the notes)`;
  const details: string[] = [];
  if (interval) details.push(intervalWords(low, high));
  const t = num(f, 't');
  const df = num(f, 'df');
  const se = num(f, 'se');
  const welch = f.get('equal_variance') === false;
  const test: string[] = [];
  if (Number.isFinite(t)) test.push(`${welch ? 'Welch’s t' : 't'} = ${numberText(t, 'statistic')}${Number.isFinite(df) ? ` on ${numberText(df, 'df')} df` : ''}`);
  if (Number.isFinite(se)) test.push(`standard error ${numberText(se, 'estimate')}`);
  if (typeof f.get('pooled_variance') === 'number' && !welch) test.push(`pooled variance ${numberText(num(f, 'pooled_variance'), 'squares')}`);
  if (test.length > 0) details.push(test.join('; '));
  const first = text(f, 'first_level');
  const second = text(f, 'second_level');
  if (first !== null && second !== null) {
    details.push([first, second].map((g, k) => groupWords(g, f, k === 0 ? 'first' : 'second')).join('; '));
  } else if (typeof f.get('sd') === 'number' && typeof f.get('n') === 'number') {
    details.push(`${numberText(num(f, 'n'), 'count')} pairs; standard deviation of the differences ${numberText(num(f, 'sd'), 'estimate')}`);
  }
  const weights = f.get('weights');
  const levels = f.get('levels');
  if (weights !== undefined && levels !== undefined && isColumn(weights) && isColumn(levels)) details.push(`weights ${pairsOf(levels, weights, 'plain')}`);
  return { kind: 'comparison', headline, details, checks: [], notes: notesOf(f.get('notes')) };
}

/** What a comparison compares: "80C − 60C", "a − b" (paired), "contrast". */
function comparisonLabel(f: ReadonlyMap<string, Value>): string {
  const a = text(f, 'a');
  const b = text(f, 'b');
  if (a !== null && b !== null) return `${a} − ${b}`;
  const first = text(f, 'first_level');
  const second = text(f, 'second_level');
  if (first !== null && second !== null) return `${first} − ${second}`;
  if (f.has('weights')) return 'Contrast';
  if (f.has('sd')) return 'Mean difference of the pairs';
  return 'Difference';
}

/** What the interval says about zero, in the words the design notes ask for. */
function intervalWords(low: number, high: number): string {
  if (low > 0 || high < 0) return 'The interval leaves out 0.';
  const reach = Math.max(Math.abs(low), Math.abs(high));
  return `The interval includes 0: no difference is detected, and a difference as large as ${numberText(reach, 'estimate')} is not ruled out.`;
}

function groupWords(level: string, f: ReadonlyMap<string, Value>, side: 'first' | 'second'): string {
  const parts = [`${level}: mean ${numberText(num(f, `${side}_mean`), 'estimate')}`];
  if (f.has(`${side}_sd`)) parts.push(`sd ${numberText(num(f, `${side}_sd`), 'estimate')}`);
  if (f.has(`${side}_n`)) parts.push(`n ${numberText(num(f, `${side}_n`), 'count')}`);
  return parts.join(', ');
}

// ---- tests: rank tests and the small test records ----------------------------------------

function testSummary(r: RecordValue): RecordSummary | null {
  const f = r.fields;
  const p = num(f, 'p');
  const method = text(f, 'method');
  const how = method === 'exact' ? ' (exact)' : method === 'normal' ? ' (normal approximation)' : '';
  const details: string[] = [];
  let headline: string;
  let kind: string;
  if (f.has('u') && f.has('rank_sum')) {
    kind = 'rank sum test';
    const first = text(f, 'first_level') ?? 'first';
    const second = text(f, 'second_level') ?? 'second';
    headline = `${first} against ${second}: U = ${numberText(num(f, 'u'), 'statistic')}, ${pPhrase(p)}${how}`;
    details.push(`rank sum of ${first} ${numberText(num(f, 'rank_sum'), 'statistic')}; ${numberText(num(f, 'n1'), 'count')} and ${numberText(num(f, 'n2'), 'count')} observations${tieWords(f)}`);
  } else if (f.has('zeros') && f.has('statistic')) {
    kind = 'signed rank test';
    headline = `Signed ranks of the paired differences: ${numberText(num(f, 'statistic'), 'statistic')}, ${pPhrase(p)}${how}`;
    const zeros = num(f, 'zeros');
    details.push(`${numberText(num(f, 'n'), 'count')} pairs${zeros > 0 ? `; ${numberText(zeros, 'count')} zero difference${zeros === 1 ? '' : 's'} left out` : ''}${tieWords(f)}`);
  } else if (f.has('mean_rank') && f.has('statistic')) {
    kind = 'rank test of several groups';
    headline = `Rank test across groups: H = ${numberText(num(f, 'statistic'), 'statistic')} on ${numberText(num(f, 'df'), 'df')} df, ${pPhrase(p)}`;
    const levels = f.get('level');
    const ranks = f.get('mean_rank');
    if (levels !== undefined && ranks !== undefined && isColumn(levels) && isColumn(ranks)) details.push(`mean ranks: ${pairsOf(levels, ranks, 'estimate')}`);
    if (f.has('n')) details.push(`${numberText(num(f, 'n'), 'count')} observations`);
  } else if (f.has('blocks') && f.has('treatments') && f.has('statistic')) {
    kind = 'rank test in blocks';
    headline = `Ranks within blocks: chi-square = ${numberText(num(f, 'statistic'), 'statistic')} on ${numberText(num(f, 'df'), 'df')} df, ${pPhrase(p)}`;
    details.push(`${numberText(num(f, 'treatments'), 'count')} treatments in ${numberText(num(f, 'blocks'), 'count')} blocks`);
    const levels = f.get('level');
    const sums = f.get('rank_sum');
    if (levels !== undefined && sums !== undefined && isColumn(levels) && isColumn(sums)) details.push(`rank sums: ${pairsOf(levels, sums, 'statistic')}`);
  } else {
    const line = testLine(r);
    if (line === null) return null;
    kind = 'test';
    headline = line;
  }
  return { kind, headline, details, checks: [], notes: notesOf(f.get('notes')) };
}

function tieWords(f: ReadonlyMap<string, Value>): string {
  const ties = num(f, 'tie_groups');
  return ties > 0 ? `; ${numberText(ties, 'count')} group${ties === 1 ? '' : 's'} of tied values` : '';
}

/**
 * A small test record (F with df1 and df2, W with n, a chi-square with df) as one line of
 * numbers, or null when it is none of them.
 */
export function testLine(v: Value | undefined): string | null {
  if (v === undefined || !isRecord(v)) return null;
  const f = v.fields;
  if (typeof f.get('p') !== 'number') return null;
  const p = pPhrase(num(f, 'p'));
  if (typeof f.get('f') === 'number') {
    const dfs = typeof f.get('df1') === 'number' && typeof f.get('df2') === 'number' ? `(${numberText(num(f, 'df1'), 'df')}, ${numberText(num(f, 'df2'), 'df')})` : '';
    return `F${dfs} = ${numberText(num(f, 'f'), 'statistic')}, ${p}`;
  }
  if (typeof f.get('w') === 'number') return `W = ${numberText(num(f, 'w'), 'statistic')}, ${p}${typeof f.get('n') === 'number' ? ` (${numberText(num(f, 'n'), 'count')} residuals)` : ''}`;
  if (typeof f.get('statistic') === 'number') return `chi-square = ${numberText(num(f, 'statistic'), 'statistic')}${typeof f.get('df') === 'number' ? ` on ${numberText(num(f, 'df'), 'df')} df` : ''}, ${p}`;
  return null;
}

// ---- residual checks ----------------------------------------------------------------------

/** The checks a residual_checks record may hold, in the order they are shown. */
const CHECKS: readonly { field: string; check: string; method: string }[] = [
  { field: 'shapiro_wilk', check: 'Residuals look normal', method: 'Shapiro-Wilk' },
  { field: 'brown_forsythe', check: 'Spread equal across treatments', method: 'Brown-Forsythe' },
  { field: 'nonadditivity', check: 'Blocks and treatments add up', method: 'Tukey, 1 df' },
  { field: 'parallel_slopes', check: 'Slopes on the covariate parallel', method: 'parallel slopes' },
];

function checksSummary(r: RecordValue): RecordSummary {
  const f = r.fields;
  const checks: CheckLine[] = [];
  let flagged = 0;
  for (const c of CHECKS) {
    const v = f.get(c.field);
    if (v === undefined) continue;
    const line = testLine(v);
    if (line === null) {
      checks.push({ check: c.check, numbers: `${c.method}: not made`, verdict: 'none', words: 'not made (see the notes)', field: c.field });
      continue;
    }
    const p = isRecord(v) ? num(v.fields, 'p') : NaN;
    const flag = p < CHECK_FLAG_P;
    if (flag) flagged++;
    checks.push({
      check: c.check,
      numbers: `${c.method} ${line}`,
      verdict: Number.isNaN(p) ? 'none' : flag ? 'flag' : 'clear',
      words: Number.isNaN(p) ? 'no p-value' : flag ? `flagged (p below ${CHECK_FLAG_P})` : 'nothing flagged',
      field: c.field,
    });
  }
  const rows = f.get('flagged');
  if (rows !== undefined && isColumn(rows)) {
    const list = columnNumbers(rows);
    const beyond = list.length === 0 ? 'none' : `row${list.length === 1 ? '' : 's'} ${list.map((x) => numberText(x, 'count')).join(', ')}`;
    if (list.length > 0) flagged++;
    checks.push({
      check: 'No plot stands out',
      numbers: `studentized residuals beyond 3: ${beyond}`,
      verdict: list.length === 0 ? 'clear' : 'flag',
      words: list.length === 0 ? 'nothing flagged' : 'check those plots',
      field: 'flagged',
    });
  }
  const made = checks.filter((c) => c.verdict !== 'none').length;
  const headline =
    made === 0 ? 'Residual checks: none could be made (see the notes).' : flagged === 0 ? `Residual checks: nothing flagged in ${made} check${made === 1 ? '' : 's'}.` : `Residual checks: ${flagged} of ${made} flagged; look before believing the F tests.`;
  return { kind: 'residual checks', headline, details: [], checks, notes: notesOf(f.get('notes')) };
}

// ---- power --------------------------------------------------------------------------------

function powerSummary(r: RecordValue): RecordSummary {
  const f = r.fields;
  const size = f.has('blocks') ? `${numberText(num(f, 'blocks'), 'count')} blocks` : f.has('n') ? `${numberText(num(f, 'n'), 'count')} per group` : null;
  const plan = [size, f.has('treatments') ? `${numberText(num(f, 'treatments'), 'count')} treatments` : null, f.has('plots') ? `${numberText(num(f, 'plots'), 'count')} plots` : null].filter((x) => x !== null);
  const headline = `Power ${numberText(num(f, 'power'), 'power')}${plan.length > 0 ? ` with ${plan.join(', ')}` : ''}`;
  const details: string[] = [];
  if (f.has('delta') && f.has('sd')) details.push(`to detect a difference of ${numberText(num(f, 'delta'), 'plain')} when the standard deviation is ${numberText(num(f, 'sd'), 'plain')}`);
  const assumes = text(f, 'assumes');
  return { kind: 'power of a plan', headline, details, checks: [], notes: assumes === null ? [] : [`Assumes ${assumes}.`] };
}

// ---- helpers ------------------------------------------------------------------------------

function has(f: ReadonlyMap<string, Value>, field: string): boolean {
  return typeof f.get(field) === 'number';
}

function num(f: ReadonlyMap<string, Value>, field: string): number {
  const v = f.get(field);
  return typeof v === 'number' ? v : NaN;
}

function text(f: ReadonlyMap<string, Value>, field: string): string | null {
  const v = f.get(field);
  return typeof v === 'string' && v !== '' ? v : null;
}

function columnNumbers(c: Column): number[] {
  const out: number[] = [];
  if (c.type !== 'number') return out;
  for (let i = 0; i < c.values.length; i++) if (!isMissingAt(c, i)) out.push(c.values[i]!);
  return out;
}

/** "a 2.500, b 6.500": each level with its number. */
function pairsOf(levels: Column, values: Column, q: Quantity): string {
  const out: string[] = [];
  const n = Math.min(levels.values.length, values.values.length);
  for (let i = 0; i < n; i++) {
    const l = levels.type === 'text' ? levels.values[i]! : String(levels.values[i]);
    const x = values.type === 'number' && !isMissingAt(values, i) ? numberText(values.values[i]!, q) : 'missing';
    out.push(`${l} ${x}`);
  }
  return out.join(', ');
}

function notesOf(v: Value | undefined): string[] {
  if (v === undefined) return [];
  if (typeof v === 'string') return v === '' ? [] : [v];
  if (isColumn(v) && v.type === 'text') {
    const out: string[] = [];
    for (let i = 0; i < v.values.length; i++) if (!isMissingAt(v, i) && v.values[i] !== '') out.push(v.values[i]!);
    return out;
  }
  return [];
}
