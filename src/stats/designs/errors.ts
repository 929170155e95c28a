/**
 * A design that cannot be analysed as asked (a treatment with no data, a block with one
 * plot, a Latin square that is not square, a comparison of a level that does not exist).
 * The message says what is wrong in plain words; it never stands in for a number.
 */
export class DesignError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'DesignError';
  }
}
