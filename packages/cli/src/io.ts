/** Where a command reads its working folder and writes its output; tests and the bin pass the real ones. */
export interface CommandIo {
  cwd: string;
  stdout: (text: string) => void;
  stderr: (text: string) => void;
}

/** The process's own working folder, stdout and stderr. */
export function processIo(): CommandIo {
  return {
    cwd: process.cwd(),
    stdout: (text) => void process.stdout.write(text),
    stderr: (text) => void process.stderr.write(text),
  };
}
