/**
 * `convert`: conversion factors against the definitions of the SI brochure and NIST SP 811,
 * exact decimal conversion where the factor is a short decimal, header units, and the
 * errors a user sees.
 */
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { msg } from '../../src/messages/language.ts';
import { headerUnit, unitConversion } from '../../src/functions/units.ts';
import type { NumberColumn, Value } from '../../src/lang/values.ts';
import { doc, evalFormula, run, valueOf } from '../helpers.ts';

/** convert(x, from, to) evaluated as a formula, as a number. */
function num(x: string, from: string, to: string): number {
  const v = evalFormula(`convert(${x}, "${from}", "${to}")`);
  if (typeof v !== 'number') throw new Error(`convert gave ${JSON.stringify(v)}`);
  return v;
}

/** The message of a formula's error. */
function errorOf(expr: string, ...before: string[]): string {
  const v = evalFormula(expr, ...before);
  if (typeof v !== 'object' || v.kind !== 'error') throw new Error(`no error: ${JSON.stringify(v)}`);
  // the evaluator names the function before a built-in's own message
  expect(v.message.startsWith('convert: ')).toBe(true);
  return v.message.slice('convert: '.length);
}

/** Throws unless |got - want| <= tol * |want| (a relative check that fails when the numbers differ). */
function relClose(got: number, want: number, tol: number): void {
  expect(Math.abs(got - want), `${got} against ${want}`).toBeLessThanOrEqual(tol * Math.abs(want));
}

describe('convert: factors of the SI', () => {
  it('prefixes, the tonne, the hectare, the litre and the pascal', () => {
    // source: BIPM, The International System of Units (SI), 9th edition 2019, Table 7 (prefixes: kilo 10^3, mega 10^6, milli 10^-3) (from memory)
    expect(num('1', 'kg', 'g')).toBe(1000);
    expect(num('1', 'MPa', 'Pa')).toBe(1e6);
    expect(num('1', 'mm', 'm')).toBe(0.001);
    // source: BIPM, The International System of Units (SI), 9th edition 2019, Table 8: 1 t = 10^3 kg (from memory)
    expect(num('1', 't', 'kg')).toBe(1000);
    // source: BIPM, The International System of Units (SI), 9th edition 2019, Table 8: 1 ha = 1 hm^2 = 10^4 m^2 (from memory)
    expect(num('1', 'ha', 'm^2')).toBe(1e4);
    expect(num('1', 'hectare', 'm^2')).toBe(1e4);
    // source: BIPM, The International System of Units (SI), 9th edition 2019, Table 8: 1 L = 1 dm^3 = 10^-3 m^3 (from memory)
    expect(num('1', 'L', 'm^3')).toBe(0.001);
    // source: BIPM, The International System of Units (SI), 9th edition 2019, Table 4: Pa = N/m^2, so 1 N/mm^2 = 10^6 Pa = 1 MPa (from memory)
    expect(num('1', 'N/mm^2', 'MPa')).toBe(1);
    expect(num('1', 'N/mm^2', 'Pa')).toBe(1e6);
  });

  it('yields per area: t/ha, kg/ha and g/m^2', () => {
    // source: BIPM, The International System of Units (SI), 9th edition 2019, Table 8 (t = 10^3 kg, ha = 10^4 m^2) (from memory)
    expect(num('1', 't/ha', 'kg/ha')).toBe(1000);
    expect(num('1', 't/ha', 'g/m^2')).toBe(100);
    expect(num('1', 'g/m^2', 'kg/ha')).toBe(10);
    expect(num('1', 'kg/ha', 't/ha')).toBe(0.001);
  });

  it('degree Celsius to kelvin and back', () => {
    // source: BIPM, The International System of Units (SI), 9th edition 2019, section 2.3.1: t/degC = T/K - 273.15 (from memory)
    expect(num('0', 'degC', 'K')).toBe(273.15);
    expect(num('25', 'degC', 'K')).toBe(298.15);
    expect(num('20.1', 'degC', 'K')).toBe(293.25);
    expect(num('-273.15', 'degC', 'K')).toBe(0);
    expect(num('300', 'K', 'degC')).toBe(26.85);
    // a temperature difference of 1 K is one of 1 degC: only the zero moves
    const c = unitConversion('degC', 'K');
    expect([c.scale, c.offset]).toEqual([1, 273.15]);
  });
});

