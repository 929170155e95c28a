/**
 * `<furrow-value>`: any value of the cell language, drawn by its type. Numbers, texts,
 * booleans and missing inline; columns and tables as grids; fits as an analysis of
 * variance with its means; pairwise comparisons as their table; claims so that one that
 * fails cannot be missed; charts through `<furrow-chart>`. What each table says is worked
 * out in record-layout.ts and grid-model.ts; this file only draws it.
 */
import { css, html, LitElement, nothing, type TemplateResult } from 'lit';
import { countText, numberText } from '../../format/digits.ts';
import { columnLength, missingCount, type Claim, type Column, type ErrorValue, type RecordValue, type Table, type Value } from '../../lang/values.ts';
import { shared } from '../theme.ts';
import './chart.ts';
import './grid.ts';
import './run-sheet.ts';
import { fitLayout, pairsLayout, recordLines, type ScalarLine, type ValueLine } from './record-layout.ts';
import { recordSummary, type RecordSummary } from './record-summary.ts';
import { tableStyles } from './styles.ts';
import { tableCsv } from '../../doc/table-csv.ts';
import { downloadCsv, fileNameFor } from '../download.ts';
import { sheetWords } from '../../messages/page.ts';

/** A one-line description of a column's size ("24 numbers, 2 missing"). */
export function columnSummary(c: Column): string {
  const n = columnLength(c);
  const noun = c.type === 'number' ? (n === 1 ? 'number' : 'numbers') : c.type === 'text' ? (n === 1 ? 'text' : 'texts') : n === 1 ? 'boolean' : 'booleans';
  const m = missingCount(c);
  return `${countText(n)} ${noun}${m > 0 ? `, ${countText(m)} missing` : ''}`;
}

/** A one-line description of a table's size ("24 rows, 3 columns"). */
export function tableSummary(t: Table): string {
  const cols = t.columns.length;
  return `${countText(t.rows)} ${t.rows === 1 ? 'row' : 'rows'}, ${cols} ${cols === 1 ? 'column' : 'columns'}`;
}

/** In a record, columns longer than this are folded behind a disclosure. */
export const FOLD_COLUMN = 12;

/** One value, drawn by its type. */
export class FurrowValue extends LitElement {
  static override properties = {
    value: { attribute: false },
    name: { type: String },
  };

  /** The value to show. */
  declare value: Value | null;
  /** The name the value is known by in the document, if any (shown in field paths). */
  declare name: string | null;

  constructor() {
    super();
    this.value = null;
    this.name = null;
  }

