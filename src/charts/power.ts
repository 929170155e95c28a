/**
 * Power against the size of a trial (plots per group, or blocks), with the chosen plan
 * marked and, when one was asked for, the target power drawn as a rule.
 */
import { chartFormat } from '../format/digits.ts';
import { assemble, tip, type Json } from './layers.ts';
import { MARKED, MARKED_SHAPE, POINT } from './look.ts';
import type { ChartResult } from './types.ts';
import { fig, percent } from '../messages/charts.ts';

/** A power curve and the plan to mark on it. */
export interface PowerCurveInput {
  /** What the size counts ("plots per group", "blocks"). */
  readonly sizeName: string;
  readonly sizes: readonly number[];
  readonly power: ArrayLike<number>;
  /** The chosen plan: its size and power. */
  readonly chosen: number;
  readonly chosenPower: number;
  /** The power asked for, or null. */
  readonly target: number | null;
  /** One line on what the curve assumes (delta, sd, level, treatments). */
  readonly assumes: string;
}

/** The power chart; see the module note. */
export function powerCurve(c: PowerCurveInput): ChartResult {
  const values: Json[] = c.sizes.map((s, i) => ({ size: s, power: c.power[i]! }));
  const x = { field: 'size', type: 'quantitative', title: c.sizeName, scale: { zero: false }, axis: { tickMinStep: 1, format: chartFormat('count') } };
  const y = { field: 'power', type: 'quantitative', title: 'power', scale: { domain: [0, 1] } };
  const layers: Json[] = [
    {
      mark: { type: 'line', color: POINT, point: { filled: true, size: 18, color: POINT } },
      encoding: { x, y, tooltip: [tip('size', c.sizeName), tip('power', 'power')] },
    },
  ];
  if (c.target !== null) {
    layers.push({
      data: { values: [{ target: c.target }] },
      mark: { type: 'rule', strokeDash: [4, 3] },
      encoding: { y: { field: 'target', type: 'quantitative' }, tooltip: [tip('target', 'power asked for')] },
    });
  }
  layers.push({
    data: { values: [{ size: c.chosen, power: c.chosenPower, label: `${c.chosen} ${c.sizeName}: power ${fig(c.chosenPower, 'power')}` }] },
    mark: { type: 'point', filled: true, color: MARKED, shape: MARKED_SHAPE, size: 110, opacity: 1 },
    encoding: { x, y, tooltip: [tip('size', c.sizeName), tip('power', 'power')] },
  });
  layers.push({
    data: { values: [{ size: c.chosen, power: c.chosenPower, label: `${c.chosen} ${c.sizeName}: power ${fig(c.chosenPower, 'power')}` }] },
    mark: { type: 'text', align: 'left', dx: 8, dy: 12 },
    encoding: { x, y, text: { field: 'label', type: 'nominal' } },
  });
  const target = c.target === null ? '' : `; the dashed line is the power asked for (${percent(c.target)})`;
  return {
    spec: assemble(`Power against ${c.sizeName}`, c.assumes, { data: { values }, layer: layers }),
    caption: `Power from ${c.sizes[0]} to ${c.sizes[c.sizes.length - 1]} ${c.sizeName}; the plan marked has ${c.chosen} ${c.sizeName} and power ${fig(c.chosenPower, 'power')}${target}.`,
    warnings: [],
  };
}
