/**
 * The look of the page's shell: the toolbar, the banner, the title block, and the sheet of
 * cells with their margins. Cells draw themselves (cells/<kind>/view.ts).
 */
import { css } from 'lit';

export const appStyles = css`
  :host {
    display: block;
    min-height: 100vh;
    background: var(--paper);
  }
  .bar {
    position: sticky;
    top: 0;
    z-index: 5;
    display: flex;
    align-items: center;
    gap: 0.4rem;
    padding: 0.45rem 1.5rem;
    background: color-mix(in srgb, var(--paper) 92%, transparent);
    backdrop-filter: blur(4px);
    border-bottom: 1px solid var(--rule);
    font-size: 0.82rem;
    flex-wrap: wrap;
    row-gap: 0.3rem;
  }
  .bar button {
    white-space: nowrap;
  }
  .mark {
    font-family: var(--font-text);
    font-weight: 700;
    letter-spacing: 0.14em;
    font-size: 0.8rem;
    color: var(--accent);
    margin-right: 0.8rem;
  }
  .sep {
    width: 1px;
    height: 1.1rem;
    background: var(--rule-strong);
    margin: 0 0.3rem;
  }
  .bar select {
    font: inherit;
    font-size: 0.8rem;
    color: var(--ink-soft);
    background: transparent;
    border: 1px solid var(--rule-strong);
    border-radius: var(--radius);
    padding: 0.1rem 0.3rem;
  }
  .status {
    margin-left: auto;
    color: var(--muted);
    font-size: 0.78rem;
    /* one line: at 800 px the words give way (ellipsis) before the buttons wrap */
    flex: 0 1 auto;
    min-width: 0;
    white-space: nowrap;
    overflow: hidden;
    text-overflow: ellipsis;
  }
  .banner {
    max-width: 58rem;
    margin: 0.8rem auto 0;
    padding: 0.45rem 0.8rem;
    font-size: 0.86rem;
    border-radius: var(--radius);
    display: flex;
    gap: 0.8rem;
    align-items: baseline;
  }
  .banner.info {
    background: var(--accent-soft);
    color: var(--ink);
  }
  .banner.problem {
    background: var(--error-soft);
    color: var(--error);
  }
  .banner button {
    margin-left: auto;
    border: none;
  }
  main {
    max-width: 58rem;
    margin: 0 auto;
    padding: 1.6rem 1.5rem 5rem;
  }
  header {
    margin: 0 0 1.6rem 8rem;
  }
  .title {
    font-family: var(--font-text);
    font-size: 1.9rem;
    font-weight: 600;
    line-height: 1.2;
    color: var(--ink);
    border: none;
    background: transparent;
    width: 100%;
    padding: 0;
    margin: 0;
    resize: none;
    field-sizing: content;
  }
  .title:focus {
    outline: none;
    box-shadow: 0 2px 0 var(--accent-soft);
  }
  .byline {
    font-family: var(--font-text);
    color: var(--ink-soft);
    margin-top: 0.3rem;
  }
  .caution {
    margin-top: 1rem;
    padding: 0.55rem 0.8rem;
    border-left: 3px solid var(--upstream);
    background: var(--upstream-soft);
    font-size: 0.9rem;
    line-height: 1.45;
  }
  .caution b {
    font-size: 0.72rem;
    letter-spacing: 0.08em;
    text-transform: uppercase;
    color: var(--upstream);
    margin-right: 0.4rem;
  }
  .cell {
    display: grid;
    /* minmax(0, 1fr): a long value wraps or scrolls in its own box instead of widening the page */
    grid-template-columns: 7rem minmax(0, 1fr);
    column-gap: 1rem;
    padding: 0.7rem 0;
    border-top: 1px solid var(--rule);
    position: relative;
  }
  .margin {
    text-align: right;
    padding-top: 0.15rem;
    font-size: 0.78rem;
    line-height: 1.3;
    border-right: 3px solid transparent;
    padding-right: 0.7rem;
    min-height: 1.6rem;
  }
  .cell.error .margin {
    border-right-color: var(--error);
  }
  .cell.upstream .margin {
    border-right-color: var(--upstream);
  }
  .cell.pending .margin {
    border-right-color: var(--pending);
  }
  .kind {
    font-size: 0.66rem;
    letter-spacing: 0.1em;
    text-transform: uppercase;
    color: var(--muted);
  }
  .name {
    display: block;
    font-family: var(--font-code);
    font-size: 0.8rem;
    color: var(--ink);
    overflow-wrap: anywhere;
    background: none;
    border: none;
    padding: 0;
    cursor: text;
    text-align: right;
    width: 100%;
  }
  .name:hover {
    color: var(--accent);
  }
  .name-input {
    font-family: var(--font-code);
    font-size: 0.8rem;
    width: 100%;
    box-sizing: border-box;
    text-align: right;
  }
  .state-word {
    display: block;
    margin-top: 0.2rem;
    font-size: 0.72rem;
  }
  .cell.error .state-word {
    color: var(--error);
  }
  .cell.upstream .state-word {
    color: var(--upstream);
  }
  .cell.pending .state-word {
    color: var(--pending);
  }
  .body {
    min-width: 0;
  }
  .tools {
    display: flex;
    justify-content: flex-end;
    gap: 0.2rem;
    margin-top: 0.4rem;
    opacity: 0;
    transition: opacity 0.12s;
  }
  .tools button {
    padding: 0 0.35rem;
    line-height: 1.25rem;
    font-size: 0.72rem;
  }
  .insert {
    position: absolute;
    left: 8rem;
    bottom: -0.75rem;
    z-index: 2;
    display: flex;
    gap: 0.3rem;
    opacity: 0;
    transition: opacity 0.12s;
  }
  .insert button {
    font-size: 0.72rem;
    padding: 0 0.4rem;
    line-height: 1.25rem;
    background: var(--paper);
  }
  .cell:hover .tools,
  .cell:focus-within .tools,
  .cell:hover .insert,
  .cell:focus-within .insert {
    opacity: 1;
  }
  .inert pre {
    font-family: var(--font-code);
    font-size: 0.82rem;
    color: var(--ink-soft);
    white-space: pre-wrap;
    margin: 0;
  }
  .add {
    display: flex;
    gap: 0.4rem;
    margin: 0.2rem 0 0 8rem;
    padding-top: 0.6rem;
    border-top: 1px solid var(--rule);
  }
  .judgement {
    margin: 1.2rem 0 0 8rem;
    font-size: 0.8rem;
    color: var(--muted);
  }
  .add span {
    color: var(--muted);
    font-size: 0.8rem;
    align-self: center;
    margin-right: 0.3rem;
  }
  @media (max-width: 720px) {
    header,
    .add,
    .judgement {
      margin-left: 0;
    }
    .cell {
      grid-template-columns: minmax(0, 1fr);
    }
    .margin {
      text-align: left;
      border-right: none;
      border-left: 3px solid transparent;
      padding: 0 0 0.3rem 0.5rem;
    }
  }
  @media print {
    :host {
      background: white;
    }
    .bar,
    .tools,
    .insert,
    .add,
    .banner {
      display: none;
    }
    main {
      max-width: none;
      padding: 0;
    }
    .cell {
      break-inside: avoid;
    }
  }
  /* the help panel: a drawer on the right; on a wide screen the sheet moves aside for it */
  aside.help {
    position: fixed;
    top: 0;
    right: 0;
    bottom: 0;
    width: min(26rem, 100vw);
    z-index: 10;
    box-shadow: -6px 0 18px rgb(0 0 0 / 0.08);
  }
  @media (min-width: 1100px) {
    main.with-help {
      margin-right: 26rem;
      margin-left: max(0px, calc((100vw - 26rem - 58rem) / 2));
    }
  }
  @media print {
    aside.help {
      display: none;
    }
  }
`;
