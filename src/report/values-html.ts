/**
 * Values as static HTML for the report: scalars inline, tables as tables (long ones cut to
 * their first rows with the count), fits as an analysis of variance with the means, pairs
 * as their table, claims so that a failing one cannot be missed. Every text from the
 * document is escaped. The layouts are the page's own (record-layout.ts, grid-model.ts), so
 * a number reads the same in the report as on the page.
 */
import { reportMsg } from '../messages/report.ts';
import { countText } from '../format/digits.ts';
import { formatInline } from '../lang/format.ts';
import { columnLength, isColumn, isRecord, isTable, missingCount, type Column, type RecordValue, type Table, type Value } from '../lang/values.ts';
import { cellText, planColumn } from '../views/values/grid-model.ts';
import { fitLayout, pairsLayout, recordLines, type ScalarLine } from '../views/values/record-layout.ts';
import { recordSummary, type RecordSummary } from '../views/values/record-summary.ts';
import { escapeHtml } from './sanitize.ts';

/** A table longer than this is shown by its first REPORT_HEAD_ROWS rows and its count. */
export const REPORT_FULL_ROWS = 30;
/** Rows shown of a long table. */
export const REPORT_HEAD_ROWS = 10;
/** Elements shown of a long column. */
const COLUMN_SHOWN = 12;

/** Charts already drawn, by the value they came from. */
export type ChartSvgs = ReadonlyMap<unknown, { svg: string } | { failure: string }>;

const e = escapeHtml;

function count(n: number, one: string, many: string): string {
  return `${countText(n)} ${n === 1 ? one : many}`;
}

