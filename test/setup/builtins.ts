/**
 * Every test file: the command line's built-ins, and its commands beyond `run`, are handed
 * over at once, so that tests call it synchronously as they always have. The command line
 * itself loads the built-ins when a document may call one (src/cli/builtins.ts) and the
 * commands when one is asked for (src/cli/lazy-commands.ts); test/cli/builtins-lazy.test.ts
 * runs the built command line, which starts without either.
 */
import { provideBuiltins } from '../../src/cli/builtins.ts';
import { provideCommands } from '../../src/cli/lazy-commands.ts';
import * as documentCommands from '../../src/cli/document-commands.ts';
import { BUILTINS } from '../../src/functions/index.ts';

provideBuiltins(BUILTINS);
provideCommands(documentCommands);
