/**
 * Bad input to split plots, covariates and site series, typed into a document as a user
 * would: each gives a plain error in the catalogue's words, never a number.
 */
import { describe, expect, it } from 'vitest';
import type { Value } from '../../src/lang/values.ts';
import { designMsg } from '../../src/messages/designs.ts';
import { fnMsg } from '../../src/messages/functions.ts';
import { evalFormula } from '../helpers.ts';

function errorText(v: Value): string {
  if (typeof v !== 'object' || v.kind !== 'error') throw new Error(`expected an error, got ${JSON.stringify(v)}`);
  return v.message;
}

// invented data: two blocks, two whole-plot levels (dry, wet), three subplot levels
const split = ['--- table f', 'block,water,variety,yield'];
for (const k of [1, 2]) for (const w of ['dry', 'wet']) for (const [j, v] of ['a', 'b', 'c'].entries()) split.push(`${k},${w},${v},${10 + k + (w === 'wet' ? 2 : 0) + j + ((k + j) % 3) / 10}`);

// invented data: two sites, two blocks each, three treatments
const sites = ['--- table s', 'site,block,variety,yield'];
for (const site of ['east', 'west']) for (const k of [1, 2]) for (const [i, v] of ['a', 'b', 'c'].entries()) sites.push(`${site},${k},${v},${20 + k + i + (site === 'east' ? 0 : 3) + ((k * 3 + i) % 4) / 10}`);

describe('split_plot bad input in a document', () => {
  it('a subplot level twice in a whole plot: not a split plot', () => {
    const rows = split.map((l) => (l.startsWith('1,dry,b,') ? l.replace(',b,', ',a,') : l));
    const e = errorText(evalFormula('split_plot(f.yield, f.water, f.variety, f.block)', ...rows, ''));
    expect(e).toContain(designMsg.splitTwice('block', 'water', 'variety', '1', 'dry', 'a', 2));
  });
  it('a whole plot with a subplot level missing (an empty measurement too)', () => {
    const gone = split.filter((l) => !l.startsWith('2,wet,c,'));
    expect(errorText(evalFormula('split_plot(f.yield, f.water, f.variety, f.block)', ...gone, ''))).toContain(
      designMsg.splitMissing('block', 'water', 'variety', '2', 'wet', 'c'),
    );
    const empty = split.map((l) => (l.startsWith('2,wet,c,') ? '2,wet,c,' : l));
    expect(errorText(evalFormula('split_plot(f.yield, f.water, f.variety, f.block)', ...empty, ''))).toContain(
      designMsg.splitMissing('block', 'water', 'variety', '2', 'wet', 'c'),
    );
  });
});

describe('covariate bad input in a document', () => {
  const table = ['--- table p', 'trt,block,x,y', 'a,1,5,10', 'b,1,6,11', 'a,2,4,12', 'b,2,7,14', 'a,3,5,11', 'b,3,6,13', ''];
  it('a missing covariate value, in blocked as in one_way', () => {
    const t = table.map((l) => (l === 'b,2,7,14' ? 'b,2,,14' : l));
    expect(errorText(evalFormula('blocked(p.y, p.trt, p.block, covariate: p.x)', ...t))).toContain(fnMsg.covariateMissing('x', 1));
  });
  it('a covariate with no variation', () => {
    const t = table.map((l) => l.replace(/^(\w),(\d),\d,/, '$1,$2,5,'));
    expect(errorText(evalFormula('one_way(p.y, p.trt, covariate: p.x)', ...t))).toContain(designMsg.covariateConstant('x'));
  });
});

describe('across_sites bad input in a document', () => {
  it('a site with one block', () => {
    const rows = sites.filter((l) => !l.startsWith('west,2,'));
    expect(errorText(evalFormula('across_sites(s.yield, s.variety, s.block, s.site)', ...rows, ''))).toContain(designMsg.sitesOneBlock('site', 'west', 'block'));
  });
  it('a treatment absent at one site', () => {
    const rows = sites.filter((l) => !(l.startsWith('east,') && l.includes(',c,')));
    expect(errorText(evalFormula('across_sites(s.yield, s.variety, s.block, s.site)', ...rows, ''))).toContain(designMsg.sitesAbsent('c', 'site', 'east'));
  });
});
