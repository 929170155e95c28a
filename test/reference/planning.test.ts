/**
 * Power and size (src/stats/planning/power.ts) against scipy 1.10.1 (docs/references.md section 7)
 * and against a seeded Monte Carlo of simulated trials run in the test itself.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import betaincinv from '@stdlib/math-base-special-betaincinv';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { fCritical, tCritical } from '../../src/stats/distributions/index.ts';
import { blockedPower, blocksForPower, replicatesForPower, twoGroupPower } from '../../src/stats/planning/index.ts';

// source: scipy 1.10.1 (stats.nct, stats.ncf), figures made by fixtures/planning_power.py
const scipy = JSON.parse(readFileSync(new URL('./fixtures/planning_power.json', import.meta.url), 'utf8')) as {
  scipy: string;
  two_groups: [number, number, number, number, number][];
  blocked: [number, number, number, number, number, number][];
};

function expectRel(actual: number, expected: number, tol: number, what: string): void {
  const rel = Math.abs(actual - expected) / Math.abs(expected);
  expect(rel, `${what}: ${actual} against ${expected}`).toBeLessThanOrEqual(tol);
}

describe('power against scipy 1.10.1 (docs/references.md section 7)', () => {
  it('the fixture was made by the stated scipy', () => {
    expect(scipy.scipy).toBe('1.10.1');
  });

  it('two groups: the printed figures of docs/references.md section 7', () => {
    // source: docs/references.md section 7 (scipy 1.10.1): n = 16 gives 0.7813978, n = 17 gives 0.8070367
    expect(twoGroupPower(1, 1, 16, 0.95).power.toFixed(7)).toBe('0.7813978');
    expect(twoGroupPower(1, 1, 17, 0.95).power.toFixed(7)).toBe('0.8070367');
    // source: the figure, scipy 1.10.1: 0.807037
    expect(twoGroupPower(1, 1, 17, 0.95).power.toFixed(6)).toBe('0.807037');
  });

  it('blocks: the printed figures of docs/references.md section 7', () => {
    // source: docs/references.md section 7 (scipy 1.10.1): 4 treatments, delta = sd = 1
    expect(blockedPower(1, 1, 4, 10, 0.95).power.toFixed(7)).toBe('0.3863486');
    expect(blockedPower(1, 1, 4, 23, 0.95).power.toFixed(7)).toBe('0.7973731');
    expect(blockedPower(1, 1, 4, 24, 0.95).power.toFixed(7)).toBe('0.8168415');
  });

  it.each(scipy.two_groups)('two groups: delta %f, sd %f, n %i, level %f', (delta, sd, n, level, expected) => {
    // source: scipy 1.10.1 (fixtures/planning_power.py)
    expectRel(twoGroupPower(delta, sd, n, level).power, expected, 1e-9, 'power');
  });

  it.each(scipy.blocked)('blocks: delta %f, sd %f, %i treatments, %i blocks, level %f', (delta, sd, k, b, level, expected) => {
    // source: scipy 1.10.1 (fixtures/planning_power.py)
    expectRel(blockedPower(delta, sd, k, b, level).power, expected, 1e-9, 'power');
  });

  it('replicates_for_power gives 17 per group for delta = sd, power 0.8: the smallest n that reaches it', () => {
    // common practice, no source: "about 17 per group"; exact figure from
    // docs/references.md section 7 (scipy 1.10.1): 16 gives 0.7813978 < 0.8 and 17 gives 0.8070367
    const r = replicatesForPower(1, 1, 0.8, 0.95);
    expect(r.n).toBe(17);
    expect(r.power.toFixed(7)).toBe('0.8070367');
  });

  it('blocks_for_power gives 24 blocks for 4 treatments, delta = sd, power 0.8', () => {
    // source: docs/references.md section 7 (scipy 1.10.1): 23 blocks 0.7973731, 24 blocks 0.8168415
    const r = blocksForPower(1, 1, 4, 0.8, 0.95);
    expect(r.blocks).toBe(24);
    expect(r.power.toFixed(7)).toBe('0.8168415');
  });

  it('the size search returns the smallest size over a grid of targets (checked by stepping one by one)', () => {
    // common practice, no source: the answer n has power(n) >= target > power(n - 1)
    for (const target of [0.5, 0.8, 0.9, 0.95, 0.99]) {
      for (const effect of [0.3, 0.8, 1.7]) {
        const r = replicatesForPower(effect, 1, target, 0.95);
        expect(r.power).toBeGreaterThanOrEqual(target);
        if (r.n > 2) expect(twoGroupPower(effect, 1, r.n - 1, 0.95).power).toBeLessThan(target);
        const b = blocksForPower(effect, 1, 5, target, 0.95);
        expect(b.power).toBeGreaterThanOrEqual(target);
        if (b.blocks > 2) expect(blockedPower(effect, 1, 5, b.blocks - 1, 0.95).power).toBeLessThan(target);
      }
    }
  });
});

/** Standard normal draws by the Box-Muller transform (Box and Muller 1958). */
function normalSource(seed: number): () => number {
  const rng = xoroshiro128plus(seed);
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const v = spare;
      spare = null;
      return v;
    }
    const u1 = 1 - uniformFloat64(rng);
    const u2 = uniformFloat64(rng);
    const r = Math.sqrt(-2 * Math.log(u1));
    spare = r * Math.sin(2 * Math.PI * u2);
    return r * Math.cos(2 * Math.PI * u2);
  };
}

