import { readdirSync, readFileSync } from 'node:fs';
import * as path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadDocuments } from '../src/document.js';
import { EXAMPLES_DIR as examples, vacnetFiles } from './example-files.js';

describe('the bundled examples', () => {
  // The valid examples: examples/invalid holds one file per finding code, on purpose.
  const files = vacnetFiles().filter((f) => !path.relative(examples, f).split(path.sep).includes('invalid'));

  it('include a catalog and at least three systems', () => {
    expect(files.length).toBeGreaterThanOrEqual(4);
  });

  it.each(files.map((f) => [path.relative(examples, f), f]))('%s parses, links and validates without errors', async (_name, file) => {
    const result = await loadDocuments([file]);
    const errors = result.files.flatMap((f) => f.diagnostics.filter((d) => d.severity === 'error').map((d) => ({ file: path.basename(f.path), ...d })));
    expect(errors).toEqual([]);
  });
});

/**
 * Each file in examples/invalid/ names the one diagnostic it must produce in
 * its first line: `// expect: <code> at <line>:<column>` (1-based).
 */
describe('examples/invalid', () => {
  const folder = path.join(examples, 'invalid');
  const files = readdirSync(folder).filter((f) => f.endsWith('.vacnet'));

  it('covers the structural errors', () => {
    expect(files.length).toBeGreaterThanOrEqual(10);
  });

  it.each(files)('%s yields exactly its expected finding', async (name) => {
    const file = path.join(folder, name);
    const header = /^\/\/\s*expect:\s*([a-z-]+)\s+at\s+(\d+):(\d+)/.exec(readFileSync(file, 'utf-8'));
    expect(header, 'first line must be // expect: <code> at <line>:<col>').not.toBeNull();
    const [, code, line, column] = header!;
    const result = await loadDocuments([file]);
    const own = result.files.find((f) => f.requested)!;
    const found = own.diagnostics.filter((d) => d.severity !== 'info' || d.code === code);
    expect(found.map((d) => ({ code: d.code, line: d.range.start.line + 1, column: d.range.start.character + 1 }))).toEqual([
      { code, line: Number(line), column: Number(column) },
    ]);
  });
});
