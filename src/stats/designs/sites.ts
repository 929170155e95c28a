/**
 * A series of trials: the same randomized complete block trial at several sites (or seasons),
 * analysed together. Blocks are nested in sites, so block labels may repeat from site to site.
 *
 * Table rows: site, blocks within sites, treatment, treatment:site, error (pooled over sites),
 * total. Sites are taken as a sample of the places the result should hold for, so the
 * treatment is tested against the treatment-by-site mean square (how much the treatment
 * differences change from site to site); its F against the pooled error is given beside it.
 * Sites are tested against blocks within sites; blocks and the interaction against the error.
 * Before the errors are pooled, Bartlett's test compares the sites' error variances.
 *
 * This version needs every treatment once in every block and the same number of blocks at
 * every site (then every sum of squares is orthogonal and comes in closed form from means);
 * anything else is a plain error that says what differs. One site is the blocked analysis.
 */
import { fUpper } from '../distributions/index.ts';
import { centredSumOfSquares, groupMeans, mean } from '../linear/sums.ts';
import { addOffset, diagonalCovariance, errorFields, factorMeans } from './assemble.ts';
import { blocked } from './blocked.ts';
import { checkFactor, checkResponse, requireAllLevels, resolveOptions } from './check.ts';
import { DesignError } from './errors.ts';
import { designMsg } from '../../messages/designs.ts';
import { bartlett } from './strata.ts';
import type { AnovaTable, DesignFit, DesignOptions, Factor, SitesParts } from './types.ts';
import { sq } from '../math/portable.ts';

const DESIGN = 'series of randomized complete block trials across sites';

/** Significance level of Bartlett's test below which the notes warn (common practice). */
const BARTLETT_WARN = 0.05;

/**
 * A site's error sum of squares, relative to its total, below which it is rounding: the site's
 * data fit its blocks and treatments exactly (the same rule as src/functions/exact.ts, common
 * practice, no source). Such a site has no F test of its own, and Bartlett's test, which takes
 * the logarithm of every site's error variance, cannot be made.
 */
const EXACT_SITE_RELATIVE = 1e-12;

/**
 * Combined analysis of randomized complete block trials at several sites.
 *
 * @param y - response, already shifted by `options.offset` (complete cases only).
 * @param treatment - treatments (every one at every site, once in every block).
 * @param block - blocks; a block is a block label within a site.
 * @param site - the sites (or seasons).
 * @returns a fit record with `sites` (per-site analyses, Bartlett's test, the treatment F
 *   against the pooled error, the treatment-by-site means).
 * @throws DesignError for a treatment absent at a site, a block that lacks a treatment or holds
 *   one twice, a site with one block, or sites with different numbers of blocks.
 */
