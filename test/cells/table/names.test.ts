/**
 * Column names that look alike on every screen: a warning on the table cell.
 */
import { describe, expect, it } from 'vitest';
import { msg } from '../../../src/messages/language.ts';
import { lookalikeNames } from '../../../cells/table/model.ts';
import { doc, run } from '../../helpers.ts';

describe('column names with invisible characters', () => {
  it('two names that differ only by an invisible character are warned about, in either order', () => {
    expect(lookalikeNames(['yield', 'yi\u200Beld'])).toEqual([msg.lookalikeColumns('yield', ['U+200B'])]);
    expect(lookalikeNames(['yi\u200Deld', 'yield'])).toEqual([msg.lookalikeColumns('yield', ['U+200D'])]);
    // composed and decomposed accents read the same too
    expect(lookalikeNames(['caf\u00e9', 'cafe\u0301'])).toEqual([msg.lookalikeColumns('café', [])]);
  });
  it('a single name with an invisible character is warned about', () => {
    expect(lookalikeNames(['block', 'yield\u2060'])).toEqual([msg.invisibleInColumn('yield', ['U+2060'])]);
  });
  it('ordinary names are not', () => {
    expect(lookalikeNames(['block', 'treatment', 'yield (t/ha)', 'Ertrag_kg'])).toEqual([]);
  });
  it('the warning shows on the table cell', () => {
    const { states } = run(doc('--- table t', 'yield,yi\u200Beld', '1,2'));
    expect(states[0]!.status).toBe('ok');
    expect(states[0]!.warnings).toEqual([msg.lookalikeColumns('yield', ['U+200B'])]);
  });
});