describe('convert: units outside the SI', () => {
  it('the pound, the inch, the foot and the acre', () => {
    // source: NIST Special Publication 811 (2008), Appendix B.8: pound (avoirdupois) = 0.453 592 37 kg exactly (from memory)
    expect(num('1', 'lb', 'kg')).toBe(0.45359237);
    expect(num('12.5', 'lb', 'kg')).toBe(5.669904625);
    // source: NIST Special Publication 811 (2008), Appendix B.8: inch = 2.54 cm, foot = 0.3048 m exactly (from memory)
    expect(num('1', 'in', 'cm')).toBe(2.54);
    expect(num('1', 'ft', 'm')).toBe(0.3048);
    // acre = 43,560 square feet (source: NIST Special Publication 811 (2008), Appendix B.8, from memory), on the
    // international foot: 43560 * 0.3048^2 = 4046.8564224 m^2 exactly (SP 811 of 2008 lists the acre on the
    // U.S. survey foot, 4046.873 m^2; that foot was retired for new work at the end of 2022)
    expect(num('1', 'acre', 'm^2')).toBe(4046.8564224);
    expect(num('1', 'acres', 'm^2')).toBe(4046.8564224);
  });

  it('the short ton, which is not the tonne', () => {
    // source: NIST Special Publication 811 (2008), Appendix B.8: ton, short (2000 lb) = 9.071 847 E+02 kg (from memory)
    expect(num('1', 'ton', 'kg')).toBe(907.18474);
    expect(num('1', 'ton', 'lb')).toBe(2000);
  });

  it('pressure in psi, force in kip', () => {
    // source: NIST Special Publication 811 (2008), Appendix B.8: pound-force per square inch = 6.894 757 E+03 Pa (from memory)
    const psi = num('1', 'psi', 'Pa');
    expect(Math.abs(psi - 6894.757)).toBeLessThan(0.0005);
    // and to the last digit: lbf = 0.45359237 kg x 9.80665 m/s^2 exactly, over (0.0254 m)^2, computed in 40-digit
    // decimal: 6894.757293168361336722673445... (source: Python 3 decimal module, the definitions above)
    relClose(psi, 6894.757293168361, 2.3e-16);
    // source: NIST Special Publication 811 (2008), Appendix B.8: kip (1000 lbf) = 4.448 222 E+03 N (from memory)
    expect(Math.abs(num('1', 'kip', 'N') - 4448.222)).toBeLessThan(0.0005);
    expect(num('1', 'kip', 'N')).toBe(4448.2216152605);
    expect(num('1', 'kips', 'N')).toBe(4448.2216152605);
    expect(num('1', 'MPa', 'psi')).toBe(1e6 / 6894.757293168361);
  });

  it('lb/acre to kg/ha', () => {
    // 0.45359237 / 4046.8564224 x 10^4 = 1.120851156194456047722... (source: Python 3 decimal module, from the
    // definitions of the pound and the acre above)
    relClose(num('1', 'lb/acre', 'kg/ha'), 1.120851156194456, 2.3e-16);
  });

  it('degrees Fahrenheit', () => {
    // source: NIST Special Publication 811 (2008), section 4.2.1.1 and Appendix B.9: t/degF = 1.8 t/degC + 32 (from memory)
    expect(num('100', 'degC', 'degF')).toBe(212);
    expect(num('-40', 'degC', 'degF')).toBe(-40);
    expect(num('37', 'degC', 'degF')).toBe(98.6);
    // the other way the factor is 5/9, which no decimal holds: converted as (x * 5 - 160) / 9
    // on the decimal digits, rounded once, the same definition read backwards
    expect(num('212', 'degF', 'degC')).toBe(100);
    expect(num('32', 'degF', 'K')).toBe(273.15);
  });

  it('from degrees Fahrenheit: each value the correctly rounded double of the exact ninths', () => {
    // definition: t/degC = (t/degF - 32) / 1.8 and T/K = (t/degF + 459.67) / 1.8 (NIST SP 811
    // Appendix B.9, from memory). Expected values: Python 3's fractions module, the exact
    // rational of each definition turned into the nearest double by float() (correctly
    // rounded). Binary arithmetic missed several by a unit in the last place: 95.9 degF
    // came out 35.50000000000001 degC and 212 degF 373.15000000000003 K.
    const xs = ['50', '68', '77', '86', '104', '212', '-40', '0', '451', '59', '41', '95.9', '37.4', '98.6', '-459.67', '0.1', '1e3', '123.456', '-17.5', '350', '1.005'];
    const celsius = [10.0, 20.0, 25.0, 30.0, 40.0, 100.0, -40.0, -17.77777777777778, 232.77777777777777, 15.0, 5.0, 35.5, 3.0, 37.0, -273.15, -17.72222222222222, 537.7777777777778, 50.80888888888889, -27.5, 176.66666666666666, -17.219444444444445];
    const kelvin = [283.15, 293.15, 298.15, 303.15, 313.15, 373.15, 233.15, 255.37222222222223, 505.9277777777778, 288.15, 278.15, 308.65, 276.15, 310.15, 0.0, 255.42777777777778, 810.9277777777778, 323.9588888888889, 245.65, 449.81666666666666, 255.93055555555554];
    xs.forEach((x, i) => {
      expect(num(x, 'degF', 'degC'), `${x} degF in degC`).toBe(celsius[i]);
      expect(num(x, 'degF', 'K'), `${x} degF in K`).toBe(kelvin[i]);
    });
    // a column converts element by element the same way
    const col = evalFormula(`convert([${xs.join(', ')}], "degF", "K")`) as NumberColumn;
    expect(Array.from(col.values)).toEqual(kelvin);
  });

  it('any factor that is a short decimal in ninths converts the same way: inches to feet, degrees to gradians', () => {
    // in to ft is 1/12 (9 x scale = 0.75), deg to grad 10/9: expected values from Python 3's
    // fractions module, float(Fraction(x) / 12) and float(Fraction(x) * 10 / 9), correctly rounded
    const xs = ['1', '7', '30', '100', '2.5', '0.1', '-45', '359.9'];
    const feet = [0.08333333333333333, 0.5833333333333334, 2.5, 8.333333333333334, 0.20833333333333334, 0.008333333333333333, -3.75, 29.991666666666667];
    const grad = [1.1111111111111112, 7.777777777777778, 33.333333333333336, 111.11111111111111, 2.7777777777777777, 0.1111111111111111, -50, 399.8888888888889];
    xs.forEach((x, i) => {
      expect(num(x, 'in', 'ft'), `${x} in`).toBe(feet[i]);
      expect(num(x, 'deg', 'grad'), `${x} deg`).toBe(grad[i]);
    });
  });
});

