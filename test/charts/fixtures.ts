/**
 * Published data sets, fitted with src/stats, as the chart builders take them; the vega-lite
 * JSON schema as a validator; helpers that read what a spec draws.
 */
import { readFileSync } from 'node:fs';
import Ajv from 'ajv';
import { expect } from 'vitest';
import type { FactorInput, ResidualInput } from '../../src/charts/index.ts';
import { reachingKeys } from '../../src/charts/safety.ts';
import { blocked, oneWay, type DesignFit } from '../../src/stats/designs/index.ts';

// source: Montgomery, Design and Analysis of Experiments, vascular-graft example (from
// memory), docs/references.md section 4: four extrusion pressures (rows) by six resin batches
// (columns, the blocks)
export const GRAFT: readonly (readonly number[])[] = [
  [90.3, 89.2, 98.2, 93.9, 87.4, 97.9],
  [92.5, 89.5, 90.6, 94.7, 87.0, 95.8],
  [85.5, 90.8, 89.6, 86.2, 88.0, 93.4],
  [82.5, 89.5, 85.6, 87.4, 78.9, 90.7],
];
export const PRESSURES = ['8500', '8700', '8900', '9100'] as const;

// source: Dobson (1983), An Introduction to Statistical Modelling, plant weights (from
// memory), docs/references.md section 3
export const PLANTS: ReadonlyMap<string, readonly number[]> = new Map([
  ['ctrl', [4.17, 5.58, 5.18, 6.11, 4.5, 4.61, 5.17, 4.53, 5.33, 5.14]],
  ['trt1', [4.81, 4.17, 4.41, 3.59, 5.87, 3.83, 6.03, 4.89, 4.32, 4.69]],
  ['trt2', [6.31, 5.12, 5.54, 5.5, 5.37, 5.29, 4.92, 6.15, 5.8, 5.26]],
]);

/** The graft data in table order (pressure by pressure, batches 1-6), optionally with one value replaced. */
export function graftData(replace?: { row: number; value: number }): { y: Float64Array; pressure: FactorInput; batch: FactorInput } {
  const y = new Float64Array(GRAFT.flat());
  if (replace !== undefined) y[replace.row - 1] = replace.value;
  return {
    y,
    pressure: { name: 'pressure', codes: Int32Array.from(y, (_, i) => Math.floor(i / 6)), levels: [...PRESSURES] },
    batch: { name: 'batch', codes: Int32Array.from(y, (_, i) => i % 6), levels: ['1', '2', '3', '4', '5', '6'] },
  };
}

/** A fit and the residual input of the chart builders. */
export interface Fitted {
  readonly fit: DesignFit;
  readonly input: ResidualInput;
}

/** The graft data fitted as randomized complete blocks. */
export function graftFit(replace?: { row: number; value: number }, response = 'yield_pct'): Fitted {
  const d = graftData(replace);
  const fit = blocked(d.y, d.pressure, d.batch);
  return { fit, input: residualInput(fit, d.y, [d.pressure, d.batch], response, null) };
}

/** Dobson's plant weights fitted one way. */
export function plantsFit(): Fitted {
  const y = new Float64Array([...PLANTS.values()].flat());
  const group: FactorInput = { name: 'group', codes: Int32Array.from(y, (_, i) => Math.floor(i / 10)), levels: [...PLANTS.keys()] };
  const fit = oneWay(y, group);
  return { fit, input: residualInput(fit, y, [group], 'weight', null) };
}

/** The chart builders' view of a fit. */
export function residualInput(fit: DesignFit, y: Float64Array, factors: readonly FactorInput[], response: string, rows: Int32Array | null): ResidualInput {
  return { residuals: fit.residuals, fitted: fit.fitted, studentized: fit.studentized_residuals, y, rows, response, factors };
}

// ---- the schema ---------------------------------------------------------------------

const schema = JSON.parse(readFileSync('node_modules/vega-lite/build/vega-lite-schema.json', 'utf8')) as object;
// The schema names three formats that ajv leaves to the user; define them as the JSON
// Schema draft 7 text and the CSS colour syntax describe them. Our specs hold no URIs at all.
const ajv = new Ajv({ strict: false, allErrors: true });
ajv.addFormat('color-hex', /^#(?:[0-9a-fA-F]{3,4}|[0-9a-fA-F]{6}|[0-9a-fA-F]{8})$/);
ajv.addFormat('uri', /^[a-zA-Z][a-zA-Z0-9+.-]*:[^\s]*$/);
ajv.addFormat('uri-reference', /^[^\s]*$/);
const validateSpec = ajv.compile(schema);

/** Fails the test unless the spec validates against vega-lite's own JSON schema. */
export function expectValidSpec(spec: unknown): void {
  const ok = validateSpec(spec);
  const why = ok ? '' : ajv.errorsText(validateSpec.errors?.slice(0, 5));
  expect(why, 'vega-lite schema').toBe('');
  expect(ok).toBe(true);
}

/** Fails the test if the spec has a key through which it could reach outside. */
export function expectSelfContained(spec: unknown): void {
  expect(reachingKeys(spec)).toEqual([]);
}

// ---- reading a spec -------------------------------------------------------------------

/** A JSON object of a spec. */
export type Obj = { [key: string]: unknown };

/** A spec read as a plain JSON object. */
export function obj(spec: unknown): Obj {
  return spec as Obj;
}

/** The layers of a layered spec (throws when it has none). */
export function layers(spec: unknown): Obj[] {
  const l = (spec as Obj).layer;
  if (!Array.isArray(l)) throw new Error('not a layered spec');
  return l as Obj[];
}

/** The first layer whose mark type is `type` and passes `where`. */
export function layerOf(spec: unknown, type: string, where: (l: Obj) => boolean = () => true): Obj {
  const found = layers(spec).find((l) => markType(l) === type && where(l));
  if (found === undefined) throw new Error(`no ${type} layer`);
  return found;
}

/** The mark type of a layer. */
export function markType(l: Obj): string {
  const m = l.mark;
  return typeof m === 'string' ? m : ((m as Obj).type as string);
}

/** The inline data rows of a layer (or of the spec, when the layer has none). */
export function valuesOf(l: Obj, spec?: unknown): Obj[] {
  const d = (l.data ?? (spec as Obj | undefined)?.data) as Obj | undefined;
  if (d === undefined || !Array.isArray(d.values)) throw new Error('no inline data');
  return d.values as Obj[];
}

/** The encoding of a layer. */
export function encodingOf(l: Obj): Obj {
  return l.encoding as Obj;
}
