/**
 * The report's one stylesheet: screen and print alike, so "Print or save as PDF" from the
 * browser gives the same layout. Inline in the report, allowed by its hash in the content
 * security policy.
 */
export const REPORT_CSS = `
:root { --ink: #1d232b; --muted: #5d6673; --rule: #d5dae1; --accent: #205f8f; --soft: #e9f1f8;
  --bad: #a3261b; --bad-soft: #fbeae8; --warn: #7a5200; --warn-soft: #fdf3dc; --good: #23663a; --good-soft: #e6f3ea; }
* { box-sizing: border-box; }
body { margin: 0 auto; max-width: 58rem; padding: 2rem 1.5rem 4rem; color: var(--ink); background: #fff;
  font: 16px/1.5 Georgia, 'Times New Roman', serif; }
h1 { font-size: 1.8rem; line-height: 1.2; margin: 0 0 0.4rem; }
h2 { font-size: 1.2rem; margin: 2rem 0 0.6rem; border-bottom: 1px solid var(--rule); padding-bottom: 0.2rem; }
h3, h4 { font-size: 1rem; margin: 1rem 0 0.3rem; }
code, pre, .source, table, .scalars, .column, .size, .cut, .label, .fingerprint { font-family: ui-monospace, 'DejaVu Sans Mono', Menlo, Consolas, monospace; }
.meta { display: grid; grid-template-columns: max-content 1fr; gap: 0.1rem 1rem; margin: 0.5rem 0 1rem; color: var(--muted); }
.meta dt { font-weight: 600; }
.meta dd { margin: 0; }
.caution { border-left: 6px solid var(--warn); background: var(--warn-soft); padding: 0.6rem 0.9rem; margin: 1rem 0; }
.warnings { list-style: none; margin: 0.4rem 0; padding: 0.3rem 0.7rem; border-left: 3px solid var(--warn); background: var(--warn-soft); font-size: 0.9rem; }
.verdict { padding: 0.7rem 0.9rem; border-radius: 4px; margin: 0.6rem 0; }
.verdict.ok { background: var(--good-soft); border-left: 6px solid var(--good); }
.verdict.bad { background: var(--bad-soft); border-left: 6px solid var(--bad); }
.verdict.none { background: var(--soft); border-left: 6px solid var(--accent); }
.verdict ul { margin: 0.4rem 0 0; padding-left: 1.2rem; font-size: 0.9rem; }
.fingerprint { font-size: 0.78rem; word-break: break-all; color: var(--muted); }
.claims { list-style: none; padding: 0; margin: 0.4rem 0; }
.claims li { margin: 0.25rem 0; }
.claim { padding: 0.45rem 0.7rem; border-left: 4px solid var(--good); background: var(--good-soft); }
.claim.fails { border: 2px solid var(--bad); border-left-width: 8px; background: var(--bad-soft); }
.claim .verdict-word, .claim .verdict { font-weight: 700; margin-right: 0.4rem; padding: 0; background: none; border: 0; }
.claim.fails .verdict { color: var(--bad); text-transform: uppercase; }
.claims a { color: var(--accent); }
.cell { margin: 1.2rem 0; break-inside: auto; }
.result { border-left: 3px solid var(--rule); padding-left: 0.7rem; }
.result .headline { font-family: Georgia, serif; font-size: 1.02rem; margin: 0 0 0.2rem; }
.result .detail { font-size: 0.85rem; color: var(--muted); margin: 0 0 0.15rem; }
.result table.checks th, .result table.checks td { text-align: left; }
.result table.checks tr.flag td:nth-child(2) { color: var(--bad); font-weight: 600; }
.result details.fields > summary { font-size: 0.8rem; color: var(--muted); cursor: pointer; }
.label { font-size: 0.75rem; color: var(--muted); margin: 0 0 0.2rem; }
.source { font-size: 0.82rem; color: var(--muted); background: #f6f7f9; padding: 0.3rem 0.5rem; margin: 0 0 0.4rem; white-space: pre-wrap; }
table { border-collapse: collapse; font-size: 0.82rem; margin: 0.3rem 0 0.6rem; font-variant-numeric: tabular-nums; }
caption { text-align: left; font-weight: 600; font-family: Georgia, serif; padding-bottom: 0.2rem; }
th, td { padding: 0.15rem 0.6rem; border-bottom: 1px solid var(--rule); text-align: right; }
th:first-child, td.text, th.text { text-align: left; }
thead th { border-bottom: 2px solid var(--ink); }
td.missing { color: var(--muted); font-style: italic; }
table.anova tr.error th, table.anova tr.total th { font-weight: 400; font-style: italic; }
table.anova tr.total td, table.anova tr.total th { border-top: 1px solid var(--ink); }
.size, .cut { font-size: 0.75rem; color: var(--muted); margin: 0.2rem 0; }
.scalars { display: grid; grid-template-columns: max-content 1fr; gap: 0 1rem; font-size: 0.85rem; margin: 0.3rem 0; }
.scalars dt { color: var(--muted); }
.scalars dd { margin: 0; }
.design { font-weight: 600; margin: 0.2rem 0; }
.balance { font-size: 0.9rem; margin: 0.2rem 0; color: var(--muted); }
.error { color: var(--bad); }
.failed { color: var(--bad); font-style: italic; }
.note p { margin: 0.5rem 0; }
.live { font-weight: 600; color: var(--accent); font-variant-numeric: tabular-nums; }
.live.failed { font-weight: 400; color: var(--bad); }
.live.doubt { color: var(--bad); background: var(--bad-soft); outline: 1px solid var(--bad); }
.doubt-note { font-size: 0.8rem; color: var(--bad); margin: 0.2rem 0; }
figure.chart { margin: 0.6rem 0; }
figure.chart svg { max-width: 100%; height: auto; }
figcaption { font-size: 0.8rem; color: var(--muted); }
footer { margin-top: 3rem; border-top: 1px solid var(--rule); padding-top: 0.6rem; font-size: 0.8rem; color: var(--muted); }
@media print {
  body { max-width: none; padding: 0; font-size: 11pt; }
  h2 { break-after: avoid; }
  table, figure.chart, .claim, .verdict, .caution, .warnings { break-inside: avoid; }
  a { color: inherit; text-decoration: none; }
}
`;
