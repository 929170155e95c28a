/**
 * The table cell's look: a quiet ruled sheet in the page's colours, names above in small
 * type, numbers right-aligned in tabular figures, marks in the error colour. Printing drops
 * the buttons and the scroll box and lays the rows out in full (up to a limit).
 */
import { css, unsafeCSS } from 'lit';
import { ROW_HEIGHT } from './grid-layout.ts';

const ROW = unsafeCSS(`${ROW_HEIGHT}px`);

/** Styles of `<furrow-table-cell>`. */
export const tableCellStyles = css`
  :host {
    display: block;
    --row-h: ${ROW};
  }
  .top {
    display: flex;
    flex-wrap: wrap;
    align-items: baseline;
    gap: 0.35rem 0.9rem;
    margin: 0 0 0.4rem;
  }
  .table-name {
    font-family: var(--font-code);
    font-size: 0.95rem;
    font-weight: 600;
    color: var(--ink);
    background: transparent;
    border: 1px solid transparent;
    border-bottom: 1px dotted var(--rule-strong);
    border-radius: 0;
    padding: 0.05rem 0.15rem;
    width: auto;
    field-sizing: content;
    min-width: 4ch;
    max-width: 40ch;
  }
  .table-name:hover {
    border-bottom-color: var(--accent);
  }
  .table-name:focus {
    outline: none;
    border-bottom: 1px solid var(--accent);
    background: var(--sheet);
  }
  .table-name[aria-invalid='true'] {
    border-bottom-color: var(--error);
    color: var(--error);
  }
  .counts {
    font-size: 0.8rem;
    color: var(--muted);
  }
  .tools {
    display: flex;
    flex-wrap: wrap;
    gap: 0.3rem;
    margin-left: auto;
  }
  .tools button {
    font-size: 0.75rem;
    padding: 0.1rem 0.45rem;
  }
  .tools button[disabled] {
    opacity: 0.45;
    cursor: default;
  }
  .file-input {
    display: none;
  }
  .line {
    margin: 0.2rem 0 0.45rem;
    font-size: 0.85rem;
    color: var(--ink-soft);
  }
  .line.problem {
    color: var(--error);
  }
  .line.file {
    font-family: var(--font-text);
    font-style: italic;
  }
  .line code,
  .raw code {
    font-family: var(--font-code);
    font-size: 0.8rem;
    background: var(--error-soft);
    padding: 0 0.25rem;
    border-radius: 2px;
    white-space: pre-wrap;
  }

  /* the sheet */
  .scroller {
    position: relative;
    width: fit-content;
    max-width: 100%;
    box-sizing: border-box;
    /* at least 20 rows and the names whole, so a 20-row table shows its last row without scrolling */
    max-height: max(min(70vh, 34rem), calc(20 * var(--row-h) + 3.6rem));
    overflow: auto;
    border: 1px solid var(--rule);
    border-radius: var(--radius);
    background: var(--sheet);
    font-size: 0.85rem;
    user-select: none;
    -webkit-user-select: none;
    outline: none;
    overscroll-behavior: contain;
  }
  .scroller:focus-visible,
  .scroller:focus-within {
    border-color: var(--rule-strong);
  }
  .sheet {
    position: relative;
    width: max-content;
    min-width: 100%;
  }
  .row {
    display: grid;
    grid-template-columns: var(--cols);
    height: var(--row-h);
  }
  .head {
    position: sticky;
    top: 0;
    z-index: 3;
    height: auto;
    background: var(--sheet);
    border-bottom: 1px solid var(--rule-strong);
  }
  .body {
    position: relative;
  }
  .rows {
    position: absolute;
    top: 0;
    left: 0;
    right: 0;
    will-change: transform;
  }
  .f,
  .rn,
  .nm,
  .corner {
    box-sizing: border-box;
    padding: 0 0.5rem;
    line-height: calc(var(--row-h) - 1px);
    border-bottom: 1px solid var(--rule);
    border-right: 1px solid var(--rule);
    white-space: pre;
    overflow: hidden;
    text-overflow: ellipsis;
    font-variant-numeric: tabular-nums lining-nums;
  }
  .f {
    cursor: cell;
  }
  .rn,
  .corner {
    position: sticky;
    left: 0;
    z-index: 1;
    background: var(--paper);
    color: var(--muted);
    font-size: 0.72rem;
    text-align: right;
    cursor: default;
  }
  .corner {
    z-index: 4;
  }
  .nm {
    white-space: nowrap;
    line-height: 1.2;
    padding-top: 0.3rem;
    padding-bottom: 0.25rem;
    cursor: cell;
    border-bottom: none;
  }
  .nm .col-name {
    display: block;
    font-weight: 600;
    overflow: hidden;
    text-overflow: ellipsis;
  }
  .nm .col-reads {
    display: block;
    font-size: 0.68rem;
    letter-spacing: 0.04em;
    color: var(--muted);
    overflow: hidden;
    text-overflow: ellipsis;
  }
  .nm .bad-count {
    color: var(--error);
    font-weight: 600;
  }
  .num {
    text-align: right;
  }
  .missing {
    color: var(--rule-strong);
    text-align: center;
  }
  .bad {
    color: var(--error);
    background: var(--error-soft);
    text-decoration: underline dotted;
    text-underline-offset: 3px;
  }
  .in {
    background: var(--accent-soft);
  }
  .bad.in {
    background: color-mix(in srgb, var(--error-soft) 55%, var(--accent-soft));
  }
  .at {
    box-shadow: inset 0 0 0 2px var(--accent);
  }
  .rn.in {
    color: var(--accent);
    font-weight: 600;
  }
  .scroller:not(:focus-within) .at {
    box-shadow: inset 0 0 0 1px var(--rule-strong);
  }
  .read-only .f {
    cursor: default;
  }
  .empty-rows {
    padding: 0.6rem 0.8rem;
    color: var(--muted);
    font-style: italic;
    font-family: var(--font-text);
  }

  /* the one field editor, laid over the field it edits */
  .editor {
    position: absolute;
    z-index: 5;
    box-sizing: border-box;
    margin: 0;
    min-height: var(--row-h);
    max-height: calc(8 * var(--row-h));
    max-width: 60ch;
    field-sizing: content;
    padding: 0 calc(0.5rem - 2px);
    font: inherit;
    line-height: calc(var(--row-h) - 4px);
    font-variant-numeric: tabular-nums lining-nums;
    color: var(--ink);
    background: var(--sheet);
    border: 2px solid var(--accent);
    border-radius: 0;
    outline: none;
    resize: none;
    overflow: hidden;
    white-space: pre;
    box-shadow: 0 2px 6px rgb(0 0 0 / 0.12);
  }
  .editor[aria-invalid='true'] {
    border-color: var(--error);
  }
  .editor-problem {
    position: absolute;
    z-index: 6;
    max-width: 44ch;
    padding: 0.25rem 0.5rem;
    font-size: 0.78rem;
    line-height: 1.3;
    white-space: normal;
    color: var(--error);
    background: var(--error-soft);
    border: 1px solid var(--error);
    border-radius: var(--radius);
  }

  /* the CSV text, when it does not read as a table or when asked for */
  .raw textarea {
    box-sizing: border-box;
    width: 100%;
    min-height: 8rem;
    max-height: 70vh;
    padding: 0.5rem 0.6rem;
    font-family: var(--font-code);
    font-size: 0.82rem;
    line-height: 1.45;
    color: var(--ink);
    background: var(--sheet);
    border: 1px solid var(--rule-strong);
    border-radius: var(--radius);
    resize: vertical;
    tab-size: 4;
  }
  .raw textarea:focus {
    outline: 2px solid var(--accent);
    outline-offset: -1px;
  }
  .raw.broken textarea {
    border-color: var(--error);
  }
  .status {
    min-height: 1.1rem;
    margin: 0.3rem 0 0;
    font-size: 0.78rem;
    color: var(--muted);
  }
  .status.problem {
    color: var(--error);
  }
  .line.offer {
    margin-top: 0.15rem;
  }
  .line.offer button {
    font-size: 0.75rem;
    padding: 0.1rem 0.45rem;
  }
  @media print {
    .line.offer {
      display: none;
    }
  }
  .print-only {
    display: none;
  }

  @media print {
    .tools,
    .status,
    .file-input,
    .editor,
    .editor-problem {
      display: none !important;
    }
    .table-name {
      border: none;
    }
    .scroller {
      max-height: none;
      overflow: visible;
      border-color: #999;
    }
    .head,
    .rn,
    .corner {
      position: static;
    }
    .body {
      height: auto !important;
    }
    .rows {
      position: static;
      transform: none !important;
    }
    .row {
      break-inside: avoid;
    }
    .in {
      background: none;
    }
    .at,
    .scroller:not(:focus-within) .at {
      box-shadow: none;
    }
    .print-only {
      display: block;
    }
    .raw textarea {
      max-height: none;
      border-color: #999;
    }
  }
`;
