/**
 * The look of values: compact ruled tables in tabular figures, labelled fields, and the
 * colours that say whether a claim holds. Shared by the value elements.
 */
import { css } from 'lit';

/** Tables of numbers: light horizontal rules, no boxes, figures that line up. */
export const tableStyles = css`
  table {
    border-collapse: collapse;
    font-size: 0.85rem;
    line-height: 1.35;
  }
  caption {
    caption-side: top;
    text-align: left;
    font-family: var(--font-text);
    font-size: 0.95rem;
    color: var(--ink);
    padding: 0 0 0.3rem;
  }
  th,
  td {
    padding: 0.2rem 0.6rem;
    text-align: left;
    vertical-align: baseline;
    white-space: nowrap;
  }
  th:first-child,
  td:first-child {
    padding-left: 0.15rem;
  }
  thead th {
    vertical-align: bottom;
    font-weight: 600;
    font-size: 0.78rem;
    color: var(--ink-soft);
    border-bottom: 1px solid var(--rule-strong);
  }
  tbody tr + tr td,
  tbody tr + tr th {
    border-top: 1px solid var(--rule);
  }
  tbody th {
    font-weight: normal;
    color: var(--ink);
  }
  td.missing,
  span.missing {
    color: var(--muted);
    font-style: italic;
    font-size: 0.8em;
  }
  .rowno {
    color: var(--muted);
    font-size: 0.75rem;
  }
  .text-cell {
    max-width: 22rem;
    overflow: hidden;
    text-overflow: ellipsis;
  }
`;
