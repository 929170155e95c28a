/**
 * The planning built-ins through documents, as a user writes them: layouts pinned byte for
 * byte, the record of how a layout was drawn, plain errors for bad input, the run sheet
 * round trip through layout_check, the design warning, and the two charts.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runSheet } from '../../src/doc/run-sheet.ts';
import { toJson } from '../../src/lang/json.ts';
import { isError, isRecord, isTable, type Chart, type RecordValue, type Table, type Value } from '../../src/lang/values.ts';
import { OKABE_ITO } from '../../src/charts/look.ts';
import { renderSvg } from '../../src/charts/render.ts';
import { Draws } from '../../src/stats/planning/index.ts';
import { doc, evalFormula, run, valueOf } from '../helpers.ts';
import { planningMsg as m } from '../../src/messages/planning.ts';
import { msg } from '../../src/messages/language.ts';

function tab(v: Value): Table {
  if (!isTable(v)) throw new Error(`expected a table, got ${JSON.stringify(v)}`);
  return v;
}
function rec(v: Value): RecordValue {
  if (!isRecord(v)) throw new Error(`expected a record, got ${isError(v) ? v.message : JSON.stringify(v)}`);
  return v;
}
function errorText(v: Value): string {
  if (!isError(v)) throw new Error(`expected an error, got ${JSON.stringify(v)}`);
  return v.message;
}

describe('layouts are pinned byte for byte: a change that would re-draw old plans fails here', () => {
  // These texts were drawn once by this code and written down; they are not computed by
  // any outside source. They pin the generator (SplitMix64 seeding of xoroshiro128+), the
  // draw below a bound, the shuffle and the order of draws. Do not update them to make a
  // change pass: a plan already in a field must be drawn again plot for plot.
  it('the first raw words of the generator', () => {
    const d = new Draws(2026);
    expect([d.word(), d.word(), d.word(), d.word()]).toEqual([2127155840, 4213002458, 2114519145, 2007831505]);
    const e = new Draws(0);
    expect([e.word(), e.word()]).toEqual([483865507, 1747211118]);
  });

  it.each([
    [
      'random_layout(["early", "mid", "late"], seed: 2026, blocks: 4)',
      'block,plot,treatment\n1,1,early\n1,2,late\n1,3,mid\n2,1,late\n2,2,early\n2,3,mid\n3,1,late\n3,2,early\n3,3,mid\n4,1,late\n4,2,mid\n4,3,early\n',
    ],
    [
      'latin_layout(["A", "B", "C", "D", "E"], seed: 11)',
      'row,column,treatment\n1,1,A\n1,2,D\n1,3,C\n1,4,B\n1,5,E\n2,1,C\n2,2,E\n2,3,D\n2,4,A\n2,5,B\n3,1,B\n3,2,C\n3,3,A\n3,4,E\n3,5,D\n4,1,E\n4,2,A\n4,3,B\n4,4,D\n4,5,C\n5,1,D\n5,2,B\n5,3,E\n5,4,C\n5,5,A\n',
    ],
    ['random_layout([0, 60, 120], seed: 4294967295, replicates: 3)', 'plot,treatment\n1,0\n2,60\n3,0\n4,0\n5,60\n6,120\n7,120\n8,60\n9,120\n'],
    [
      'split_plot_layout(["dry", "wet"], ["A", "B", "C"], seed: 2026, blocks: 2)',
      'block,whole_plot,plot,whole,sub,treatment\n1,1,1,wet,B,wet / B\n1,1,2,wet,A,wet / A\n1,1,3,wet,C,wet / C\n1,2,4,dry,C,dry / C\n1,2,5,dry,A,dry / A\n1,2,6,dry,B,dry / B\n2,1,1,wet,C,wet / C\n2,1,2,wet,B,wet / B\n2,1,3,wet,A,wet / A\n2,2,4,dry,A,dry / A\n2,2,5,dry,B,dry / B\n2,2,6,dry,C,dry / C\n',
    ],
    [
      'random_layout(["N1", "N2", "N3", "N4", "N5", "N6"], seed: 0, blocks: 2)',
      'block,plot,treatment\n1,1,N5\n1,2,N6\n1,3,N2\n1,4,N4\n1,5,N3\n1,6,N1\n2,1,N3\n2,2,N6\n2,3,N2\n2,4,N1\n2,5,N4\n2,6,N5\n',
    ],
  ])('%s', (formula, pinned) => {
    expect(runSheet(tab(evalFormula(formula)), [])).toBe(pinned);
  });
});

describe('a layout is a table, and says how it was drawn', () => {
  it('its JSON is the contract’s table shape (docs/language.md section 9)', () => {
    const v = evalFormula('random_layout(["a", "b"], seed: 5, blocks: 2)');
    expect(JSON.parse(toJson(v))).toEqual({ block: [1, 1, 2, 2], plot: [1, 2, 1, 2], treatment: expect.any(Array) });
  });

  it('layout_details gives the design, seed, generator and algorithm', () => {
    const r = rec(evalFormula('layout_details(plan)', '--- formula', 'plan = random_layout(["a", "b", "c"], seed: 77, blocks: 5)'));
    expect(r.fields.get('design')).toBe('randomized complete blocks');
    expect(r.fields.get('drawn_by')).toBe('random_layout');
    expect(r.fields.get('seed')).toBe(77);
    expect(r.fields.get('blocks')).toBe(5);
    expect(r.fields.get('plots')).toBe(15);
    expect(String(r.fields.get('generator'))).toMatch(/xoroshiro128\+ \(pure-rand 8\.4\.2\), state from two SplitMix64 outputs/);
    expect(String(r.fields.get('algorithm'))).toMatch(/Fisher-Yates/);
  });

  it('a table typed by hand has no such record, and says so', () => {
    expect(errorText(evalFormula('layout_details(t)', '--- table t', 'block,plot,treatment', '1,1,a'))).toContain(m.notALayout());
  });

  it('a changed seed gives a changed value even where the plots come out the same', () => {
    // two treatments in one block: seeds 1 and 2 may draw the same order; the record differs
    const { engine } = run(doc('--- formula', 'a = random_layout(["x", "y"], seed: 1, blocks: 1)', '--- formula', 'b = layout_details(a)'));
    expect(rec(valueOf(engine, 'b')).fields.get('seed')).toBe(1);
  });
});

describe('bad input gets a plain error on its cell, never a number (issue point 6)', () => {
  it.each([
    ['random_layout(["a"], seed: 1, blocks: 2)', m.fewTreatments(1)],
    ['random_layout(["a", "b", "a"], seed: 1, blocks: 2)', m.duplicateTreatment('a')],
    ['latin_layout(["a", "a"], seed: 1)', m.duplicateTreatment('a')],
    ['random_layout(["a", "b"], seed: 2.5, blocks: 2)', m.seedNotWhole(2.5)],
    ['random_layout(["a", "b"], seed: -3, blocks: 2)', m.seedNotWhole(-3)],
    ['random_layout(["a", "b"], seed: 1, blocks: 0)', m.countNotWhole('blocks', 0, 1)],
    ['random_layout(["a", "b"], seed: 1, blocks: 1.5)', m.countNotWhole('blocks', 1.5, 1)],
    ['random_layout(["a", "b"], seed: 1, replicates: 0)', m.countNotWhole('replicates', 0, 1)],
    ['random_layout(["a", "b"], seed: 1)', m.noCount()],
    ['random_layout(["a", "b"], seed: 1, blocks: 2, replicates: 2)', m.bothCounts()],
    ['random_layout(["a", "b"], seed: 1, blocks: 600000)', m.tooManyPlots(1_200_000)],
    ['power_two_sample(1, 0, 10)', m.sdNotPositive(0)],
    ['power_two_sample(1, -2, 10)', m.sdNotPositive(-2)],
    ['power_two_sample(0, 1, 10)', m.deltaZero()],
    ['power_two_sample(1, 1, 10, level: 1)', m.outsideUnit('level', 1)],
    ['power_two_sample(1, 1, 1)', m.countNotWhole('n (plots per group)', 1, 2)],
    ['replicates_for_power(1, 1, power: 0)', m.outsideUnit('power', 0)],
    ['replicates_for_power(1, 1, power: 1.5)', m.outsideUnit('power', 1.5)],
    ['replicates_for_power(1, 1, level: 0)', m.outsideUnit('level', 0)],
    ['replicates_for_power(0.0001, 1)', /plots, more than the limit of 1,000,000/],
    ['power_blocked(1, 1, 1, 5)', m.countNotWhole('treatments', 1, 2)],
    ['power_blocked(1, 1, 4, 1)', m.countNotWhole('blocks', 1, 2)],
    ['power_blocked(1, 1, 4, 5.5)', m.countNotWhole('blocks', 5.5, 2)],
    ['blocks_for_power(1, 1, 4, power: 1)', m.outsideUnit('power', 1)],
    ['blocks_for_power(0.001, 1, 4)', /more than the limit of 1,000,000/],
    ['blocks_for_power(1, 1, 4, power: 0.04)', /no more than the false-alarm rate/],
    ['power_chart(1)', msg.wrongType('power_chart', 'plan', 'a record', 'a number')],
  ])('%s', (formula, message) => {
    // a pattern where the figure in the words is computed, the builder's words elsewhere
    if (typeof message === 'string') expect(errorText(evalFormula(formula))).toContain(message);
    else expect(errorText(evalFormula(formula))).toMatch(message);
  });
});

describe('power records say what they assumed', () => {
  it('blocks_for_power: 24 blocks for 4 treatments at delta = sd (docs/references.md section 7)', () => {
    // source: docs/references.md section 7 (scipy 1.10.1): 24 blocks give 0.8168415
    const r = rec(evalFormula('blocks_for_power(1, 1, 4)'));
    expect(r.fields.get('blocks')).toBe(24);
    expect((r.fields.get('power') as number).toFixed(7)).toBe('0.8168415');
    expect(r.fields.get('plots')).toBe(96);
    expect(String(r.fields.get('assumes'))).toMatch(/least favourable/);
  });

  it('replicates_for_power: 17 per group for delta = sd, power 0.8', () => {
    // source: docs/references.md section 7 (scipy 1.10.1): 17 per group give 0.8070367
    const r = rec(evalFormula('replicates_for_power(1, 1)'));
    expect(r.fields.get('n')).toBe(17);
    expect((r.fields.get('power') as number).toFixed(7)).toBe('0.8070367');
    expect(String(r.fields.get('assumes'))).toMatch(/two-sided t test at level 0\.95/);
  });
});

/** A run sheet filled in by hand: every measurement column given a value. */
function fillIn(sheet: string, value: (row: number) => string): string {
  const lines = sheet.trimEnd().split('\n');
  return [lines[0]!, ...lines.slice(1).map((l, i) => l.replace(/,$/, `,${value(i)}`).replace(/,,/, `,${value(i)},`))].join('\n');
}

