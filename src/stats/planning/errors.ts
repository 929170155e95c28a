/**
 * Bad planning input (fewer than two treatments, a seed that is not whole, a power outside
 * (0, 1)): the message says what is wrong in plain words; it never stands in for a number.
 * The name is one that src/functions/records.ts `guarded` turns into a usage error.
 */
export class PlanningError extends Error {
  constructor(message: string) {
    super(message);
    // guarded() passes errors of this name through as plain usage errors
    this.name = 'StatsInputError';
  }
}
