/**
 * The layout of records on the page, as data: which rows an analysis-of-variance table
 * has, what each of its cells says, which fields of a fit are shown as labelled numbers and
 * which are folded away. The elements only draw what these functions return, so the layout
 * is tested in Node.
 */
import { numberText, pPhrase, quantityOf, type Quantity } from '../../format/digits.ts';
import {
  isColumn,
  decimalAt,
  isMissingAt,
  isRecord,
  isTable,
  tableColumn,
  type Column,
  type RecordValue,
  type Table,
  type Value,
} from '../../lang/values.ts';
import { levelText, pText } from './digits.ts';

/** Which part of the analysis a row of the table is. */
export type AnovaRole = 'term' | 'error' | 'total';

/** One row of an analysis-of-variance table, as it is written. Blank cells are ''. */
export interface AnovaRowText {
  readonly role: AnovaRole;
  readonly source: string;
  readonly df: string;
  readonly ss: string;
  readonly ms: string;
  readonly f: string;
  readonly p: string;
}

/** A field shown as a label and a short text. */
export interface ScalarLine {
  readonly field: string;
  readonly label: string;
  readonly text: string;
}

/** A field drawn as a value of its own (a table, a long column, a nested record). */
export interface ValueLine {
  readonly field: string;
  readonly label: string;
  readonly value: Value;
}

/** One row of a means table, as written. */
export interface MeansRowText {
  readonly level: string;
  readonly n: string;
  readonly mean: string;
  readonly se: string;
  readonly low: string;
  readonly high: string;
}

/** Everything a fit record shows, in order. */
export interface FitLayout {
  /** The design in words ("randomized complete block"), when the record says. */
  readonly design: string | null;
  /** One sentence on balance and how the sums of squares were formed, or null. */
  readonly balance: string | null;
  readonly anova: readonly AnovaRowText[] | null;
  readonly meansTitle: string;
  readonly means: readonly MeansRowText[] | null;
  /** Header of the interval columns ("95% interval"). */
  readonly intervalHeader: string;
  readonly scalars: readonly ScalarLine[];
  /** Notes the analysis wrote: what was assumed, dropped or missing. */
  readonly notes: readonly string[];
  /** Tables, records and short columns shown as values under their labels. */
  readonly others: readonly ValueLine[];
  /** Columns the length of the data (fitted values, residuals), folded away behind a disclosure. */
  readonly folded: readonly ValueLine[];
}

// Words for the fields the contract names (docs/language.md section 8); other fields are shown
// under their own name with underscores read as spaces.
const LABELS: ReadonlyMap<string, string> = new Map([
  ['mse', 'error mean square'],
  ['df_error', 'error degrees of freedom'],
  ['sd', 'residual standard deviation'],
  ['grand_mean', 'grand mean'],
  ['r2', 'R²'],
  ['relative_efficiency', 'relative efficiency of blocking'],
  ['relative_efficiency_uncorrected', 'relative efficiency, uncorrected'],
  ['nonadditivity', "Tukey's test for nonadditivity (1 df)"],
  ['n', 'observations'],
  ['level', 'confidence level'],
  ['ss_method', 'sums of squares'],
  ['treatment', 'treatment factor'],
  ['fitted', 'fitted values'],
  ['residuals', 'residuals'],
  ['studentized_residuals', 'studentized residuals'],
  ['studentized', 'studentized residuals'],
  ['leverage', 'leverages'],
  ['estimate', 'estimate'],
  ['se', 'standard error'],
  ['df', 'degrees of freedom'],
  ['t', 't'],
  ['p', 'p'],
  ['low', 'interval low'],
  ['high', 'interval high'],
  ['critical', 'critical multiplier'],
  ['pooled_variance', 'pooled variance'],
  ['mse_whole', 'whole-plot error mean square'],
  ['df_whole_error', 'whole-plot error degrees of freedom'],
  ['sub_means', 'subplot means'],
  ['cell_means', 'means of every combination'],
  ['slope', 'slope on the covariate'],
  ['slope_se', 'standard error of the slope'],
  ['covariate_mean', 'covariate mean (means adjusted to it)'],
  ['unadjusted_means', 'unadjusted means'],
  ['f_against_error', 'treatment F against the pooled error'],
  ['p_against_error', 'p against the pooled error'],
  ['bartlett', "Bartlett's test of equal error variances across sites"],
  ['per_site', 'each site alone'],
  ['site_means', 'treatment means at each site'],
  ['parallel_slopes', 'test of parallel slopes'],
]);

/** The words shown for a record field. */
export function fieldLabel(field: string): string {
  return LABELS.get(field) ?? field.replace(/_/g, ' ');
}

