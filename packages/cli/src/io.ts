/** Where a command reads its working folder and writes its output; tests and the bin pass the real ones. */
export interface CommandIo {
  cwd: string;
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Whether stdout and stderr are terminals (for colour and the progress line); false when absent. */
  tty?: { stdout: boolean; stderr: boolean };
  /** The environment (NO_COLOR, FORCE_COLOR); the process's own when absent. */
  env?: Readonly<Record<string, string | undefined>>;
}

/**
 * The process's own working folder, stdout and stderr. A reader that stops
 * early (`vacnet check . | head`) closes the pipe: the command then ends
 * quietly, as command-line tools do, instead of failing with EPIPE.
 */
export function processIo(): CommandIo {
  if (!pipeGuarded) {
    pipeGuarded = true;
    for (const stream of [process.stdout, process.stderr]) {
      stream.on('error', (error: NodeJS.ErrnoException) => {
        if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
        throw error;
      });
    }
  }
  return {
    cwd: process.cwd(),
    stdout: (text) => void process.stdout.write(text),
    stderr: (text) => void process.stderr.write(text),
    tty: { stdout: process.stdout.isTTY === true, stderr: process.stderr.isTTY === true },
    env: process.env,
  };
}

let pipeGuarded = false;