describe('run sheet -> filled in -> layout_check', () => {
  const PLAN = 'plan = random_layout(["early", "mid", "late", "none"], seed: 31, blocks: 5)';

  function sheetOf(formula: string): string {
    const { engine } = run(doc('--- formula', formula));
    return runSheet(tab(valueOf(engine, 'plan')), ['yield']);
  }

  it('a filled-in run sheet read back as a table passes layout_check', () => {
    const sheet = sheetOf(PLAN);
    expect(sheet.split('\n')[0]).toBe('block,plot,treatment,yield');
    const filled = fillIn(sheet, (i) => (40 + ((i * 7) % 11) / 10).toFixed(1));
    const { engine } = run(doc('--- formula', PLAN, '--- table harvest', filled, '', '--- formula', 'check = layout_check(harvest, plan)'));
    const r = rec(valueOf(engine, 'check'));
    expect(r.fields.get('holds')).toBe(true);
    expect(r.fields.get('matched')).toBe(20);
    expect(r.fields.get('summary')).toBe(m.layoutHolds(20));
  });

  it('a plot whose measurement is missing still counts as present', () => {
    const filled = fillIn(sheetOf(PLAN), (i) => (i === 3 ? '' : '41.0'));
    const { engine } = run(doc('--- formula', PLAN, '--- table harvest', filled, '', '--- formula', 'check = layout_check(harvest, plan)'));
    expect(rec(valueOf(engine, 'check')).fields.get('holds')).toBe(true);
  });

  it('two treatments swapped in one block fail it, and both plots are named', () => {
    const lines = fillIn(sheetOf(PLAN), () => '40.0').split('\n');
    // block 3 is rows 9..12 of the sheet (after the header); swap the treatments of its plots 1 and 2
    const a = lines[9]!.split(',');
    const b = lines[10]!.split(',');
    expect([a[0], a[1], b[0], b[1]]).toEqual(['3', '1', '3', '2']);
    [a[2], b[2]] = [b[2]!, a[2]!];
    lines[9] = a.join(',');
    lines[10] = b.join(',');
    const { engine } = run(doc('--- formula', PLAN, '--- table harvest', lines.join('\n'), '', '--- formula', 'check = layout_check(harvest, plan)', '--- formula', 'ok = claim(check.holds, "the data follow the plan")'));
    const r = rec(valueOf(engine, 'check'));
    expect(r.fields.get('holds')).toBe(false);
    const differ = tab(r.fields.get('differ')!);
    expect(differ.rows).toBe(2);
    expect([...differ.columns[0]!.values]).toEqual(['3', '3']);
    expect([...differ.columns[1]!.values]).toEqual(['1', '2']);
    expect([...differ.columns[2]!.values]).toEqual([b[2], a[2]]);
    expect([...differ.columns[3]!.values]).toEqual([a[2], b[2]]);
    const summary = String(r.fields.get('summary'));
    expect(summary).toContain(`block 3, plot 1 has ${a[2]} in the data but ${b[2]} in the layout`);
    expect(summary).toContain(`block 3, plot 2 has ${b[2]} in the data but ${a[2]} in the layout`);
    const claim = valueOf(engine, 'ok');
    expect(typeof claim === 'object' && claim.kind === 'claim' && claim.holds).toBe(false);
  });

  it('missing and extra plots are listed; the data’s treatment column may have another name', () => {
    const { engine } = run(
      doc(
        '--- formula',
        'plan = random_layout(["a", "b"], seed: 3, blocks: 2)',
        '--- table data',
        'block,plot,variety,y',
        ...(() => {
          const t = tab(evalFormula('random_layout(["a", "b"], seed: 3, blocks: 2)'));
          const tr = t.columns[2]!.values as readonly string[];
          return [`1,1,${tr[0]},5`, `1,2,${tr[1]},6`, `2,1,${tr[2]},7`, '3,1,a,8'];
        })(),
        '',
        '--- formula',
        'check = layout_check(data, plan, treatment: "variety")',
      ),
    );
    const r = rec(valueOf(engine, 'check'));
    expect(r.fields.get('holds')).toBe(false);
    const missing = tab(r.fields.get('missing')!);
    expect([...missing.columns[0]!.values, ...missing.columns[1]!.values]).toEqual(['2', '2']);
    const extra = tab(r.fields.get('extra')!);
    expect([...extra.columns[0]!.values, ...extra.columns[1]!.values]).toEqual(['3', '1']);
    expect(String(r.fields.get('summary'))).toBe(m.differences([m.plotsMissingFromData(1, ['block 2, plot 2']), m.plotsNotInLayout(1, ['block 3, plot 1'])]));
  });

  it('a plot entered twice in the data is named with its rows, never matched to either', () => {
    const v = evalFormula(
      'layout_check(d, random_layout(["a", "b"], seed: 3, blocks: 2))',
      '--- table d',
      'block,plot,treatment,y',
      '1,1,b,5',
      '1,2,a,6',
      '2,1,b,7',
      '1,2,a,6.5',
      '2,2,a,8',
    );
    expect(errorText(v)).toContain(m.repeatedKey(true, 'block 1, plot 2', 2, 4));
  });

  it('data without the layout’s key columns get a plain error', () => {
    const v = evalFormula('layout_check(d, random_layout(["a", "b"], seed: 1, blocks: 2))', '--- table d', 'plot,treatment', '1,a');
    expect(errorText(v)).toContain(m.dataLacks('block'));
  });

  it('a sheet written from a hostile treatment name cannot run as a spreadsheet formula', () => {
    const t = tab(evalFormula('random_layout(["=1+1", "@x", "plain"], seed: 1, replicates: 1)'));
    const text = runSheet(t, ['y']);
    for (const line of text.trimEnd().split('\n').slice(1)) expect(line.split(',')[1]).toMatch(/^('=|'@|plain)/);
  });
});

