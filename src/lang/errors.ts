/**
 * The error that the lexer, parser and evaluator raise inside one cell. It never escapes a
 * cell: the graph turns it into an error value with the same message and range.
 */
export class LangError extends Error {
  /** Character range [from, to) in the cell's text. */
  readonly from: number;
  readonly to: number;
  /** Set when the failure is only that a name this cell reads has an error. */
  readonly upstream: string | null;

  constructor(message: string, from: number, to: number, upstream: string | null = null) {
    super(message);
    this.name = 'LangError';
    this.from = from;
    this.to = to;
    this.upstream = upstream;
  }
}

/**
 * The error a built-in raises for bad input (a design too broken to estimate, a level that
 * does not exist). The evaluator places it at the call's range.
 */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}
