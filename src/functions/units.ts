/**
 * Unit conversion, `convert(x, from, to)`, on mathjs's unit system.
 *
 * How a conversion is done (documented in the built-in's doc, tested in
 * test/functions/units.test.ts against the SI brochure's and NIST SP 811's definitions):
 * 1. mathjs reads both units and says whether they measure the same quantity; the
 *    conversion is then y = x * scale + offset, with the offset zero except between
 *    temperature scales.
 * 2. When the scale and offset are short decimals (t to kg: 1000; lb to kg: 0.45359237;
 *    degC to K: 1 and 273.15; degC to degF: 1.8 and 32; see `shortDecimal`) each value is
 *    converted on its decimal digits (its typed text in a table column, otherwise its
 *    shortest text) and rounded once: 1.005 t is 1005 kg and 100 degC is 212 degF, where
 *    binary arithmetic gives 1004.9999999999999 and 211.99999999999997. A column that kept
 *    its typed texts keeps the converted texts, so the exact decimal shift of the sums of
 *    squares (docs/language.md section 5) still applies after a conversion.
 * 3. When the scale and offset are not short decimals but nine times each is (degF to degC:
 *    5/9 and -160/9; degF to K: 5/9 and 2298.35/9; also in to ft, 0.75/9, deg to grad, 10/9,
 *    min to h and the like), each value is (x * scale9 + offset9) / 9 on its decimal digits,
 *    rounded once: 212 degF is 373.15 K and 95.9 degF 35.5 degC, where binary arithmetic
 *    gives 373.15000000000003 and 35.50000000000001.
 * 4. Any other scale (lb/acre to kg/ha, psi to Pa) multiplies in floating point, one
 *    rounding.
 *
 * mathjs is loaded at the first conversion, never at start (see `unitMath`).
 */
import type { create, createUnitDependencies, FactoryFunctionMap, Unit, unitDependencies } from 'mathjs';
import { UsageError } from '../lang/errors.ts';
import { msg } from '../messages/language.ts';
import type { Builtin } from '../lang/builtins.ts';
import { MISSING, decimalAt, isMissing, numberColumn, type NumberColumn, type Value } from '../lang/values.ts';
import { readDecimal, roundQuotient, roundScaledInteger, type ExactDecimal } from '../stats/decimal/index.ts';

/** What convert needs of mathjs: its factory functions for the unit system. */
export interface UnitLibrary {
  readonly create: typeof create;
  readonly unitDependencies: typeof unitDependencies;
  readonly createUnitDependencies: typeof createUnitDependencies;
}

type UnitMath = ReturnType<typeof create>;
type ParsedUnit = Unit;

let provided: UnitLibrary | null = null;
let math: UnitMath | null = null;

/**
 * Hands convert the unit part of mathjs where it cannot load it itself (the page's worker
 * imports src/functions/unit-library.ts and passes it here).
 */
export function provideUnitLibrary(lib: UnitLibrary): void {
  provided = lib;
}

interface NodeModuleApi {
  createRequire(url: string): (id: string) => unknown;
}

/**
 * In Node, loads mathjs's unit part synchronously at the first conversion: the command
 * line's build has it bundled beside the chunk that holds this code
 * (build/cli/chunks/unit-library.cjs); from the sources (tests, a development checkout) it
 * is the mathjs package. Null outside Node.
 */
function nodeUnitLibrary(): UnitLibrary | null {
  // process.getBuiltinModule is Node's (20.16 and later); a browser or worker has no process
  const proc = (globalThis as { process?: { getBuiltinModule?: (id: string) => unknown } }).process;
  const mod = proc?.getBuiltinModule?.('node:module') as NodeModuleApi | undefined;
  if (mod === undefined) return null;
  const load = mod.createRequire(import.meta.url);
  try {
    return load('./unit-library.cjs') as UnitLibrary;
  } catch (err) {
    if ((err as { code?: unknown }).code !== 'MODULE_NOT_FOUND') throw err;
    return load('mathjs') as UnitLibrary;
  }
}

