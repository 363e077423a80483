import { randomBytes } from 'node:crypto';
import { open, rename, stat, unlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';

/**
 * Replaces a file's content all at once: the new text goes to a temporary
 * file in the same folder (same filesystem, so the rename cannot turn into a
 * copy), is flushed to disk, takes the old file's permissions, and is then
 * renamed over the old file. rename(2) replaces the target atomically
 * (POSIX.1-2017), so a reader sees the old text or the new, never half of
 * one, and a crash leaves the old file whole. The temporary file is removed
 * if anything fails.
 */
export async function writeFileAtomic(path: string, text: string): Promise<void> {
  const temporary = join(dirname(path), `.${basename(path)}.${randomBytes(6).toString('hex')}.tmp`);
  let mode: number | undefined;
  try {
    mode = (await stat(path)).mode & 0o7777;
  } catch {
    // A new file: the default permissions.
  }
  const handle = await open(temporary, 'wx', mode ?? 0o666);
  try {
    try {
      await handle.writeFile(text, 'utf8');
      await handle.sync();
      if (mode !== undefined) await handle.chmod(mode);
    } finally {
      await handle.close();
    }
    await rename(temporary, path);
  } catch (error) {
    await unlink(temporary).catch(() => undefined);
    throw error;
  }
}
