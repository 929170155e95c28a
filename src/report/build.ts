/**
 * The report: one self-contained HTML file that a reviewer opens with no network.
 *
 *   document + engine states --> header, caution, verification, claims
 *                            --> each cell: notes with live values, tables (long ones cut),
 *                                analyses in the trade's layout, charts as inline SVG
 *                            --> the document's own bytes, so the page can open it back
 *
 * No script of any kind: the content security policy allows nothing but the one inline
 * stylesheet (by its hash) and pictures carried inside the file. Everything that came
 * from the document is escaped, or, for a note's Markdown, passed through an allow-list.
 */
import { reportMsg } from '../messages/report.ts';
import { sha256 } from '@noble/hashes/sha2.js';
import { visibleBody, documentTitle, headerFields, type Document } from '../doc/document.ts';
import { CELL_KINDS } from '../../cells/kinds.ts';
import type { CellState } from '../graph/engine.ts';
import type { NameUse } from '../lang/ast.ts';
import { collectCharts } from './walk.ts';
import { isError, type Value } from '../lang/values.ts';
import { renderSvg } from '../charts/render.ts';
import { msg } from '../messages/language.ts';
import { ATTRIBUTE_SLOT, SLOT, noteMarkdownHtml, placeholderSources } from '../../cells/note/markdown.ts';
import { MAX_NOTE_PLACEHOLDERS, placeholderCount, placeholderText, splitNote } from '../../cells/note/model.ts';
import { notesInDoubt, type NoteDoubt } from '../seal/doubt.ts';
import { fingerprint, isSealedCell } from '../seal/fingerprint.ts';
import { verificationText } from '../seal/verify-text.ts';
import { verifyDocument, type Verification } from '../seal/verify.ts';
import { ENGINE_NAME } from '../seal/version.ts';
import { escapeHtml, sanitizeMarkdownHtml } from './sanitize.ts';
import { sourceElements, toBase64 } from './source.ts';
import { REPORT_CSS } from './style.ts';
import { svgProblem } from './svg-check.ts';
import { valueHtml, type ChartSvgs } from './values-html.ts';

/** What a report is made from. */
export interface ReportInput {
  /** The document's file name (carried in the report for opening it back). */
  readonly name: string;
  /** The document's bytes as read, carried in the report unchanged. */
  readonly bytes: Uint8Array;
  readonly doc: Document;
  /** The engine's states for `doc`, in document order. */
  readonly states: readonly CellState[];
  /** The names each cell reads (the engine's `reads`). */
  readonly readsOf: (id: string) => readonly NameUse[];
  /** The bytes of the data files the document names. */
  readonly files: ReadonlyMap<string, Uint8Array>;
}

const e = escapeHtml;

/** The content security policy of a report whose one stylesheet is `css`. */
export function reportPolicy(css: string): string {
  const hash = toBase64(sha256(new TextEncoder().encode(css)));
  return `default-src 'none'; style-src 'sha256-${hash}'; img-src data:; base-uri 'none'; form-action 'none'`;
}

/** Draws every chart the states hold (nested ones too), in Node, once each. */
async function drawCharts(states: readonly CellState[]): Promise<Map<unknown, { svg: string } | { failure: string }>> {
  const out = new Map<unknown, { svg: string } | { failure: string }>();
  const charts: Value[] = [];
  for (const s of states) collectCharts(s.value, charts);
  for (const c of charts) {
    if (out.has(c) || typeof c !== 'object' || c.kind !== 'chart') continue;
    try {
      const { svg } = await renderSvg(c.spec);
      const problem = svgProblem(svg);
      out.set(c, problem === null ? { svg } : { failure: problem });
    } catch (err) {
      out.set(c, { failure: err instanceof Error ? err.message : String(err) });
    }
  }
  return out;
}

/** A note's Markdown as safe HTML with its live values; placeholders in doubt are marked. */
export function noteHtml(body: string, parts: readonly Value[] | null, doubt: NoteDoubt | undefined): string {
  const text = body.replace(/(\r?\n)+$/, '');
  // past the page's limit of live values the note is shown as its text, as on the page
  const count = placeholderCount(splitNote(text));
  if (count > MAX_NOTE_PLACEHOLDERS) return `<div class="note"><pre>${e(text)}</pre></div><p class="doubt-note">${e(msg.tooManyPlaceholders(count, MAX_NOTE_PLACEHOLDERS))}</p>`;
  const sources = placeholderSources(text);
  const safe = sanitizeMarkdownHtml(noteMarkdownHtml(text).html, (v) => v.replace(ATTRIBUTE_SLOT, (_m, i: string) => sources[Number(i)] ?? ''));
  const filled = safe.replace(SLOT, (_m, k: string) => {
    const i = Number(k);
    const v = parts?.[i];
    if (v === undefined) return `<span class="live failed">${e(sources[i] ?? '')}</span>`;
    if (isError(v)) return `<span class="live failed" title="${e(v.message)}">${e(sources[i] ?? '')}</span>`;
    const inDoubt = doubt?.slots.has(i) === true;
    return `<span class="live${inDoubt ? ' doubt' : ''}"${inDoubt ? ` title="${e(reportMsg.liveInDoubt())}"` : ''}>${e(placeholderText(sources[i] ?? '', v))}</span>`;
  });
  const warning =
    doubt === undefined ? '' : `<p class="doubt-note">${e(reportMsg.doubtNote(doubt.claims))}</p>`;
  return `<div class="note">${filled}</div>${warning}`;
}