describe('convert: exact on the decimal digits where the factor is a short decimal', () => {
  it('1.005 t is 1005 kg, not the binary product', () => {
    // common practice, no source: the binary products below miss the decimal by a unit in the last place
    expect(1.005 * 1000).toBe(1004.9999999999999);
    expect(num('1.005', 't', 'kg')).toBe(1005);
    expect(4.35 * 100).toBe(434.99999999999994);
    expect(num('4.35', 't/ha', 'g/m^2')).toBe(435);
    expect(0.57 * 1e4).toBe(5699.999999999999);
    expect(num('0.57', 'ha', 'm^2')).toBe(5700);
    expect(num('0.29', 'MPa', 'bar')).toBe(2.9);
  });

  it('a table column keeps its typed texts, converted, so the exact decimal shift still applies', () => {
    const v = evalFormula('convert(plots["yield (t/ha)"], to: "kg/ha")', '--- table plots', 'block,yield (t/ha)', '1,4.35', '2,', '3,0.070', '4,-1.10') as NumberColumn;
    expect(v.kind).toBe('column');
    expect([...v.values].map((x, i) => (v.missing?.[i] === 1 ? null : x))).toEqual([4350, null, 70, -1100]);
    expect(v.decimals).toEqual(['4350', '', '70', '-1100']);
    expect(v.name).toBe('yield (kg/ha)');
    // to a smaller unit's fraction, the texts carry the places that the shift needs
    const w = evalFormula('convert(plots.y, "kg/ha", "t/ha")', '--- table plots', 'y', '4350.5', '12') as NumberColumn;
    expect(w.decimals).toEqual(['4.3505', '0.012']);
    expect([...w.values]).toEqual([4.3505, 0.012]);
  });

  it('a computed column carries no texts, and a binary factor drops them', () => {
    const v = evalFormula('convert(plots.y * 2, "t", "kg")', '--- table plots', 'y', '1.1') as NumberColumn;
    expect([...v.values]).toEqual([2200]);
    expect(v.decimals).toBeNull();
    const w = evalFormula('convert(plots.y, "psi", "kPa")', '--- table plots', 'y', '100') as NumberColumn;
    expect(w.decimals).toBeNull();
    relClose(w.values[0]!, 689.4757293168361, 2.3e-16);
  });

  it('zeros keep their sign, and infinities and NaN pass through', () => {
    expect(Object.is(num('-0', 't', 'kg'), -0)).toBe(true);
    expect(evalFormula('convert(1 / 0, "t", "kg")')).toBe(Infinity);
    expect(Number.isNaN(evalFormula('convert(0 / 0, "t", "kg")') as number)).toBe(true);
  });

  it('a blocked fit on a converted column is the fit on the typed column, scaled', () => {
    // invented numbers: six plots of two rations in three pens
    const table = ['--- table pens', 'pen,ration,gain (kg)', '1,a,12.41', '1,b,13.02', '2,a,11.87', '2,b,12.55', '3,a,12.93', '3,b,13.60'];
    const { engine } = run(
      doc(...table, '--- formula', 'kg = blocked(pens["gain (kg)"], pens.ration, pens.pen)', '--- formula', 'g = blocked(convert(pens["gain (kg)"], to: "g"), pens.ration, pens.pen)'),
    );
    const ss = (name: string, row: number): number => {
      const fit = valueOf(engine, name);
      if (typeof fit !== 'object' || fit.kind !== 'record') throw new Error(`${name} is not a fit`);
      const t = fit.fields.get('table') as Value;
      if (typeof t !== 'object' || t.kind !== 'table') throw new Error('no table');
      return (t.columns[t.names.indexOf('ss')] as NumberColumn).values[row]!;
    };
    for (const row of [0, 1, 2]) relClose(ss('g', row), ss('kg', row) * 1e6, 1e-14);
  });
});