  static override styles = [
    shared,
    tableStyles,
    css`
      :host {
        display: block;
        font-size: 0.9rem;
      }
      .scalar {
        font-size: 1.05rem;
      }
      .text {
        white-space: pre-wrap;
        overflow-wrap: anywhere;
        font-family: var(--font-text);
      }
      .result {
        display: grid;
        gap: 0.3rem;
        justify-items: start;
        border-left: 3px solid var(--rule-strong);
        padding-left: 0.7rem;
        max-width: 100%;
      }
      .result .headline {
        margin: 0;
        font-family: var(--font-text);
        font-size: 1.05rem;
        font-variant-numeric: tabular-nums lining-nums;
        overflow-wrap: anywhere;
      }
      .result .detail {
        margin: 0;
        font-size: 0.85rem;
        color: var(--ink-soft);
        overflow-wrap: anywhere;
      }
      table.checks {
        max-width: 100%;
      }
      table.checks th,
      table.checks td {
        white-space: normal;
      }
      table.checks td.verdict {
        white-space: nowrap;
      }
      table.checks td.numbers {
        color: var(--ink-soft);
        font-variant-numeric: tabular-nums;
      }
      table.checks .mark {
        display: inline-block;
        width: 1.1em;
        text-align: center;
        font-weight: 700;
      }
      table.checks tr.flag .verdict {
        color: var(--error);
        font-weight: 600;
      }
      table.checks tr.clear .verdict {
        color: var(--accent);
      }
      table.checks tr.none .verdict {
        color: var(--muted);
      }
      details.raw {
        max-width: 100%;
      }
      .quiet,
      .missing {
        color: var(--muted);
        font-style: italic;
      }
      .summary {
        font-size: 0.75rem;
        color: var(--muted);
        margin: 0 0 0.2rem;
      }
      .error {
        color: var(--error);
      }
      .error.upstream {
        color: var(--upstream);
      }
      .claim {
        display: flex;
        gap: 0.6rem;
        align-items: baseline;
        padding: 0.45rem 0.7rem;
        border-radius: var(--radius);
        border-left: 4px solid var(--accent);
        background: var(--accent-soft);
      }
      .claim .verdict {
        font-weight: 700;
        white-space: nowrap;
        color: var(--accent);
      }
      .claim .statement {
        font-family: var(--font-text);
      }
      .claim.fails {
        border: 2px solid var(--error);
        border-left-width: 8px;
        background: var(--error-soft);
      }
      .claim.fails .verdict {
        color: var(--error);
        text-transform: uppercase;
        letter-spacing: 0.04em;
      }
      .record,
      .fit,
      .pairs {
        display: grid;
        gap: 0.75rem;
        justify-items: start;
      }
      .heading {
        font-family: var(--font-text);
        font-size: 1rem;
        margin: 0;
      }
      .heading .design {
        font-style: italic;
      }
      .balance {
        margin: 0.1rem 0 0;
        font-size: 0.8rem;
        color: var(--ink-soft);
      }
      table.anova tr.role-total td,
      table.anova tr.role-total th {
        border-top: 1px solid var(--rule-strong);
      }
      table.anova tr.role-error th,
      table.anova tr.role-total th {
        color: var(--ink-soft);
      }
      th.group {
        text-align: center;
        border-bottom: 1px solid var(--rule);
        font-weight: normal;
        font-style: italic;
      }
      dl.fields {
        display: grid;
        grid-template-columns: minmax(0, max-content) minmax(0, max-content);
        max-width: 100%;
        column-gap: 1rem;
        row-gap: 0.15rem;
        margin: 0;
      }
      dl.fields dt {
        color: var(--ink-soft);
      }
      dl.fields dt code {
        font-family: var(--font-code);
        font-size: 0.75rem;
        color: var(--muted);
        margin-left: 0.4rem;
      }
      dl.fields dd {
        margin: 0;
        overflow-wrap: anywhere;
      }
      .part {
        display: grid;
        gap: 0.2rem;
        max-width: 100%;
      }
      code.path {
        font-family: var(--font-code);
        font-size: 0.78rem;
        color: var(--ink-soft);
      }
      .part > .label code {
        font-family: var(--font-code);
        text-transform: none;
        letter-spacing: 0;
      }
      ul.notes {
        margin: 0;
        padding-left: 1.1rem;
        font-size: 0.82rem;
        color: var(--ink-soft);
      }
      details > summary {
        cursor: pointer;
        font-size: 0.82rem;
        color: var(--ink-soft);
      }
      details[open] > summary {
        margin-bottom: 0.3rem;
      }
      .wide {
        max-width: 100%;
        overflow-x: auto;
      }
      /* narrow pages: column heads and pair names wrap before the table needs to scroll */
      table.pairs-table thead th,
      table.means thead th {
        white-space: normal;
      }
      table.pairs-table tbody th {
        white-space: normal;
        min-width: 7rem;
      }
      @media print {
        details > summary {
          list-style: none;
        }
        .wide {
          overflow: visible;
        }
      }
    `,
  ];

  private path(field: string): string {
    return this.name ? `${this.name}.${field}` : field;
  }

  protected override render() {
    const v = this.value;
    if (v === null || v === undefined) return nothing;
    switch (typeof v) {
      case 'number':
        return html`<span class="scalar num" title=${String(v)}>${numberText(v, 'plain')}</span>`;
      case 'string':
        return v === '' ? html`<span class="quiet">empty text</span>` : html`<span class="text">${v}</span>`;
      case 'boolean':
        return html`<span class="scalar">${v ? 'true' : 'false'}</span>`;
    }
    switch (v.kind) {
      case 'missing':
        return html`<span class="missing">missing</span>`;
      case 'column':
        return this.renderColumn(v);
      case 'table':
        return this.renderTable(v);
      case 'record':
        if (v.tag === 'fit') return this.renderFit(v);
        if (v.tag === 'pairs') return this.renderPairs(v);
        return this.renderResult(v);
      case 'chart':
        return html`<furrow-chart .value=${v} name=${this.name ?? 'chart'}></furrow-chart>`;
      case 'claim':
        return this.renderClaim(v);
      case 'error':
        return this.renderError(v);
    }
  }

  private renderColumn(c: Column): TemplateResult {
    if (columnLength(c) === 0) return html`<span class="quiet">an empty column</span>`;
    const header = c.name ?? this.name ?? 'value';
    return html`<p class="summary">${columnSummary(c)}</p>
      <furrow-grid .columns=${[c]} .names=${[header]} label=${header}></furrow-grid>`;
  }

  /** A button that saves a table of this value as CSV (`part`: which table of a record). */
  private saveCsv(t: Value | undefined, part: string | null, label: string): TemplateResult | typeof nothing {
    if (t === undefined || typeof t !== 'object' || t.kind !== 'table') return nothing;
    const name = part === null ? this.name : `${this.name ?? 'value'}-${part}`;
    return html`<button type="button" class="save-csv" title=${sheetWords.saveCsvTitle()} @click=${() => downloadCsv(fileNameFor(name, 'csv'), tableCsv(t))}>${label}</button>`;
  }