function headerHtml(doc: Document): string {
  const fields = headerFields(doc);
  const meta: string[] = [];
  for (const [key, words] of reportMsg.headerWords) {
    const v = fields.get(key);
    if (v !== undefined && v.trim() !== '') meta.push(`<dt>${words}</dt><dd>${e(v.trim())}</dd>`);
  }
  const caution = fields.get('caution')?.trim();
  return [
    `<h1>${e(documentTitle(doc))}</h1>`,
    meta.length > 0 ? `<dl class="meta">${meta.join('')}</dl>` : '',
    caution ? `<p class="caution" role="note"><strong>${reportMsg.caution()}</strong> ${e(caution)}</p>` : '',
  ].join('\n');
}

function verdictHtml(v: Verification, whole: string): string {
  if (!v.sealed) {
    return `<div class="verdict none"><strong>${reportMsg.notSealed()}</strong> ${reportMsg.notSealedText()}<p class="fingerprint">${reportMsg.fingerprintOfAll(whole)}</p></div>`;
  }
  const lines = verificationText('', v).filter((l) => l.trim() !== '' && !/^ {2}same /.test(l) && !/^Values:$/.test(l));
  const headline = v.matches ? reportMsg.verified() : reportMsg.notVerified();
  return `<div class="verdict ${v.matches ? 'ok' : 'bad'}"><strong>${e(headline)}</strong><ul>${lines.map((l) => `<li>${e(l.trim())}</li>`).join('')}</ul><p class="fingerprint">${reportMsg.fingerprint(v.fingerprint.now)}</p></div>`;
}

function claimsHtml(states: readonly CellState[]): string {
  const items: string[] = [];
  states.forEach((s, i) => {
    const v = s.value;
    if (typeof v !== 'object' || v.kind !== 'claim') return;
    items.push(
      `<li><a href="#cell-${i + 1}" class="claim ${v.holds ? 'holds' : 'fails'}"><span class="verdict">${v.holds ? reportMsg.holds() : reportMsg.doesNotHold()}</span> ${e(v.statement)}</a></li>`,
    );
  });
  if (items.length === 0) return `<p>${reportMsg.noClaims()}</p>`;
  const failing = items.filter((x) => x.includes('claim fails')).length;
  return `<p>${failing === 0 ? reportMsg.allClaimsHold(items.length) : reportMsg.claimsFail(failing, items.length)}</p><ul class="claims">${items.join('')}</ul>`;
}

/** What the engine warned about on a cell (rows left out, a design the fit ignores, ...): a reviewer reads them too. */
function warningsHtml(s: CellState): string {
  if (s.warnings.length === 0) return '';
  return `<ul class="warnings" role="note">${s.warnings.map((w) => `<li><strong>${reportMsg.warningLead()}</strong> ${e(w)}</li>`).join('')}</ul>`;
}

function cellHtml(doc: Document, i: number, s: CellState, charts: ChartSvgs, doubts: ReadonlyMap<string, NoteDoubt>): string {
  const cell = doc.cells[i]!;
  const m = CELL_KINDS.readMarker(cell.marker) ?? { kind: cell.marker.trim().split(/[ \t]+/)[0] ?? '', name: null, file: null, extra: [] };
  const id = `cell-${i + 1}`;
  if (m.kind === 'note') return `<section class="cell note-cell" id="${id}">${noteHtml(cell.body, s.parts, doubts.get(cell.id))}</section>`;
  if (m.kind === 'table') {
    const label = `table ${m.name ?? ''}${m.file !== null ? `, read from ${m.file}` : ''}`;
    return `<section class="cell" id="${id}"><p class="label">${e(label)}</p>${valueHtml(s.value, charts)}${warningsHtml(s)}</section>`;
  }
  if (m.kind === 'formula') {
    return `<section class="cell" id="${id}"><pre class="source">${e(visibleBody(cell))}</pre>${valueHtml(s.value, charts)}${warningsHtml(s)}</section>`;
  }
  return `<section class="cell" id="${id}"><p class="label">${e(`--- ${cell.marker}`)}: kept as written, not evaluated</p><pre class="source">${e(visibleBody(cell))}</pre></section>`;
}

/** The report as one HTML text. */
export async function buildReport(input: ReportInput): Promise<string> {
  const { doc, states } = input;
  const charts = await drawCharts(states);
  const doubts = notesInDoubt(doc.cells, states, input.readsOf);
  const verification = verifyDocument(doc, states, input.files);
  const whole = fingerprint(doc, input.files).whole;
  const cells = doc.cells.flatMap((c, i) => (isSealedCell(c.marker) ? [] : [cellHtml(doc, i, states[i]!, charts, doubts)]));
  const css = REPORT_CSS;
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${reportPolicy(css)}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="${ENGINE_NAME}">
<title>${e(documentTitle(doc))}</title>
<style>${css}</style>
</head>
<body>
<header>
${headerHtml(doc)}
</header>
<section class="hand-off">
<h2>${reportMsg.verificationHeading()}</h2>
${verdictHtml(verification, whole)}
<h2>${reportMsg.claimsHeading()}</h2>
${claimsHtml(states)}
</section>
<main>
<h2>${reportMsg.trialHeading()}</h2>
${cells.join('\n')}
</main>
<footer>
<p>${e(reportMsg.footer(ENGINE_NAME, input.name))}</p>
</footer>
${sourceElements(input.name, input.bytes, input.files)}
</body>
</html>
`;
}
