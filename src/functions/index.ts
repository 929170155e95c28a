/**
 * The registry of every built-in, assembled from the category files.
 */
import { CHARTS } from './charts.ts';
import { CLAIMS } from './claims.ts';
import { DESIGNS } from './designs.ts';
import { DISTRIBUTIONS } from './distributions.ts';
import { MATHS } from './maths.ts';
import { PLANNING } from './planning.ts';
import { Registry } from '../lang/builtins.ts';
import { STRATA } from './strata.ts';
import { SUMMARIES } from './summaries.ts';
import { TWO_GROUPS } from './two-groups.ts';
import { UNITS } from './units.ts';

/** All built-ins of the language. */
export const BUILTINS = new Registry([...SUMMARIES, ...MATHS, ...UNITS, ...DISTRIBUTIONS, ...TWO_GROUPS, ...DESIGNS, ...STRATA, ...CHARTS, ...PLANNING, ...CLAIMS]);
