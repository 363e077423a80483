/** A `vacnet` task as the workspace writes it in tasks.json. */
export interface CheckTaskDefinition {
  type: 'vacnet';
  /** Files, folders or globs, relative to the workspace folder. */
  paths: string[];
  /** More options for `vacnet check`. */
  args?: string[];
}

/** How to run a check: a program, its arguments and the environment to add. */
export interface CheckCommandLine {
  command: string;
  args: string[];
  env: Record<string, string>;
}

/**
 * The command line of a check task: the bundled command line run by the
 * editor's own runtime as plain Node (ELECTRON_RUN_AS_NODE, honoured by
 * Electron), without colour so the problem matcher reads every line.
 * Paths that look like options are passed after `--`.
 */
export function checkCommandLine(runtime: string, cli: string, definition: Pick<CheckTaskDefinition, 'paths' | 'args'>): CheckCommandLine {
  const paths = definition.paths.length > 0 ? definition.paths : ['.'];
  const args = (definition.args ?? []).filter((arg) => typeof arg === 'string');
  return {
    command: runtime,
    args: [cli, 'check', ...args, '--', ...paths],
    env: { ELECTRON_RUN_AS_NODE: '1', NO_COLOR: '1' },
  };
}
