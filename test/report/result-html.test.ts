import { describe, expect, it } from 'vitest';
import { record } from '../../src/lang/values.ts';
import { valueHtml } from '../../src/report/values-html.ts';

describe('results in the report', () => {
  it('reads a comparison in one line, as the page does, with its fields under it', () => {
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
    const html = valueHtml(r, new Map());
    expect(html).toContain('<p class="headline">80C − 60C: 2.038 (95% interval 0.9300 to 3.145), p = 0.0018</p>');
    expect(html).toContain('<details class="fields" open><summary>Every field</summary>');
    expect(html).toContain('<dd>0.5000</dd>');
  });
});
