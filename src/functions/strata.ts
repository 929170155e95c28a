/**
 * Designs with more than one error: split plots (whole-plot and subplot errors) and a series
 * of trials across sites (treatments judged against how much they vary from site to site).
 */
import type { Column, NumberColumn, Table } from '../lang/values.ts';
import { acrossSites, notSplitPlotSuspicion, splitPlot } from '../stats/designs/index.ts';
import { planningMsg } from '../messages/planning.ts';
import { factorOf } from './columns.ts';
import { finish, prepare, type Prepared } from './fits.ts';
import { guarded } from './records.ts';
import type { Builtin } from '../lang/builtins.ts';

const Y = { name: 'y', type: 'numbers' as const, doc: 'The measurements (the response).' };

export const STRATA: readonly Builtin[] = [
  {
    name: 'split_plot',
    category: 'designs',
    params: [
      Y,
      { name: 'whole', type: 'factor', doc: 'The factor applied to whole plots (hard to change: irrigation on strips, oven temperature for a batch).' },
      { name: 'sub', type: 'factor', doc: 'The factor randomized to the subplots inside each whole plot.' },
      { name: 'block', type: 'factor', doc: 'The block (replicate) of each measurement; a whole plot is one block and one whole-plot level.' },
    ],
    returns: 'a fit record with mse_whole, df_whole_error, sub_means and cell_means',
    doc: 'Analysis of variance for a split plot with whole plots in randomized complete blocks, in two error strata. Table rows: the block, the whole-plot factor, whole_error (blocks by whole plots), the subplot factor, their interaction (WHOLE:SUB), error, total. The whole-plot factor is tested against whole_error, so the hard-to-change factor is not credited with evidence it does not have; the rest (blocks included) against error. `means` are the whole-plot means, `sub_means` and `cell_means` the others (standard errors combining both errors, on Satterthwaite’s degrees of freedom). After the fit, difference, pairwise and contrast take `factor:` (the subplot factor’s name to compare its levels) and `at:` (a level of the other factor, to compare within it), each with the standard error that comparison needs, stated in its notes. This version needs complete whole plots: a whole plot that lacks a subplot level is an error that names it. When the data’s table has a column that groups the plots as whole plots would be (as many groups as whole plots, each with one plot of every subplot level) while the whole-plot factor changes inside those groups, the fit warns that the data may not be a split plot.',
    example: 'split_plot(field.yield, field.irrigation, field.variety, field.block)',
    run: (a, ctx) => {
      const p = prepare(
        a.get('y') as NumberColumn,
        [
          { col: a.get('whole') as Column, role: 'whole' },
          { col: a.get('sub') as Column, role: 'sub' },
          { col: a.get('block') as Column, role: 'block' },
        ],
        ctx,
      );
      const owner = ctx.sourceTable?.('y')?.table ?? null;
      const used = [a.get('y'), a.get('whole'), a.get('sub'), a.get('block')] as Column[];
      const warning = notSplitPlotWarning(owner, used, p);
      if (warning !== null) ctx.warn(warning);
      return finish(p, guarded(() => splitPlot(p.y, p.factors[0]!, p.factors[1]!, p.factors[2]!, { offset: p.offset, dropped: p.dropped })));
    },
  },
  {
    name: 'across_sites',
    category: 'designs',
    params: [
      Y,
      { name: 'treatment', type: 'factor', doc: 'The treatment of each measurement.' },
      { name: 'block', type: 'factor', doc: 'The block within its site (labels may repeat from site to site).' },
      { name: 'site', type: 'factor', doc: 'The site (or season) of each measurement.' },
    ],
    returns: 'a fit record with f_against_error, p_against_error, bartlett, per_site and site_means',
    doc: 'Combined analysis of the same randomized complete block trial at several sites. Table rows: the site, blocks within sites, the treatment, TREATMENT:SITE, the pooled error, total. Sites are taken as a sample of the places the result should hold for, so the treatment’s F is against the treatment-by-site mean square (its F against the pooled error is in `f_against_error`); sites are tested against blocks within sites. Bartlett’s test of equal error variances across sites is made before pooling and stated in the notes; `per_site` gives each site’s own blocked analysis and `site_means` the treatment means at each site. Needs every treatment once in every block and the same number of blocks at every site; a single site gives the blocked analysis.',
    example: 'across_sites(trials.yield, trials.variety, trials.block, trials.site)',
    run: (a, ctx) => {
      const p = prepare(
        a.get('y') as NumberColumn,
        [
          { col: a.get('treatment') as Column, role: 'treatment' },
          { col: a.get('block') as Column, role: 'block' },
          { col: a.get('site') as Column, role: 'site' },
        ],
        ctx,
      );
      return finish(p, guarded(() => acrossSites(p.y, p.factors[0]!, p.factors[1]!, p.factors[2]!, { offset: p.offset, dropped: p.dropped })));
    },
  },
];

/**
 * A warning when the table the data came from has a column that groups the plots as whole
 * plots would be while the whole-plot factor changes inside those groups (the data look
 * randomized plot by plot, not as a split plot). Null when nothing suggests it.
 */
function notSplitPlotWarning(owner: Table | null, used: readonly Column[], p: Prepared): string | null {
  if (owner === null) return null;
  const [whole, sub, block] = p.factors as [Prepared['factors'][0], Prepared['factors'][0], Prepared['factors'][0]];
  // only complete whole plots can be grouped as whole plots: skip reading the other columns
  if (whole.levels.length * block.levels.length * sub.levels.length !== p.y.length) return null;
  const taken = new Set<Column>(used);
  const others = owner.columns
    .filter((c) => !taken.has(c) && c.values.length === p.length)
    .map((c, i) => factorOf(c, p.rows, c.name ?? `column_${i + 1}`));
  const s = notSplitPlotSuspicion(whole, sub, block, others);
  return s === null ? null : planningMsg.notSplitPlot(whole.name, sub.name, s.unit);
}