describe('the design warning: a fit that ignores the blocks of its data', () => {
  const warned = (text: string, name: string): string[] => {
    const { states } = run(text);
    const s = states.find((x) => x.name === name);
    if (s === undefined) throw new Error(`no cell ${name}`);
    if (isError(s.value)) throw new Error(s.value.message);
    return s.warnings.filter((w) => /exactly once per level/.test(w));
  };
  const sample = (file: string, ...cells: string[]): string => `${readFileSync(`samples/${file}`, 'utf8')}\n${cells.join('\n')}\n`;

  it('fires on the paired sample analysed as two independent groups, and names the pairing column and the analysis', () => {
    const w = warned(sample('tread-wear.furrow'), 'as_groups');
    expect(w).toEqual([
      m.ignoredBlocks('tread', 'van', 'compound', 'two_sample', 'blocked(tread.wear_mm, tread.compound, tread.van) (the paired comparison)'),
    ]);
    expect(warned(sample('tread-wear.furrow', '--- formula', 'r = rank_sum(tread.wear_mm, tread.compound)'), 'r')[0]).toMatch(/rank_sum ignores it .* signed_rank on the pairs, or friedman\(tread\.wear_mm, tread\.compound, tread\.van\)/);
  });

  it('fires on the blocked sample (which has a missing plot) analysed as one-way and by Kruskal-Wallis', () => {
    const text = sample('adhesive-cure.furrow', '--- formula', 'wrong = one_way(coupons.shear_mpa, coupons.cure)', '--- formula', 'ranks = kruskal_wallis(coupons.shear_mpa, coupons.cure)');
    expect(warned(text, 'wrong')).toEqual([
      m.ignoredBlocks('coupons', 'batch', 'cure', 'one_way', 'blocked(coupons.shear_mpa, coupons.cure, coupons.batch)'),
    ]);
    expect(warned(text, 'ranks')[0]).toMatch(/friedman\(coupons\.shear_mpa, coupons\.cure, coupons\.batch\) would use it/);
  });

  it('does not fire when the fit uses the block', () => {
    expect(warned(sample('adhesive-cure.furrow'), 'fit')).toEqual([]);
    expect(warned(sample('tread-wear.furrow'), 'as_blocks')).toEqual([]);
  });

  it('does not fire on a completely randomized trial, nor when a treatment is twice in a block', () => {
    const crd = doc('--- table t', 'plot,g,y', '1,a,1', '2,b,2', '3,a,3', '4,b,5', '5,a,2', '6,b,4', '', '--- formula', 'f = one_way(t.y, t.g)');
    expect(warned(crd, 'f')).toEqual([]);
    const twice = doc('--- table t', 'block,g,y', '1,a,1', '1,a,2', '1,b,3', '2,a,5', '2,b,2', '2,b,4', '', '--- formula', 'f = one_way(t.y, t.g)');
    expect(warned(twice, 'f')).toEqual([]);
  });

  it('does not fire when the columns do not come from one table', () => {
    const text = doc('--- table t', 'block,g,y', '1,a,1', '1,b,3', '2,a,5', '2,b,2', '', '--- formula', 'yy = t.y', '--- formula', 'f = two_sample(yy, t.g)');
    expect(warned(text, 'f')).toEqual([]);
  });

  it('fires on a filtered table too, naming the columns alone', () => {
    const text = doc('--- table t', 'site,block,g,y', 'x,1,a,1', 'x,1,b,3', 'x,2,a,5', 'x,2,b,2', 'z,1,a,4', 'z,1,a,4.5', '', '--- formula', 'f = two_sample(t[t.site == "x"].y, t[t.site == "x"].g)');
    expect(warned(text, 'f')).toEqual([
      m.ignoredBlocks('', 'block', 'g', 'two_sample', 'blocked(y, g, block) (the paired comparison)'),
    ]);
  });

  it('a column name that is not a plain name is written as the user would write it', () => {
    const text = doc('--- table t', '"pair no",g,y', '1,a,1', '1,b,3', '2,a,5', '2,b,2', '3,a,4', '3,b,4.5', '', '--- formula', 'f = two_sample(t["y"], t.g)');
    expect(warned(text, 'f')[0]).toMatch(/column "pair no" .* blocked\(t\.y, t\.g, t\["pair no"\]\)/);
  });
});

