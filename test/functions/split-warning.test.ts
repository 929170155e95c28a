/**
 * The design warning: a split-plot layout analysed with factorial is told that the whole-plot
 * factor's error is wrong; an ordinary blocked factorial is not.
 */
import { describe, expect, it } from 'vitest';
import { factorOf } from '../stats/designs/support.ts';
import { notSplitPlotSuspicion, splitPlotSuspicion } from '../../src/stats/designs/index.ts';
import { doc, run } from '../helpers.ts';
import { planningMsg } from '../../src/messages/planning.ts';

/** Rows of a trial: 3 blocks; `strip` names whole plots when `split` (strip numbers restart in each block). */
function rows(split: boolean): string[] {
  const out = ['--- table t', 'block,strip,plot,water,variety,yield'];
  let plot = 0;
  for (let k = 1; k <= 3; k++) {
    for (const s of [0, 1]) {
      for (const [j, v] of ['a', 'b', 'c'].entries()) {
        plot++;
        // split: water drawn per strip (strip 1 is dry in some blocks, wet in others);
        // without the split, water changes from plot to plot inside each strip
        const water = split ? ['dry', 'wet'][(s + k) % 2]! : ['dry', 'wet'][(j + s) % 2]!;
        out.push(`${k},${s + 1},${plot},${water},${v},${10 + k + s + j + ((plot * 7) % 5) / 10}`);
      }
    }
  }
  return [...out, ''];
}

describe('the split-plot warning on factorial', () => {
  it('fires when a column names whole plots on which one factor is constant', () => {
    const { states } = run(doc(...rows(true), '--- formula', 'fit = factorial(t.yield, [t.water, t.variety])'));
    expect(states[1]!.warnings).toContain(planningMsg.splitPlotSuspected('water', 'variety', ['block', 'strip']));
    // the words name the unit, the wrong error and the analysis to use
    const w = planningMsg.splitPlotSuspected('water', 'variety', ['block', 'strip']);
    expect(w).toMatch(/"water" is the same on every plot of each "block" and "strip" while "variety" changes within it: this looks like a split plot/);
    expect(w).toMatch(/Use split_plot\(y, water, variety, block\)/);
  });
  it('does not fire for a factorial randomized plot by plot', () => {
    const { states } = run(doc(...rows(false), '--- formula', 'fit = factorial(t.yield, [t.water, t.variety])'));
    expect(states[1]!.warnings.join(' ')).not.toMatch(/split plot/);
  });
  it('does not fire for split_plot itself', () => {
    const { states } = run(doc(...rows(true), '--- formula', 'fit = split_plot(t.yield, t.water, t.variety, t.block)'));
    expect(states[1]!.warnings).toEqual([]);
  });
  it('warns split_plot when a column groups plots as whole plots but the whole-plot factor changes inside them', () => {
    // rows(false): in each block, strip 1 holds a dry a, a wet b and a dry c; split_plot alone
    // cannot see it (each block and water level still holds every variety once)
    const { states, engine } = run(doc(...rows(false), '--- formula', 'fit = split_plot(t.yield, t.water, t.variety, t.block)'));
    expect(states[1]!.warnings).toEqual([planningMsg.notSplitPlot('water', 'variety', ['block', 'strip'])]);
    const fit = engine.valueOf('fit');
    expect(typeof fit === 'object' && fit.kind === 'record').toBe(true);
    expect(planningMsg.notSplitPlot('water', 'variety', ['block', 'strip'])).toMatch(/^Each "block" and "strip" holds one plot of every variety, as a whole plot would, but "water" changes inside it: .*not a split plot/);
  });
  it('the reverse check ignores plot labels and groups that do not hold one plot of each subplot level', () => {
    const water = factorOf('water', ['dry', 'wet', 'dry', 'wet', 'dry', 'wet', 'dry', 'wet']);
    const variety = factorOf('variety', ['a', 'b', 'b', 'a', 'a', 'b', 'b', 'a']);
    const block = factorOf('block', ['1', '1', '1', '1', '2', '2', '2', '2']);
    const plot = factorOf('plot', ['1', '2', '3', '4', '5', '6', '7', '8']);
    // rows of the field: (1, 2) and (3, 4) in each block hold a and b once each, water mixed
    const row = factorOf('row', ['1', '1', '2', '2', '1', '1', '2', '2']);
    // pairs that hold a twice: not shaped like whole plots
    const pair = factorOf('pair', ['1', '2', '2', '1', '1', '2', '2', '1']);
    expect(notSplitPlotSuspicion(water, variety, block, [plot])).toBeNull();
    expect(notSplitPlotSuspicion(water, variety, block, [pair])).toBeNull();
    expect(notSplitPlotSuspicion(water, variety, block, [plot, row])).toEqual({ unit: ['block', 'row'] });
    // the same rows with water constant on each: a split plot, nothing to say
    const strips = factorOf('water', ['dry', 'dry', 'wet', 'wet', 'wet', 'wet', 'dry', 'dry']);
    expect(notSplitPlotSuspicion(strips, variety, block, [plot, row])).toBeNull();
  });
  it('ignores a column that only recodes a factor', () => {
    const water = factorOf('water', ['dry', 'dry', 'wet', 'wet', 'dry', 'dry', 'wet', 'wet']);
    const variety = factorOf('variety', ['a', 'b', 'a', 'b', 'a', 'b', 'a', 'b']);
    const block = factorOf('block', ['1', '1', '1', '1', '2', '2', '2', '2']);
    const code = factorOf('water_code', ['0', '0', '1', '1', '0', '0', '1', '1']);
    expect(splitPlotSuspicion([water, variety], [block, code])).toBeNull();
  });
});
