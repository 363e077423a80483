/**
 * The command line as the extension ships it (dist/cli.mjs): the same
 * `vacnet` as the CLI package, in one file, run by the editor's runtime for
 * check tasks and comparisons.
 */
import { main } from '../../cli/src/main.js';

process.exitCode = await main(process.argv);