export function acrossSites(y: Float64Array, treatment: Factor, block: Factor, site: Factor, options?: DesignOptions): DesignFit {
  const opts = resolveOptions(options);
  checkResponse(y);
  const n = y.length;
  const tc = checkFactor(treatment, n, 'treatment');
  requireAllLevels(treatment, tc, 'treatment');
  checkFactor(block, n, 'block');
  const sc = checkFactor(site, n, 'site');
  const t = tc.length;
  const s = sc.length;
  if (sc.some((c) => c === 0)) throw new DesignError(designMsg.levelWithoutData('site', site.levels[sc.indexOf(0)] ?? ''));

  // blocks within sites: code (site, block label) pairs in first-seen order per site
  const B = block.levels.length;
  const local = new Int32Array(s * B).fill(-1);
  const blocksAt = new Int32Array(s);
  const blockLabels: string[][] = Array.from({ length: s }, () => []);
  for (let i = 0; i < n; i++) {
    const key = site.codes[i]! * B + block.codes[i]!;
    if (local[key] === -1) {
      local[key] = blocksAt[site.codes[i]!]!;
      blocksAt[site.codes[i]!]! += 1;
      blockLabels[site.codes[i]!]!.push(block.levels[block.codes[i]!] ?? '');
    }
  }
  // every treatment at every site, once in every block
  const siteTreatment = new Int32Array(s * t);
  for (let i = 0; i < n; i++) siteTreatment[site.codes[i]! * t + treatment.codes[i]!]! += 1;
  for (let u = 0; u < s; u++) {
    for (let g = 0; g < t; g++) {
      if (siteTreatment[u * t + g] === 0) throw new DesignError(designMsg.sitesAbsent(treatment.levels[g] ?? '', site.name, site.levels[u] ?? ''));
    }
    if (blocksAt[u]! < 2) throw new DesignError(designMsg.sitesOneBlock(site.name, site.levels[u] ?? '', block.name));
  }
  const b = blocksAt[0]!;
  for (let u = 1; u < s; u++) {
    if (blocksAt[u] !== b) throw new DesignError(designMsg.sitesUnequalBlocks(site.name, site.levels[0] ?? '', b, site.levels[u] ?? '', blocksAt[u]!));
  }
  const blockOf = new Int32Array(n); // block within site: site * b + local index
  for (let i = 0; i < n; i++) blockOf[i] = site.codes[i]! * b + local[site.codes[i]! * B + block.codes[i]!]!;
  const inBlock = new Int32Array(s * b * t);
  for (let i = 0; i < n; i++) inBlock[blockOf[i]! * t + treatment.codes[i]!]! += 1;
  for (let k = 0; k < s * b; k++) {
    for (let g = 0; g < t; g++) {
      const c = inBlock[k * t + g]!;
      if (c !== 1) {
        const u = Math.floor(k / b);
        const label = blockLabels[u]![k % b] ?? '';
        if (c === 0) throw new DesignError(designMsg.sitesMissingPlot(site.name, site.levels[u] ?? '', block.name, label, treatment.levels[g] ?? ''));
        throw new DesignError(designMsg.sitesIncomplete(site.name, site.levels[u] ?? '', block.name, label, treatment.levels[g] ?? '', c));
      }
    }
  }

  // per-site analyses (each its own blocked fit, on the same shifted scale)
  const perSite: SitesParts['perSite'] = { site: [], blocks: [], mean: [], mse: [], df_error: [], f: [], p: [] };
  const siteRows: number[][] = Array.from({ length: s }, () => []);
  for (let i = 0; i < n; i++) siteRows[site.codes[i]!]!.push(i);
  const siteFits: DesignFit[] = [];
  const exactSites: string[] = [];
  for (let u = 0; u < s; u++) {
    const rows = siteRows[u]!;
    const ys = Float64Array.from(rows, (i) => y[i]!);
    const trt: Factor = { name: treatment.name, levels: treatment.levels, codes: Int32Array.from(rows, (i) => treatment.codes[i]!) };
    const blk: Factor = { name: block.name, levels: blockLabels[u]!, codes: Int32Array.from(rows, (i) => blockOf[i]! - u * b) };
    const f = blocked(ys, trt, blk, { offset: opts.offset, level: opts.level });
    siteFits.push(f);
    perSite.site.push(site.levels[u] ?? '');
    perSite.blocks.push(b);
    perSite.mean.push(f.grand_mean);
    perSite.mse.push(f.mse);
    perSite.df_error.push(f.df_error);
    const sseU = f.table.ss[f.table.source.indexOf('error')]!;
    const sstU = f.table.ss[f.table.source.indexOf('total')]!;
    const exact = !(sseU > EXACT_SITE_RELATIVE * sstU);
    if (exact) exactSites.push(site.levels[u] ?? '');
    perSite.f.push(exact ? NaN : f.table.f[0]!);
    perSite.p.push(exact ? NaN : f.table.p[0]!);
  }
  if (s === 1) {
    const only = siteFits[0]!;
    only.notes.push(designMsg.sitesOne(site.name));
    if (opts.dropped > 0) only.notes.unshift(designMsg.dropped(opts.dropped));
    return only;
  }

  const grand = mean(y);
  const mT = groupMeans(y, treatment.codes, t).mean;
  const mS = groupMeans(y, site.codes, s).mean;
  const mK = groupMeans(y, blockOf, s * b).mean;
  const cellOf = Int32Array.from(site.codes, (u, i) => treatment.codes[i]! * s + u);
  const mTS = groupMeans(y, cellOf, t * s).mean;
  let ssSite = 0;
  for (let u = 0; u < s; u++) ssSite += sq(mS[u]! - grand);
  ssSite *= t * b;
  let ssBlocks = 0;
  for (let k = 0; k < s * b; k++) ssBlocks += sq(mK[k]! - mS[Math.floor(k / b)]!);
  ssBlocks *= t;
  let ssT = 0;
  for (let g = 0; g < t; g++) ssT += sq(mT[g]! - grand);
  ssT *= s * b;
  let ssTS = 0;
  for (let g = 0; g < t; g++) for (let u = 0; u < s; u++) ssTS += sq(mTS[g * s + u]! - mT[g]! - mS[u]! + grand);
  ssTS *= b;
  const residuals = new Float64Array(n);
  const fittedShifted = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const f = mK[blockOf[i]!]! + mTS[cellOf[i]!]! - mS[site.codes[i]!]!;
    fittedShifted[i] = f;
    residuals[i] = y[i]! - f;
  }
  const sse = centredSumOfSquares(residuals, 0);
  const sst = centredSumOfSquares(y, grand);
  const dfSite = s - 1;
  const dfBlocks = s * (b - 1);
  const dfT = t - 1;
  const dfTS = (t - 1) * (s - 1);
  const dfError = s * (t - 1) * (b - 1);
  const mse = sse / dfError;
  const msBlocks = ssBlocks / dfBlocks;
  const msTS = ssTS / dfTS;
  const interaction = `${treatment.name}:${site.name}`;
  // the treatment-by-site sum of squares zero to rounding beside the total (the rule of
  // src/functions/exact.ts): the treatment has nothing to be tested against
  const interactionExact = !(ssTS > 1e-12 * sst);
  const rows = [
    { source: site.name, df: dfSite, ss: ssSite, err: msBlocks, edf: dfBlocks },
    { source: `${block.name} within ${site.name}`, df: dfBlocks, ss: ssBlocks, err: mse, edf: dfError },
    { source: treatment.name, df: dfT, ss: ssT, err: interactionExact ? NaN : msTS, edf: dfTS },
    { source: interaction, df: dfTS, ss: ssTS, err: mse, edf: dfError },
  ];
  const table: AnovaTable = { source: [], df: [], ss: [], ms: [], f: [], p: [] };
  for (const r of rows) {
    const ms = r.ss / r.df;
    const f = r.err > 0 ? ms / r.err : NaN;
    table.source.push(r.source);
    table.df.push(r.df);
    table.ss.push(r.ss);
    table.ms.push(ms);
    table.f.push(f);
    table.p.push(f === f ? fUpper(f, r.df, r.edf) : NaN);
  }
  table.source.push('error', 'total');
  table.df.push(dfError, n - 1);
  table.ss.push(sse, sst);
  table.ms.push(mse, NaN);
  table.f.push(NaN, NaN);
  table.p.push(NaN, NaN);

  const fAgainstError = ssT / dfT / mse;
  const bt = exactSites.length > 0 ? { statistic: NaN, df: s - 1, p: NaN } : bartlett(perSite.mse, perSite.df_error);
  const notes: string[] = [];
  if (opts.dropped > 0) notes.push(designMsg.dropped(opts.dropped));
  notes.push(designMsg.sitesNote(treatment.name, site.name));
  if (exactSites.length > 0) notes.push(designMsg.sitesExact(site.name, exactSites));
  else notes.push(designMsg.sitesBartlett(bt.statistic, bt.df, bt.p));
  if (bt.p < BARTLETT_WARN) notes.push(designMsg.sitesBartlettWarn());
  notes.push(designMsg.sitesMeansNote(treatment.name, site.name));
  if (interactionExact) notes.push(designMsg.sitesInteractionExact(treatment.name, site.name));

  const trtCounts = new Float64Array(t).fill(s * b);
  const trtMeans = factorMeans(treatment.name, treatment.levels, trtCounts, mT, opts.offset, diagonalCovariance(trtCounts), interactionExact ? NaN : msTS, dfTS, opts.level);
  trtMeans.error = { mse: msTS, df: dfTS, note: designMsg.sitesMeansNote(treatment.name, site.name) };
  const cellMeans: SitesParts['cellMeans'] = { treatment: [], site: [], mean: [] };
  for (let g = 0; g < t; g++) {
    for (let u = 0; u < s; u++) {
      cellMeans.treatment.push(treatment.levels[g] ?? '');
      cellMeans.site.push(site.levels[u] ?? '');
      cellMeans.mean.push(mTS[g * s + u]! + opts.offset);
    }
  }
  const h = (b + t - 1) / (b * t);
  return {
    design: DESIGN,
    kind: 'across_sites',
    factors: [treatment.name, site.name, block.name],
    treatment: treatment.name,
    n,
    level: opts.level,
    table,
    ss_method: 'closed form from site, block, treatment and treatment-by-site means (every treatment once in every block, the same number of blocks at every site, so the sums are orthogonal)',
    means: trtMeans.table,
    factor_means: [trtMeans],
    ...errorFields({ mse, dfError, sse, sst, grand, offset: opts.offset, residuals, leverage: new Float64Array(n).fill(h) }),
    fitted: addOffset(fittedShifted, opts.offset),
    balanced: true,
    notes,
    sites: {
      site: site.name,
      block: block.name,
      siteLevels: [...site.levels],
      f_against_error: fAgainstError,
      p_against_error: fUpper(fAgainstError, dfT, dfError),
      bartlett: bt,
      perSite,
      cellMeans,
    },
  };
}