/** A number, written by the digits policy for the quantity its field name says it is. */
export function scalarNumberText(field: string, x: number): string {
  return numberText(x, quantityOf(field));
}

/** A scalar value as the text of a labelled line, or null when the value is not a scalar. */
export function scalarText(field: string, v: Value): string | null {
  switch (typeof v) {
    case 'number':
      return scalarNumberText(field, v);
    case 'string':
      return v;
    case 'boolean':
      return v ? 'yes' : 'no';
  }
  if (v.kind === 'missing') return 'missing';
  if (v.kind === 'error') return `error: ${v.message}`;
  return null;
}

function numberAt(c: Column | undefined, i: number): number {
  if (c === undefined || c.type !== 'number' || isMissingAt(c, i)) return NaN;
  return c.values[i] ?? NaN;
}

function textAt(c: Column | undefined, i: number): string {
  if (c === undefined || isMissingAt(c, i)) return '';
  if (c.type === 'text') return c.values[i] ?? '';
  if (c.type === 'number') return (c.decimals === null ? '' : decimalAt(c.decimals, i)) || numberText(c.values[i] ?? NaN, 'plain');
  return c.values[i] === 1 ? 'true' : 'false';
}


function roleOf(source: string): AnovaRole {
  if (source === 'error') return 'error';
  if (source === 'total') return 'total';
  return 'term';
}

/** A result number by the digits policy; blank where there is none (NaN or missing). */
function cell(x: number, q: Quantity): string {
  return Number.isNaN(x) ? '' : numberText(x, q);
}

/**
 * The rows of an analysis-of-variance table (columns `source df ss ms f p`), or null when
 * the table lacks one of them. Every number is written by the digits policy for its
 * quantity, as it is everywhere else. MS is blank on the total row, F and p on the
 * error and total rows, and any cell whose number does not exist (NaN or missing) is blank.
 */
export function anovaRows(t: Table): AnovaRowText[] | null {
  const source = tableColumn(t, 'source');
  const df = tableColumn(t, 'df');
  const ss = tableColumn(t, 'ss');
  const ms = tableColumn(t, 'ms');
  const f = tableColumn(t, 'f');
  const p = tableColumn(t, 'p');
  if (source === undefined || df === undefined || ss === undefined || ms === undefined || f === undefined || p === undefined) return null;
  if (df.type !== 'number' || ss.type !== 'number' || ms.type !== 'number' || f.type !== 'number' || p.type !== 'number') return null;
  const rows = t.rows;
  const roles: AnovaRole[] = [];
  for (let i = 0; i < rows; i++) roles.push(roleOf(textAt(source, i)));
  const out: AnovaRowText[] = [];
  for (let i = 0; i < rows; i++) {
    const role = roles[i]!;
    out.push({
      role,
      source: textAt(source, i),
      df: cell(numberAt(df, i), 'df'),
      ss: cell(numberAt(ss, i), 'squares'),
      ms: role === 'total' ? '' : cell(numberAt(ms, i), 'squares'),
      f: role === 'term' ? cell(numberAt(f, i), 'statistic') : '',
      p: role === 'term' ? pText(numberAt(p, i)) : '',
    });
  }
  return out;
}

/**
 * The rows of a means table (columns `level n mean se low high`), or null when one is
 * missing. Numbers by the digits policy (estimates).
 */
export function meansRows(t: Table): MeansRowText[] | null {
  const level = tableColumn(t, 'level');
  const n = tableColumn(t, 'n');
  const mean = tableColumn(t, 'mean');
  const se = tableColumn(t, 'se');
  const low = tableColumn(t, 'low');
  const high = tableColumn(t, 'high');
  if (level === undefined || n === undefined || mean === undefined || se === undefined || low === undefined || high === undefined) return null;
  if (mean.type !== 'number' || se.type !== 'number' || low.type !== 'number' || high.type !== 'number') return null;
  const rows = t.rows;
  const out: MeansRowText[] = [];
  for (let i = 0; i < rows; i++) {
    out.push({
      level: textAt(level, i),
      n: textAt(n, i),
      mean: cell(numberAt(mean, i), 'estimate'),
      se: cell(numberAt(se, i), 'estimate'),
      low: cell(numberAt(low, i), 'estimate'),
      high: cell(numberAt(high, i), 'estimate'),
    });
  }
  return out;
}

/** A column of texts (or one text) as a list of notes. */
function notesOf(v: Value | undefined): string[] | null {
  if (v === undefined) return [];
  if (typeof v === 'string') return v === '' ? [] : [v];
  if (isColumn(v) && v.type === 'text') {
    const out: string[] = [];
    for (let i = 0; i < v.values.length; i++) if (!isMissingAt(v, i) && v.values[i] !== '') out.push(v.values[i]!);
    return out;
  }
  return null;
}

