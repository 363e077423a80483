import { readFileSync } from 'node:fs';
import { Command, CommanderError, InvalidArgumentError, Option } from 'commander';
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
        '(node_modules and folders starting with "." are skipped); quoted globs (*, **, ?, [..], {a,b}) are expanded. ' +
        'Each file is checked with the project settings file (vacnet.json) found above it.',
    )
    .argument('<paths...>', '.vacnet files, folders or globs to check')
    .addOption(new Option('-f, --format <format>', 'output format').choices(['text', 'json', 'sarif', 'github']).default('text'))
    .option('--no-analysis', 'check structure and units only; skip the airflow analysis and design rules')
    .option('--max-warnings <n>', 'exit 1 when there are more than n warnings', parseCount)
    .option('-q, --quiet', 'print errors only (warnings still count for --max-warnings)')
    .option('--settings <file>', 'use this project settings file instead of finding vacnet.json')
    .option('--no-settings', 'use no project settings file')
    .addHelpText(
      'after',
      [
        '',
        'Output (text): one line per finding, then for each analysed system its',
        'producer operating point and worst inlet, then a summary:',
        '  path:line:column severity code message',
        'Lines and columns are 1-based in every format. Colour on a terminal;',
        'NO_COLOR=1 turns it off, FORCE_COLOR=1 turns it on for pipes.',
        'sarif: a SARIF 2.1.0 log with rule help from docs/rules.',
        'github: workflow annotation commands (::error file=...,line=...::message).',
        '',
        'Exit codes:',
        '  0  no errors, and no more warnings than --max-warnings',
        '  1  at least one error, or more warnings than --max-warnings',
        '  2  usage error, or a file or folder could not be read',
        '',
        'Examples:',
        '  vacnet check examples/',
        "  vacnet check 'systems/**/*.vacnet' --max-warnings 0",
        '  vacnet check --format sarif . > vacnet.sarif',
      ].join('\n'),
    )
    .action(async (paths: string[], options: { format: 'text' | 'json' | 'sarif' | 'github'; analysis: boolean; maxWarnings?: number; quiet?: boolean; settings?: string | boolean }) => {
      const { runCheck } = await import('./commands/check.js');
      exitCode = await runCheck(
        paths,
        {
          format: options.format,
          analysis: options.analysis,
          quiet: options.quiet === true,
          version: readVersion(),
          ...(options.maxWarnings !== undefined ? { maxWarnings: options.maxWarnings } : {}),
          ...(options.settings !== undefined ? { settings: options.settings } : {}),
        },
        io,
      );
    });

  program
    .command('report')
    .summary('write a design report (HTML or Markdown) for one .vacnet file')
    .description(
      'Analyse one .vacnet file and write its design report: summary and cautions, design basis, the producer curve ' +
        'with the system demand, a schematic of the network, inlet and pipe tables, findings, bill of materials and the ' +
        'commissioning test sheet. HTML is one self-contained page (no scripts, no network); Markdown links its two ' +
        'figures as SVG files written beside it.',
    )
    .argument('<file>', 'the .vacnet file of the system')
    .option('-o, --out <file>', 'write the report here (.html or .md); without it the report goes to stdout')
    .addOption(new Option('-f, --format <format>', 'report format (default: from the --out extension, else html)').choices(['html', 'markdown']))
    .option('--settings <file>', 'use this project settings file instead of finding vacnet.json')
    .option('--no-settings', 'use no project settings file')
    .addHelpText(
      'after',
      [
        '',
        'Markdown: with --out report.md, the figures are written beside it as',
        'report.producer-curve.svg and report.schematic.svg and linked as images;',
        'on stdout they are left out. Rule codes link to docs/rules when that',
        'folder lies inside the working folder.',
        '',
        'Exit codes:',
        '  0  report written',
        '  1  report written, but the file has errors (the report lists them)',
        '  2  usage error, or a file could not be read or written',
        '',
        'Examples:',
        '  vacnet report plant.vacnet --out plant-report.html',
        '  vacnet report plant.vacnet --out review/plant.md',
      ].join('\n'),
    )
    .action(async (file: string, options: { out?: string; format?: 'html' | 'markdown'; settings?: string | boolean }) => {
      const { runReport } = await import('./commands/report.js');
      exitCode = await runReport(file, { ...options, version: readVersion() }, io);
    });

  program
    .command('fmt')
    .summary('format .vacnet files the way the editor does')
    .description(
      'Format .vacnet files with the editor\'s formatter: one element per line, consistent spacing and indentation, ' +
        'every comment kept. Without a flag the formatted text goes to stdout. A file with syntax errors is never changed.',
    )
    .argument('<paths...>', '.vacnet files, folders or globs')
    .addOption(new Option('--check', 'print a unified diff for each file that would change, and exit 1 if any would').conflicts('write'))
    .addOption(new Option('--write', 'replace each file that changes (atomically: a temporary file, then a rename)').conflicts('check'))
    .addHelpText(
      'after',
      [
        '',
        'Exit codes:',
        '  0  formatted (--check: every file is already formatted)',
        '  1  --check: some file would change; or a file has syntax errors (not formatted)',
        '  2  usage error, or a file could not be read or written',
        '',
        'Examples:',
        '  vacnet fmt --check .',
        '  vacnet fmt --write plant.vacnet',
      ].join('\n'),
    )
    .action(async (paths: string[], options: { check?: boolean; write?: boolean }) => {
      const { runFmt } = await import('./commands/fmt.js');
      exitCode = await runFmt(paths, options.check ? 'check' : options.write ? 'write' : 'print', io);
    });

  program
    .command('compare')
    .summary('compare two versions of a system: what changed and how the results moved')
    .description(
      'Compare two versions of a .vacnet system semantically: elements added, removed and changed (formatting and ' +
        'order do not count), and how the results moved: the worst-case vacuum at every inlet, pipes that crossed ' +
        'the carrying velocity, the producer\'s operating point and margin, findings new and resolved. Each side is ' +
        'a path or <git-rev>:<path> (read with git show, with the catalogs and settings of that revision).',
    )
    .argument('<old>', 'the version before: a path, or <git-rev>:<path> such as HEAD~1:plant.vacnet')
    .argument('<new>', 'the version after, the same way')
    .addOption(new Option('-f, --format <format>', 'output format').choices(['text', 'markdown', 'json']).default('text'))
    .option('--fail-on-regression', 'exit 1 when an inlet falls short of the vacuum its tool needs and got worse, or a new error appears')
    .option('--no-settings', 'use no project settings file on either side')
    .addHelpText(
      'after',
      [
        '',
        'A <git-rev>:<path> path is relative to the repository\'s top folder, or to',
        'the working folder when it starts with ./ or ../ (as git reads it).',
        '',
        'Exit codes:',
        '  0  compared (and no regression with --fail-on-regression)',
        '  1  --fail-on-regression: at least one regression',
        '  2  usage error, an unknown revision, or a file could not be read',
        '',
        'Examples:',
        '  vacnet compare HEAD~1:plant.vacnet plant.vacnet',
        '  vacnet compare --format markdown origin/main:plant.vacnet plant.vacnet > comment.md',
      ].join('\n'),
    )
    .action(async (oldSide: string, newSide: string, options: { format: 'text' | 'markdown' | 'json'; failOnRegression?: boolean; settings: boolean }) => {
      const { runCompare } = await import('./commands/compare.js');
      exitCode = await runCompare(oldSide, newSide, { format: options.format, failOnRegression: options.failOnRegression === true, settings: options.settings }, io);
    });

  program
    .command('show')
    .summary('print a file with its computed results as comments (for git diff)')
    .description(
      'Print a .vacnet file followed by its computed results as // comments: the producer\'s operating point, ' +
        'each inlet\'s worst-case vacuum, each pipe\'s velocities and the findings, one line each. Made as a git ' +
        'text conversion, so that `git diff` shows how the results moved beside the text.',
    )
    .argument('<file>', 'the .vacnet file')
    .addHelpText(
      'after',
      [
        '',
        'To see results in git diff, add to .gitattributes:',
        '  *.vacnet diff=vacnet',
        'and run once in the repository:',
        '  git config diff.vacnet.textconv "npx vacnet show"',
        '',
        'Exit codes: 0 printed (whatever the file holds), 2 the file could not be read.',
      ].join('\n'),
    )
    .action(async (file: string) => {
      const { runShow } = await import('./commands/show.js');
      exitCode = await runShow(file, io);
    });

  program
    .command('init')
    .summary('write a starter system (and a starter catalog if there is none)')
    .description(
      'Write a new, valid starter system to edit: a plant room and, per operator, a zone of two inlets on its own main, in the ' +
        'units asked for. It uses the catalog given, or catalog.vacnet beside the file; a catalog that does not exist ' +
        'is written with placeholder equipment. The new system is checked at once.',
    )
    .argument('[file]', 'the system file to write', 'system.vacnet')
    .option('--name <title>', 'the system\'s title (default: from the file name)')
    .option('--operators <n>', 'design operators cleaning at once', parsePositive, 1)
    .addOption(new Option('--units <units>', 'units of the file and its results').choices(['imperial', 'si']).default('imperial'))
    .option('--catalog <path>', 'the catalog to use (written with starter items if it does not exist)')
    .option('--force', 'overwrite the system file if it exists (a catalog is never overwritten)')
    .addHelpText(
      'after',
      [
        '',
        'Exit codes:',
        '  0  written, and it checks without errors',
        '  1  written, but the check finds errors (a catalog of your own that lacks something)',
        '  2  usage error, the file exists (without --force), or a file could not be written',
        '',
        'Examples:',
        '  vacnet init',
        '  vacnet init --name "Harbour offices" --operators 3 --units si offices.vacnet',
      ].join('\n'),
    )
    .action(async (file: string, options: { name?: string; operators: number; units: 'imperial' | 'si'; catalog?: string; force?: boolean }) => {
      const { runInit } = await import('./commands/init.js');
      exitCode = await runInit(file, options, io);
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

/** A whole number of at least 0, for options that count (commander calls this with the option's text). */
function parseCount(text: string): number {
  if (!/^\d+$/.test(text.trim())) throw new InvalidArgumentError('expected a whole number of 0 or more.');
  return Number(text.trim());
}

/** A whole number of at least 1. */
function parsePositive(text: string): number {
  const value = parseCount(text);
  if (value < 1) throw new InvalidArgumentError('expected a whole number of 1 or more.');
  return value;
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