describe('convert: header units', () => {
  it('reads a unit in parentheses at the end of a header', () => {
    expect(headerUnit('yield (t/ha)')).toEqual({ base: 'yield', unit: 't/ha' });
    expect(headerUnit('shear (MPa)')).toEqual({ base: 'shear', unit: 'MPa' });
    expect(headerUnit('plot (north)')).toBeNull();
    expect(headerUnit('yield')).toBeNull();
    expect(headerUnit(null)).toBeNull();
  });

  it('names the result with the new unit, or adds it to a header without one', () => {
    const v = evalFormula('convert(p.shear, "MPa", "kPa")', '--- table p', 'shear', '1.5') as NumberColumn;
    expect(v.name).toBe('shear (kPa)');
    expect([...v.values]).toEqual([1500]);
  });

  it('agrees with a unit given that means the same, and refuses one that does not', () => {
    const t = ['--- table p', 'yield (t/ha)', '2.5'];
    expect((evalFormula('convert(p["yield (t/ha)"], "Mg/ha", "kg/ha")', ...t) as NumberColumn).values[0]).toBe(2500);
    expect(errorOf('convert(p["yield (t/ha)"], "kg/ha", "g/m^2")', ...t)).toBe(msg.headerUnitDiffers('yield (t/ha)', 't/ha', 'kg/ha'));
    expect(errorOf('convert(p["yield (t/ha)"], "MPa", "Pa")', ...t)).toBe(msg.headerUnitDiffers('yield (t/ha)', 't/ha', 'MPa'));
  });
});