/** A table as HTML, cut to its first rows when long. */
export function tableHtml(t: Table, caption: string | null = null): string {
  const shown = t.rows > REPORT_FULL_ROWS ? REPORT_HEAD_ROWS : t.rows;
  const plans = t.columns.map((c) => planColumn(c));
  const head = t.names.map((n, j) => `<th class="${plans[j]!.align}">${e(n)}</th>`).join('');
  const rows: string[] = [];
  for (let i = 0; i < shown; i++) {
    rows.push(
      `<tr>${t.columns
        .map((c, j) => {
          const cell = cellText(c, i, plans[j]);
          return `<td class="${plans[j]!.align}${cell.missing ? ' missing' : ''}">${e(cell.text)}</td>`;
        })
        .join('')}</tr>`,
    );
  }
  const size = `${count(t.rows, 'row', 'rows')}, ${count(t.columns.length, 'column', 'columns')}`;
  const note = shown < t.rows ? `<p class="cut">${e(size)}; the first ${shown} rows are shown.</p>` : `<p class="size">${e(size)}</p>`;
  return `${note}<table>${caption === null ? '' : `<caption>${e(caption)}</caption>`}<thead><tr>${head}</tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

/** A column as one line, cut when long. */
function columnHtml(c: Column): string {
  const n = columnLength(c);
  const plan = planColumn(c);
  const shown: string[] = [];
  for (let i = 0; i < Math.min(n, COLUMN_SHOWN); i++) shown.push(cellText(c, i, plan).text);
  const m = missingCount(c);
  const size = `${count(n, 'element', 'elements')}${m > 0 ? `, ${m} missing` : ''}`;
  return `<p class="column">${e(shown.join(', '))}${n > COLUMN_SHOWN ? ', …' : ''} <span class="size">(${e(size)})</span></p>`;
}

function scalarsHtml(lines: readonly ScalarLine[]): string {
  if (lines.length === 0) return '';
  return `<dl class="scalars">${lines.map((l) => `<dt>${e(l.label)}</dt><dd>${e(l.text)}</dd>`).join('')}</dl>`;
}

function fitHtml(r: RecordValue, charts: ChartSvgs): string {
  const f = fitLayout(r);
  const parts: string[] = [];
  if (f.design !== null) parts.push(`<p class="design">${e(f.design)}</p>`);
  if (f.balance !== null) parts.push(`<p class="balance">${e(f.balance)}</p>`);
  if (f.anova !== null) {
    const rows = f.anova
      .map((row) => `<tr class="${row.role}"><th>${e(row.source)}</th><td>${e(row.df)}</td><td>${e(row.ss)}</td><td>${e(row.ms)}</td><td>${e(row.f)}</td><td>${e(row.p)}</td></tr>`)
      .join('');
    parts.push(
      `<table class="anova"><caption>${reportMsg.anovaCaption()}</caption><thead><tr>${reportMsg.anovaHeads().map((h, j) => `<th${j > 0 ? ' class="num"' : ''}>${h}</th>`).join('')}</tr></thead><tbody>${rows}</tbody></table>`,
    );
  }
  if (f.means !== null) {
    const rows = f.means
      .map((m) => `<tr><th>${e(m.level)}</th><td>${e(m.n)}</td><td>${e(m.mean)}</td><td>${e(m.se)}</td><td>${e(m.low)}</td><td>${e(m.high)}</td></tr>`)
      .join('');
    parts.push(
      `<table class="means"><caption>${e(f.meansTitle)}</caption><thead><tr><th>level</th><th class="num">n</th><th class="num">mean</th><th class="num">standard error</th><th class="num" colspan="2">${e(f.intervalHeader)}</th></tr></thead><tbody>${rows}</tbody></table>`,
    );
  }
  parts.push(scalarsHtml(f.scalars));
  if (f.notes.length > 0) parts.push(`<ul class="notes">${f.notes.map((n) => `<li>${e(n)}</li>`).join('')}</ul>`);
  for (const o of f.others) parts.push(`<div class="field"><h4>${e(o.label)}</h4>${valueHtml(o.value, charts)}</div>`);
  if (f.folded.length > 0) {
    const sizes = f.folded.map((o) => `${o.label} (${isColumn(o.value) ? count(columnLength(o.value), 'value', 'values') : ''})`);
    parts.push(`<p class="size">${e(reportMsg.notPrinted(sizes.join(', ')))}</p>`);
  }
  return `<div class="fit">${parts.join('')}</div>`;
}

function pairsHtml(r: RecordValue, charts: ChartSvgs): string {
  const p = pairsLayout(r);
  const parts: string[] = [];
  if (p.rows !== null) {
    const rows = p.rows
      .map((x) => `<tr><th>${e(x.pair)}</th><td>${e(x.estimate)}</td><td>${e(x.se)}</td><td>${e(x.low)}</td><td>${e(x.high)}</td><td>${e(x.p)}</td><td>${e(x.excludesZero)}</td></tr>`)
      .join('');
    parts.push(
      `<table class="pairs"><caption>${e(p.title)}</caption><thead><tr><th>difference</th><th class="num">estimate</th><th class="num">standard error</th><th class="num" colspan="2">${e(p.intervalHeader)}</th><th class="num">p</th><th>interval leaves out 0</th></tr></thead><tbody>${rows}</tbody></table>`,
    );
  }
  parts.push(scalarsHtml(p.scalars));
  for (const o of p.others) parts.push(`<div class="field"><h4>${e(o.label)}</h4>${valueHtml(o.value, charts)}</div>`);
  return `<div class="pairs-record">${parts.join('')}</div>`;
}

/** A result read in words (the page's own summary), with its fields under it. */
function summaryHtml(s: RecordSummary, fields: string): string {
  const parts = [`<p class="headline">${e(s.headline)}</p>`, ...s.details.map((d) => `<p class="detail">${e(d)}</p>`)];
  if (s.checks.length > 0) {
    const rows = s.checks.map((c) => `<tr class="${c.verdict}"><th>${e(c.check)}</th><td>${e(c.words)}</td><td>${e(c.numbers)}</td></tr>`).join('');
    parts.push(`<table class="checks"><tbody>${rows}</tbody></table>`);
  }
  if (s.notes.length > 0) parts.push(`<ul class="notes">${s.notes.map((n) => `<li>${e(n)}</li>`).join('')}</ul>`);
  parts.push(`<details class="fields" open><summary>${reportMsg.everyField()}</summary>${fields}</details>`);
  return `<div class="result">${parts.join('')}</div>`;
}

function recordHtml(r: RecordValue, charts: ChartSvgs, depth: number): string {
  if (r.tag === 'fit') return fitHtml(r, charts);
  if (r.tag === 'pairs') return pairsHtml(r, charts);
  const summary = recordSummary(r);
  if (summary !== null) return summaryHtml(summary, fieldsHtml(r, charts, depth));
  return fieldsHtml(r, charts, depth);
}

function fieldsHtml(r: RecordValue, charts: ChartSvgs, depth: number): string {
  const scalars: ScalarLine[] = [];
  const rest: string[] = [];
  for (const l of recordLines(r)) {
    if (l.text !== null) scalars.push({ field: l.field, label: l.field.replace(/_/g, ' '), text: l.text });
    else rest.push(`<div class="field"><h4>${e(l.field.replace(/_/g, ' '))}</h4>${valueHtml(l.value, charts, depth + 1)}</div>`);
  }
  return `<div class="record">${scalarsHtml(scalars)}${rest.join('')}</div>`;
}

/** A value as HTML. */
export function valueHtml(v: Value, charts: ChartSvgs, depth = 0): string {
  if (typeof v !== 'object') return `<p class="scalar">${e(formatInline(v))}</p>`;
  switch (v.kind) {
    case 'missing':
      return '<p class="scalar missing">missing</p>';
    case 'column':
      return columnHtml(v);
    case 'table':
      return tableHtml(v);
    case 'record':
      return depth > 6 ? `<p>${e(formatInline(v))}</p>` : recordHtml(v, charts, depth);
    case 'chart': {
      const drawn = charts.get(v);
      const body =
        drawn === undefined ? `<p class="failed">${reportMsg.chartNotDrawn()}</p>` : 'svg' in drawn ? drawn.svg : `<p class="failed">${e(reportMsg.chartFailed(drawn.failure))}</p>`;
      return `<figure class="chart">${body}<figcaption>${e(v.caption)}</figcaption></figure>`;
    }
    case 'claim':
      return `<p class="claim ${v.holds ? 'holds' : 'fails'}"><span class="verdict">${v.holds ? reportMsg.holds() : reportMsg.doesNotHold()}</span> ${e(v.statement)}</p>`;
    case 'error':
      return `<p class="error">${v.upstream !== null ? reportMsg.dependsOnError() : reportMsg.error()}${e(v.message)}</p>`;
  }
}

/** True for values drawn as a table of their own (for a label's wording). */
export function isTabularValue(v: Value): boolean {
  return isTable(v) || isColumn(v) || isRecord(v);
}
