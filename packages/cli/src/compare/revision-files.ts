import { isAbsolute, relative, resolve, sep } from 'node:path';
import { diskAccess, type SettingsFileAccess } from '@vacnet/language';
import { UsageError } from '../exit-codes.js';
import { git, repositoryRoot } from './git.js';

/**
 * The files of one git revision, seen at their working-tree paths: a file
 * inside the repository reads as `git show <rev>:<path>`, so a system at
 * that revision resolves the catalogs it `use`d then, and the project
 * settings file it had then. Paths outside the repository read from disk.
 * Nothing is written anywhere.
 */
export class RevisionFiles implements SettingsFileAccess {
  private readonly texts = new Map<string, Promise<string | undefined>>();

  private constructor(
    readonly root: string,
    readonly revision: string,
    /** The abbreviated commit the revision named when it was read. */
    readonly commit: string,
  ) {}

  /** Opens a revision of the repository that holds `cwd`; UsageError when there is none or the revision is unknown. */
  static async open(revision: string, cwd: string): Promise<RevisionFiles> {
    const root = await repositoryRoot(cwd);
    if (!root) throw new UsageError(`${revision}: the working folder is not inside a git repository`);
    // `--end-of-options` keeps a revision that starts with '-' from being read as an option.
    const commit = await git(['rev-parse', '--verify', '--quiet', '--short', '--end-of-options', `${revision}^{commit}`], root);
    if (commit.code !== 0) throw new UsageError(`${revision}: not a revision of the repository at ${root}`);
    return new RevisionFiles(root, revision, commit.stdout.trim());
  }

  /** The repository path (forward slashes) of an absolute path, or undefined outside the repository or inside .git. */
  repositoryPath(absolute: string): string | undefined {
    const rel = relative(this.root, absolute);
    if (rel === '' || rel.startsWith('..') || isAbsolute(rel)) return undefined;
    const path = rel.split(sep).join('/');
    return path === '.git' || path.startsWith('.git/') ? undefined : path;
  }

  readText(absolute: string): Promise<string | undefined> {
    const path = this.repositoryPath(absolute);
    if (path === undefined) return diskAccess.readText(absolute);
    let text = this.texts.get(path);
    if (!text) {
      text = git(['show', `${this.commit}:${path}`], this.root).then((run) => {
        if (run.code === 0) return run.stdout;
        // "does not exist in", "exists on disk, but not in": the revision has no such file.
        if (/does not exist|exists on disk, but not in|not a tree|bad revision/i.test(run.stderr)) return undefined;
        throw new Error(`git show ${this.revision}:${path} failed: ${run.stderr.trim()}`);
      });
      this.texts.set(path, text);
    }
    return text;
  }

  async exists(absolute: string): Promise<boolean> {
    // The repository's own .git marks the top for settings discovery, as on disk.
    if (resolve(absolute) === resolve(this.root, '.git')) return true;
    const path = this.repositoryPath(absolute);
    if (path === undefined) return diskAccess.exists(absolute);
    return (await git(['cat-file', '-e', `${this.commit}:${path}`], this.root)).code === 0;
  }
}

/**
 * A compared side as written: `<rev>:<path>` names a file at a git
 * revision (the path relative to the repository's top, or to the working
 * folder when it starts with ./ or ../, as git reads it); anything else is
 * a path on disk. A path that exists on disk is always taken as a path.
 */
export interface SideSpec {
  text: string;
  revision?: string;
  path: string;
}

export function parseSide(text: string, existsOnDisk: (path: string) => boolean): SideSpec {
  const colon = text.indexOf(':');
  // `C:\...` is a Windows drive, not a revision.
  if (colon <= 0 || existsOnDisk(text) || /^[A-Za-z]:[\\/]/.test(text)) return { text, path: text };
  return { text, revision: text.slice(0, colon), path: text.slice(colon + 1) };
}

/** The absolute working-tree path a revision path names, with git's rule for relative paths. */
export function revisionPathToAbsolute(path: string, root: string, cwd: string): string {
  if (isAbsolute(path)) return resolve(path);
  return /^\.\.?([\\/]|$)/.test(path) ? resolve(cwd, path) : resolve(root, path);
}
