/**
 * Human-readable text of values for the command line: numbers by the one digits policy,
 * tables as aligned columns, analysis-of-variance tables in the trade's layout, records
 * as labelled fields.
 */
import { numberText, quantityOf } from '../format/digits.ts';
import { decimalAt, elementAt, isColumn, isRecord, isTable, type Table, type Value } from '../lang/values.ts';
import { cliMsg } from '../messages/cli.ts';

const MAX_ROWS = 30;

/**
 * Characters a terminal would act on rather than show (escape sequences that clear the
 * screen, hide text, set the window title or make links; carriage returns that overwrite a
 * line; direction overrides that reorder it), written visibly as `\x1B` or `\u202E`. A
 * document's text can then never paint a fake verdict on a reviewer's screen.
 */
const TERMINAL_CONTROLS = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F\u061C\u200E\u200F\u2028\u2029\u202A-\u202E\u2066-\u2069]/g;

/** Text made safe to print: control characters shown as escapes; line feeds and tabs kept. */
export function visible(text: string): string {
  return text.replace(TERMINAL_CONTROLS, (c) => {
    const code = c.charCodeAt(0);
    return code <= 0xff ? `\\x${code.toString(16).toUpperCase().padStart(2, '0')}` : `\\u${code.toString(16).toUpperCase().padStart(4, '0')}`;
  });
}

/** A scalar as text; a number by the digits policy for the quantity its column or field name says. */
function scalar(v: Value, column = ''): string {
  if (typeof v === 'number') return numberText(v, quantityOf(column));
  if (typeof v === 'string') return visible(v);
  if (typeof v === 'boolean') return v ? 'true' : 'false';
  if (typeof v === 'object' && v.kind === 'missing') return '·';
  return '';
}

/** A table as aligned text columns; numbers right-aligned. */
export function tableText(t: Table, indent = ''): string[] {
  const shown = Math.min(t.rows, MAX_ROWS);
  const cells: string[][] = t.names.map((name, j) => {
    const col = t.columns[j]!;
    const out = [visible(name)];
    // typed numbers print as typed (21.0 stays 21.0); computed ones by the digits policy
    const typed = col.type === 'number' ? col.decimals : null;
    for (let i = 0; i < shown; i++) out.push((typed === null ? '' : decimalAt(typed, i)) || scalar(elementAt(col, i), name));
    return out;
  });
  const widths = cells.map((c) => Math.max(...c.map((s) => s.length)));
  const lines: string[] = [];
  for (let i = 0; i <= shown; i++) {
    const row = cells.map((c, j) => {
      const s = c[i]!;
      const numeric = t.columns[j]!.type === 'number';
      return numeric ? s.padStart(widths[j]!) : s.padEnd(widths[j]!);
    });
    lines.push(indent + row.join('  ').trimEnd());
    if (i === 0) lines.push(indent + widths.map((w) => '─'.repeat(w)).join('  '));
  }
  if (t.rows > shown) lines.push(`${indent}${cliMsg.moreRows(t.rows - shown, t.rows)}`);
  return lines;
}

/** A value as lines of text. */
export function valueText(v: Value, indent = '', field = ''): string[] {
  if (isTable(v)) return tableText(v, indent);
  if (isColumn(v)) {
    const n = v.values.length;
    const shown: string[] = [];
    for (let i = 0; i < Math.min(n, 20); i++) shown.push(scalar(elementAt(v, i), field));
    return [`${indent}[${shown.join(', ')}${n > 20 ? `, ${cliMsg.inAll(n)}` : ''}]`];
  }
  if (isRecord(v)) {
    const lines: string[] = [];
    for (const [k, x] of v.fields) {
      if (isTable(x) || isRecord(x)) {
        lines.push(`${indent}${k}:`);
        lines.push(...valueText(x, `${indent}  `));
      } else if (isColumn(x)) {
        lines.push(`${indent}${k}: ${valueText(x, '', k)[0]}`);
      } else {
        lines.push(`${indent}${k}: ${inline(x, k)}`);
      }
    }
    return lines;
  }
  return inline(v)
    .split('\n')
    .map((l) => indent + l);
}

function inline(v: Value, field = ''): string {
  if (typeof v === 'object') {
    switch (v.kind) {
      case 'chart':
        return `(chart) ${v.caption}`;
      case 'claim':
        return `${v.holds ? 'HOLDS' : 'DOES NOT HOLD'}: ${v.statement}`;
      case 'error':
        return `error: ${v.message}`;
      default:
        return scalar(v, field);
    }
  }
  return scalar(v, field);
}
