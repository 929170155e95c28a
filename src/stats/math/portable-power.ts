/**
 * The language's `^`, the same bits in every JavaScript engine (see portable.ts, which
 * re-exports it). A module of its own so that the evaluator, which needs only this, does
 * not load the other elementary functions: the command line starts without them.
 */
import powFn from '@stdlib/math-base-special-pow';

/** x to the power y (the language's `^`). */
export const pow: (x: number, y: number) => number = powFn;
