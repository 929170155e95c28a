/**
 * Files a hostile document may point the command line at: links out of the folder, devices,
 * pipes, huge files, bytes that are not UTF-8. Each ends in one plain line and status 2,
 * within a time bound, never a hang or an unbounded read.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, symlinkSync, truncateSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CSV_LIMIT_BYTES, DOCUMENT_LIMIT_BYTES, FileProblem, readBytes, readText } from '../../src/cli/files.ts';
import { cliMsg } from '../../src/messages/cli.ts';
import { main } from '../../src/cli/main.ts';

function cli(...args: string[]): { code: number; out: string; err: string } {
  const out: string[] = [];
  const err: string[] = [];
  const code = main(args, { out: (s) => out.push(s), err: (s) => err.push(s) }) as number; // run and sheet are synchronous
  return { code, out: out.join('\n'), err: err.join('\n') };
}

const DOC = 'furrow 1\ntitle: t\n\n--- table plots from plots.csv\n--- formula\nm = mean(plots.y)\n';

function folder(): string {
  return mkdtempSync(join(tmpdir(), 'furrow-files-'));
}

describe('files beside a document', () => {
  it('a link that leads out of the folder is not followed', () => {
    const outside = folder();
    writeFileSync(join(outside, 'secret.csv'), 'y\n42\n');
    const dir = folder();
    writeFileSync(join(dir, 'd.furrow'), DOC);
    symlinkSync(join(outside, 'secret.csv'), join(dir, 'plots.csv'));
    const r = cli('run', join(dir, 'd.furrow'));
    expect(r.code).toBe(2);
    expect(r.err).toContain(cliMsg.outsideFolder('plots.csv'));
    expect(r.out).not.toContain('42');
  });

  it('a link inside the folder is followed', () => {
    const dir = folder();
    writeFileSync(join(dir, 'd.furrow'), DOC);
    writeFileSync(join(dir, 'real.csv'), 'y\n4\n6\n');
    symlinkSync(join(dir, 'real.csv'), join(dir, 'plots.csv'));
    const r = cli('run', join(dir, 'd.furrow'), '--json');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).cells[1].value).toBe(5);
  });

  it('a link to a device that never ends is refused at once', () => {
    const dir = folder();
    writeFileSync(join(dir, 'd.furrow'), DOC);
    symlinkSync('/dev/zero', join(dir, 'plots.csv'));
    const t0 = performance.now();
    const r = cli('run', join(dir, 'd.furrow'));
    expect(r.code).toBe(2);
    expect(r.err).toContain(cliMsg.outsideFolder('plots.csv'));
    expect(performance.now() - t0).toBeLessThan(5000);
  });

  it('a pipe is refused without waiting for a writer', () => {
    const dir = folder();
    writeFileSync(join(dir, 'd.furrow'), DOC);
    execFileSync('mkfifo', [join(dir, 'plots.csv')]);
    const t0 = performance.now();
    const r = cli('run', join(dir, 'd.furrow'));
    expect(r.code).toBe(2);
    expect(r.err).toContain(cliMsg.notRegular(cliMsg.theCsvFile(), join(dir, 'plots.csv')).slice(1));
    expect(performance.now() - t0).toBeLessThan(5000);
    // and a pipe given as the document itself
    const p = join(dir, 'doc.fifo');
    execFileSync('mkfifo', [p]);
    const d = cli('run', p);
    expect(d.code).toBe(2);
    expect(d.err).toBe(cliMsg.failure(cliMsg.notRegular(cliMsg.theDocument(), p)));
  });

  it('a CSV file past the limit is refused by its size, before it is read', () => {
    const dir = folder();
    writeFileSync(join(dir, 'd.furrow'), DOC);
    // a sparse file: its size is past the limit, its blocks cost nothing
    writeFileSync(join(dir, 'plots.csv'), 'y\n');
    truncateSync(join(dir, 'plots.csv'), CSV_LIMIT_BYTES + 1);
    const t0 = performance.now();
    const r = cli('run', join(dir, 'd.furrow'));
    expect(r.code).toBe(2);
    // the table's line lowercases the message's first letter after "but"
    expect(r.err).toContain(cliMsg.tooLarge(cliMsg.theCsvFile(), join(dir, 'plots.csv'), CSV_LIMIT_BYTES).slice(1));
    expect(performance.now() - t0).toBeLessThan(5000);
  });

  it('a document past the limit is refused for its size, not for its bytes', () => {
    const dir = folder();
    const p = join(dir, 'big.furrow');
    writeFileSync(p, DOC);
    truncateSync(p, DOCUMENT_LIMIT_BYTES * 10);
    const r = cli('run', p);
    expect(r.code).toBe(2);
    expect(r.err).toContain(cliMsg.tooLarge(cliMsg.theDocument(), p, DOCUMENT_LIMIT_BYTES));
    expect(r.err).not.toMatch(/UTF-8/);
  });

  it('the read stops at the limit, whatever the file says its size is', () => {
    const dir = folder();
    const p = join(dir, 'f.csv');
    writeFileSync(p, 'x'.repeat(5000));
    expect(readBytes(p, 'the file', 5000).length).toBe(5000);
    expect(() => readBytes(p, 'the file', 4999)).toThrow(FileProblem);
  });

  it('bytes that are not UTF-8 are refused, not replaced', () => {
    const dir = folder();
    writeFileSync(join(dir, 'd.furrow'), DOC);
    writeFileSync(join(dir, 'plots.csv'), Buffer.from([0x79, 0x0a, 0xff, 0x0a]));
    const r = cli('run', join(dir, 'd.furrow'));
    expect(r.code).toBe(2);
    expect(r.err).toContain(cliMsg.notUtf8(cliMsg.theCsvFile(), join(dir, 'plots.csv')).slice(1));
  });

  it('reads plain ASCII and UTF-8 text the same as the standard decoder, whichever way it takes', () => {
    // readText takes a quicker way for ASCII files; both ways must give the decoder's text
    const dir = folder();
    const texts = [
      'y,note\n1.5,plain\r\n2,"quoted, with comma"\n',
      '\u0000\u0001\u007f~ all ASCII control and edge bytes\n',
      'y,site\n3.25,Gr\u00fcnfeld \u2013 north\n4,\u6771\n5,\ud83c\udf31\n',
      '\ufeffy\n1\n', // a byte-order mark is kept as a character, as the decoder keeps it
      '',
    ];
    for (const [i, t] of texts.entries()) {
      const p = join(dir, `t${i}.csv`);
      writeFileSync(p, t, 'utf8');
      const decoded = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(readBytes(p, 'the file', 1000));
      expect(readText(p, 'the file', 1000)).toBe(decoded);
      expect(readText(p, 'the file', 1000)).toBe(t);
    }
    // one byte past ASCII in the middle of a long ASCII run: still refused when it is not UTF-8
    const p = join(dir, 'late.csv');
    writeFileSync(p, Buffer.concat([Buffer.from('y\n'.concat('1\n'.repeat(50_000))), Buffer.from([0xc3, 0x28, 0x0a])]));
    expect(() => readText(p, 'the file', 1_000_000)).toThrow(FileProblem);
  });
});

describe('what reaches the terminal', () => {
  it('shows control characters from a document as escapes, never raw', () => {
    const dir = folder();
    const esc = '\u001b';
    writeFileSync(
      join(dir, 'd.furrow'),
      `furrow 1\ntitle: Trial${esc}[2J${esc}]0;owned\u0007\n\n--- note\nAll fine${esc}[8m hidden\r5 cells, all evaluated.\u202E\n\n--- table t\n"na${esc}[1mme",x\n"va${esc}[31mlue",1\n`,
    );
    const r = cli('run', join(dir, 'd.furrow'));
    expect(r.out).not.toMatch(/[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u202e]/);
    expect(r.out).toContain('Trial\\x1B[2J\\x1B]0;owned\\x07');
    expect(r.out).toContain('All fine\\x1B[8m hidden\\x0D5 cells, all evaluated.\\u202E');
    expect(r.out).toContain('na\\x1B[1mme');
    expect(r.out).toContain('va\\x1B[31mlue');
  });

  it('ends quietly when the reader of its output goes away', () => {
    const dir = folder();
    writeFileSync(join(dir, 'd.furrow'), `furrow 1\n${Array.from({ length: 3000 }, (_, i) => `--- formula\nx${i} = ${i}\n`).join('')}`);
    const r = spawnSync('sh', ['-c', `node bin/furrow.js run ${join(dir, 'd.furrow')} | head -n 1`], { encoding: 'utf8' });
    expect(r.stdout.split('\n').length).toBeLessThanOrEqual(2);
    expect(r.stderr).not.toMatch(/EPIPE|Error|at /);
  });
});
