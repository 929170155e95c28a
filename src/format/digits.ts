/**
 * The one digits policy: how every result number becomes text, wherever it is shown (the
 * page's tables and records, a note's placeholders, chart titles and tooltips, the command
 * line's human output, the report). Nothing else in the product turns a number into digits
 * with toFixed, toPrecision, toExponential or toLocaleString (a test reads the source and
 * fails on any), so one quantity reads the same in every place.
 *
 * The rule, by quantity (common practice, no source; the choices are ours):
 * - p-values: below 0.001 as "< 0.001"; otherwise two significant digits, trailing zero kept
 *   (0.050, 0.66); one that would round to 1.0 as "> 0.99".
 * - estimates (means, differences, standard errors, interval ends, standard deviations, slopes)
 *   and sums of squares and mean squares: four significant digits.
 * - test statistics (F, t, z, W, chi-square) and power: three significant digits; a whole
 *   statistic (a rank sum, U) prints whole.
 * - degrees of freedom: whole numbers as they are; fractional ones (Welch) to three digits.
 * - counts: whole numbers with commas between thousands (12,400).
 * - confidence levels: as percentages (95%).
 * - plain numbers (a formula's own result, whose meaning the policy cannot know): six
 *   significant digits.
 * For all but p: digits left of the decimal point are never rounded away (1234.56 at four
 * digits is 1235, and 123456.7 is 123457, so sums of squares still add up); magnitudes
 * below 0.0001 or from 10^15 up print in exponent form. A result keeps its trailing zeros,
 * since they are significant digits (38.50, 2.000); a plain number drops them and prints
 * whole when it is whole (0.6, 12). NaN prints "NaN" and the infinities "∞" and "-∞".
 *
 * This folder imports nothing of the project, so every floor of the stairs may use it.
 */

/** What a number is, for the digits it gets. */
export type Quantity = 'estimate' | 'squares' | 'statistic' | 'power' | 'p' | 'df' | 'count' | 'level' | 'plain';

/** Significant digits of each quantity that is written to significant digits. */
export const SIGNIFICANT: ReadonlyMap<Quantity, number> = new Map<Quantity, number>([
  ['estimate', 4],
  ['squares', 4],
  ['statistic', 3],
  ['power', 3],
  ['df', 3],
  ['plain', 6],
]);

/** A p-value below this is written as "< 0.001". */
export const P_FLOOR = 0.001;

/** The policy in words, for the built-ins' docs and the README. */
export const DIGITS_RULE =
  'Results are shown by one rule: p-values below 0.001 as "< 0.001", otherwise to two significant digits; estimates, sums of squares and mean squares to four significant digits; test statistics and power to three; degrees of freedom whole (or to three digits when fractional); digits left of the decimal point are never rounded away.';

/**
 * The quantity a field or column name stands for (the names the built-ins give their
 * results); a name the policy does not know is 'plain'.
 */
export function quantityOf(name: string | null | undefined): Quantity {
  if (name === null || name === undefined) return 'plain';
  const n = name.toLowerCase();
  const known = NAMED.get(n);
  if (known !== undefined) return known;
  if (n.endsWith('_p') || n.startsWith('p_')) return 'p';
  if (/^df(\d+|_\w+)$/.test(n)) return 'df';
  if (n.startsWith('ss_') || n.startsWith('ms_') || n.startsWith('mse_')) return 'squares';
  if (n.endsWith('_mean') || n.endsWith('_sd') || n.endsWith('_se') || n.endsWith('_means')) return 'estimate';
  return 'plain';
}

const NAMED: ReadonlyMap<string, Quantity> = new Map<string, Quantity>([
  ...(['p', 'adjusted_p'] as const).map((k) => [k, 'p'] as [string, Quantity]),
  ...(['ss', 'ms', 'mse', 'pooled_variance', 'variance'] as const).map((k) => [k, 'squares'] as [string, Quantity]),
  ...(['f', 't', 'z', 'w', 'u', 'statistic', 'chi_square', 'f_against_error', 'rank_sum'] as const).map((k) => [k, 'statistic'] as [string, Quantity]),
  ...(['power', 'chosen_power', 'target'] as const).map((k) => [k, 'power'] as [string, Quantity]),
  ...(['df', 'df1', 'df2'] as const).map((k) => [k, 'df'] as [string, Quantity]),
  ...(['n', 'n1', 'n2', 'level_n', 'zeros', 'tie_groups', 'rows', 'blocks', 'treatments', 'observations', 'row'] as const).map((k) => [k, 'count'] as [string, Quantity]),
  ['level', 'level'],
  ...([
    'estimate',
    'mean',
    'se',
    'sd',
    'low',
    'high',
    'grand_mean',
    'slope',
    'slope_se',
    'covariate_mean',
    'critical',
    'relative_efficiency',
    'relative_efficiency_uncorrected',
    'r2',
    'mean_rank',
    'fitted',
    'residuals',
    'residual',
    'studentized',
    'studentized_residuals',
    'leverage',
    'tie_correction',
    'difference',
  ] as const).map((k) => [k, 'estimate'] as [string, Quantity]),
]);

/** A number as text by its quantity: the one rule of the product. */
export function numberText(x: number, quantity: Quantity = 'plain'): string {
  if (quantity === 'p') return pValueText(x);
  if (quantity === 'level') return x > 0 && x < 1 ? percentText(x) : significantText(x, 6);
  if (quantity === 'count') return Number.isInteger(x) && Math.abs(x) < 1e15 ? countText(x) : significantText(x, 6);
  // a whole statistic (a rank sum, U, the signed-rank statistic) is a count of ranks: whole
  if (quantity === 'plain' || quantity === 'df' || (quantity === 'statistic' && Number.isInteger(x))) return significantText(x, SIGNIFICANT.get(quantity) ?? 6);
  return significantText(x, SIGNIFICANT.get(quantity) ?? 6, true);
}

