/**
 * Where the integrand over the scale s > 0 peaks, for the outer integrals of the studentized
 * range and the noncentral t: a scan over a geometric grid, then a golden-section refinement.
 * It only places the first quadrature panel, so moderate precision suffices.
 */
import * as pm from '../math/portable.ts';

/**
 * The maximizer over s > 0 of `logh(s)`, searched from s = min(1e-6, 0.1 / reach) up to 3:
 * the integrand may sit anywhere from s ~ 1/reach (a huge statistic, a tiny tail) to a few
 * units.
 */
export function scaleMode(logh: (s: number) => number, reach: number): number {
  let best = 1;
  let bestVal = -Infinity;
  const lo = pm.log(Math.min(1e-6, 0.1 / reach));
  const hi = 3;
  const steps = 45 + Math.ceil(-lo / 3);
  for (let i = 0; i <= steps; i++) {
    const s = pm.exp(lo + ((hi - lo) * i) / steps);
    const v = logh(s);
    if (v > bestVal) {
      bestVal = v;
      best = s;
    }
  }
  const ratio = pm.exp((hi - lo) / steps);
  let a = pm.log(best / ratio);
  let b = pm.log(best * ratio);
  const gr = (Math.sqrt(5) - 1) / 2;
  let x1 = b - gr * (b - a);
  let x2 = a + gr * (b - a);
  let f1 = logh(pm.exp(x1));
  let f2 = logh(pm.exp(x2));
  for (let i = 0; i < 20; i++) {
    if (f1 > f2) {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - gr * (b - a);
      f1 = logh(pm.exp(x1));
    } else {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + gr * (b - a);
      f2 = logh(pm.exp(x2));
    }
  }
  return pm.exp(0.5 * (a + b));
}
