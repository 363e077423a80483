// The command line's public surface, for the bin and for tests.
export { main } from './main.js';
export { ExitCode, UsageError } from './exit-codes.js';
