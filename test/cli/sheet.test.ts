/**
 * `furrow sheet FILE NAME -o plan.csv` (src/cli/sheet.ts), and the design warning in
 * `furrow run`.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { DEFAULT_MEASUREMENTS } from '../../src/doc/run-sheet.ts';
import { cliMsg } from '../../src/messages/cli.ts';
import { planningMsg } from '../../src/messages/planning.ts';

function cli(...args: string[]): { code: number; out: string; err: string } {
  const out: string[] = [];
  const err: string[] = [];
  const code = main(args, { out: (s) => out.push(s), err: (s) => err.push(s) }) as number; // run and sheet are synchronous
  return { code, out: out.join('\n'), err: err.join('\n') };
}

const PLAN = 'furrow 1\ntitle: plan\n\n--- formula\nplan = random_layout(["early", "mid", "late"], seed: 2026, blocks: 4)\n\n--- formula\nn = 3\n';

function scratch(text: string): string {
  const dir = mkdtempSync(join(tmpdir(), 'furrow-sheet-'));
  writeFileSync(join(dir, 'plan.furrow'), text);
  return dir;
}

describe('furrow sheet', () => {
  it('writes the layout with empty measurement columns to a file', () => {
    const dir = scratch(PLAN);
    const r = cli('sheet', join(dir, 'plan.furrow'), 'plan', '-o', join(dir, 'plan.csv'), '--columns', 'yield_kg,notes');
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    // the same plan as the byte-for-byte pin in test/functions/planning.test.ts
    expect(readFileSync(join(dir, 'plan.csv'), 'utf8')).toBe(
      'block,plot,treatment,yield_kg,notes\n1,1,early,,\n1,2,late,,\n1,3,mid,,\n2,1,late,,\n2,2,early,,\n2,3,mid,,\n3,1,late,,\n3,2,early,,\n3,3,mid,,\n4,1,late,,\n4,2,mid,,\n4,3,early,,\n',
    );
  });

  it('prints to standard output without -o, with the default measurement columns', () => {
    const r = cli('sheet', join(scratch(PLAN), 'plan.furrow'), 'plan');
    expect(r.code).toBe(0);
    expect(r.out.split('\n')[0]).toBe('block,plot,treatment,measurement,notes');
    expect(r.out.split('\n').length).toBe(13);
  });

  it('never writes over a sheet that has been filled in, unless told to', () => {
    const dir = scratch(PLAN);
    const doc = join(dir, 'plan.furrow');
    const out = join(dir, 'plan.csv');
    expect(cli('sheet', doc, 'plan', '-o', out).code).toBe(0);
    const blank = readFileSync(out, 'utf8');
    // the same sheet again: nothing to lose, so it succeeds and the file is unchanged
    expect(cli('sheet', doc, 'plan', '-o', out)).toMatchObject({ code: 0, err: '' });
    expect(readFileSync(out, 'utf8')).toBe(blank);
    // a measurement typed into the sheet: running the command again keeps it
    const filled = blank.replace('1,1,early,,', '1,1,early,41.7,dry');
    expect(filled).not.toBe(blank);
    writeFileSync(out, filled);
    expect(cli('sheet', doc, 'plan', '-o', out)).toMatchObject({ code: 2, err: cliMsg.sheetWouldOverwrite(out) });
    expect(readFileSync(out, 'utf8')).toBe(filled);
    // other columns asked for: still a different sheet, still kept
    expect(cli('sheet', doc, 'plan', '-o', out, '--columns', 'y').code).toBe(2);
    expect(readFileSync(out, 'utf8')).toBe(filled);
    // said plainly: written over
    expect(cli('sheet', doc, 'plan', '-o', out, '--replace')).toMatchObject({ code: 0, err: '' });
    expect(readFileSync(out, 'utf8')).toBe(blank);
    // never over the document itself, even with --replace
    const before = readFileSync(doc, 'utf8');
    expect(cli('sheet', doc, 'plan', '-o', doc, '--replace')).toMatchObject({ code: 2, err: cliMsg.sheetOverDocument() });
    expect(readFileSync(doc, 'utf8')).toBe(before);
  });

  it('the whole round: sheet to a file, filled in, read back from the file, checked against the plan in furrow run', () => {
    const dir = scratch(PLAN);
    const sheet = join(dir, 'plan.csv');
    expect(cli('sheet', join(dir, 'plan.furrow'), 'plan', '-o', sheet, '--columns', 'yield_kg,notes').code).toBe(0);
    const lines = readFileSync(sheet, 'utf8').trimEnd().split('\n');
    const filled = [lines[0]!, ...lines.slice(1).map((l, i) => l.replace(/,,$/, `,${(30 + i * 0.7).toFixed(1)},`))];
    writeFileSync(sheet, `${filled.join('\n')}\n`);
    const checked = PLAN + '\n--- table harvest from plan.csv\n--- formula\ncheck = layout_check(harvest, plan)\n\n--- formula\nok = claim(check.holds, "the harvest follows the plan")\n';
    writeFileSync(join(dir, 'checked.furrow'), checked);
    const r = cli('run', join(dir, 'checked.furrow'), '--json');
    expect(r.code, r.err).toBe(0);
    const cells = (JSON.parse(r.out) as { cells: { name: string | null; value: unknown }[] }).cells;
    expect(cells.find((c) => c.name === 'check')!.value).toMatchObject({ holds: true, plots: 12, matched: 12 });
    // two treatments swapped in block 2 of the file: the check fails and names both plots
    const [x, y] = [filled[4]!.split(','), filled[5]!.split(',')];
    expect([x[0], x[1], y[0], y[1]]).toEqual(['2', '1', '2', '2']);
    [x[2], y[2]] = [y[2]!, x[2]!];
    filled[4] = x.join(',');
    filled[5] = y.join(',');
    writeFileSync(sheet, `${filled.join('\n')}\n`);
    const s2 = (JSON.parse(cli('run', join(dir, 'checked.furrow'), '--json').out) as { cells: { name: string | null; value: unknown }[] }).cells;
    const check = s2.find((c) => c.name === 'check')!.value as { holds: boolean; summary: string };
    expect(check.holds).toBe(false);
    expect(check.summary).toContain(planningMsg.plotDiffers('block 2, plot 1', x[2]!, y[2]!));
    expect(check.summary).toContain(planningMsg.plotDiffers('block 2, plot 2', y[2]!, x[2]!));
  });

  it('says plainly what is wrong, with exit status 2', () => {
    const dir = scratch(PLAN);
    const f = join(dir, 'plan.furrow');
    expect(cli('sheet', f, 'nope')).toMatchObject({ code: 2, err: cliMsg.sheetNoCell(f, 'nope') });
    expect(cli('sheet', f, 'n')).toMatchObject({ code: 2, err: cliMsg.sheetNotTable('n', 'a number') });
    expect(cli('sheet', f, 'plan', '--columns', 'plot')).toMatchObject({ code: 2, err: cliMsg.sheetFailure(planningMsg.measurementTaken('plot')) });
    expect(cli('sheet', f)).toMatchObject({ code: 2, err: cliMsg.sheetArguments(cliMsg.sheetUsage(DEFAULT_MEASUREMENTS)) });
    expect(cli('sheet', join(dir, 'missing.furrow'), 'plan')).toMatchObject({ code: 2, err: expect.stringMatching(/does not exist/) });
    expect(cli('sheet', f, 'plan', '--bogus')).toMatchObject({ code: 2, err: cliMsg.sheetUnknownOption('--bogus', cliMsg.sheetUsage(DEFAULT_MEASUREMENTS)) });
  });
});

describe('furrow run shows the design warning', () => {
  it('on the paired sample analysed as two groups, in the text and in the JSON', () => {
    const r = cli('run', 'samples/tread-wear.furrow');
    expect(r.out).toMatch(/note: Table "tread" has a column "van" in which every compound appears exactly once per level/);
    const j = JSON.parse(cli('run', 'samples/tread-wear.furrow', '--json').out) as { cells: { name: string | null; warnings?: string[] }[] };
    const cell = j.cells.find((c) => c.name === 'as_groups')!;
    expect(cell.warnings!.some((w) => /two_sample ignores it/.test(w))).toBe(true);
    expect(j.cells.find((c) => c.name === 'as_blocks')!.warnings ?? []).toEqual([]);
  });
});
