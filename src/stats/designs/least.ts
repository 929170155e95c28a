/**
 * The designs' door to the least-squares core: turns its setup errors and any aliasing into
 * plain-words design errors.
 */
import { fitFactorModel, LinearModelError, type FactorModelSpec, type LinearFit } from '../linear/fit.ts';
import { DesignError } from './errors.ts';
import { designMsg } from '../../messages/designs.ts';

/**
 * Fit by least squares; throws DesignError when the model cannot be set up or when some term
 * is not fully determined by the data (naming the term).
 */
export function fitOrExplain(spec: FactorModelSpec): LinearFit {
  let fit: LinearFit;
  try {
    fit = fitFactorModel(spec);
  } catch (e) {
    if (e instanceof LinearModelError) throw new DesignError(e.message);
    throw e;
  }
  if (fit.aliasedTerms.length > 0) {
    throw new DesignError(designMsg.notEstimable(fit.aliasedTerms.map((a) => a.message).join('; ')));
  }
  return fit;
}