describe('the charts', () => {
  it('layout_chart: one labelled plot per plot, Okabe-Ito colours, drawn without warnings', async () => {
    const v = evalFormula('layout_chart(random_layout(["early", "mid", "late", "none"], seed: 8, blocks: 6))') as Chart;
    expect(v.kind).toBe('chart');
    const spec = v.spec as { layer: { mark: { type: string }; encoding: { color?: { scale: { range: string[] } } } }[]; data: { values: { t: string }[] } };
    expect(spec.data.values.length).toBe(24);
    expect(spec.layer.map((l) => l.mark.type)).toEqual(['rect', 'text']);
    expect(spec.layer[0]!.encoding.color!.scale.range).toEqual([...OKABE_ITO]);
    const r = await renderSvg(v.spec);
    expect(r.warnings).toEqual([]);
    // every plot's label is in the drawing
    const labels = [...r.svg.matchAll(/<text[^>]*>(early|mid|late|none)<\/text>/g)].length;
    // 24 plot labels, and the legend's 4 labels, which are drawn as text too
    expect(labels).toBe(24 + 4);
    expect(v.caption).toBe('24 plots in 6 blocks of 4 plots; 4 treatments, each plot labelled with its treatment; drawn with seed 8.');
  });

  it('layout_chart never cuts a long treatment name short', async () => {
    const v = evalFormula('layout_chart(random_layout(["fescue_mix", "quickpatch", "hardwear", "rye_blend", "a much longer name"], seed: 3, blocks: 2))') as Chart;
    const r = await renderSvg(v.spec);
    const labels = [...r.svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]!);
    expect(labels.filter((l) => l === 'a much longer name').length).toBe(2 + 1);
    expect(labels.some((l) => l.includes('…'))).toBe(false);
  });

  it('layout_chart draws a Latin square by rows and columns and a plan without blocks ten plots to a row', () => {
    const sq = evalFormula('layout_chart(latin_layout(["A", "B", "C"], seed: 2))') as Chart;
    expect(sq.caption).toMatch(/^9 plots in 3 rows of 3 columns/);
    const crd = evalFormula('layout_chart(random_layout(["A", "B"], seed: 2, replicates: 12))') as Chart;
    expect(crd.caption).toMatch(/^24 plots in 3 rows of 10 plots/);
  });

  it('a map too large to read is refused with a way to draw it in parts, which works', () => {
    const before = ['--- formula', 'plan = random_layout(["a", "b", "c", "d"], seed: 1, blocks: 1500)'];
    expect(errorText(evalFormula('layout_chart(plan)', ...before))).toContain(m.mapTooLarge(6000, 5000, 'plan[plan.block <= 20]'));
    expect((evalFormula('layout_chart(plan[plan.block <= 20])', ...before) as Chart).caption).toMatch(/^80 plots in 20 blocks/);
  });

  it('layout_check matches a Latin square on row and column', () => {
    const { engine } = run(
      doc('--- formula', 'sq = latin_layout(["A", "B", "C"], seed: 4)', '--- formula', 'check = layout_check(sq, sq)', '--- formula', 'map = layout_chart(sq)'),
    );
    const r = rec(valueOf(engine, 'check'));
    expect(r.fields.get('holds')).toBe(true);
    expect(tab(r.fields.get('missing')!).names).toEqual(['row', 'column', 'treatment']);
  });

  it('power_chart of a two-group plan runs over plots per group', () => {
    const v = evalFormula('power_chart(replicates_for_power(1, 1))') as Chart;
    expect(v.caption).toBe('Power from 2 to 34 plots per group; the plan marked has 17 plots per group and power 0.807; the dashed line is the power asked for (80%).');
    // source: scipy 1.10.1 (stats.nct, as in fixtures/planning_power.py): n = 30, delta = sd = 1 gives 0.9677083
    const p = evalFormula('power_chart(power_two_sample(1, 1, 30))') as Chart;
    expect(p.caption).toBe('Power from 2 to 60 plots per group; the plan marked has 30 plots per group and power 0.968.');
  });

  it('power_chart marks the plan and the power asked for', async () => {
    const v = evalFormula('power_chart(blocks_for_power(1, 1, 4))') as Chart;
    expect(v.caption).toBe('Power from 2 to 48 blocks; the plan marked has 24 blocks and power 0.817; the dashed line is the power asked for (80%).');
    const r = await renderSvg(v.spec);
    expect(r.warnings).toEqual([]);
  });
});

