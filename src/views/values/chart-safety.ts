/**
 * Drawing a chart in the page without letting it reach anything. The parts that Node needs
 * too (cleaning a spec, the locked loader, the collecting logger) live in
 * src/charts/safety.ts and are re-exported here; this file adds the page's embedding
 * options:
 *
 * - expressions run in vega's interpreter (`ast: true`), so the page needs no unsafe-eval;
 * - no actions menu, no config or patch fetched by URL, the locked loader always passed.
 */
import type { Loader } from 'vega';
import type { EmbedOptions } from 'vega-embed';
import type { expressionInterpreter } from 'vega-interpreter';
import { WARN, type ChartLogger } from '../../charts/safety.ts';

export {
  cleanSpec,
  collectingLogger,
  LoadRefused,
  lockedLoader,
  MAX_MESSAGES,
  STRIPPED_KEYS,
  type ChartLogger,
  type CollectingLogger,
  type SpecObject,
} from '../../charts/safety.ts';

/**
 * The options every chart is embedded with. The spec is always vega-lite (the project
 * builds no other kind), so the mode is fixed rather than guessed from a `$schema`.
 */
export function safeEmbedOptions(
  loader: Loader,
  logger: ChartLogger,
  expr: typeof expressionInterpreter,
): EmbedOptions {
  return {
    mode: 'vega-lite',
    renderer: 'svg',
    actions: false,
    ast: true,
    expr,
    loader,
    logger: logger as NonNullable<EmbedOptions['logger']>,
    logLevel: WARN,
    tooltip: true,
    hover: false,
  };
}
