/**
 * The look of the page, in one place: a calm, typographic sheet. Colours are custom
 * properties so that print and any later theme change them once. Numbers use tabular
 * figures everywhere they line up.
 */
import { css } from 'lit';

/** Custom properties, set on :root by index.html and inherited through shadow roots. */
export const THEME_PROPERTIES = `
  --paper: #fbfaf6;
  --sheet: #ffffff;
  --ink: #1d2125;
  --ink-soft: #4a5058;
  --muted: #7a7f87;
  --rule: #e4e1d8;
  --rule-strong: #c9c4b6;
  --accent: #2d6a57;
  --accent-soft: #e3efe9;
  --error: #a8321f;
  --error-soft: #fbece8;
  --upstream: #8a5a00;
  --upstream-soft: #fbf3e1;
  --pending: #4f6d8f;
  --pending-soft: #e9eff6;
  --warn: #8a5a00;
  --font-text: "Iowan Old Style", "Palatino Linotype", Palatino, "Book Antiqua", Georgia, serif;
  --font-ui: system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif;
  --font-code: ui-monospace, "SFMono-Regular", "Cascadia Mono", "DejaVu Sans Mono", Menlo, Consolas, monospace;
  --radius: 4px;
`;

/** Styles shared by components: tabular figures, small caps labels, status colours. */
export const shared = css`
  :host {
    font-family: var(--font-ui);
    color: var(--ink);
  }
  .num,
  td.num,
  th.num {
    font-variant-numeric: tabular-nums lining-nums;
    text-align: right;
    white-space: nowrap;
  }
  .label {
    font-size: 0.72rem;
    letter-spacing: 0.06em;
    text-transform: uppercase;
    color: var(--muted);
  }
  .error-text {
    color: var(--error);
  }
  .upstream-text {
    color: var(--upstream);
  }
  button {
    font: inherit;
    font-size: 0.8rem;
    color: var(--ink-soft);
    background: transparent;
    border: 1px solid var(--rule-strong);
    border-radius: var(--radius);
    padding: 0.15rem 0.5rem;
    cursor: pointer;
  }
  button:hover {
    border-color: var(--accent);
    color: var(--accent);
  }
  button:focus-visible {
    outline: 2px solid var(--accent);
    outline-offset: 1px;
  }
`;
