/**
 * Timings of the distribution functions (vitest bench; prints, never fails).
 * Run: npx vitest bench --run test/bench/dist.bench.ts
 *
 * The studentized range tabulates the range of k normals once per k (a few tens of
 * milliseconds, then cached), so the per-call cases measure the steady state; the "table"
 * case builds tables directly to show that one-off cost.
 */
import { bench, describe } from 'vitest';
import {
  fCritical,
  noncentralFUpper,
  noncentralTUpper,
  rangeCdf,
  rangeCritical,
  rangeUpper,
  tCritical,
} from '../../src/stats/distributions/index.ts';
import { rangeTable } from '../../src/stats/distributions/range.ts';

describe('studentized range', () => {
  bench('rangeCdf, 3 groups, 12 df', () => {
    rangeCdf(3.5, 3, 12);
  });
  bench('rangeUpper, 10 groups, 60 df', () => {
    rangeUpper(4.6, 10, 60);
  });
  bench('rangeUpper far tail, 2 groups, 60 df, q 12', () => {
    rangeUpper(12, 2, 60);
  });
  bench('rangeCritical 0.95, 10 groups, 60 df', () => {
    rangeCritical(0.95, 10, 60);
  });
  bench('rangeCritical 0.99, 20 groups, 2 df', () => {
    rangeCritical(0.99, 20, 2);
  });
  let k = 30;
  bench('table for a new number of groups (30 to 130)', () => {
    // The first pass over 30..130 builds each table; later passes find them cached only while
    // they stay in the cache, so most calls measure a build.
    rangeTable(k);
    k = k >= 130 ? 30 : k + 1;
  }, { iterations: 20 });
});

describe('noncentral and central', () => {
  bench('noncentralTUpper, 20 df', () => {
    noncentralTUpper(2.1, 20, 2.5);
  });
  bench('noncentralFUpper, 3 and 20 df, lambda 10', () => {
    noncentralFUpper(3.1, 3, 20, 10);
  });
  bench('noncentralFUpper, 4 and 30 df, lambda 500', () => {
    noncentralFUpper(40, 4, 30, 500);
  });
  bench('tCritical', () => {
    tCritical(0.95, 18);
  });
  bench('fCritical', () => {
    fCritical(0.95, 3, 15);
  });
});