/**
 * Units added to mathjs's own, or given their exact definitions where mathjs rounds them
 * (each checked in test/functions/units.test.ts):
 * - `ha`, the hectare under the symbol the SI brochure gives it (mathjs knows only `hectare`);
 * - `acre`, exactly 43,560 international square feet, 4046.8564224 m^2 (mathjs: 4046.86);
 * - `psi`, exactly one pound-force per square inch (mathjs's constant differs in the
 *   tenth digit), and `kip`, exactly 1000 pound-force (mathjs: 4448.2216 N).
 */
function unitMath(): UnitMath {
  if (math !== null) return math;
  const lib = provided ?? nodeUnitLibrary();
  if (lib === null || lib.unitDependencies === undefined || lib.createUnitDependencies === undefined) throw new UsageError(msg.unitsUnavailable());
  const factories: FactoryFunctionMap = { unitDependencies: lib.unitDependencies, createUnitDependencies: lib.createUnitDependencies };
  const m = lib.create(factories);
  m.createUnit('ha', '10000 m^2');
  m.createUnit('acre', '4046.8564224 m^2', { override: true });
  m.createUnit('psi', '1 lbf / in^2', { override: true });
  m.createUnit('kip', '1000 lbf', { override: true });
  // mathjs copies a unit to its plural when it starts, so the plurals are given again
  m.createUnit('acres', '1 acre', { override: true });
  m.createUnit('kips', '1 kip', { override: true });
  math = m;
  return m;
}

/** A unit text read by mathjs; an error in our words when it is not a unit alone. */
function readUnit(m: UnitMath, text: string): ParsedUnit {
  let u: ParsedUnit;
  try {
    u = m.Unit.parse(text.trim());
  } catch {
    throw new UsageError(msg.unknownUnit(text));
  }
  // a parsed unit's value is null when the text held no number
  if ((u as unknown as { value: unknown }).value != null) throw new UsageError(msg.unitWithNumber(text));
  return u;
}

/** How values in one unit become values in another: y = x * scale + offset. */
export interface UnitConversion {
  readonly from: string;
  readonly to: string;
  readonly scale: number;
  readonly offset: number;
  /**
   * The scale and offset as exact decimals, when both are short decimals (1000, 0.45359237,
   * 1.8 and 32, 1 and 273.15): each value is then converted on its decimal digits. Null
   * otherwise.
   */
  readonly exact: { readonly scale: ExactDecimal; readonly offset: ExactDecimal } | null;
  /**
   * When the scale and offset are not short decimals but nine times each is (degF to degC:
   * 5 and -160; degF to K: 5 and 2298.35): each value is then converted as
   * (x * scale9 + offset9) / 9 on its decimal digits, rounded once. Null otherwise.
   */
  readonly ninths: { readonly scale9: ExactDecimal; readonly offset9: ExactDecimal } | null;
}

/** Significant digits up to which a factor counts as a short decimal. */
const SHORT_DIGITS = 8;
/** Relative distance within which mathjs's binary factor counts as that short decimal. */
const SHORT_TOLERANCE = 1e-13;

/**
 * The short decimal that mathjs's binary factor stands for, or null.
 *
 * mathjs forms a compound factor by multiplying and dividing its units' binary factors, so
 * t/ha to kg/ha may come out a unit in the last place from 1000, and degC to degF comes out
 * as 1.7999999999999972. The definitions behind them are exact decimals of a few digits (the
 * SI prefixes, 0.45359237 kg for the pound, 1.8 and 273.15 for temperatures); a factor
 * within 1e-13 of a decimal of at most 8 significant digits is taken to be that decimal. A
 * factor that is not one (5/9; lb/acre in kg/ha) stays binary.
 */
function shortDecimal(x: number): ExactDecimal | null {
  if (x === 0) return { significand: 0n, scale: 0 };
  if (!Number.isFinite(x)) return null;
  const near = Number(x.toPrecision(SHORT_DIGITS));
  if (Math.abs(near / x - 1) >= SHORT_TOLERANCE) return null;
  return readDecimal(String(near));
}

/**
 * The conversion from one unit to another, as mathjs's unit system defines it.
 *
 * @throws UsageError for an unknown unit, a unit with a number, or units of different quantities
 */