  private renderTable(t: Table): TemplateResult {
    return html`<p class="summary">${tableSummary(t)} ${this.saveCsv(t, null, sheetWords.saveCsv())}</p>
      <furrow-grid .columns=${t.columns} .names=${t.names} label=${this.name ?? 'table'}></furrow-grid>
      ${t.drawn === undefined ? nothing : html`<furrow-run-sheet .layout=${t} name=${this.name ?? 'layout'}></furrow-run-sheet>`}`;
  }

  private renderClaim(c: Claim): TemplateResult {
    return c.holds
      ? html`<div class="claim holds" role="status"><span class="verdict">✓ holds</span><span class="statement">${c.statement}</span></div>`
      : html`<div class="claim fails" role="alert"><span class="verdict">✗ does not hold</span><span class="statement">${c.statement}</span></div>`;
  }

  private renderError(e: ErrorValue): TemplateResult {
    return html`<p class="error ${e.upstream === null ? '' : 'upstream'}" style="margin:0">${e.message}</p>`;
  }

  private renderScalars(lines: readonly ScalarLine[]): TemplateResult | typeof nothing {
    if (lines.length === 0) return nothing;
    return html`<dl class="fields">
      ${lines.map(
        (l) => html`<dt>${l.label}${l.label !== l.field ? html`<code>${this.path(l.field)}</code>` : nothing}</dt>
          <dd class=${/^[-\d.<>]/.test(l.text) ? 'num' : ''} style="text-align:left">${l.text}</dd>`,
      )}
    </dl>`;
  }

  private renderPart(line: ValueLine): TemplateResult {
    // a field without words of its own is labelled by the name a formula reaches it by
    const label = line.label === line.field ? html`<code class="path">${this.path(line.field)}</code>` : html`<span class="label">${line.label} <code>${this.path(line.field)}</code></span>`;
    return html`<div class="part">
      ${label}
      <furrow-value .value=${line.value} name=${this.path(line.field)}></furrow-value>
    </div>`;
  }

  private renderFolded(line: ValueLine): TemplateResult {
    const v = line.value;
    const size = typeof v === 'object' && v.kind === 'column' ? ` (${columnSummary(v)})` : '';
    const path = html`<code class="path">${this.path(line.field)}</code>`;
    return html`<details>
      <summary>${line.label === line.field ? html`${path}${size}` : html`${line.label}${size} ${path}`}</summary>
      <furrow-value .value=${v} name=${this.path(line.field)}></furrow-value>
    </details>`;
  }

  private renderFit(r: RecordValue): TemplateResult {
    const f = fitLayout(r);
    return html`<section class="fit" aria-label="analysis of variance">
      <div>
        <p class="heading">Analysis of variance${f.design === null ? nothing : html`: <span class="design">${f.design}</span>`}</p>
        ${f.balance === null ? nothing : html`<p class="balance">${f.balance}</p>`}
      </div>
      ${f.anova === null
        ? nothing
        : html`<div class="wide">
            <table class="anova">
              <thead>
                <tr>
                  <th scope="col">Source</th>
                  <th scope="col" class="num">df</th>
                  <th scope="col" class="num">SS</th>
                  <th scope="col" class="num">MS</th>
                  <th scope="col" class="num">F</th>
                  <th scope="col" class="num">p</th>
                </tr>
              </thead>
              <tbody>
                ${f.anova.map(
                  (row) => html`<tr class="role-${row.role}">
                    <th scope="row">${row.source}</th>
                    <td class="num">${row.df}</td>
                    <td class="num">${row.ss}</td>
                    <td class="num">${row.ms}</td>
                    <td class="num">${row.f}</td>
                    <td class="num">${row.p}</td>
                  </tr>`,
                )}
              </tbody>
            </table>
          </div>`}
      ${f.means === null
        ? nothing
        : html`<div class="wide">
            <table class="means">
              <caption>${f.meansTitle}</caption>
              <thead>
                <tr>
                  <th rowspan="2" scope="col">level</th>
                  <th rowspan="2" scope="col" class="num">n</th>
                  <th rowspan="2" scope="col" class="num">mean</th>
                  <th rowspan="2" scope="col" class="num">se</th>
                  <th colspan="2" scope="colgroup" class="group">${f.intervalHeader}</th>
                </tr>
                <tr>
                  <th scope="col" class="num">low</th>
                  <th scope="col" class="num">high</th>
                </tr>
              </thead>
              <tbody>
                ${f.means.map(
                  (row) => html`<tr>
                    <th scope="row">${row.level}</th>
                    <td class="num">${row.n}</td>
                    <td class="num">${row.mean}</td>
                    <td class="num">${row.se}</td>
                    <td class="num">${row.low}</td>
                    <td class="num">${row.high}</td>
                  </tr>`,
                )}
              </tbody>
            </table>
          </div>`}
      <p class="exports">${this.saveCsv(r.fields.get('table'), 'analysis', sheetWords.saveAnalysisTable())} ${this.saveCsv(r.fields.get('means'), 'means', sheetWords.saveMeans())}</p>
      ${this.renderScalars(f.scalars)}
      ${f.notes.length === 0 ? nothing : html`<ul class="notes">${f.notes.map((n) => html`<li>${n}</li>`)}</ul>`}
      ${f.others.map((o) => this.renderPart(o))} ${f.folded.map((o) => this.renderFolded(o))}
    </section>`;
  }