/**
 * Tukey's nonadditivity record (ss f p, with df1 df2 when given) in one line, or null when
 * it is not one.
 */
export function nonadditivityText(v: Value): string | null {
  if (!isRecord(v)) return null;
  const ss = v.fields.get('ss');
  const f = v.fields.get('f');
  const p = v.fields.get('p');
  const df1 = v.fields.get('df1');
  const df2 = v.fields.get('df2');
  if (typeof ss !== 'number' || typeof f !== 'number' || typeof p !== 'number') return null;
  const dfs = typeof df1 === 'number' && typeof df2 === 'number' ? `(${numberText(df1, 'df')}, ${numberText(df2, 'df')})` : '';
  return `SS ${numberText(ss, 'squares')}, F${dfs} ${numberText(f, 'statistic')}, ${pPhrase(p)}`;
}

/** A phrase as a sentence: capital first letter, full stop at the end. */
function sentence(s: string): string {
  const t = s.trim();
  const cap = t.charAt(0).toUpperCase() + t.slice(1);
  return /[.!?]$/.test(cap) ? cap : `${cap}.`;
}

// Fields that the fit layout draws in its own place.
const FIT_PLACED: ReadonlySet<string> = new Set(['design', 'table', 'means', 'balanced', 'notes', 'ss_method']);

/**
 * The layout of a fit record (tag 'fit', docs/language.md section 8). Fields the contract does
 * not name are not lost: scalars join the labelled lines, everything else is shown under
 * its name.
 */
export function fitLayout(r: RecordValue): FitLayout {
  const f = r.fields;
  const design = f.get('design');
  const table = f.get('table');
  const means = f.get('means');
  const balanced = f.get('balanced');
  const ssMethod = f.get('ss_method');
  const treatment = f.get('treatment');
  const level = f.get('level');

  const anova = table !== undefined && isTable(table) ? anovaRows(table) : null;
  const meanRows = means !== undefined && isTable(means) ? meansRows(means) : null;

  const method = typeof ssMethod === 'string' && ssMethod.trim() !== '' ? sentence(ssMethod) : null;
  let balance: string | null = null;
  if (balanced === true) balance = 'Balanced: every cell has the same number of observations.';
  else if (balanced === false) {
    balance = method === null ? 'Not balanced: each sum of squares is adjusted for the other factors (fitted by least squares).' : 'Not balanced (unequal or missing cells).';
  }
  if (method !== null) balance = balance === null ? method : `${balance} ${method}`;

  const scalars: ScalarLine[] = [];
  const others: ValueLine[] = [];
  const folded: ValueLine[] = [];
  const notesValue = f.get('notes');
  const notes = notesOf(notesValue);
  if (notes === null && notesValue !== undefined) others.push({ field: 'notes', label: fieldLabel('notes'), value: notesValue });
  if (table !== undefined && anova === null) others.push({ field: 'table', label: 'analysis of variance', value: table });
  if (means !== undefined && meanRows === null) others.push({ field: 'means', label: 'means', value: means });

  for (const [field, v] of f) {
    if (FIT_PLACED.has(field)) continue;
    const text = scalarText(field, v);
    if (text !== null) {
      scalars.push({ field, label: fieldLabel(field), text });
      continue;
    }
    if (field === 'nonadditivity') {
      const line = nonadditivityText(v);
      if (line !== null) {
        scalars.push({ field, label: fieldLabel(field), text: line });
        continue;
      }
    }
    const line = { field, label: fieldLabel(field), value: v };
    // a fit's columns (fitted values, residuals) run the length of the data: fold them all
    if (isColumn(v)) folded.push(line);
    else others.push(line);
  }

  const treatmentName = typeof treatment === 'string' && treatment !== '' ? treatment : null;
  return {
    design: typeof design === 'string' && design !== '' ? design : null,
    balance,
    anova,
    meansTitle: meansTitleOf(treatmentName, f.has('covariate_mean'), f.has('mse_whole')),
    means: meanRows,
    intervalHeader: typeof level === 'number' && level > 0 && level < 1 ? `${levelText(level)} interval` : 'interval',
    scalars,
    notes: notes ?? [],
    others,
    folded,
  };
}

/**
 * The heading of a fit's means: with a covariate they are adjusted means (a reader must not
 * take them for the plain ones), and a split plot's are the whole-plot factor's means.
 */
