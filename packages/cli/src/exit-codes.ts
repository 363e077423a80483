/**
 * Process exit codes of every vacnet command, documented in the README so
 * build pipelines can rely on them.
 */
export const ExitCode = {
  /** Nothing failed: no errors (warnings and infos allowed). */
  ok: 0,
  /** The checked files have at least one error. */
  findings: 1,
  /** The command was used wrongly, or a file or folder could not be read. */
  usage: 2,
} as const;

export type ExitCodeValue = (typeof ExitCode)[keyof typeof ExitCode];

/**
 * A failure of the invocation itself (bad arguments, unreadable input):
 * printed as one line on stderr, exit code 2.
 */
export class UsageError extends Error {
  override readonly name = 'UsageError';
}
