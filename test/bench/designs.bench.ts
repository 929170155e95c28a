/**
 * Benchmarks of the designed-experiment core (run with `npx vitest bench --run
 * test/bench/designs.bench.ts`). Targets from the brief:
 * - exact decimal shift of 1,000,000 texts: fast (compare with plain Number());
 * - blocked, balanced, 1,000,000 observations (50 treatments x 20,000 blocks): under 100 ms;
 * - least squares, unbalanced, 200 parameters and 100,000 observations: under 2 s.
 * Data are generated outside the timed functions (columns already in memory).
 */
import { cpus } from 'node:os';
import { bench, describe } from 'vitest';
import { shiftDecimals } from '../../src/stats/decimal/index.ts';
import { blocked, factorial, type Factor } from '../../src/stats/designs/index.ts';
import { denseDesign, fitFactorModel, householderLeastSquares } from '../../src/stats/linear/index.ts';

console.log(`machine: ${cpus()[0]?.model ?? 'unknown CPU'} (${cpus().length} cores), Node ${process.version}`);

let state = 12345;
function uniform(): number {
  state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
  return state / 4294967296;
}

function factor(name: string, codes: Int32Array, levels: number): Factor {
  return { name, codes, levels: Array.from({ length: levels }, (_, k) => `${name}${k + 1}`) };
}

// ---- decimal texts ------------------------------------------------------------------
// Built only while their own benchmark runs (tinybench's per-task setup and teardown):
// a million strings held in memory make every major garbage collection of the other
// benchmarks slower, which is measured on purpose once, below.
const N = 1_000_000;
const makeNist = (): string[] => Array.from({ length: N }, (_, i) => `1000000000000.${(i * 7) % 10}`); // 13 constant digits
const makeFine = (): string[] => Array.from({ length: N }, (_, i) => `107.868${1000 + ((i * 7919) % 9000)}`); // 7 constant digits, 7 decimals
const makePlain = (): string[] => Array.from({ length: N }, (_, i) => `${(((i * 7919) % 20001) - 10000) / 100}`); // straddles 0: no shift
let texts: string[] | null = null;
function held(): string[] {
  if (texts === null) throw new Error('texts not built');
  return texts;
}
/** Options that build the texts before the task and drop them after its measured run. */
function holding(make: () => string[]) {
  return {
    setup: () => {
      texts ??= make();
    },
    teardown: (_task: unknown, mode: 'warmup' | 'run') => {
      if (mode === 'run') texts = null;
    },
  };
}

// ---- blocked, balanced, 50 x 20,000 ----------------------------------------------------
const T = 50;
const B = 20_000;
const yBlocked = new Float64Array(T * B);
const trt = new Int32Array(T * B);
const blk = new Int32Array(T * B);
for (let j = 0, i = 0; j < B; j++) {
  for (let k = 0; k < T; k++, i++) {
    trt[i] = k;
    blk[i] = j;
    yBlocked[i] = k * 0.01 + (j % 17) * 0.1 + uniform();
  }
}
const treatment = factor('treatment', trt, T);
const block = factor('block', blk, B);
// The same with about 1% of plots missing (least squares with the blocks absorbed).
const keep: number[] = [];
for (let i = 0; i < T * B; i++) if (i % 97 !== 5) keep.push(i);
const yMissing = Float64Array.from(keep, (i) => yBlocked[i]!);
const trtMissing = factor('treatment', Int32Array.from(keep, (i) => trt[i]!), T);
const blkMissing = factor('block', Int32Array.from(keep, (i) => blk[i]!), B);

// ---- least squares: 200 parameters, 100,000 observations, unbalanced ---------------------
const M = 100_000;
const a = new Int32Array(M);
const b = new Int32Array(M);
const c3 = [new Int32Array(M), new Int32Array(M), new Int32Array(M)];
const yLs = new Float64Array(M);
for (let i = 0; i < M; i++) {
  a[i] = Math.floor(uniform() * 100);
  b[i] = Math.floor(uniform() * 101);
  c3[0]![i] = Math.floor(uniform() * 10);
  c3[1]![i] = Math.floor(uniform() * 5);
  c3[2]![i] = Math.floor(uniform() * 4);
  yLs[i] = a[i]! * 0.01 + b[i]! * 0.02 + uniform();
}
// Main effects 100 + 101 levels: 1 + 99 + 100 = 200 parameters.
const mainEffects = [factor('a', a, 100), factor('b', b, 101)];
// 10 x 5 x 4 factorial with all interactions, unequal cells: 200 parameters.
const threeWay = [factor('p', c3[0]!, 10), factor('q', c3[1]!, 5), factor('r', c3[2]!, 4)];
// Dense Householder QR for comparison, on a fifth of the rows (100,000 rows took 9.2 s and
// 160 MB for X when measured once; see src/stats/linear/fit.ts).
const QR_ROWS = 20_000;
const mainEffectsSmall = mainEffects.map((f) => ({ ...f, codes: f.codes.subarray(0, QR_ROWS) }));
const yLsSmall = yLs.subarray(0, QR_ROWS);

describe('exact decimal shift, 1,000,000 texts', () => {
  bench('13 constant leading digits (SmLs09-like)', () => {
    shiftDecimals(held());
  }, holding(makeNist));
  bench('7 constant leading digits, 7 decimals (offset with 15 decimals)', () => {
    shiftDecimals(held());
  }, holding(makeFine));
  bench('no constant digits (no shift)', () => {
    shiftDecimals(held());
  }, holding(makePlain));
  bench('for comparison: plain Number() on the SmLs09-like texts', () => {
    const t = held();
    const out = new Float64Array(N);
    for (let i = 0; i < N; i++) out[i] = Number(t[i]);
  }, holding(makeNist));
});

describe('blocked, 1,000,000 observations (50 treatments x 20,000 blocks)', () => {
  bench('balanced: closed form (target < 100 ms)', () => {
    blocked(yBlocked, treatment, block);
  });
  bench('1% of plots missing: least squares, blocks absorbed', () => {
    blocked(yMissing, trtMissing, blkMissing);
  }, { iterations: 3, time: 0 });
});

describe('blocked, balanced, 1,000,000 observations, with 1,000,000 decimal texts also in memory', () => {
  bench('balanced: closed form, larger heap (each major collection marks the texts)', () => {
    if (held().length !== N) throw new Error('texts missing');
    blocked(yBlocked, treatment, block);
  }, holding(makeNist));
});

describe('least squares, 200 parameters, 100,000 observations (target < 2 s)', () => {
  bench('two factors, main effects (100 and 101 levels)', () => {
    fitFactorModel({ y: yLs, factors: mainEffects, terms: [[0], [1]] });
  });
  bench('factorial 10 x 5 x 4, all interactions, unequal cells', () => {
    factorial(yLs, threeWay);
  });
  bench(`for comparison: dense Householder QR of X, ${QR_ROWS} rows`, () => {
    householderLeastSquares(denseDesign(mainEffectsSmall, [[0], [1]], QR_ROWS), yLsSmall);
  }, { iterations: 1, time: 0, warmupIterations: 0 });
});
