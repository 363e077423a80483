import { readFileSync } from 'node:fs';
import { Command, CommanderError, Option } from 'commander';
import { ExitCode } from './exit-codes.js';
import { processIo, type CommandIo } from './io.js';

/**
 * The `vacnet` command line: argument parsing and help only. Each command's
 * work lives in `commands/` and is imported when that command runs, so
 * `--help` and `--version` start without loading the language.
 *
 * Returns the exit code instead of exiting, so output is flushed and tests
 * can call it in-process.
 */
export async function main(argv: readonly string[], io: CommandIo = processIo()): Promise<number> {
  let exitCode: number = ExitCode.ok;
  const program = new Command('vacnet')
    .description('Check central vacuum cleaning system files (.vacnet) written in the vacnet language.')
    .version(readVersion(), '-v, --version', 'print the version')
    .helpOption('-h, --help', 'show help')
    .configureOutput({ writeOut: io.stdout, writeErr: io.stderr })
    .showHelpAfterError('(run `vacnet --help` for usage)')
    .exitOverride();

  program
    .command('check')
    .summary('check .vacnet files for errors and design findings')
    .description(
      'Check .vacnet files and the catalogs they use. Folders are searched recursively ' +
        '(node_modules and folders starting with "." are skipped).',
    )
    .argument('<paths...>', '.vacnet files or folders to check')
    .addOption(new Option('-f, --format <format>', 'output format').choices(['text', 'json']).default('text'))
    .option('--no-analysis', 'check structure and units only; skip the airflow analysis and design rules')
    .addHelpText(
      'after',
      [
        '',
        'Output (text): one line per finding, then for each analysed system its',
        'producer operating point and worst inlet, then a summary:',
        '  path:line:column severity code message',
        'Lines and columns are 1-based in both formats.',
        '',
        'Exit codes:',
        '  0  no errors (warnings and infos allowed)',
        '  1  at least one error',
        '  2  usage error, or a file or folder could not be read',
        '',
        'Examples:',
        '  vacnet check examples/',
        '  vacnet check --format json plant.vacnet > findings.json',
      ].join('\n'),
    )
    .action(async (paths: string[], options: { format: 'text' | 'json'; analysis: boolean }) => {
      const { runCheck } = await import('./commands/check.js');
      exitCode = await runCheck(paths, { format: options.format, analysis: options.analysis }, io);
    });

  try {
    await program.parseAsync([...argv]);
  } catch (error) {
    if (error instanceof CommanderError) {
      // Help and version exit 0; every other parse failure is a usage error.
      return error.exitCode === 0 ? ExitCode.ok : ExitCode.usage;
    }
    io.stderr(`vacnet: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    return ExitCode.usage;
  }
  return exitCode;
}

/** The package version, read from package.json one folder above this file (dist/ in every build). */
function readVersion(): string {
  try {
    const manifest = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version?: unknown };
    return typeof manifest.version === 'string' ? manifest.version : 'unknown';
  } catch {
    return 'unknown';
  }
}