/**
 * A p-value: "< 0.001" below P_FLOOR, "> 0.99" when two digits would round it to 1,
 * otherwise two significant digits with a trailing zero kept (0.050). NaN is "NaN".
 */
export function pValueText(p: number): string {
  if (Number.isNaN(p)) return 'NaN';
  if (p < P_FLOOR) return `< ${P_FLOOR}`;
  const s = p.toPrecision(2);
  if (Number(s) >= 1) return p > 1 ? significantText(p, 6) : '> 0.99';
  return s;
}

/** A p-value as a phrase in a sentence: "p = 0.66", "p < 0.001", "p > 0.99"; NaN is "p not available". */
export function pPhrase(p: number): string {
  if (Number.isNaN(p)) return 'p not available';
  const t = pValueText(p);
  return t.startsWith('<') || t.startsWith('>') ? `p ${t}` : `p = ${t}`;
}

/** A whole count with commas between thousands: 12,400. Written by hand, the same in every runtime and locale. */
export function countText(n: number): string {
  if (!Number.isFinite(n)) return significantText(n, 6);
  const whole = String(Math.round(Math.abs(n))).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return n < 0 && Math.round(n) !== 0 ? `-${whole}` : whole;
}

/** A fraction as a percentage (a confidence level): 0.95 is "95%", 0.999 is "99.9%". */
export function percentText(fraction: number): string {
  return `${significantText(fraction * 100, 6)}%`;
}

/**
 * A number to `sig` significant digits, with the rules of the module comment: whole digits
 * kept, exponent form only for tiny or huge numbers; trailing zeros kept when `keepZeros`
 * (a result), else dropped, and a whole number printed whole.
 */
export function significantText(x: number, sig: number, keepZeros = false): string {
  if (Number.isNaN(x)) return 'NaN';
  if (x === Infinity) return '∞';
  if (x === -Infinity) return '-∞';
  const a = Math.abs(x);
  const trim = keepZeros ? (t: string) => t : trimZeros;
  if (!keepZeros && Number.isInteger(x) && a < 1e15) return String(x === 0 ? 0 : x);
  if (a !== 0 && (a < 1e-4 || a >= 1e15)) {
    const [m, e] = x.toExponential(sig - 1).split('e');
    return `${trim(m!)}e${e}`;
  }
  // more whole digits than significant ones: round to a whole number, never into the digits
  if (a >= 10 ** sig) return unsignedZero(x.toFixed(0));
  return unsignedZero(trim(x.toPrecision(sig)));
}

/**
 * A number with a fixed count of decimals, trailing zeros kept ("0.60"): the form a writer
 * asks for in a note. Rounds half away from zero on the number as it reads in decimal
 * (2.675 to 2 decimals is 2.68). NaN and the infinities as numberText writes them; a zero
 * that rounds from a negative number has no sign.
 */
export function decimalsText(x: number, decimals: number): string {
  if (!Number.isFinite(x)) return significantText(x, 6);
  const d = Math.max(0, Math.min(100, Math.trunc(decimals)));
  const { negative, digits, pointAt } = decimalDigits(x);
  // digits d1 d2 ... with the decimal point after `pointAt` of them (pointAt may be <= 0)
  const keep = pointAt + d;
  let whole: bigint;
  if (keep < 0) whole = 0n;
  else {
    const head = digits.slice(0, keep);
    whole = head === '' ? 0n : BigInt(head);
    if (keep < digits.length && digits.charCodeAt(keep) - 48 >= 5) whole += 1n;
    if (keep > digits.length) whole *= 10n ** BigInt(keep - digits.length);
  }
  let s = whole.toString().padStart(d + 1, '0');
  if (d > 0) s = `${s.slice(0, s.length - d)}.${s.slice(s.length - d)}`;
  return negative && whole !== 0n ? `-${s}` : s;
}

/**
 * The shortest decimal digits that read back as x (the digits JavaScript prints), with
 * where the point goes: 2.675 is digits "2675", pointAt 1; 0.05 is "5", pointAt -1.
 * For rounding on the number as it reads (round, decimalsText). x must be finite.
 */
export function decimalDigits(x: number): { negative: boolean; digits: string; pointAt: number } {
  const [mant, expPart] = x.toExponential().split('e') as [string, string];
  const negative = mant.startsWith('-');
  const digits = mant.replace('-', '').replace('.', '');
  return { negative, digits: digits === '0' ? '' : digits, pointAt: Number(expPart) + 1 };
}

/**
 * A d3-format string for a chart's tooltip that writes a quantity as numberText does for
 * numbers from 0.0001 up to 10^sig (beyond that, d3 rounds whole digits that numberText
 * keeps, and a whole statistic such as 2 reads 2.00). p-values are not given one: a chart
 * shows them as texts made by pValueText.
 */
export function chartFormat(quantity: Exclude<Quantity, 'p'>): string {
  if (quantity === 'count') return ',d';
  if (quantity === 'level') return '.6~%';
  const sig = SIGNIFICANT.get(quantity) ?? 6;
  return quantity === 'plain' || quantity === 'df' ? `.${sig}~r` : `.${sig}r`;
}

/**
 * The d3-format string for a measured value in a tooltip: twelve significant digits, so that
 * data with many constant leading digits (1000000000000.4) still read as typed. Data are
 * not results: they keep the digits they were measured with.
 */
export const MEASURED_CHART_FORMAT = '.12~g';

function trimZeros(s: string): string {
  if (!s.includes('.')) return s;
  return s.replace(/\.?0+$/, '');
}

function unsignedZero(s: string): string {
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s;
}
