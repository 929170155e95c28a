/**
 * The registry of every built-in, assembled from the category files.
 */
import { DISTRIBUTIONS } from './distributions.ts';
import { MATHS } from './maths.ts';
import { Registry } from './registry.ts';
import { SUMMARIES } from './summaries.ts';

/** All built-ins of the language. */
export const BUILTINS = new Registry([...SUMMARIES, ...MATHS, ...DISTRIBUTIONS]);
