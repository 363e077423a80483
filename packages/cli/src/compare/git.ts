import { execFile } from 'node:child_process';

/** The output of one git command; `code` is its exit status (0 on success). */
export interface GitRun {
  code: number;
  stdout: string;
  stderr: string;
}

/** Largest file `git show` may hand back (our bound: far above any .vacnet file). */
const MAX_OUTPUT_BYTES = 64 * 1024 * 1024;

/**
 * Runs git with arguments (never through a shell, so paths and revisions
 * are not interpreted), in a folder. Resolves with the exit status instead
 * of throwing for a failing command; rejects only when git cannot be
 * started at all.
 */
export function git(args: readonly string[], cwd: string): Promise<GitRun> {
  return new Promise((resolve, reject) => {
    execFile('git', [...args], { cwd, encoding: 'utf8', maxBuffer: MAX_OUTPUT_BYTES, windowsHide: true }, (error, stdout, stderr) => {
      if (error && typeof (error as { code?: unknown }).code === 'string') {
        // ENOENT and the like: git itself is missing.
        reject(new Error(`git could not be run (${(error as { code: string }).code}); is git installed and on the PATH?`));
        return;
      }
      const code = error ? Number((error as { code?: unknown }).code ?? 1) : 0;
      resolve({ code: Number.isFinite(code) ? code : 1, stdout, stderr });
    });
  });
}

/** The top folder of the repository that holds `folder`, or undefined outside any. */
export async function repositoryRoot(folder: string): Promise<string | undefined> {
  const run = await git(['rev-parse', '--show-toplevel'], folder);
  return run.code === 0 ? run.stdout.trim() : undefined;
}