describe('a split-plot layout through a document', () => {
  const PLAN = 'plan = split_plot_layout(["dry", "irrigated", "mulched"], ["A", "B", "C", "D"], seed: 7, blocks: 4)';

  it('says how it was drawn, with both factors', () => {
    const d = rec(evalFormula('layout_details(split_plot_layout(["dry", "wet"], [30, 60, 90], seed: 5, blocks: 3))'));
    expect(d.fields.get('design')).toBe('split plot in randomized complete blocks');
    expect(d.fields.get('drawn_by')).toBe('split_plot_layout');
    expect(d.fields.get('seed')).toBe(5);
    expect(d.fields.get('blocks')).toBe(3);
    expect(d.fields.get('plots')).toBe(18);
    expect(toJson(d.fields.get('whole_treatments')!)).toBe('["dry","wet"]');
    expect(toJson(d.fields.get('sub_treatments')!)).toBe('["30","60","90"]');
    // numbers given as numbers stay numbers in the layout's column
    const t = tab(evalFormula('split_plot_layout(["dry", "wet"], [30, 60, 90], seed: 5, blocks: 3)'));
    const sub = t.columns[t.names.indexOf('sub')]!;
    expect(sub.type).toBe('number');
  });

  it('maps each plot labelled with both treatments and coloured by its whole plot', async () => {
    const v = evalFormula(`layout_chart(${PLAN.slice('plan = '.length)})`) as Chart;
    const spec = v.spec as { layer: { encoding: { color?: { field: string; title: string; scale: { domain: string[] } } } }[]; data: { values: { t: string; c: string }[] } };
    expect(spec.data.values.length).toBe(48);
    expect(spec.layer[0]!.encoding.color!.field).toBe('c');
    expect(spec.layer[0]!.encoding.color!.title).toBe('whole-plot treatment');
    expect(spec.layer[0]!.encoding.color!.scale.domain).toEqual(['dry', 'irrigated', 'mulched']);
    expect(spec.data.values.every((p) => p.t.startsWith(`${p.c} / `))).toBe(true);
    const r = await renderSvg(v.spec);
    expect(r.warnings).toEqual([]);
    expect([...r.svg.matchAll(/<text[^>]*>(dry|irrigated|mulched) \/ [ABCD]<\/text>/g)].length).toBe(48);
    expect(v.caption).toBe('48 plots in 4 blocks of 12 plots; 12 treatments, each plot labelled with its treatment, coloured by its whole-plot treatment; drawn with seed 7.');
  });

  it('goes to a run sheet, comes back as data that pass layout_check, and is analysed by split_plot', () => {
    const { engine } = run(doc('--- formula', PLAN));
    const sheet = runSheet(tab(valueOf(engine, 'plan')), ['yield']);
    expect(sheet.split('\n')[0]).toBe('block,whole_plot,plot,whole,sub,treatment,yield');
    // invented yields: block, whole-plot and subplot effects and a small deterministic scatter
    const rows = sheet.trimEnd().split('\n').slice(1).map((l) => l.split(','));
    const effect = (r: string[], i: number): string =>
      (50 + Number(r[0]) + { dry: -4, irrigated: 3, mulched: 1 }[r[3]!]! + { A: 0, B: 2, C: -1, D: 1.5 }[r[4]!]! + (((i * 37) % 17) - 8) / 10).toFixed(1);
    const filled = ['block,whole_plot,plot,whole,sub,treatment,yield', ...rows.map((r, i) => [...r.slice(0, 6), effect(r, i)].join(','))].join('\n');
    const { engine: e2, states } = run(
      doc('--- formula', PLAN, '--- table harvest', filled, '', '--- formula', 'check = layout_check(harvest, plan)', '--- formula', 'fit = split_plot(harvest.yield, harvest.whole, harvest.sub, harvest.block)'),
    );
    expect(rec(valueOf(e2, 'check')).fields.get('holds')).toBe(true);
    const fit = rec(valueOf(e2, 'fit'));
    const table = tab(fit.fields.get('table')!);
    const df = table.columns[table.names.indexOf('df')]!.values as Float64Array;
    const source = table.columns[table.names.indexOf('source')]!.values as string[];
    // degrees of freedom of a split plot in b = 4 blocks, w = 3 whole-plot and s = 4 subplot
    // treatments (the standard partition, from memory): whole_error (b - 1)(w - 1) = 6, the
    // split-plot error w (b - 1)(s - 1) = 27; with blocks 3, whole 2, sub 3 and their
    // interaction 6 they add up to the 47 of 48 plots
    const dfOf = (name: string): number => df[source.indexOf(name)]!;
    expect(dfOf('whole_error')).toBe(6);
    expect(dfOf('error')).toBe(27);
    expect(source.filter((x) => x !== 'total').reduce((a, x) => a + dfOf(x), 0)).toBe(47);
    // no warning that the data are not a split plot: the layout's whole plots are whole plots
    expect(states.flatMap((s) => s.warnings)).toEqual([]);
  });

  it('refuses bad input on its cell, naming the factor', () => {
    expect(errorText(evalFormula('split_plot_layout(["dry"], ["A", "B"], seed: 1, blocks: 2)'))).toContain(m.ofFactor('whole-plot', m.fewTreatments(1)));
    expect(errorText(evalFormula('split_plot_layout(["dry", "wet"], ["A", "A"], seed: 1, blocks: 2)'))).toContain(m.ofFactor('subplot', m.duplicateTreatment('A')));
    expect(errorText(evalFormula('split_plot_layout(["dry", "wet"], ["A", "B"], seed: -1, blocks: 2)'))).toContain(m.seedNotWhole(-1));
    expect(errorText(evalFormula('split_plot_layout(["dry", "wet"], ["A", "B"], seed: 1, blocks: 0)'))).toContain(m.countNotWhole('blocks', 0, 1));
    // two pairs that would share a label cannot be told apart on the map or by layout_check
    expect(errorText(evalFormula('split_plot_layout(["a / b", "a"], ["c", "b / c"], seed: 1, blocks: 2)'))).toContain(m.splitLabelsClash('a / b / c'));
    // a name that holds the separator is fine while every label stays its own
    expect(isTable(evalFormula('split_plot_layout(["N / P", "none"], ["early", "late"], seed: 1, blocks: 2)'))).toBe(true);
  });

  it('drawn in one block, says that the whole-plot treatments will have nothing to be tested against', () => {
    const { states } = run(doc('--- formula', 'plan = split_plot_layout(["dry", "wet"], ["A", "B", "C"], seed: 3, blocks: 1)'));
    expect(states[0]!.error).toBeNull();
    expect(states[0]!.warnings).toEqual([`${m.splitOneBlock()}.`]);
    const { states: two } = run(doc('--- formula', 'plan = split_plot_layout(["dry", "wet"], ["A", "B", "C"], seed: 3, blocks: 2)'));
    expect(two[0]!.warnings).toEqual([]);
  });
});
