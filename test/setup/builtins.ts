/**
 * Every test file: the command line's built-ins are handed over at once, so that tests call
 * it synchronously as they always have. The command line itself loads them when a document
 * may call one (src/cli/builtins.ts); test/cli/builtins-lazy.test.ts runs the built command
 * line, which starts without them.
 */
import { provideBuiltins } from '../../src/cli/builtins.ts';
import { BUILTINS } from '../../src/functions/index.ts';

provideBuiltins(BUILTINS);
