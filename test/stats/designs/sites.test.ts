/**
 * Series of trials across sites: cross-checks inside the project and bad input. statsmodels'
 * figures are in test/reference/across-sites.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { difference } from '../../../src/stats/compare/index.ts';
import { acrossSites, blocked } from '../../../src/stats/designs/index.ts';
import { designMsg } from '../../../src/messages/designs.ts';
import { expectRelative, factorOf, normals, seeded, subset } from './support.ts';

function series(sites: number, blocks: number, treatments: number, seed: number) {
  const z = normals(seeded(seed));
  const y: number[] = [];
  const t: string[] = [];
  const b: string[] = [];
  const s: string[] = [];
  for (let u = 0; u < sites; u++) {
    for (let k = 0; k < blocks; k++) {
      for (let i = 0; i < treatments; i++) {
        y.push(20 + 3 * u + k + i + z());
        t.push(`t${i + 1}`);
        b.push(`${k + 1}`);
        s.push(`site${u + 1}`);
      }
    }
  }
  return { y: Float64Array.from(y), trt: factorOf('trt', t), block: factorOf('block', b), site: factorOf('site', s) };
}

describe('across_sites cross-checks', () => {
  it('a single site is the blocked analysis', () => {
    const d = series(1, 4, 3, 2);
    const fit = acrossSites(d.y, d.trt, d.block, d.site);
    const bl = blocked(d.y, d.trt, d.block);
    expect(fit.table.source).toEqual(bl.table.source);
    fit.table.ss.forEach((v, i) => expectRelative(v, bl.table.ss[i]!, 1e-12, `ss ${i}`));
    expectRelative(fit.table.f[0]!, bl.table.f[0]!, 1e-12, 'F');
    expect(fit.notes.join(' ')).toMatch(/only one site/);
  });
  it('pooled error is the sum of the sites’ errors, and the table adds up', () => {
    const d = series(3, 3, 4, 5);
    const fit = acrossSites(d.y, d.trt, d.block, d.site);
    let sse = 0;
    for (let u = 0; u < 3; u++) {
      const part = subset(d.y, [d.trt, d.block], (i) => d.site.codes[i] === u);
      sse += blocked(part.y, part.factors[0]!, part.factors[1]!).table.ss[2]!;
    }
    expectRelative(fit.table.ss[4]!, sse, 1e-12, 'pooled error');
    const parts = fit.table.ss.slice(0, 5).reduce((a, b) => a + b, 0);
    expectRelative(parts, fit.table.ss[5]!, 1e-12, 'total');
  });
});

describe('across_sites block labels', () => {
  it('gives the same analysis whether block labels repeat from site to site or not', () => {
    const d = series(3, 3, 4, 9);
    const unique = factorOf('block', Array.from(d.block.codes, (c, i) => `${d.site.levels[d.site.codes[i]!]}-${d.block.levels[c]}`));
    const a = acrossSites(d.y, d.trt, d.block, d.site);
    const b = acrossSites(d.y, d.trt, unique, d.site);
    a.table.ss.forEach((v, i) => expectRelative(b.table.ss[i]!, v, 1e-13, `ss ${i}`));
    expect(b.table.df).toEqual(a.table.df);
  });
});

describe('across_sites bad input', () => {
  it('treatment differences identical at every site: no F against the interaction, no comparison, said in words', () => {
    const d = series(3, 2, 3, 6);
    // every site: its own level and block effects plus the same treatment effects, plus noise
    // that sums to zero over treatments in each block (so the site-by-treatment means are additive)
    const noise = [0.3, -0.1, -0.2, -0.4, 0.5, -0.1];
    const y = Float64Array.from(d.y, (_, i) => 20 + 4 * d.site.codes[i]! + d.block.codes[i]! + 2 * d.trt.codes[i]! + noise[(d.block.codes[i]! * 3 + d.trt.codes[i]! + d.site.codes[i]! * 3) % 6]!);
    const fit = acrossSites(y, d.trt, d.block, d.site);
    expect(fit.table.ss[3]! / fit.table.ss[5]!).toBeLessThan(1e-12);
    expect(Number.isNaN(fit.table.f[2]!)).toBe(true);
    expect(Number.isFinite(fit.sites!.f_against_error)).toBe(true);
    expect(fit.notes).toContain(designMsg.sitesInteractionExact('trt', 'site'));
    expect(() => difference(fit, 't1', 't2')).toThrow(designMsg.ownErrorZero(designMsg.sitesMeansNote('trt', 'site')));
  });
  it('a site whose data fit exactly has no F of its own, and Bartlett is not made, in plain words', () => {
    const d = series(2, 2, 3, 4);
    // site 1 made exactly additive: block effect plus treatment effect, no error
    const y = Float64Array.from(d.y, (v, i) => (d.site.codes[i] === 0 ? 10 + d.block.codes[i]! + 2 * d.trt.codes[i]! : v));
    const fit = acrossSites(y, d.trt, d.block, d.site);
    const st = fit.sites!;
    expect(Number.isNaN(st.bartlett.statistic) && Number.isNaN(st.bartlett.p)).toBe(true);
    expect(Number.isNaN(st.perSite.f[0]!) && Number.isNaN(st.perSite.p[0]!)).toBe(true);
    expect(Number.isFinite(st.perSite.f[1]!)).toBe(true);
    expect(fit.notes).toContain(designMsg.sitesExact('site', ['site1']));
    expect(fit.notes.some((n) => /chi-square/.test(n))).toBe(false);
  });
  it('refuses a site with one block', () => {
    const d = series(2, 2, 3, 1);
    const keep = subset(d.y, [d.trt, d.block, d.site], (i) => !(d.site.codes[i] === 1 && d.block.codes[i] === 1));
    const [t, b, s] = keep.factors as [typeof d.trt, typeof d.trt, typeof d.trt];
    expect(() => acrossSites(keep.y, t, b, s)).toThrow(/site "site2" has only one block/);
  });
  it('refuses a treatment absent at one site', () => {
    const d = series(2, 3, 3, 1);
    const keep = subset(d.y, [d.trt, d.block, d.site], (i) => !(d.site.codes[i] === 0 && d.trt.codes[i] === 2));
    const [t, b, s] = keep.factors as [typeof d.trt, typeof d.trt, typeof d.trt];
    expect(() => acrossSites(keep.y, t, b, s)).toThrow(/treatment "t3" is absent at site "site1"/);
  });
  it('refuses a block with a plot missing, and sites with different numbers of blocks', () => {
    const d = series(2, 3, 3, 1);
    const one = subset(d.y, [d.trt, d.block, d.site], (i) => i !== 4);
    const [t, b, s] = one.factors as [typeof d.trt, typeof d.trt, typeof d.trt];
    expect(() => acrossSites(one.y, t, b, s)).toThrow(/block "2" has no plot for treatment "t2"/);
    const fewer = subset(d.y, [d.trt, d.block, d.site], (i) => !(d.site.codes[i] === 1 && d.block.codes[i] === 2));
    const [t2, b2, s2] = fewer.factors as [typeof d.trt, typeof d.trt, typeof d.trt];
    expect(() => acrossSites(fewer.y, t2, b2, s2)).toThrow(/site "site1" has 3 blocks and site "site2" has 2/);
  });
});
