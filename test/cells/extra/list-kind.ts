/**
 * A small cell kind that lives only in the test folder: `--- list NAME`, whose body is one
 * number per line (a blank line is a missing value), and whose value is that column. It
 * proves that a kind is one description: nothing outside this file knows about it.
 */
import type { Cell } from '../../../src/doc/document.ts';
import type { CellKind } from '../../../src/graph/cell-kind.ts';
import { LangError } from '../../../src/lang/errors.ts';
import { isPlainName } from '../../../src/lang/lexer.ts';
import { errorValue, numberColumn } from '../../../src/lang/values.ts';

const words = (rest: string): string[] => rest.split(/[ \t]+/).filter((w) => w.length > 0);
const nameOf = (cell: Cell): string | null => words(cell.marker)[1] ?? null;

export const listKind: CellKind = {
  kind: 'list',
  label: 'list',
  readMarker: (rest) => ({ name: words(rest)[0] ?? null, file: null, extra: words(rest).slice(1) }),
  template: (fresh) => ({ marker: `list ${fresh('list')}`, body: '1\n\n' }),
  nameOf,
  rename: (cell, name) => ({ marker: `list ${name}`, body: cell.body }),
  filesRead: () => [],
  printing: { heading: (name) => `list ${name ?? ''}`, faultsOnMarker: true },
  analyse(cell) {
    const name = nameOf(cell);
    const lines = cell.body.replace(/(\r?\n)+$/, '').split(/\r?\n/);
    const values = new Float64Array(lines.length);
    const missing = new Uint8Array(lines.length);
    let problem = name === null || !isPlainName(name) ? errorValue('A list needs a plain name after "list".', 0, 0) : null;
    let at = 0;
    lines.forEach((line, i) => {
      const t = line.trim();
      if (t === '') missing[i] = 1;
      else if (/^[-+]?(\d+\.?\d*|\.\d+)$/.test(t)) values[i] = Number(t);
      else problem ??= errorValue(`Line ${i + 1} of the list is not a number: "${t}".`, at, at + line.length);
      at += line.length + 1;
    });
    return {
      defines: problem === null && name !== null ? { name, from: -1, to: -1 } : null,
      reads: [],
      problem,
      evaluates: true,
      evaluate: () => {
        if (problem !== null) throw new LangError(problem.message, problem.from, problem.to);
        return { value: numberColumn(values, missing, name) };
      },
    };
  },
};
