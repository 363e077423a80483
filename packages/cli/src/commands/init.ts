import { mkdir, stat, writeFile } from 'node:fs/promises';
import { basename, dirname, join, relative, resolve, sep } from 'node:path';
import type { UnitSystem } from '@vacnet/engine';
import { formatText, loadDocuments } from '@vacnet/language';
import { ExitCode, UsageError } from '../exit-codes.js';
import { VACNET_EXTENSION } from '../expand-paths.js';
import { formatSummary } from '../formats/text.js';
import { STARTER_ITEMS, starterCatalog } from '../init/starter-catalog.js';
import { starterSystem, type StarterItems } from '../init/starter-system.js';
import type { CommandIo } from '../io.js';
import { checkFiles } from './check.js';

export interface InitOptions {
  name?: string;
  operators?: number;
  units?: UnitSystem;
  /** The catalog to use; written with starter items when it does not exist. Default: catalog.vacnet beside the file. */
  catalog?: string;
  /** Overwrite an existing system file. */
  force?: boolean;
}

/** The file `vacnet init` writes when none is named. */
export const DEFAULT_SYSTEM_FILE = 'system.vacnet';

/**
 * `vacnet init [file]`: writes a starter system (and a starter catalog
 * when the catalog it uses does not exist yet), then checks it and prints
 * the summary. Never overwrites a system file without --force, and never
 * overwrites a catalog. Exit 0 when written and free of errors, 1 when the
 * check finds errors (with a catalog of your own that lacks something), 2
 * for usage and I/O errors.
 */
export async function runInit(file: string | undefined, options: InitOptions, io: CommandIo): Promise<number> {
  try {
    const target = resolve(io.cwd, file ?? DEFAULT_SYSTEM_FILE);
    if (!target.endsWith(VACNET_EXTENSION)) throw new UsageError(`${file}: the system file must end in ${VACNET_EXTENSION}`);
    if ((await kindOf(target)) !== undefined && !options.force) {
      throw new UsageError(`${shown(target, io.cwd)} exists already; use --force to overwrite it`);
    }
    const units = options.units ?? 'imperial';
    const operators = options.operators ?? 1;
    if (!Number.isInteger(operators) || operators < 1) throw new UsageError('--operators must be a whole number of 1 or more');
    const catalog = options.catalog !== undefined ? resolve(io.cwd, options.catalog) : join(dirname(target), 'catalog.vacnet');
    if (catalog === target) throw new UsageError('the catalog and the system must be different files');
    if (!catalog.endsWith(VACNET_EXTENSION)) throw new UsageError(`${options.catalog}: the catalog must end in ${VACNET_EXTENSION}`);

    let items: StarterItems;
    let wroteCatalog = false;
    const catalogKind = await kindOf(catalog);
    if (catalogKind === 'folder') throw new UsageError(`${shown(catalog, io.cwd)} is a folder`);
    if (catalogKind === 'file') {
      items = await itemsOf(catalog, io.cwd);
    } else {
      items = STARTER_ITEMS;
      await mkdir(dirname(catalog), { recursive: true });
      // 'wx': fail rather than overwrite, should the catalog appear meanwhile.
      await writeFile(catalog, formatText(starterCatalog(units, operators)), { encoding: 'utf8', flag: 'wx' });
      wroteCatalog = true;
    }

    const usePath = relative(dirname(target), catalog).split(sep).join('/');
    // Written as the formatter lays it out, so `vacnet fmt --check` passes from the start.
    const text = formatText(starterSystem({ name: options.name ?? titleFrom(target), operators, units, catalogPath: usePath, items }));
    await mkdir(dirname(target), { recursive: true });
    await writeFile(target, text, { encoding: 'utf8', flag: options.force ? 'w' : 'wx' });

    io.stdout(`Wrote ${shown(target, io.cwd)}${wroteCatalog ? ` and the starter catalog ${shown(catalog, io.cwd)}` : `, using ${shown(catalog, io.cwd)}`}.\n`);
    const result = await checkFiles([target], io.cwd, true, { settings: 'discover' });
    io.stdout(`${formatSummary(result.summary)} Run \`vacnet check ${shown(target, io.cwd)}\` for the details.\n`);
    return result.summary.errors > 0 ? ExitCode.findings : ExitCode.ok;
  } catch (error) {
    const code = (error as { code?: string }).code;
    const message = code === 'EEXIST' ? 'a file appeared where vacnet init was writing; nothing was overwritten' : error instanceof Error ? error.message : String(error);
    io.stderr(`vacnet init: ${message}\n`);
    return ExitCode.usage;
  }
}

async function kindOf(path: string): Promise<'file' | 'folder' | undefined> {
  try {
    return (await stat(path)).isDirectory() ? 'folder' : 'file';
  } catch {
    return undefined;
  }
}

/** The first item of each kind in an existing catalog; UsageError naming what it lacks. */
async function itemsOf(catalog: string, cwd: string): Promise<StarterItems> {
  const root = (await loadDocuments([catalog])).files[0]?.root;
  const first = (type: string) => root?.definitions.find((d) => d.$type === type)?.name;
  const found = { spec: first('PipeSpec'), hose: first('HoseKind'), tool: first('ToolKind'), producer: first('ProducerModel'), separator: first('SeparatorModel') };
  const missing = (['spec', 'hose', 'tool', 'producer'] as const).filter((kind) => found[kind] === undefined);
  if (missing.length > 0) {
    throw new UsageError(`${shown(catalog, cwd)} has no ${missing.join(', ')}; add ${missing.length === 1 ? 'it' : 'them'}, or name another catalog with --catalog`);
  }
  return { spec: found.spec!, hose: found.hose!, tool: found.tool!, producer: found.producer!, ...(found.separator ? { separator: found.separator } : {}) };
}

/** `harbour-offices.vacnet` -> `Harbour offices`. */
function titleFrom(path: string): string {
  const words = basename(path, VACNET_EXTENSION).replace(/[-_]+/g, ' ').trim();
  return words === '' || words === 'system' ? 'New system' : words.charAt(0).toUpperCase() + words.slice(1);
}

function shown(path: string, cwd: string): string {
  return relative(cwd, path) || path;
}
