/**
 * A large invented trial for the CSV and end-to-end benchmarks: `rows` plots of a blocked
 * trial (`treatments` varieties in blocks), three columns: the variety (text), the block
 * (a whole number) and the yield (a decimal with two places). Seeded, so every run reads the
 * same bytes.
 */
import { Draws } from '../../../src/stats/planning/draws.ts';

/** The CSV text of the invented trial: `variety,block,yield_t_ha`, one plot a line. */
export function bigTrialCsv(rows: number, treatments = 50, seed = 20261202): string {
  const draws = new Draws(seed);
  const parts: string[] = ['variety,block,yield_t_ha\n'];
  const names = Array.from({ length: treatments }, (_, t) => `line-${String(t + 1).padStart(2, '0')}`);
  const effect = Array.from({ length: treatments }, (_, t) => (t % 7) * 0.11 - 0.3);
  let chunk = '';
  for (let i = 0; i < rows; i++) {
    const t = i % treatments;
    const block = Math.floor(i / treatments) + 1;
    // yield around 6 t/ha: a variety effect, a block effect and noise, two decimals
    const noise = (draws.below(2001) - 1000) / 1000;
    const blockEffect = ((block * 37) % 101) / 200 - 0.25;
    const y = 6 + effect[t]! + blockEffect + noise;
    chunk += `${names[t]},${block},${y.toFixed(2)}\n`;
    if (chunk.length > 1 << 16) {
      parts.push(chunk);
      chunk = '';
    }
  }
  parts.push(chunk);
  return parts.join('');
}

/** A document that names the CSV file beside it and fits the blocked analysis. */
export function bigTrialDocument(file: string): string {
  return [
    'furrow 1',
    'title: Invented yield trial, one million plots',
    '',
    `--- table plots from ${file}`,
    '',
    '--- formula',
    'fit = blocked(plots.yield_t_ha, plots.variety, plots.block)',
    '',
  ].join('\n');
}
