import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { cliMsg } from '../../src/messages/cli.ts';
import { fnMsg } from '../../src/messages/functions.ts';
import { msg } from '../../src/messages/language.ts';

function cli(...args: string[]): { code: number; out: string; err: string } {
  const out: string[] = [];
  const err: string[] = [];
  const code = main(args, { out: (s) => out.push(s), err: (s) => err.push(s) }) as number;
  return { code, out: out.join('\n'), err: err.join('\n') };
}

function scratch(files: Record<string, string | Buffer>): string {
  const dir = mkdtempSync(join(tmpdir(), 'furrow-cli-'));
  for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
  return dir;
}

const GOOD = 'furrow 1\ntitle: t\n\n--- table plots from plots.csv\n--- formula\nm = mean(plots.y)\n\n--- note\nmean {m}\n';

describe('furrow run', () => {
  it('runs every sample without errors', () => {
    const samples = readdirSync('samples').filter((f) => f.endsWith('.furrow'));
    expect(samples.length).toBeGreaterThan(0);
    for (const s of samples) {
      const r = cli('run', join('samples', s));
      expect(r.err, s).toBe('');
      expect(r.code, `${s}\n${r.out}`).toBe(0);
    }
  });
  it('every claim the samples make holds, so their notes say what the numbers say', () => {
    for (const s of readdirSync('samples').filter((f) => f.endsWith('.furrow'))) {
      const r = cli('run', join('samples', s), '--json');
      const claims = JSON.parse(r.out).cells.filter((c: { type: string }) => c.type === 'claim');
      expect(claims.length, s).toBeGreaterThan(0);
      for (const c of claims) expect(c.value.holds, `${s}: ${c.value.statement}`).toBe(true);
    }
  });
  it('prints the JSON of the contract', () => {
    const dir = scratch({ 'd.furrow': GOOD, 'plots.csv': 'y,g\n1,a\n2,b\n,c\n' });
    const r = cli('run', join(dir, 'd.furrow'), '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.furrow).toBe(1);
    expect(j.cells).toEqual([
      { index: 0, kind: 'table', name: 'plots', type: 'table', value: { y: [1, 2, null], g: ['a', 'b', 'c'] }, error: null },
      { index: 1, kind: 'formula', name: 'm', type: 'number', value: 1.5, error: null, warnings: [fnMsg.rowsLeftOut(1)] },
      { index: 2, kind: 'note', name: null, type: 'text', value: 'mean 1.5', error: null },
    ]);
  });
  it('writes non-finite numbers as texts and errors with their range; exits 1', () => {
    const dir = scratch({ 'd.furrow': 'furrow 1\n--- formula\na = 0 / 0\n--- formula\nb = [1 / 0, -1 / 0]\n--- formula\nc = nope\n' });
    const r = cli('run', join(dir, 'd.furrow'), '--json');
    expect(r.code).toBe(1);
    const j = JSON.parse(r.out);
    expect(j.cells[0].value).toBe('NaN');
    expect(j.cells[1].value).toEqual(['Infinity', '-Infinity']);
    expect(j.cells[2]).toEqual({
      index: 2,
      kind: 'formula',
      name: 'c',
      type: 'error',
      value: null,
      error: { message: msg.unknownName('nope', null), from: 4, to: 8 },
    });
  });
  it('prints readable text, with the file line of each error', () => {
    const dir = scratch({ 'd.furrow': 'furrow 1\ntitle: Readable\n\n--- formula\nx = 2 * 3\n\n--- formula\ny = x +\n' });
    const r = cli('run', join(dir, 'd.furrow'));
    expect(r.code).toBe(1);
    expect(r.out).toContain('Readable');
    expect(r.out).toContain(`${cliMsg.cellHeading(1, 'formula x')}\n    6`);
    expect(r.out).toContain(cliMsg.cellError(2, 'formula y', false, cliMsg.lineColumn(8, 7)));
    expect(r.out).toContain(cliMsg.runSummary(2, 1));
  });
  it('exits 2 with one clear line for a missing file', () => {
    const r = cli('run', 'no/such/file.furrow');
    expect(r.code).toBe(2);
    expect(r.err).toBe(cliMsg.failure(cliMsg.noSuchFile(cliMsg.theDocument(), 'no/such/file.furrow')));
    expect(r.out).toBe('');
  });
  it('exits 2 for a file that is not a document', () => {
    const dir = scratch({ 'data.csv': 'a,b\n1,2\n', 'bin.furrow': Buffer.from([0xff, 0xfe, 0x00, 0x41]) });
    const r = cli('run', join(dir, 'data.csv'));
    expect(r.code).toBe(2);
    expect(r.err).toBe(cliMsg.failure(cliMsg.documentProblem(join(dir, 'data.csv'), msg.notADocument())));
    expect(r.err.split('\n')).toHaveLength(1);
    const b = cli('run', join(dir, 'bin.furrow'));
    expect(b.code).toBe(2);
    expect(b.err).toBe(cliMsg.failure(cliMsg.notUtf8(cliMsg.theDocument(), join(dir, 'bin.furrow'))));
    expect(cli('run', dir).err).toBe(cliMsg.failure(cliMsg.isFolder(cliMsg.theDocument(), dir)));
  });
  it('exits 2 when a CSV file a table names is not there', () => {
    const dir = scratch({ 'd.furrow': GOOD });
    const r = cli('run', join(dir, 'd.furrow'));
    expect(r.code).toBe(2);
    expect(r.err).toBe(cliMsg.failure(cliMsg.tableFileProblem(join(dir, 'd.furrow'), 'table plots', 'plots.csv', cliMsg.noSuchFile(cliMsg.theCsvFile(), join(dir, 'plots.csv')))));
  });
  it('refuses a CSV file outside the document folder, on the table cell', () => {
    const dir = scratch({ 'd.furrow': 'furrow 1\n--- table t from ../etc/passwd\n' });
    const r = cli('run', join(dir, 'd.furrow'), '--json');
    expect(r.code).toBe(1);
    expect(JSON.parse(r.out).cells[0].error.message).toBe(msg.csvFileUnsafe('../etc/passwd'));
  });
  it('explains its usage', () => {
    expect(cli().code).toBe(2);
    expect(cli('--help').out).toBe(cliMsg.usage());
    expect(cli('frobnicate', 'x').err).toBe(cliMsg.unknownCommand('frobnicate', cliMsg.usage()));
    expect(cli('run', 'a', '--fast').err).toBe(cliMsg.unknownOption('--fast', cliMsg.usage()));
  });
  it('works as `npx furrow` through the package bin', () => {
    const out = execFileSync('npx', ['furrow', 'run', 'samples/adhesive-cure.furrow', '--json'], { encoding: 'utf8' });
    const j = JSON.parse(out);
    expect(j.furrow).toBe(1);
    expect(j.cells.length).toBeGreaterThan(3);
    const bad = spawnSync('npx', ['furrow', 'run', 'missing.furrow'], { encoding: 'utf8' });
    expect(bad.status).toBe(2);
    expect(bad.stderr.trim()).toBe(cliMsg.failure(cliMsg.noSuchFile(cliMsg.theDocument(), 'missing.furrow')));
  }, 60_000);
});

describe('a note whose placeholders read a failing cell', () => {
  it('prints each distinct error once, with every placeholder it reaches', () => {
    const dir = mkdtempSync(join(tmpdir(), 'furrow-note-errors-'));
    const path = join(dir, 'note.furrow');
    writeFileSync(path, 'furrow 1\n\n--- formula\nbad = 1 + \n\n--- note\nFirst {bad}, then {bad * 2}, and {nothing_here}.\n');
    const out: string[] = [];
    main(['run', path], { out: (s) => out.push(s), err: () => {} });
    const lines = out.join('\n').split('\n').filter((l) => /placeholder error/.test(l));
    expect(lines.length).toBe(2);
    expect(lines[0]).toBe(`    ${cliMsg.placeholderError(['line 7, column 8', 'line 7, column 20'], msg.upstream('bad'))}`);
    expect(lines[1]).toMatch(new RegExp(`^ {4}placeholder error at line 7, column 35: There is no cell or table called`));
  });
});
