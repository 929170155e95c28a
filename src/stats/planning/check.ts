/**
 * Comparing measured data with the layout they came from. Plots are matched on their key
 * (block and plot, row and column, or plot alone), written as texts; a key seen twice on
 * either side is an error, since it would make the match ambiguous.
 */
import { PlanningError } from './errors.ts';
import { planningMsg as m } from '../../messages/planning.ts';

/** One side of the comparison: a key and a treatment per plot (null where the treatment is empty). */
export interface KeyedPlots {
  readonly keys: readonly (readonly string[])[];
  readonly treatment: readonly (string | null)[];
}

/** What differs between a layout and the data. Indices are rows of the layout or of the data. */
export interface LayoutDifferences {
  /** Layout rows whose plot is in the data with another treatment, with the data's row. */
  readonly differ: readonly { readonly layoutRow: number; readonly dataRow: number }[];
  /** Layout rows whose plot is not in the data. */
  readonly missing: readonly number[];
  /** Data rows whose plot is not in the layout. */
  readonly extra: readonly number[];
  readonly matched: number;
}

const keyText = (k: readonly string[]): string => k.join('\u0000');

/** A plot in words, as "block 2, plot 3" (or the key's values alone when its columns are not named). */
function plotWords(k: readonly string[], names: readonly string[] | undefined): string {
  return names === undefined ? k.join(' / ') : k.map((v, j) => `${names[j] ?? ''} ${v}`).join(', ');
}

function index(side: KeyedPlots, inData: boolean, names: readonly string[] | undefined): Map<string, number> {
  const at = new Map<string, number>();
  side.keys.forEach((k, i) => {
    const t = keyText(k);
    const first = at.get(t);
    if (first !== undefined) throw new PlanningError(m.repeatedKey(inData, plotWords(k, names), first + 1, i + 1));
    at.set(t, i);
  });
  return at;
}

/**
 * Compares data with a layout, plot by plot.
 *
 * @param keyNames the names of the key's columns ("block", "plot"), for the words of an error
 */
export function compareWithLayout(layout: KeyedPlots, data: KeyedPlots, keyNames?: readonly string[]): LayoutDifferences {
  const inLayout = index(layout, false, keyNames);
  const inData = index(data, true, keyNames);
  const differ: { layoutRow: number; dataRow: number }[] = [];
  const missing: number[] = [];
  let matched = 0;
  layout.keys.forEach((k, i) => {
    const j = inData.get(keyText(k));
    if (j === undefined) {
      missing.push(i);
      return;
    }
    matched++;
    if (data.treatment[j] !== layout.treatment[i]) differ.push({ layoutRow: i, dataRow: j });
  });
  const extra: number[] = [];
  data.keys.forEach((k, j) => {
    if (!inLayout.has(keyText(k))) extra.push(j);
  });
  return { differ, missing, extra, matched };
}
