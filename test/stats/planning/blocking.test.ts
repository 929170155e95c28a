/**
 * The rule of the design warning (src/stats/planning/blocking.ts): a column in which every
 * treatment appears exactly once per level.
 */
import { describe, expect, it } from 'vitest';
import { isCompleteBlocking, type Codes } from '../../../src/stats/planning/index.ts';

const codes = (xs: readonly number[]): Codes => ({ codes: Int32Array.from(xs), levels: Math.max(-1, ...xs) + 1 });

describe('complete-block columns', () => {
  it('three treatments once in each of two blocks', () => {
    expect(isCompleteBlocking(codes([0, 1, 2, 2, 0, 1]), codes([0, 0, 0, 1, 1, 1]))).toBe(true);
  });
  it('pairs: two treatments once in each of four units', () => {
    expect(isCompleteBlocking(codes([0, 1, 1, 0, 0, 1, 1, 0]), codes([0, 0, 1, 1, 2, 2, 3, 3]))).toBe(true);
  });
  it('a treatment twice in a block is not complete blocks', () => {
    expect(isCompleteBlocking(codes([0, 0, 1, 0, 1, 1]), codes([0, 0, 0, 1, 1, 1]))).toBe(false);
  });
  it('a block that lacks a treatment (its row gone from the table) is not complete blocks', () => {
    expect(isCompleteBlocking(codes([0, 1, 2, 0, 1]), codes([0, 0, 0, 1, 1]))).toBe(false);
  });
  it('a plot identifier (one row per level) is not a block', () => {
    expect(isCompleteBlocking(codes([0, 1, 0, 1]), codes([0, 1, 2, 3]))).toBe(false);
  });
  it('one block is not enough, nor one treatment', () => {
    expect(isCompleteBlocking(codes([0, 1, 2]), codes([0, 0, 0]))).toBe(false);
    expect(isCompleteBlocking(codes([0, 0]), codes([0, 1]))).toBe(false);
  });
  it('rows with an empty treatment are left out; an empty block where the treatment is given is not blocks', () => {
    expect(isCompleteBlocking(codes([0, 1, -1, 1, 0]), codes([0, 0, 0, 1, 1]))).toBe(true);
    expect(isCompleteBlocking(codes([0, 1, 1, 0]), codes([0, 0, -1, 1]))).toBe(false);
  });
});