function meansTitleOf(treatment: string | null, adjusted: boolean, wholePlots: boolean): string {
  if (treatment === null) return adjusted ? 'Adjusted treatment means' : 'Treatment means';
  if (adjusted) return `Adjusted means of ${treatment} (at the covariate's mean)`;
  if (wholePlots) return `Means of ${treatment} (whole plots)`;
  return `Means of ${treatment}`;
}

/** One row of a table of pairwise differences, as written. */
export interface PairRowText {
  readonly pair: string;
  readonly estimate: string;
  readonly se: string;
  readonly low: string;
  readonly high: string;
  readonly p: string;
  /** Whether the interval leaves out zero: 'yes', 'no', or '' when the record does not say. */
  readonly excludesZero: string;
}

/** Everything a record of pairwise differences (tag 'pairs') shows. */
export interface PairsLayout {
  readonly title: string;
  readonly intervalHeader: string;
  readonly rows: readonly PairRowText[] | null;
  readonly scalars: readonly ScalarLine[];
  readonly others: readonly ValueLine[];
}

const METHOD_WORDS: ReadonlyMap<string, string> = new Map([
  ['tukey', 'Tukey (simultaneous intervals)'],
  ['bonferroni', 'Bonferroni (simultaneous intervals)'],
  ['lsd', 'least significant difference (unadjusted, one pair at a time)'],
]);

/** The rows of a pairs table (columns `a b estimate se low high p`, optionally `significant`). */
export function pairRows(t: Table): PairRowText[] | null {
  const a = tableColumn(t, 'a');
  const b = tableColumn(t, 'b');
  const estimate = tableColumn(t, 'estimate');
  const se = tableColumn(t, 'se');
  const low = tableColumn(t, 'low');
  const high = tableColumn(t, 'high');
  const p = tableColumn(t, 'p');
  const significant = tableColumn(t, 'significant');
  if (a === undefined || b === undefined || estimate === undefined || se === undefined || low === undefined || high === undefined || p === undefined) return null;
  const rows = t.rows;
  const out: PairRowText[] = [];
  for (let i = 0; i < rows; i++) {
    let excludesZero = '';
    if (significant !== undefined && significant.type === 'boolean' && !isMissingAt(significant, i)) {
      excludesZero = significant.values[i] === 1 ? 'yes' : 'no';
    }
    out.push({
      pair: `${textAt(a, i)} − ${textAt(b, i)}`,
      estimate: cell(numberAt(estimate, i), 'estimate'),
      se: cell(numberAt(se, i), 'estimate'),
      low: cell(numberAt(low, i), 'estimate'),
      high: cell(numberAt(high, i), 'estimate'),
      p: pText(numberAt(p, i)),
      excludesZero,
    });
  }
  return out;
}

const PAIRS_PLACED: ReadonlySet<string> = new Set(['table', 'method', 'factor']);

/** The layout of a record of pairwise comparisons. */
export function pairsLayout(r: RecordValue): PairsLayout {
  const f = r.fields;
  const method = f.get('method');
  const factor = f.get('factor');
  const level = f.get('level');
  const table = f.get('table');
  const rows = table !== undefined && isTable(table) ? pairRows(table) : null;
  const methodWords = typeof method === 'string' ? (METHOD_WORDS.get(method) ?? method) : null;
  const of = typeof factor === 'string' && factor !== '' ? `${factor} means` : 'means';
  const title = `Pairwise differences of ${of}${methodWords === null ? '' : `: ${methodWords}`}`;
  const scalars: ScalarLine[] = [];
  const others: ValueLine[] = [];
  if (table !== undefined && rows === null) others.push({ field: 'table', label: 'pairs', value: table });
  for (const [field, v] of f) {
    if (PAIRS_PLACED.has(field)) continue;
    const text = scalarText(field, v);
    if (text !== null) scalars.push({ field, label: fieldLabel(field), text });
    else others.push({ field, label: fieldLabel(field), value: v });
  }
  return {
    title,
    intervalHeader: typeof level === 'number' && level > 0 && level < 1 ? `${levelText(level)} interval` : 'interval',
    rows,
    scalars,
    others,
  };
}

/** One field of a record without a layout of its own. */
export interface RecordLine {
  readonly field: string;
  /** The short text of a scalar field; null when the value is drawn as a value of its own. */
  readonly text: string | null;
  readonly value: Value;
}

/** The fields of any other record, in order: scalars as texts, the rest to be drawn. */
export function recordLines(r: RecordValue): RecordLine[] {
  const out: RecordLine[] = [];
  for (const [field, v] of r.fields) out.push({ field, text: scalarText(field, v), value: v });
  return out;
}
