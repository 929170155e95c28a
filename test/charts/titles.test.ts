import { describe, expect, it } from 'vitest';
import { axisTitle, derivedTitle, readName } from '../../src/charts/titles.ts';

// The rule of src/charts/titles.ts (our own convention, documented there): units from
// brackets, or from a final `_unit` suffix of a short fixed list; nothing guessed.
describe('axis titles from column names', () => {
  it('keeps a unit given in brackets', () => {
    expect(readName('yield (kg)')).toEqual({ label: 'yield', unit: 'kg' });
    expect(readName('dose [mg]')).toEqual({ label: 'dose', unit: 'mg' });
    expect(axisTitle('yield (kg)')).toBe('yield (kg)');
    expect(derivedTitle('fitted', 'yield (kg)')).toBe('fitted yield (kg)');
  });
  it('reads a final unit suffix from the list, in its proper symbol', () => {
    expect(axisTitle('yield_kg')).toBe('yield (kg)');
    expect(axisTitle('shear_mpa')).toBe('shear (MPa)');
    expect(axisTitle('plant_height_cm')).toBe('plant height (cm)');
    expect(axisTitle('grain_yield_kg_ha')).toBe('grain yield (kg/ha)');
    expect(axisTitle('moisture_pct')).toBe('moisture (%)');
    expect(axisTitle('cure_temp_degc')).toBe('cure temp (°C)');
  });
  it('guesses nothing else', () => {
    expect(readName('yield')).toEqual({ label: 'yield', unit: null });
    expect(readName('grain_yield')).toEqual({ label: 'grain yield', unit: null });
    // `t`, `n` and `c` name other things as often as units: not read as tonnes, newtons, degrees
    expect(readName('block_t')).toEqual({ label: 'block t', unit: null });
    expect(readName('count_n')).toEqual({ label: 'count n', unit: null });
    // a bare unit word is a name, not a unit
    expect(readName('kg')).toEqual({ label: 'kg', unit: null });
    expect(readName('_kg')).toEqual({ label: 'kg', unit: null });
    // brackets with nothing before them are part of the name
    expect(readName('(kg)').unit).toBeNull();
  });
});

describe('reading a name costs time in proportion to its length', () => {
  // every scanner over user text must be linear (a pattern with nested repetition took 14 s
  // on a header of "(" and 3,000 spaces); 1 MB adversarial inputs, generous time bound
  const cases: [string, string][] = [
    ['an opening bracket then spaces', `(${' '.repeat(1_000_000)}`],
    ['spaces between brackets', `a (${' '.repeat(1_000_000)}x`],
    ['many opening brackets', `${'('.repeat(1_000_000)}kg)`],
    ['many bracket pairs', `${'(a)'.repeat(333_333)}`],
  ];
  for (const [what, name] of cases) {
    it(what, () => {
      const t0 = performance.now();
      readName(name);
      axisTitle(name);
      expect(performance.now() - t0).toBeLessThan(1000);
    });
  }
  it('still reads what the pattern read', () => {
    expect(readName('  dose  [ mg ]  ')).toEqual({ label: 'dose', unit: 'mg' });
    expect(readName('a (b) (kg)')).toEqual({ label: 'a (b)', unit: 'kg' });
    expect(readName('a (b (kg)').unit).toBe('kg');
    expect(readName('a (kg))').unit).toBeNull();
    expect(readName('a ( )').unit).toBeNull();
  });
});