export function unitConversion(from: string, to: string): UnitConversion {
  const m = unitMath();
  const a = readUnit(m, from);
  const b = readUnit(m, to);
  if (!a.equalBase(b)) throw new UsageError(msg.incompatibleUnits(from, to));
  const at = (x: number): number => m.unit(x, from.trim()).toNumber(to.trim());
  const offset = at(0);
  const scale = at(1) - offset;
  const exactScale = shortDecimal(scale);
  const exactOffset = shortDecimal(offset);
  const exact = exactScale !== null && exactOffset !== null ? { scale: exactScale, offset: exactOffset } : null;
  const scale9 = exact === null ? shortDecimal(scale * 9) : null;
  const offset9 = exact === null ? shortDecimal(offset * 9) : null;
  return {
    from,
    to,
    scale: exact === null ? scale : roundScaledInteger(exact.scale.significand, exact.scale.scale),
    offset: exact === null ? offset : roundScaledInteger(exact.offset.significand, exact.offset.scale),
    exact,
    ninths: scale9 !== null && offset9 !== null ? { scale9, offset9 } : null,
  };
}

/** `significand * 10^scale` written as a plain decimal text (exponent form past 30 places). */
function decimalText(significand: bigint, scale: number): string {
  const negative = significand < 0n;
  let digits = (negative ? -significand : significand).toString();
  if (scale > 30 || scale < -30) return `${negative ? '-' : ''}${digits}e${scale}`;
  if (scale >= 0) digits = significand === 0n ? '0' : digits + '0'.repeat(scale);
  else {
    const point = digits.length + scale;
    digits = point > 0 ? `${digits.slice(0, point)}.${digits.slice(point)}` : `0.${'0'.repeat(-point)}${digits}`;
  }
  return negative ? `-${digits}` : digits;
}

/** The exact decimal `text * scale + offset`, as the nearest double and as a text. */
function exactlyConverted(text: string, c: { scale: ExactDecimal; offset: ExactDecimal }): { value: number; text: string } {
  const d = readDecimal(text);
  if (d === null) return { value: NaN, text: '' };
  const r = scaledAndOffset(d, c.scale, c.offset);
  return { value: roundScaledInteger(r.significand, r.scale), text: decimalText(r.significand, r.scale) };
}

/** `significand * 10^scale`, the exact decimal `text * scale + offset`, as BigInt and power of ten. */
function scaledAndOffset(d: ExactDecimal, scale: ExactDecimal, offset: ExactDecimal): { significand: bigint; scale: number } {
  let significand = d.significand * scale.significand;
  let power = d.scale + scale.scale;
  if (offset.significand !== 0n) {
    const low = Math.min(power, offset.scale);
    significand = significand * 10n ** BigInt(power - low) + offset.significand * 10n ** BigInt(offset.scale - low);
    power = low;
  }
  return { significand, scale: power };
}

/** `(text * scale9 + offset9) / 9`, exactly, as the nearest double. */
function ninthsConverted(text: string, c: { scale9: ExactDecimal; offset9: ExactDecimal }): number {
  const d = readDecimal(text);
  if (d === null) return NaN;
  const r = scaledAndOffset(d, c.scale9, c.offset9);
  return r.scale >= 0 ? roundQuotient(r.significand * 10n ** BigInt(r.scale), 9n) : roundQuotient(r.significand, 9n * 10n ** BigInt(-r.scale));
}

/** Converts one number. */
function convertNumber(x: number, c: UnitConversion): number {
  // infinities, NaN and zeros (whose sign a decimal text drops) need no digits
  const plain = !Number.isFinite(x) || (x === 0 && c.offset === 0);
  if (!plain && c.exact !== null) return exactlyConverted(String(x), c.exact).value;
  if (!plain && c.ninths !== null) return ninthsConverted(String(x), c.ninths);
  if (c.offset === 0) return x * c.scale;
  // between temperature scales of different degree sizes, as mathjs converts them
  return unitMath().unit(x, c.from.trim()).toNumber(c.to.trim());
}

/**
 * A header's unit: `yield (t/ha)` is `yield` in `t/ha`. Null when the header has no
 * parentheses at its end, or when what they hold is not a unit (`plot (north)`).
 */
