/**
 * `furrow report FILE -o OUT.html`: one self-contained HTML report (src/report).
 */
import type { Output } from './main.ts';

/** Runs `furrow report FILE -o OUT.html`; returns the exit status. */
export async function reportCommand(args: readonly string[], o: Output, usage: string): Promise<number> {
  o.err(`furrow: report is being written. ${args.length}\n\n${usage}`);
  return 2;
}
