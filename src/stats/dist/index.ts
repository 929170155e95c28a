export * from './central.ts';
export { rangeCdf, rangeUpper, rangeQuantile, rangeCritical, rangeUpperQuantile } from './range.ts';
export { noncentralTCdf, noncentralTUpper } from './noncentral-t.ts';
export { noncentralFCdf, noncentralFUpper } from './noncentral-f.ts';
