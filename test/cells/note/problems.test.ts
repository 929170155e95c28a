import { describe, expect, it } from 'vitest';
import { PLACEHOLDERS_LISTED, groupNoteProblems, listedPlaceholders, placeholderQuantity, placeholderText } from '../../../cells/note/model.ts';
import { startMsg } from '../../../src/messages/page.ts';
import { parseExpression } from '../../../src/lang/parser.ts';
import { errorValue, textColumn, type Value } from '../../../src/lang/values.ts';
import { doc, evalFormula, run } from '../../helpers.ts';

describe('a problem line of the page', () => {
  it('lists the first placeholders by name and counts the rest', () => {
    const many = Array.from({ length: 166_666 }, (_, i) => `m.c${i}`);
    const { listed, more } = listedPlaceholders(many);
    expect(listed).toEqual(many.slice(0, PLACEHOLDERS_LISTED));
    expect(more).toBe(166_666 - PLACEHOLDERS_LISTED);
    expect(startMsg.morePlaceholders(more)).toBe('and 166,646 other placeholders');
    expect(listedPlaceholders(many.slice(0, PLACEHOLDERS_LISTED))).toEqual({ listed: many.slice(0, PLACEHOLDERS_LISTED), more: 0 });
  });
});

describe('a note groups its errors', () => {
  it('gives one line per distinct error, naming the placeholders it affects', () => {
    const upstream = (m: string): Value => errorValue(m, 0, 1, 'fit');
    const parts: Value[] = [upstream('fit: the treatment has one level'), 3, upstream('fit: the treatment has one level'), errorValue('Unknown name "gian".', 0, 4), upstream('fit: the treatment has one level')];
    const sources = ['fit.mse', 'n', 'fit.sd', 'gian', 'fit.mse'];
    expect(groupNoteProblems(parts, sources)).toEqual([
      { message: 'fit: the treatment has one level', upstream: true, placeholders: ['fit.mse', 'fit.sd'] },
      { message: 'Unknown name "gian".', upstream: false, placeholders: ['gian'] },
    ]);
  });

  it('groups the errors of a real note that reads a failing cell', () => {
    const { engine } = run(
      doc(
        '--- table t',
        'y,g',
        '1.2,a',
        '1.4,a',
        '',
        '--- formula',
        'fit = one_way(t.y, t.g)',
        '--- note',
        'Error mean square {fit.mse}, sd {fit.sd}, grand mean {fit.grand_mean}; {nothing_here}.',
      ),
    );
    const state = engine.states().find((s) => s.kind === 'note')!;
    const parts = state.parts ?? [];
    expect(parts).toHaveLength(4);
    const groups = groupNoteProblems(parts, ['fit.mse', 'fit.sd', 'fit.grand_mean', 'nothing_here']);
    expect(groups).toHaveLength(2);
    expect(groups[0]!.placeholders).toEqual(['fit.mse', 'fit.sd', 'fit.grand_mean']);
    expect(groups[0]!.upstream).toBe(true);
    expect(groups[1]!.placeholders).toEqual(['nothing_here']);
  });
});

describe('a placeholder shows a result by the digits of its quantity', () => {
  it('reads the quantity from the field it reads last', () => {
    const q = (s: string) => placeholderQuantity(parseExpression(s));
    expect([q('fit.mse'), q('fit.table.p[1]'), q('gain["low"]'), q('round(fit.mse, 2)'), q('x'), q('fit.table.f[1] * 2')]).toEqual(['squares', 'p', 'estimate', 'plain', 'plain', 'plain']);
    expect(placeholderText('fit.mse', 0.477706)).toBe('0.4777');
    expect(placeholderText('checks.shapiro_wilk.p', 0.6625)).toBe('0.66');
    expect(placeholderText('x', 0.477706)).toBe('0.477706');
  });
});

describe('fixed', () => {
  it('writes fixed decimals with trailing zeros, as text', () => {
    expect(evalFormula('fixed(0.6, 2)')).toBe('0.60');
    expect(evalFormula('fixed(2.675, 2)')).toBe('2.68');
    const c = evalFormula('fixed([0.36, 0.6, 1], 2)');
    expect(c).toEqual(textColumn(['0.36', '0.60', '1.00']));
  });

  it('refuses a count of decimals out of range, in words', () => {
    const v = evalFormula('fixed(1, 21)');
    expect(typeof v === 'object' && v.kind === 'error' ? v.message : '').toMatch(/fixed shows 0 to 20 decimals; 21 was asked for/);
  });
});
