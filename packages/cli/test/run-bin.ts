import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** The launcher people run; it loads the bundle `npm run build` writes. */
export const BIN = fileURLToPath(new URL('../bin/vacnet.js', import.meta.url));
export const BUNDLE = fileURLToPath(new URL('../dist/vacnet.mjs', import.meta.url));
export const REPO_ROOT = fileURLToPath(new URL('../../..', import.meta.url));
export const FIXTURES = fileURLToPath(new URL('./fixtures', import.meta.url));

export interface BinRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

export interface BinOptions {
  /** Changes to the environment (undefined removes a variable); NO_COLOR=1 is set unless changed here. */
  env?: Record<string, string | undefined>;
  /** Text for stdin. */
  input?: string;
}

/** Runs the built `vacnet` bin as a child process, as a shell or build pipeline would. */
export function runBin(args: readonly string[], cwd: string = REPO_ROOT, options: BinOptions = {}): BinRun {
  if (!existsSync(BUNDLE)) {
    throw new Error(`${BUNDLE} is missing: run \`npm run build\` before the command-line tests.`);
  }
  const env: Record<string, string | undefined> = { ...process.env, NO_COLOR: '1', ...options.env };
  for (const key of Object.keys(env)) if (env[key] === undefined) delete env[key];
  const run = spawnSync(process.execPath, [BIN, ...args], {
    cwd,
    encoding: 'utf8',
    timeout: 60_000,
    env,
    ...(options.input !== undefined ? { input: options.input } : {}),
  });
  if (run.error) throw run.error;
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

/** `path:line:col severity code message`, as documented in the README. */
export const FINDING_LINE = /^(?<path>[^:\s][^:]*):(?<line>[1-9]\d*):(?<column>[1-9]\d*) (?<severity>error|warning|info) (?<code>[a-z][a-z0-9-]*) (?<message>\S.*)$/;

/** `Checked N files: E errors, W warnings, I infos.` */
export const SUMMARY_LINE = /^Checked (?<files>\d+) files?: (?<errors>\d+) errors?, (?<warnings>\d+) warnings?, (?<infos>\d+) infos?\.$/;
