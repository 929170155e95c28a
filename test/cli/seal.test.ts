/**
 * `furrow seal`: what the sealed section holds, how it is written, and that it reads back.
 */
import { createHash } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readDocument, writeDocument } from '../../src/doc/format.ts';
import { toJson } from '../../src/lang/json.ts';
import { fingerprint } from '../../src/seal/fingerprint.ts';
import { readSeal } from '../../src/seal/section.ts';
import { columnDigest } from '../../src/seal/sealed-json.ts';
import { run } from '../helpers.ts';
import { cli, sampleCopies, scratch } from './support.ts';
import { isNumberColumn, isTable } from '../../src/lang/values.ts';
import { cliMsg } from '../../src/messages/cli.ts';

const sealedPart = (text: string): string => text.slice(text.indexOf('--- sealed'));

describe('furrow seal', () => {
  it('seals every sample: one section at the end, that reads back and writes back byte for byte', () => {
    for (const path of sampleCopies()) {
      const before = readFileSync(path, 'utf8');
      const r = cli('seal', path);
      expect(r.err, path).toBe('');
      expect(r.code, r.out).toBe(0);
      const text = readFileSync(path, 'utf8');
      // the cells above the seal are untouched (the samples end in a line break)
      expect(text.startsWith(before), path).toBe(true);
      expect(text.match(/^--- sealed$/gm)?.length).toBe(1);
      expect(writeDocument(readDocument(text).document)).toBe(text);
      const doc = readDocument(text).document;
      const section = doc.cells[doc.cells.length - 1]!;
      expect(section.marker).toBe('sealed');
      const seal = readSeal(section.body, 1);
      expect(seal.problems).toEqual([]);
      expect(seal.engine).toBe('furrow 0.1.0');
      // every named value is sealed, in its canonical JSON when small
      const { states } = run(before);
      const names = states.filter((s) => s.name !== null).map((s) => s.name);
      expect([...seal.values.keys()]).toEqual(names);
      expect(seal.claims!.length).toBe(states.filter((s) => typeof s.value === 'object' && s.value.kind === 'claim').length);
      for (const s of states) {
        if (s.name === null || (typeof s.value === 'object' && s.value.kind === 'chart')) continue;
        if (typeof s.value === 'object' && s.value.kind === 'record' && [...s.value.fields.values()].some((f) => typeof f === 'object' && f.kind === 'chart')) continue;
        const line = text.split('\n').find((l) => l.startsWith(`${s.name}: `))!;
        expect(line.slice(s.name.length + 2), s.name).toBe(toJson(s.value));
      }
      // the seal does not count in its own fingerprint
      expect(seal.fingerprint).toBe(fingerprint(doc, new Map()).whole);
    }
  });

  it('replaces its section when sealing again, giving the same bytes', () => {
    for (const path of sampleCopies()) {
      expect(cli('seal', path).code).toBe(0);
      const once = readFileSync(path, 'utf8');
      expect(cli('seal', path).code).toBe(0);
      expect(readFileSync(path, 'utf8')).toBe(once);
    }
  });

  it('gives identical bytes in two separate processes', () => {
    const [a, b] = [sampleCopies()[0]!, sampleCopies()[0]!];
    for (const p of [a, b]) {
      const r = spawnSync(process.execPath, ['bin/furrow.js', 'seal', p], { encoding: 'utf8' });
      expect(r.status, r.stderr).toBe(0);
    }
    expect(readFileSync(a!, 'utf8')).toBe(readFileSync(b!, 'utf8'));
    expect(readFileSync(a!, 'utf8')).toContain('--- sealed');
  });

  it('closes a document that ends without a line break before sealing it', () => {
    const dir = scratch({ 'd.furrow': 'furrow 1\ntitle: t\n\n--- formula\nx = 1' });
    const path = join(dir, 'd.furrow');
    expect(cli('seal', path).code).toBe(0);
    const text = readFileSync(path, 'utf8');
    expect(text.startsWith('furrow 1\ntitle: t\n\n--- formula\nx = 1\n\n--- sealed\nengine: furrow 0.1.0\n')).toBe(true);
    expect(text.endsWith('\nx: 1\n')).toBe(true);
    expect(cli('verify', path).code).toBe(0);
  });

  it('keeps CRLF line ends when the document has them', () => {
    const dir = scratch({ 'd.furrow': 'furrow 1\r\ntitle: t\r\n\r\n--- formula\r\nx = 2\r\n' });
    const path = join(dir, 'd.furrow');
    expect(cli('seal', path).code).toBe(0);
    const text = readFileSync(path, 'utf8');
    expect(text).toContain('--- sealed\r\nengine: furrow 0.1.0\r\n');
    expect(text.replace(/\r\n/g, '')).not.toContain('\n');
    expect(cli('verify', path).code).toBe(0);
  });

  it('seals cells that hold errors as errors, says so and exits 1', () => {
    const dir = scratch({ 'd.furrow': 'furrow 1\ntitle: t\n\n--- formula\na = nope\n\n--- formula\nb = a + 1\n\n--- formula\nc = 2\n' });
    const path = join(dir, 'd.furrow');
    const r = cli('seal', path);
    expect(r.code).toBe(1);
    expect(r.out).toContain(cliMsg.sealedWithErrors(['a', 'b']));
    const text = readFileSync(path, 'utf8');
    expect(text).toMatch(/^a: \{"error":\{"message":".*nope.*","from":4,"to":8\}\}$/m);
    expect(text).toMatch(/^b: \{"error":\{"message":".*which has an error.*","from":4,"to":5\}\}$/m);
    expect(text).toContain('\nc: 2\n');
  });

  it('says which claims do not hold when it seals them', () => {
    const dir = scratch({ 'd.furrow': 'furrow 1\ntitle: t\n\n--- formula\na = 1\n\n--- formula\nlow = claim(a < 2, "a is below 2")\n\n--- formula\nhigh = claim(a > 2, "a is above 2")\n' });
    const path = join(dir, 'd.furrow');
    const r = cli('seal', path);
    expect(r.code).toBe(0);
    expect(r.out.split('\n')).toEqual([cliMsg.sealed(path, 3, 2), cliMsg.sealedFailingClaims(['a is above 2'])]);
    expect(readFileSync(path, 'utf8')).toContain('{"cell":3,"name":"high","holds":false,"statement":"a is above 2"}');
    // and verify does not pass it
    expect(cli('verify', path).code).toBe(1);
  });

  it('seals a long column by its length and digest, with the digest of its canonical JSON', () => {
    const rows = Array.from({ length: 2000 }, (_, i) => `${i % 7},${(i * 0.37).toFixed(2)}`);
    const dir = scratch({ 'd.furrow': `furrow 1\ntitle: t\n\n--- table big\ng,y\n${rows.join('\n')}\n\n--- formula\nm = mean(big.y)\n` });
    const path = join(dir, 'd.furrow');
    expect(cli('seal', path).code).toBe(0);
    const line = readFileSync(path, 'utf8').split('\n').find((l) => l.startsWith('big: '))!;
    const { engine } = run(readFileSync(path, 'utf8'));
    const big = engine.valueOf('big')!;
    if (!isTable(big) || !isNumberColumn(big.columns[1]!)) throw new Error('expected a table');
    // source: Node 20 crypto as the reference SHA-256 of the column's canonical JSON
    const ref = createHash('sha256').update(toJson(big.columns[1]!)).digest('hex');
    expect(line).toContain(`"y":{"length":2000,"sha256":"${ref}","blocks":[`);
    expect(line.slice(5)).toBe(`{"g":${columnDigest(big.columns[0]!)},"y":${columnDigest(big.columns[1]!)}}`);
    expect(line.length).toBeLessThan(1000);
  });

  it('leaves the original file whole when the process dies between writing and renaming', () => {
    const [path] = sampleCopies();
    const before = readFileSync(path!, 'utf8');
    const script = join(mkdtempSync(join(tmpdir(), 'furrow-crash-')), 'crash.mjs');
    const sealModule = resolve('src/cli/seal.ts');
    writeFileSync(
      script,
      // the command line loads the built-ins before it reads a document (src/cli/builtins.ts)
      `await (await import(${JSON.stringify(resolve('src/cli/builtins.ts'))})).loadBuiltins();\n` +
        `const { sealFile } = await import(${JSON.stringify(sealModule)});\n` +
        `sealFile(${JSON.stringify(path)}, () => process.kill(process.pid, 'SIGKILL'));\nconsole.log('not killed');\n`,
    );
    const r = spawnSync(process.execPath, ['--import', 'tsx', script], { encoding: 'utf8', cwd: resolve('.') });
    expect(r.signal, r.stderr).toBe('SIGKILL');
    expect(r.stdout).not.toContain('not killed');
    expect(readFileSync(path!, 'utf8')).toBe(before);
    // the complete temporary file was there, beside it, when the process died
    const dir = resolve(path!, '..');
    const temps = readdirSync(dir).filter((f) => f.endsWith('.sealing'));
    expect(temps.length).toBe(1);
    expect(sealedPart(readFileSync(join(dir, temps[0]!), 'utf8'))).toContain('engine: furrow 0.1.0');
  });

  it('refuses bad arguments with the usage', () => {
    expect(cli('seal').code).toBe(2);
    expect(cli('seal', 'a', 'b').err).toBe(cliMsg.takesOneFile('seal', cliMsg.usage()));
    expect(cli('seal', '/nonexistent/x.furrow').err).toBe(cliMsg.failure(cliMsg.noSuchFile(cliMsg.theDocument(), '/nonexistent/x.furrow')));
  });
});