/** Clopper-Pearson interval for a binomial proportion. */
function clopperPearson(x: number, n: number, level: number): [number, number] {
  const a = (1 - level) / 2;
  return [x === 0 ? 0 : betaincinv(a, x, n - x + 1), x === n ? 1 : betaincinv(1 - a, x + 1, n - x)];
}

describe('power against a seeded Monte Carlo (20,000 simulated trials per design, 99.9% Clopper-Pearson interval)', () => {
  const TRIALS = 20_000;

  it('two groups of 10, delta 1.2, sd 1.5, level 0.95', () => {
    // common practice, no source: simulate the trial and count how often the t test rejects
    const [delta, sd, n, level] = [1.2, 1.5, 10, 0.95];
    const z = normalSource(8101);
    const tc = tCritical(level, 2 * n - 2);
    let rejected = 0;
    for (let trial = 0; trial < TRIALS; trial++) {
      let s1 = 0;
      let q1 = 0;
      let s2 = 0;
      let q2 = 0;
      const a: number[] = [];
      const b: number[] = [];
      for (let i = 0; i < n; i++) a.push(delta + sd * z());
      for (let i = 0; i < n; i++) b.push(sd * z());
      for (const x of a) s1 += x;
      for (const x of b) s2 += x;
      const m1 = s1 / n;
      const m2 = s2 / n;
      for (const x of a) q1 += (x - m1) ** 2;
      for (const x of b) q2 += (x - m2) ** 2;
      const pooled = (q1 + q2) / (2 * n - 2);
      const t = (m1 - m2) / Math.sqrt(pooled * (2 / n));
      if (Math.abs(t) > tc) rejected++;
    }
    const computed = twoGroupPower(delta, sd, n, level).power;
    const [lo, hi] = clopperPearson(rejected, TRIALS, 0.999);
    console.log(`two groups: computed ${computed.toFixed(5)}, simulated ${(rejected / TRIALS).toFixed(5)} [${lo.toFixed(5)}, ${hi.toFixed(5)}]`);
    expect(computed).toBeGreaterThanOrEqual(lo);
    expect(computed).toBeLessThanOrEqual(hi);
  });

  it.each([
    // treatments, blocks, delta, sd, level, seed
    [3, 6, 1.5, 1, 0.95, 8203],
    [6, 5, 1.8, 1.2, 0.95, 8206],
  ] as const)('%i treatments in %i blocks, delta %f, sd %f: the F test of blocked analysis', (k, b, delta, sd, level, seed) => {
    // common practice, no source: simulate a blocked trial (block effects of their own, two
    // treatments delta apart and the rest midway) and count how often the F test rejects
    const z = normalSource(seed);
    const fc = fCritical(level, k - 1, (k - 1) * (b - 1));
    const effect = Array.from({ length: k }, (_, i) => (i === 0 ? delta / 2 : i === 1 ? -delta / 2 : 0));
    const y = new Float64Array(k * b);
    let rejected = 0;
    for (let trial = 0; trial < TRIALS; trial++) {
      for (let j = 0; j < b; j++) {
        const blockEffect = 3 * z();
        for (let i = 0; i < k; i++) y[j * k + i] = 10 + blockEffect + effect[i]! + sd * z();
      }
      let grand = 0;
      for (const v of y) grand += v;
      grand /= k * b;
      let ssT = 0;
      let ssB = 0;
      let ssTot = 0;
      for (let i = 0; i < k; i++) {
        let m = 0;
        for (let j = 0; j < b; j++) m += y[j * k + i]!;
        ssT += b * (m / b - grand) ** 2;
      }
      for (let j = 0; j < b; j++) {
        let m = 0;
        for (let i = 0; i < k; i++) m += y[j * k + i]!;
        ssB += k * (m / k - grand) ** 2;
      }
      for (const v of y) ssTot += (v - grand) ** 2;
      const ssE = ssTot - ssT - ssB;
      const f = ssT / (k - 1) / (ssE / ((k - 1) * (b - 1)));
      if (f > fc) rejected++;
    }
    const computed = blockedPower(delta, sd, k, b, level).power;
    const [lo, hi] = clopperPearson(rejected, TRIALS, 0.999);
    console.log(`${k} treatments, ${b} blocks: computed ${computed.toFixed(5)}, simulated ${(rejected / TRIALS).toFixed(5)} [${lo.toFixed(5)}, ${hi.toFixed(5)}]`);
    expect(computed).toBeGreaterThanOrEqual(lo);
    expect(computed).toBeLessThanOrEqual(hi);
  });
});
