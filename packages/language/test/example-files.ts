// The bundled examples, as the language tests read them.
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The repository's examples folder. */
export const EXAMPLES_DIR = fileURLToPath(new URL('../../../examples/', import.meta.url));

/** Every .vacnet file under a folder (default: the examples, invalid ones included), sorted. */
export function vacnetFiles(dir: string = EXAMPLES_DIR): string[] {
  return readdirSync(dir)
    .flatMap((entry) => {
      const full = join(dir, entry);
      if (statSync(full).isDirectory()) return vacnetFiles(full);
      return entry.endsWith('.vacnet') ? [full] : [];
    })
    .sort();
}
