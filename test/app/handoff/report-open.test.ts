/**
 * Opening a report back as its document (what the page does with a dropped report).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { documentFromReport } from '../../../src/app/handoff/report-open.ts';
import { reportHtml } from '../../../src/cli/report.ts';
import { readDocument, writeDocument } from '../../../src/doc/format.ts';
import { scratch } from '../../cli/support.ts';

describe('documentFromReport', () => {
  it('gives back the document text, byte order mark and line ends included, and its data files', async () => {
    const text = '\uFEFFfurrow 1\r\ntitle: t\r\n\r\n--- table plots from plots.csv\r\n--- note\r\nMean {mean(plots.y)} é\r\n';
    const dir = scratch({ 'd.furrow': text, 'plots.csv': 'y\n1\n2\n' });
    const opened = documentFromReport(await reportHtml(join(dir, 'd.furrow')))!;
    expect(opened.name).toBe('d.furrow');
    expect(opened.text).toBe(text);
    // what the page writes back when it saves
    expect(writeDocument(readDocument(opened.text).document)).toBe(readFileSync(join(dir, 'd.furrow'), 'utf8'));
    expect(opened.files).toEqual([['plots.csv', 'y\n1\n2\n']]);
  });
  it('is null for HTML that is not a report, and for a report whose bytes are not UTF-8', () => {
    expect(documentFromReport('<!doctype html><p>hello</p>')).toBe(null);
    expect(documentFromReport('furrow 1\n')).toBe(null);
    expect(documentFromReport('<!doctype html><pre hidden id="furrow-source" data-name="x.furrow">/w==</pre>')).toBe(null);
  });
});