export function headerUnit(name: string | null): { base: string; unit: string } | null {
  if (name === null) return null;
  const m = /^(.*?)\s*\(([^()]+)\)\s*$/.exec(name);
  if (m === null) return null;
  const unit = m[2]!.trim();
  try {
    readUnit(unitMath(), unit);
  } catch (err) {
    if (err instanceof UsageError && err.message !== msg.unitsUnavailable()) return null;
    throw err;
  }
  return { base: m[1]!, unit };
}

/**
 * Converts a number or a column of numbers; a column's name gets the new unit in its
 * parentheses (`yield (t/ha)` becomes `yield (kg/ha)`), so tables and charts show it.
 */
export function convertValues(x: Value, c: UnitConversion): Value {
  if (typeof x === 'number') return convertNumber(x, c);
  if (isMissing(x)) return MISSING;
  const col = x as NumberColumn;
  const n = col.values.length;
  const out = new Float64Array(n);
  const miss = col.missing;
  // a column that kept its typed texts keeps them through an exact conversion
  const exact = c.exact;
  const texts: string[] | null = exact !== null && col.decimals !== null ? new Array<string>(n) : null;
  for (let i = 0; i < n; i++) {
    if (miss !== null && miss[i] === 1) {
      out[i] = NaN;
      if (texts !== null) texts[i] = '';
    } else if (texts !== null) {
      const r = exactlyConverted(decimalAt(col.decimals!, i)!, exact!);
      out[i] = r.value;
      texts[i] = r.text;
    } else out[i] = convertNumber(col.values[i]!, c);
  }
  const header = headerUnit(col.name);
  const name = col.name === null ? null : `${header === null ? col.name : header.base} (${c.to.trim()})`;
  return numberColumn(out, miss, name, texts);
}

export const UNITS: readonly Builtin[] = [
  {
    name: 'convert',
    category: 'maths',
    params: [
      { name: 'x', type: 'numeric', doc: 'A number or a column of numbers.' },
      {
        name: 'from',
        type: 'text',
        default: MISSING,
        doc: 'The unit x is in, such as "t/ha"; left out, the unit in parentheses at the end of the column\'s header ("yield (t/ha)").',
      },
      { name: 'to', type: 'text', default: MISSING, doc: 'The unit to convert to, such as "kg/ha".' },
    ],
    returns: 'a number, or a column of the same length',
    doc:
      'Converts values from one unit to another with the unit system of mathjs: SI units with their prefixes, written as in the SI (kg, t, ha, m^2, MPa, N/mm^2, degC, K) and joined by / * and ^, and common non-SI units (lb, acre, psi, degF). t is the tonne (1000 kg); ton is the short ton of 2000 lb. ' +
      'Units of different quantities are an error. When the factor is a short decimal (t/ha to kg/ha, MPa to Pa, lb to kg, degC to K or degF) each value is converted exactly on its decimal digits as it reads, and a table column keeps its typed digits through it; where the factor is a short decimal in ninths (degF to degC or K, 5/9; in to ft; deg to grad) each value is converted exactly as ninths of its digits and rounded once; other factors (lb/acre to kg/ha, psi to Pa) multiply in floating point. ' +
      'A column whose header ends with its unit in parentheses needs only the unit to convert to, and the result is named with the new unit.',
    example: 'convert(trees["yield (t/ha)"], to: "kg/ha")',
    run: (args) => {
      const x = args.get('x')!;
      const fromArg = args.get('from')!;
      const toArg = args.get('to')!;
      if (typeof toArg !== 'string') throw new UsageError(msg.noTargetUnit());
      const name = typeof x === 'object' && x.kind === 'column' ? x.name : null;
      const header = headerUnit(name);
      let from: string;
      if (typeof fromArg === 'string') {
        // a header that names a unit must agree with the one given
        if (header !== null && name !== null) {
          let same = false;
          try {
            const check = unitConversion(header.unit, fromArg);
            same = check.scale === 1 && check.offset === 0;
          } catch (err) {
            if (!(err instanceof UsageError) || err.message === msg.unitsUnavailable()) throw err;
          }
          if (!same) throw new UsageError(msg.headerUnitDiffers(name, header.unit, fromArg));
        }
        from = fromArg;
      } else if (header !== null) from = header.unit;
      else throw new UsageError(msg.noSourceUnit(name));
      return convertValues(x, unitConversion(from, toArg));
    },
  },
];
