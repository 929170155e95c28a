// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import '../../../src/views/values/value.ts';
import type { FurrowGrid } from '../../../src/views/values/grid.ts';
import { columnSummary } from '../../../src/views/values/value.ts';
import { MISSING, numberColumn, record, table, textColumn, type Value } from '../../../src/lang/values.ts';

let mounted: HTMLElement[] = [];
afterEach(() => {
  for (const el of mounted) el.remove();
  mounted = [];
});

async function show(value: Value, name?: string) {
  const el = document.createElement('furrow-value');
  el.value = value;
  if (name !== undefined) el.name = name;
  document.body.append(el);
  mounted.push(el);
  await el.updateComplete;
  return el.shadowRoot!;
}

const nums = (xs: number[], name: string | null = null) => numberColumn(new Float64Array(xs), null, name);
const cells = (row: Element) => [...row.children].map((c) => c.textContent!.trim());

describe('<furrow-value>', () => {
  it('draws scalars by type', async () => {
    expect((await show(Math.PI)).textContent!.trim()).toBe('3.14159');
    expect((await show('open centre')).textContent!.trim()).toBe('open centre');
    expect((await show(false)).textContent!.trim()).toBe('false');
    const missing = await show(MISSING);
    expect(missing.querySelector('.missing')!.textContent).toBe('missing');
  });

  it('makes a failing claim impossible to miss, and a holding one calm', async () => {
    const fails = await show({ kind: 'claim', holds: false, statement: 'open beats spindle by 2 kg' });
    const box = fails.querySelector('.claim')!;
    expect(box.classList.contains('fails')).toBe(true);
    expect(box.getAttribute('role')).toBe('alert');
    expect(box.textContent).toContain('does not hold');
    expect(box.textContent).toContain('open beats spindle by 2 kg');
    const holds = await show({ kind: 'claim', holds: true, statement: 's' });
    expect(holds.querySelector('.claim.holds')!.textContent).toContain('holds');
  });

  it('draws a fit as an analysis of variance with its means', async () => {
    const anova = table(
      ['source', 'df', 'ss', 'ms', 'f', 'p'],
      [textColumn(['method', 'error', 'total']), nums([2, 21, 23]), nums([84.5, 42.7, 127.2]), nums([42.25, 2.0333, NaN]), nums([20.78, NaN, NaN]), nums([0.0000102, NaN, NaN], 'p')],
    );
    const means = table(
      ['level', 'n', 'mean', 'se', 'low', 'high'],
      [textColumn(['open', 'spindle', 'vase']), nums([8, 8, 8]), nums([41.2, 38.9, 39.5]), nums([0.5, 0.5, 0.5]), nums([40.16, 37.86, 38.46]), nums([42.24, 39.94, 40.54])],
    );
    const fit = record(
      [
        ['design', 'completely randomized'],
        ['table', anova],
        ['means', means],
        ['mse', 2.0333],
        ['fitted', nums(Array.from({ length: 24 }, () => 40))],
        ['balanced', true],
      ],
      'fit',
    );
    const root = await show(fit, 'fit');
    const rows = [...root.querySelectorAll('table.anova tbody tr')];
    expect(cells(root.querySelector('table.anova thead tr')!)).toEqual(['Source', 'df', 'SS', 'MS', 'F', 'p']);
    expect(rows.map(cells)).toEqual([
      // the digits policy: SS and MS to four significant digits, F to three, p "< 0.001"
      ['method', '2', '84.50', '42.25', '20.8', '< 0.001'],
      ['error', '21', '42.70', '2.033', '', ''],
      ['total', '23', '127.2', '', '', ''],
    ]);
    expect(root.querySelectorAll('table.means tbody tr')).toHaveLength(3);
    expect(root.textContent).toContain('error mean square');
    expect(root.textContent).toContain('fit.mse');
    // the long column is folded away, closed
    const details = root.querySelector('details')!;
    expect(details.open).toBe(false);
    expect(details.querySelector('summary')!.textContent).toContain('fitted values');
  });

  it('draws a million-element column with a few dozen rows', async () => {
    const n = 1_000_000;
    const xs = new Float64Array(n);
    for (let i = 0; i < n; i++) xs[i] = i / 4;
    const root = await show(numberColumn(xs, null, 'x'));
    expect(root.querySelector('.summary')!.textContent).toBe('1,000,000 numbers');
    const grid = root.querySelector('furrow-grid') as FurrowGrid;
    await grid.updateComplete;
    const drawn = grid.shadowRoot!.querySelectorAll('tbody tr.row');
    expect(drawn.length).toBeGreaterThan(0);
    expect(drawn.length).toBeLessThan(50);
    // three decimals keep three digits of the smallest non-zero element, 0.250
    expect(cells(drawn[1]!)).toEqual(['2', '0.250']);
    expect(grid.shadowRoot!.querySelector('.count')!.textContent).toContain('1,000,000 rows');
  });

  it('draws a short table whole, with typed numbers as typed', async () => {
    const t = table(['plot', 'yield'], [textColumn(['a', 'b']), numberColumn(new Float64Array([4.1, 3]), null, 'yield', ['4.10', '3.0'])]);
    const root = await show(t, 'plots');
    const grid = root.querySelector('furrow-grid') as FurrowGrid;
    await grid.updateComplete;
    const rows = [...grid.shadowRoot!.querySelectorAll('tbody tr.row')].map(cells);
    expect(rows).toEqual([['1', 'a', '4.10'], ['2', 'b', '3.0']]);
  });

  it('lists the fields of another record under their names', async () => {
    const root = await show(record([['estimate', 2.3], ['p', 0.0321], ['level', 0.95]]), 'gain');
    const dts = [...root.querySelectorAll('dl.fields dt')].map((d) => d.textContent!.trim());
    const dds = [...root.querySelectorAll('dl.fields dd')].map((d) => d.textContent!.trim());
    expect(dts).toEqual(['estimate', 'p', 'level']);
    expect(dds).toEqual(['2.300', '0.032', '95%']);
  });

  it('reads a comparison as one line, its fields one click away', async () => {
    const r = record(
      [
        ['a', '80C'],
        ['b', '60C'],
        ['estimate', 2.0375],
        ['se', 0.5],
        ['df', 11],
        ['t', 4.075],
        ['p', 0.0018],
        ['low', 0.93],
        ['high', 3.145],
        ['level', 0.95],
      ],
      'comparison',
    );
    const root = await show(r, 'gain');
    expect(root.querySelector('.result .headline')!.textContent!.trim()).toBe('80C − 60C: 2.038 (95% interval 0.9300 to 3.145), p = 0.0018');
    const raw = root.querySelector('details.raw') as HTMLDetailsElement;
    expect(raw.open).toBe(false);
    expect([...raw.querySelectorAll('dl.fields dt')].map((d) => d.textContent!.trim())).toEqual(['a', 'b', 'estimate', 'se', 'df', 't', 'p', 'low', 'high', 'level']);
  });

  it('says what a column holds', () => {
    expect(columnSummary(numberColumn(new Float64Array([1, NaN]), new Uint8Array([0, 1])))).toBe('2 numbers, 1 missing');
    expect(columnSummary(textColumn(['a']))).toBe('1 text');
  });
});

describe('<furrow-value> records without a layout of their own', () => {
  it('folds long columns, says an empty column is empty, and labels parts by their path', async () => {
    const long = numberColumn(new Float64Array(24).fill(0.5), null, 'studentized');
    const r = record([
      ['shapiro_wilk', record([['w', 0.97], ['p', 0.66]], 'test')],
      ['studentized', long],
      ['flagged', numberColumn(new Float64Array(0), null, 'row')],
    ]);
    const root = await show(r, 'checks');
    const details = root.querySelector('details')!;
    expect(details.querySelector('summary')!.textContent).toContain('checks.studentized');
    expect(details.querySelector('summary')!.textContent).toContain('24 numbers');
    const paths = [...root.querySelectorAll('.part > code.path')].map((c) => c.textContent);
    expect(paths).toEqual(['checks.shapiro_wilk', 'checks.flagged']);
    const parts = [...root.querySelectorAll('.part furrow-value')];
    await (parts[1] as HTMLElement & { updateComplete: Promise<unknown> }).updateComplete;
    expect(parts[1]!.shadowRoot!.textContent!.trim()).toBe('an empty column');
  });
});
