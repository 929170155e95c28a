/**
 * The report: what it shows, that it carries the document byte for byte, and that nothing
 * in it runs or loads.
 */
import { createHash } from 'node:crypto';
import { readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { reportHtml } from '../../src/cli/report.ts';
import { REPORT_CSS } from '../../src/report/style.ts';
import { reportPolicy } from '../../src/report/build.ts';
import { carriedDocument } from '../../src/report/source.ts';
import { reportMsg } from '../../src/messages/report.ts';
import { planningMsg } from '../../src/messages/planning.ts';
import { ENGINE_NAME } from '../../src/seal/version.ts';
import { cli, sampleCopies, scratch } from '../cli/support.ts';
import { cliMsg } from '../../src/messages/cli.ts';

describe('the report', () => {
  it('allows its one stylesheet by the SHA-256 of its text, and no script at all', () => {
    // source: Node 20 crypto as the reference SHA-256; CSP Level 3, hash-source (base64 of the digest)
    const ref = createHash('sha256').update(REPORT_CSS, 'utf8').digest('base64');
    expect(reportPolicy(REPORT_CSS)).toBe(`default-src 'none'; style-src 'sha256-${ref}'; img-src data:; base-uri 'none'; form-action 'none'`);
  });

  it('carries every sample byte for byte, and holds no script element and no remote address', async () => {
    for (const path of sampleCopies()) {
      const html = await reportHtml(path);
      const carried = carriedDocument(html)!;
      expect(carried.name).toBe(path.split('/').pop());
      expect(Buffer.from(carried.bytes).equals(readFileSync(path))).toBe(true);
      expect(html).not.toMatch(/<script/i);
      expect(html).not.toMatch(/(?:href|src)="(?:https?:|\/\/|file:)/i);
      expect(html.match(/<svg /g)?.length).toBe((readFileSync(path, 'utf8').match(/_chart\(|scatter\(/g) ?? []).length);
    }
  });

  it('carries a document with a byte order mark, CRLF line ends and a data file, byte for byte', async () => {
    const text = '\uFEFFfurrow 1\r\ntitle: t\r\n\r\n--- table plots from plots.csv\r\n--- formula\r\nm = mean(plots.y)\r\n';
    const dir = scratch({ 'd.furrow': text, 'plots.csv': 'y,g\r\n1,a\r\n2,"b, c"\r\n' });
    const html = await reportHtml(join(dir, 'd.furrow'));
    const carried = carriedDocument(html)!;
    expect(Buffer.from(carried.bytes).equals(readFileSync(join(dir, 'd.furrow')))).toBe(true);
    expect(Buffer.from(carried.files.get('plots.csv')!).equals(readFileSync(join(dir, 'plots.csv')))).toBe(true);
  });

  it('shows the caution line where the document declares one, and only there', async () => {
    const [adhesive, backing] = ['adhesive-cure', 'backing-abrasion'].map((n) => sampleCopies().find((p) => p.endsWith(`${n}.furrow`))!);
    expect(await reportHtml(adhesive!)).toContain('<p class="caution" role="note"><strong>Caution.</strong> These coupons qualify a bonding process');
    expect(await reportHtml(backing!)).not.toContain('class="caution"');
  });

  it('ends every report, caution declared or not, with the line that a statistical result does not replace qualified judgement', async () => {
    // design rule (docs: Cautions): a document that declares no caution may still touch health,
    // food or safety, so the footer of every report says it in plain words
    for (const path of sampleCopies()) {
      const footer = (await reportHtml(path)).match(/<footer>([\s\S]*?)<\/footer>/)?.[1] ?? '';
      expect(footer, path).toContain('A statistical result supports, and does not replace, the judgement of qualified people');
      expect(footer, path).toContain(reportMsg.footer(ENGINE_NAME, path.split('/').pop()!));
    }
  });

  it('shows what the engine warned about on a cell: the design warning on the fit that ignores the pairs, none on the one that uses them', async () => {
    const path = sampleCopies().find((p) => p.endsWith('tread-wear.furrow'))!;
    const html = await reportHtml(path);
    const section = (name: string): string => {
      const found = [...html.matchAll(/<section class="cell" id="cell-\d+">([\s\S]*?)<\/section>/g)].find((m) => m[1]!.includes(`<pre class="source">${name} = `));
      if (found === undefined) throw new Error(`no cell ${name} in the report`);
      return found[1]!;
    };
    const warning = planningMsg.ignoredBlocks('tread', 'van', 'compound', 'two_sample', 'blocked(tread.wear_mm, tread.compound, tread.van) (the paired comparison)');
    const escaped = warning.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
    expect(section('as_groups')).toContain(`<ul class="warnings" role="note"><li><strong>${reportMsg.warningLead()}</strong> ${escaped}</li></ul>`);
    expect(section('as_blocks')).not.toContain('class="warnings"');
  });

  it('cuts a long table to its first rows and says how many there are', async () => {
    const rows = Array.from({ length: 100 }, (_, i) => `${i + 1},${i * 2}`);
    const dir = scratch({ 'd.furrow': `furrow 1\ntitle: t\n\n--- table big\nplot,y\n${rows.join('\n')}\n` });
    const html = await reportHtml(join(dir, 'd.furrow'));
    expect(html).toContain('<p class="cut">100 rows, 2 columns; the first 10 rows are shown.</p>');
    const body = html.slice(html.indexOf('<tbody>'), html.indexOf('</tbody>'));
    expect(body.match(/<tr>/g)?.length).toBe(10);
    expect(body).toContain('<td class="num">10</td><td class="num">18</td>');
    expect(body).not.toContain('<td class="num">11</td>');
  });

  it('shows notes with their live values, and marks a number that a failing claim reads', async () => {
    const dir = scratch({
      'd.furrow':
        'furrow 1\ntitle: t\n\n--- formula\ngain = 2.5\n\n--- formula\nbase = 7\n\n--- note\nThe gain is **{gain}**, the base {base}.\n\n--- formula\nbig = claim(gain > 3, "the gain is above 3")\n',
    });
    const html = await reportHtml(join(dir, 'd.furrow'));
    expect(html).toContain('<p>The gain is <strong><span class="live doubt" title="A claim that reads this number does not hold.">2.5</span></strong>, the base <span class="live">7</span>.</p>');
    expect(html).toContain('<p class="doubt-note">Marked numbers are read by a claim that does not hold: “the gain is above 3”.</p>');
    expect(html).toContain('<li><a href="#cell-4" class="claim fails"><span class="verdict">Does not hold</span> the gain is above 3</a></li>');
    expect(html).toContain('<section class="cell" id="cell-4">');
  });

  it('gives the verification verdict of a sealed document, and its differences once edited', async () => {
    const path = sampleCopies().find((p) => p.endsWith('backing-abrasion.furrow'))!;
    expect(cli('seal', path).code).toBe(0);
    const ok = await reportHtml(path);
    expect(ok).toContain('<div class="verdict ok"><strong>Verified: every value recomputes to its sealed value, bit for bit, and every claim holds.</strong>');
    expect(ok).not.toContain('--- sealed');
    writeFileSync(path, readFileSync(path, 'utf8').replace('1,M3,felt,36.9', '1,M3,felt,26.9'));
    const bad = await reportHtml(path);
    expect(bad).toContain('<div class="verdict bad"><strong>Not verified: the document no longer computes what was sealed.</strong>');
    expect(bad).toContain('<li>runs.loss_mg[3]: was 36.9, now 26.9</li>');
    expect(bad).toContain('<li>&quot;felt loses more than woven&quot; (felt_wears_most, cell 9) NO LONGER HOLDS</li>');
  });
});

describe('furrow report', () => {
  it('writes the file and refuses to overwrite the document or to run without -o', async () => {
    const [path] = sampleCopies();
    const out: string[] = [];
    const err: string[] = [];
    const o = { out: (s: string) => out.push(s), err: (s: string) => err.push(s) };
    const { main } = await import('../../src/cli/main.ts');
    expect(await main(['report', path!, '-o', `${path}.html`], o)).toBe(0);
    expect(readFileSync(`${path}.html`, 'utf8').startsWith('<!doctype html>')).toBe(true);
    expect(await main(['report', path!], o)).toBe(2);
    expect(await main(['report', path!, '-o', path!], o)).toBe(2);
    expect(err.join('\n')).toContain('the report would overwrite the document');
  });

  it('writes over an earlier report, but over any other file only when told to', async () => {
    const [path] = sampleCopies();
    const dir = resolve(path!, '..');
    const err: string[] = [];
    const o = { out: () => {}, err: (s: string) => err.push(s) };
    const { main } = await import('../../src/cli/main.ts');
    const html = join(dir, 'r.html');
    expect(await main(['report', path!, '-o', html], o)).toBe(0);
    // an earlier report is made again without a word
    writeFileSync(html, readFileSync(html, 'utf8').replace('<title>', '<title>old '));
    expect(await main(['report', path!, '-o', html], o)).toBe(0);
    expect(readFileSync(html, 'utf8')).not.toContain('<title>old ');
    // a data file named by mistake is kept
    const csv = join(dir, 'plots.csv');
    writeFileSync(csv, 'block,y\n1,4.2\n');
    expect(await main(['report', path!, '-o', csv], o)).toBe(2);
    expect(err.pop()).toBe(cliMsg.reportWouldOverwrite(csv));
    expect(readFileSync(csv, 'utf8')).toBe('block,y\n1,4.2\n');
    expect(await main(['report', path!, '-o', csv, '--replace'], o)).toBe(0);
    expect(readFileSync(csv, 'utf8').startsWith('<!doctype html>')).toBe(true);
    // the document itself, even through a link to it and with --replace, never
    const before = readFileSync(path!, 'utf8');
    const link = join(dir, 'link.furrow');
    symlinkSync(path!, link);
    expect(await main(['report', path!, '-o', link, '--replace'], o)).toBe(2);
    expect(err.pop()).toBe(cliMsg.reportOverDocument());
    expect(readFileSync(path!, 'utf8')).toBe(before);
  });
});