  private renderPairs(r: RecordValue): TemplateResult {
    const p = pairsLayout(r);
    return html`<section class="pairs" aria-label="pairwise differences">
      ${p.rows === null
        ? html`<p class="heading">${p.title}</p>`
        : html`<div class="wide">
            <table class="pairs-table">
              <caption>${p.title}</caption>
              <thead>
                <tr>
                  <th rowspan="2" scope="col">pair</th>
                  <th rowspan="2" scope="col" class="num">difference</th>
                  <th rowspan="2" scope="col" class="num">se</th>
                  <th colspan="2" scope="colgroup" class="group">${p.intervalHeader}</th>
                  <th rowspan="2" scope="col" class="num">p</th>
                  <th rowspan="2" scope="col">interval excludes 0</th>
                </tr>
                <tr>
                  <th scope="col" class="num">low</th>
                  <th scope="col" class="num">high</th>
                </tr>
              </thead>
              <tbody>
                ${p.rows.map(
                  (row) => html`<tr>
                    <th scope="row">${row.pair}</th>
                    <td class="num">${row.estimate}</td>
                    <td class="num">${row.se}</td>
                    <td class="num">${row.low}</td>
                    <td class="num">${row.high}</td>
                    <td class="num">${row.p}</td>
                    <td>${row.excludesZero}</td>
                  </tr>`,
                )}
              </tbody>
            </table>
          </div>`}
      <p class="exports">${this.saveCsv(r.fields.get('table'), 'pairs', sheetWords.savePairs())}</p>
      ${this.renderScalars(p.scalars)} ${p.others.map((o) => this.renderPart(o))}
    </section>`;
  }

  /** A result record read in words, its fields one click away; any other record field by field. */
  private renderResult(r: RecordValue): TemplateResult {
    const s = recordSummary(r);
    if (s === null) return this.renderRecord(r);
    return html`<section class="result" aria-label=${s.kind}>
      <p class="headline">${s.headline}</p>
      ${s.details.map((d) => html`<p class="detail">${d}</p>`)} ${s.checks.length === 0 ? nothing : this.renderChecks(s)}
      ${s.notes.length === 0 ? nothing : html`<ul class="notes">${s.notes.map((n) => html`<li>${n}</li>`)}</ul>`}
      <details class="raw">
        <summary>Every field${this.name ? html` of <code>${this.name}</code>` : nothing}</summary>
        ${this.renderRecord(r)}
      </details>
    </section>`;
  }

  private renderChecks(s: RecordSummary): TemplateResult {
    return html`<table class="checks">
      <tbody>
        ${s.checks.map(
          (c) => html`<tr class=${c.verdict}>
            <th scope="row">${c.check}</th>
            <td class="verdict"><span class="mark" aria-hidden="true">${c.verdict === 'flag' ? '!' : c.verdict === 'clear' ? '✓' : '–'}</span> ${c.words}</td>
            <td class="numbers">${c.numbers}</td>
          </tr>`,
        )}
      </tbody>
    </table>`;
  }

  private renderRecord(r: RecordValue): TemplateResult {
    const lines = recordLines(r);
    const scalars: ScalarLine[] = [];
    const parts: TemplateResult[] = [];
    for (const l of lines) {
      const v = l.value;
      if (l.text !== null) scalars.push({ field: l.field, label: l.field, text: l.text });
      else if (typeof v === 'object' && v.kind === 'column' && columnLength(v) > FOLD_COLUMN) parts.push(this.renderFolded({ field: l.field, label: l.field, value: v }));
      else parts.push(this.renderPart({ field: l.field, label: l.field, value: v }));
    }
    return html`<section class="record">${this.renderScalars(scalars)} ${parts}</section>`;
  }
}

if (!customElements.get('furrow-value')) customElements.define('furrow-value', FurrowValue);

declare global {
  interface HTMLElementTagNameMap {
    'furrow-value': FurrowValue;
  }
}
