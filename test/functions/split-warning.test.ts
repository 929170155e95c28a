/**
 * The design warning: a split-plot layout analysed with factorial is told that the whole-plot
 * factor's error is wrong; an ordinary blocked factorial is not.
 */
import { describe, expect, it } from 'vitest';
import { factorOf } from '../stats/designs/support.ts';
import { splitPlotSuspicion } from '../../src/stats/designs/index.ts';
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
  it('ignores a column that only recodes a factor', () => {
    const water = factorOf('water', ['dry', 'dry', 'wet', 'wet', 'dry', 'dry', 'wet', 'wet']);
    const variety = factorOf('variety', ['a', 'b', 'a', 'b', 'a', 'b', 'a', 'b']);
    const block = factorOf('block', ['1', '1', '1', '1', '2', '2', '2', '2']);
    const code = factorOf('water_code', ['0', '0', '1', '1', '0', '0', '1', '1']);
    expect(splitPlotSuspicion([water, variety], [block, code])).toBeNull();
  });
});
