/**
 * `furrow verify`: recompute a sealed document and name exactly what differs.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sameValue } from '../../src/lang/values.ts';
import { sealMsg } from '../../src/messages/seal.ts';
import { run } from '../helpers.ts';
import { cli, sampleCopies, scratch } from './support.ts';

/** Replaces the first occurrence of a line in a file (the test fails if it is not there). */
function editLine(path: string, from: string, to: string): void {
  const text = readFileSync(path, 'utf8');
  const lines = text.split('\n');
  const i = lines.indexOf(from);
  if (i < 0) throw new Error(`no line ${from} in ${path}`);
  lines[i] = to;
  writeFileSync(path, lines.join('\n'));
}

/** The names whose values differ between two documents, found by the engine itself. */
function changedNames(before: string, after: string): string[] {
  const a = run(before).engine;
  const b = run(after).engine;
  return a.definedNames().filter((n) => !sameValue(a.valueOf(n)!, b.valueOf(n)!));
}

function reported(out: string, state: string): string[] {
  return [...out.matchAll(new RegExp(`^  ${state} +(\\w+)`, 'gm'))].map((m) => m[1]!);
}

describe('furrow verify', () => {
  it('passes on every sealed sample', () => {
    for (const path of sampleCopies()) {
      expect(cli('seal', path).code).toBe(0);
      const r = cli('verify', path);
      expect(r.code, r.out).toBe(0);
      expect(r.out).toContain(sealMsg.verified());
      expect(r.out).toContain('Fingerprint: matches');
      expect(reported(r.out, 'changed')).toEqual([]);
    }
  });

  it('names exactly the cells whose values changed and the claims that now fail, after one measurement is edited', () => {
    const path = sampleCopies().find((p) => p.endsWith('backing-abrasion.furrow'))!;
    expect(cli('seal', path).code).toBe(0);
    const before = readFileSync(path, 'utf8');
    editLine(path, '1,M3,felt,36.9', '1,M3,felt,26.9');
    const r = cli('verify', path);
    expect(r.code).toBe(1);
    const expected = changedNames(before, readFileSync(path, 'utf8'));
    expect(expected.length).toBeGreaterThan(2);
    expect(reported(r.out, 'changed')).toEqual(expected);
    expect(r.out).toContain(sealMsg.valueWasNow('runs.loss_mg[3]', '36.9', '26.9', null));
    expect(r.out).toContain(`"felt loses more than woven" ${sealMsg.claimWho('felt_wears_most', 9)} ${sealMsg.claimStanding('no-longer', '')}`);
    expect(r.out).toContain(sealMsg.cellsChanged());
    expect(r.out).toContain(sealMsg.notVerified([sealMsg.reasonFingerprint(), sealMsg.reasonValues(expected.length), sealMsg.reasonClaims(1)]));
  });

  it('fails the fingerprint and names the data file when a CSV beside the document changes', () => {
    const dir = scratch({
      'd.furrow': 'furrow 1\ntitle: t\n\n--- table plots from plots.csv\n--- formula\nm = mean(plots.y)\n',
      'plots.csv': 'y,g\n1,a\n2,b\n',
    });
    const path = join(dir, 'd.furrow');
    expect(cli('seal', path).code).toBe(0);
    expect(readFileSync(path, 'utf8')).toMatch(/^data: \{"plots.csv":"sha256:[0-9a-f]{64}"\}$/m);
    expect(cli('verify', path).code).toBe(0);
    // the same numbers written differently: every value is the same, the fingerprint is not
    writeFileSync(join(dir, 'plots.csv'), 'y,g\n1.0,a\n2,b\n');
    const r = cli('verify', path);
    expect(r.code).toBe(1);
    expect(r.out).toContain('Fingerprint: DIFFERS');
    expect(r.out).toContain(sealMsg.dataChanged('plots.csv'));
    expect(r.out).not.toContain(sealMsg.cellsChanged());
    expect(reported(r.out, 'changed')).toEqual([]);
  });

  it('says which elements differ in a value sealed by digest', () => {
    const rows = Array.from({ length: 100_000 }, (_, i) => `${i % 10},${i / 4}`);
    const dir = scratch({ 'd.furrow': `furrow 1\ntitle: t\n\n--- table big\ng,y\n${rows.join('\n')}\n\n--- formula\nm = mean(big.y)\n` });
    const path = join(dir, 'd.furrow');
    expect(cli('seal', path).code).toBe(0);
    const at = 60_001; // row 60,001 of the table, line 60,006 of the file
    editLine(path, rows[at - 1]!, `${(at - 1) % 10},12345`);
    const r = cli('verify', path);
    expect(r.code).toBe(1);
    // blocks of 100,000 / 32 = 3,125 elements: row 60,001 is in the 20th, 59,376 to 62,500
    expect(r.out).toContain(sealMsg.runsDiffer('big.y', ['59376 to 62500'], 0, 100000));
    expect(r.out).not.toContain('big.g:');
    expect(reported(r.out, 'changed')).toEqual(['big', 'm']);
  });

  it('compares numbers bit for bit: one unit in the last place, and -0 for 0, are changes', () => {
    // 0.1 + 0.2 is 0.30000000000000004 in IEEE 754 binary64; the next double up is 0.3000000000000001
    const dir = scratch({ 'd.furrow': 'furrow 1\ntitle: t\n\n--- formula\na = 0.1 + 0.2\n\n--- formula\nb = -0\n\n--- formula\nc = 2\n' });
    const path = join(dir, 'd.furrow');
    expect(cli('seal', path).code).toBe(0);
    expect(cli('verify', path).code).toBe(0);
    editLine(path, 'a: 0.30000000000000004', 'a: 0.3000000000000001');
    editLine(path, 'b: -0', 'b: 0');
    const r = cli('verify', path);
    expect(r.code).toBe(1);
    expect(reported(r.out, 'changed')).toEqual(['a', 'b']);
    expect(reported(r.out, 'same')).toEqual(['c']);
    expect(r.out).toContain(sealMsg.valueWasNow('a', '0.3000000000000001', '0.30000000000000004', 1));
    expect(r.out).toContain(sealMsg.valueWasNow('b', '0', '-0', null));
  });

  it('says first when another engine version sealed the document', () => {
    const [path] = sampleCopies();
    expect(cli('seal', path!).code).toBe(0);
    editLine(path!, 'engine: furrow 0.1.0', 'engine: furrow 0.0.9');
    const r = cli('verify', path!);
    expect(r.code).toBe(1);
    expect(r.out.split('\n')[0]).toBe(sealMsg.otherEngine('furrow 0.0.9', 'furrow 0.1.0'));
  });

  it('reports values that are missing and new, and claims that are gone', () => {
    const dir = scratch({ 'd.furrow': 'furrow 1\ntitle: t\n\n--- formula\na = 1\n\n--- formula\nok = claim(a > 0, "a is positive")\n' });
    const path = join(dir, 'd.furrow');
    expect(cli('seal', path).code).toBe(0);
    editLine(path, 'a = 1', 'b = 1');
    const r = cli('verify', path);
    expect(r.code).toBe(1);
    expect(r.out).toMatch(/^ {2}missing +a$/m);
    expect(r.out).toMatch(/^ {2}new +b +\(cell 1\)$/m);
    expect(r.out).toContain(`"a is positive" ${sealMsg.claimWho('ok', 2)} ${sealMsg.claimStanding('error', sealMsg.claimCellError(''))}`);
  });

  describe('a sealed section edited by hand is reported in plain words, never a crash', () => {
    const sealedCopy = (): string => {
      const path = sampleCopies().find((p) => p.endsWith('tread-wear.furrow'))!;
      expect(cli('seal', path).code).toBe(0);
      return path;
    };
    const edit = (path: string, f: (lines: string[]) => string[]): void => {
      writeFileSync(path, f(readFileSync(path, 'utf8').split('\n')).join('\n'));
    };
    it('a line removed', () => {
      const path = sealedCopy();
      edit(path, (ls) => ls.filter((l) => !l.startsWith('fingerprint: ')));
      const r = cli('verify', path);
      expect(r.code).toBe(1);
      expect(r.out).toContain(sealMsg.sectionProblem(sealMsg.keyMissing('fingerprint')));
      expect(r.out).toContain(sealMsg.noFingerprint());
    });
    it('a value removed', () => {
      const path = sealedCopy();
      edit(path, (ls) => ls.filter((l) => !l.startsWith('as_pairs: ')));
      const r = cli('verify', path);
      expect(r.code).toBe(1);
      expect(r.out).toMatch(/^ {2}new +as_pairs/m);
    });
    it('a value altered', () => {
      const path = sealedCopy();
      edit(path, (ls) => ls.map((l) => (l.startsWith('as_pairs: ') ? l.replace(/"df":(\d+)/, (_m, d: string) => `"df":${Number(d) + 1}`) : l)));
      const r = cli('verify', path);
      expect(r.code).toBe(1);
      expect(r.out).toMatch(/as_pairs\.df: was \d+, now \d+/);
      expect(reported(r.out, 'changed')).toEqual(['as_pairs']);
    });
    it('a value that is not JSON', () => {
      const path = sealedCopy();
      edit(path, (ls) => ls.map((l) => (l.startsWith('as_pairs: ') ? l.slice(0, 40) : l)));
      const r = cli('verify', path);
      expect(r.code).toBe(1);
      expect(r.out).toMatch(/Sealed section: Line \d+: the sealed value of as_pairs cannot be read \(.+ at character \d+\)\./);
    });
    it('junk appended', () => {
      const path = sealedCopy();
      writeFileSync(path, `${readFileSync(path, 'utf8')}this is not part of a seal\n`);
      const r = cli('verify', path);
      expect(r.code).toBe(1);
      expect(r.out).toMatch(/Sealed section: Line \d+ of the sealed section is not "name: value": this is not part of a seal/);
    });
    it('a second sealed section', () => {
      const path = sealedCopy();
      const text = readFileSync(path, 'utf8');
      writeFileSync(path, text + text.slice(text.indexOf('--- sealed')));
      const r = cli('verify', path);
      expect(r.code).toBe(1);
      expect(r.out).toMatch(/The document has 2 sealed sections \(at lines \d+, \d+\); a sealed document has one\. The last one is checked\./);
    });
    it('no sealed section at all', () => {
      const [path] = sampleCopies();
      const r = cli('verify', path!);
      expect(r.code).toBe(1);
      expect(r.out).toContain(sealMsg.noSection());
    });
    it('a claim list altered', () => {
      const path = sealedCopy();
      edit(path, (ls) => ls.map((l) => (l.startsWith('claims: ') ? 'claims: [{"cell":1}]' : l)));
      const r = cli('verify', path);
      expect(r.code).toBe(1);
      expect(r.out).toContain('"claims:" should be a list of claims');
    });
  });
});
