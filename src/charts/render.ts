/**
 * Headless SVG of a chart, in Node (the command line's report) and anywhere else:
 *
 * ```
 * spec --cleanSpec--> vega-lite --compile--> vega --parse (ast)--> View (renderer 'none',
 *   locked loader, collecting logger, expression interpreter) --toSVG--> svg text
 * ```
 *
 * The same locks as the page: the spec is copied as plain JSON without `usermeta`, the
 * loader refuses every load, expressions run in vega's interpreter rather than as generated
 * functions, and whatever vega-lite or vega warns about is returned, not printed.
 *
 * The drawing libraries load at the first chart drawn: they are modules of their own (the
 * command line, built as CommonJS, keeps them as such and never loads them for a run).
 */
import type * as Vega from 'vega';
import type { TopLevelSpec } from 'vega-lite';
import { cleanSpec, collectingLogger, lockedLoader } from './safety.ts';

/** What {@link renderSvg} returns. */
export interface Rendered {
  /** The chart as a standalone SVG document fragment (`<svg ...>...</svg>`). */
  readonly svg: string;
  /** Warnings and errors that vega-lite and vega logged while drawing, one line each. */
  readonly warnings: readonly string[];
}

/**
 * Draws a vega-lite spec to SVG text without a DOM, a canvas or any loading.
 *
 * @throws Error when the spec is not a plain JSON object, or when vega-lite or vega reject it
 */
export async function renderSvg(spec: unknown): Promise<Rendered> {
  const clean = cleanSpec(spec);
  if (clean === null) throw new Error('a chart must be a plain JSON object');
  const [vega, { expressionInterpreter }, { compile }] = await Promise.all([import('vega'), import('vega-interpreter'), import('vega-lite')]);
  const logger = collectingLogger();
  const vg = compile(clean as unknown as TopLevelSpec, { logger: logger as unknown as Vega.LoggerInterface }).spec;
  const view = new vega.View(vega.parse(vg, undefined, { ast: true }), {
    renderer: 'none',
    loader: lockedLoader(vega.loader()),
    logger: logger as unknown as Vega.LoggerInterface,
    expr: expressionInterpreter,
  });
  try {
    const svg = await view.toSVG();
    return { svg, warnings: [...logger.messages] };
  } finally {
    view.finalize();
  }
}
