/**
 * Axis and legend titles from column names, with the unit where the header states one.
 *
 * The rule, kept small on purpose so that it never guesses:
 * 1. A header that already has its unit in brackets, `yield (kg)` or `dose [mg]`, is used as
 *    written (the bracket part is the unit).
 * 2. A header ending in `_` plus one of the unit words of {@link UNIT_SUFFIXES}, such as
 *    `yield_kg` or `shear_mpa`, reads `yield (kg)`, `shear (MPa)`: the suffix must be the
 *    whole last part, and the table lists only symbols that have one obvious meaning as a
 *    trailing part of a measurement's name (no `t`, `l`, `c` or `n`, which name other things
 *    as often as units).
 * 3. Anything else is the header with underscores read as spaces, and no unit.
 */

/**
 * Unit words a header may end in, each with the symbol it stands for (SI symbols in their
 * proper case; `pct` for per cent and `kg_ha` for kilograms per hectare, as field books
 * write them).
 */
export const UNIT_SUFFIXES: ReadonlyMap<string, string> = new Map([
  ['kg_ha', 'kg/ha'],
  ['t_ha', 't/ha'],
  ['mg', 'mg'],
  ['g', 'g'],
  ['kg', 'kg'],
  ['um', 'µm'],
  ['mm', 'mm'],
  ['cm', 'cm'],
  ['m', 'm'],
  ['km', 'km'],
  ['ml', 'mL'],
  ['ms', 'ms'],
  ['s', 's'],
  ['min', 'min'],
  ['h', 'h'],
  ['pa', 'Pa'],
  ['kpa', 'kPa'],
  ['mpa', 'MPa'],
  ['gpa', 'GPa'],
  ['kn', 'kN'],
  ['degc', '°C'],
  ['pct', '%'],
  ['ppm', 'ppm'],
]);

/** A column name split into what it measures and its unit (null when none is stated). */
export interface NamedQuantity {
  readonly label: string;
  readonly unit: string | null;
}

const BRACKETS = '()[]';

/**
 * `label (unit)` or `label [unit]` at the end of a name: the unit is what stands between the
 * last closing bracket and the opening bracket before it, with no bracket in between. One
 * backward scan, so a hostile header costs time in proportion to its length (a pattern with
 * nested repetition took seconds on a few thousand spaces).
 */
function bracketedUnit(trimmed: string): NamedQuantity | null {
  const last = trimmed.charAt(trimmed.length - 1);
  if (last !== ')' && last !== ']') return null;
  let open = -1;
  for (let i = trimmed.length - 2; i >= 0; i--) {
    const c = trimmed.charAt(i);
    if (!BRACKETS.includes(c)) continue;
    if (c === '(' || c === '[') open = i;
    break;
  }
  if (open < 0) return null;
  const unit = trimmed.slice(open + 1, trimmed.length - 1).trim();
  const label = trimmed.slice(0, open).trimEnd();
  return unit.length > 0 && label.length > 0 ? { label, unit } : null;
}

/** Reads a column name by the rule of the module note. */
export function readName(name: string): NamedQuantity {
  const trimmed = name.trim();
  const b = bracketedUnit(trimmed);
  if (b !== null) return b;
  const lower = trimmed.toLowerCase();
  // longest suffix first, so that `yield_kg_ha` is kilograms per hectare and not hectares
  for (const [suffix, unit] of [...UNIT_SUFFIXES].sort((x, y) => y[0].length - x[0].length)) {
    const tail = `_${suffix}`;
    if (lower.endsWith(tail) && lower.length > tail.length) {
      return { label: spaced(trimmed.slice(0, trimmed.length - tail.length)), unit };
    }
  }
  return { label: spaced(trimmed), unit: null };
}

function spaced(s: string): string {
  const t = s.replace(/_+/g, ' ').trim();
  return t.length === 0 ? s : t;
}

/** `label (unit)`, or the label alone. */
export function withUnit(q: NamedQuantity, label = q.label): string {
  return q.unit === null ? label : `${label} (${q.unit})`;
}

/** The title of an axis that shows a column: `yield (kg)`. */
export function axisTitle(name: string): string {
  return withUnit(readName(name));
}

/** The title of an axis that shows something of a column, in its unit: `fitted yield (kg)`. */
export function derivedTitle(prefix: string, name: string): string {
  const q = readName(name);
  return withUnit(q, `${prefix} ${q.label}`);
}