describe('convert: errors in plain words', () => {
  it('units of different quantities', () => {
    expect(errorOf('convert(2.5, "t/ha", "kg")')).toBe(msg.incompatibleUnits('t/ha', 'kg'));
    expect(errorOf('convert(2.5, "MPa", "N")')).toBe(msg.incompatibleUnits('MPa', 'N'));
  });

  it('unknown units, names of object members among them, and a unit with a number', () => {
    for (const bad of ['furlong per fortnight', '', '__proto__', 'constructor', 'toString', 'hasOwnProperty', '%']) {
      expect(errorOf(`convert(1, "${bad}", "kg")`), bad).toBe(msg.unknownUnit(bad));
      expect(errorOf(`convert(1, "kg", "${bad}")`), bad).toBe(msg.unknownUnit(bad));
    }
    expect(errorOf('convert(1, "5 kg", "g")')).toBe(msg.unitWithNumber('5 kg'));
  });

  it('no unit to convert to, no unit to convert from', () => {
    expect(errorOf('convert(1, "kg")')).toBe(msg.noTargetUnit());
    expect(errorOf('convert(p.y, to: "kg")', '--- table p', 'y', '1')).toBe(msg.noSourceUnit('y'));
    expect(errorOf('convert(p["plot (north)"], to: "kg")', '--- table p', 'plot (north)', '1')).toBe(msg.noSourceUnit('plot (north)'));
    expect(errorOf('convert(2, to: "kg")')).toBe(msg.noSourceUnit(null));
  });
});

describe('convert: mathjs stays out of the start', () => {
  it('no module of the engine imports mathjs but the unit library', () => {
    const found: string[] = [];
    const walk = (dir: string): void => {
      for (const e of readdirSync(dir, { withFileTypes: true })) {
        const p = join(dir, e.name);
        if (e.isDirectory()) walk(p);
        else if (p.endsWith('.ts') && /^\s*(import|export)\s+(?!type\b)[^;]*from\s+'mathjs'/m.test(readFileSync(p, 'utf8'))) found.push(p);
      }
    };
    for (const dir of ['src', 'cells']) walk(dir);
    expect(found.sort()).toEqual(['src/functions/unit-library.ts']);
  });

  it('the command line bundle leaves the unit tables to a file of their own', () => {
    // the tests' global setup builds the command line (test/setup/build-cli.ts)
    const tables = 'build/cli/chunks/unit-library.cjs';
    expect(existsSync(tables)).toBe(true);
    const built = ['build/cli/main.cjs', ...readdirSync('build/cli/chunks').filter((f) => f.endsWith('.cjs') && f !== 'unit-library.cjs').map((f) => join('build/cli/chunks', f))];
    for (const f of built) {
      const text = readFileSync(f, 'utf8');
      // a word of mathjs's unit table and a function name of its unit class
      expect(text.includes('hectare'), f).toBe(false);
      expect(text.includes('createUnitClass'), f).toBe(false);
    }
    expect(readFileSync(tables, 'utf8').includes('hectare')).toBe(true);
  });
});
