import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

/**
 * Architecture guard (docs/ARCHITECTURE.md, "Invariants"): the engine takes
 * plain data and knows nothing of the editor or the file system, so it runs
 * anywhere (CLI, language server, browser, tests). Any import of these
 * modules from packages/engine/src fails this test.
 */
const FORBIDDEN = [
  /^langium(\/.*)?$/,
  /^vscode$/,
  /^vscode-languageserver(-[a-z]+)?(\/.*)?$/,
  /^vscode-languageclient(\/.*)?$/,
  /^(node:)?fs(\/promises)?$/,
  /^(node:)?path(\/(posix|win32))?$/,
];

/** Module specifiers of static imports, re-exports, dynamic imports and require() calls. */
function importedModules(source: string): string[] {
  const patterns = [
    /\bimport\s+(?:type\s+)?(?:[\w*\s{},$]+\s+from\s+)?['"]([^'"]+)['"]/g,
    /\bexport\s+(?:type\s+)?(?:\*(?:\s+as\s+\w+)?|\{[^}]*\})\s+from\s+['"]([^'"]+)['"]/g,
    /\bimport\s*\(\s*['"]([^'"]+)['"]\s*\)/g,
    /\brequire\s*\(\s*['"]([^'"]+)['"]\s*\)/g,
  ];
  const found: string[] = [];
  for (const pattern of patterns) {
    for (const match of source.matchAll(pattern)) found.push(match[1]!);
  }
  return found;
}

function forbiddenImports(source: string): string[] {
  return importedModules(source).filter((specifier) => FORBIDDEN.some((rule) => rule.test(specifier)));
}

function sourceFiles(folder: string): string[] {
  return readdirSync(folder, { withFileTypes: true }).flatMap((entry) => {
    const full = join(folder, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return /\.(ts|mts|cts|js|mjs|cjs)$/.test(entry.name) ? [full] : [];
  });
}

const engineSrc = fileURLToPath(new URL('../src', import.meta.url));

describe('engine architecture guard', () => {
  it('the detector catches each forbidden form (so the guard itself can fail)', () => {
    const offending = [
      "import { AstNode } from 'langium';",
      "import type { LangiumDocument } from 'langium/lsp';",
      "import * as vscode from 'vscode';",
      "import { Connection } from 'vscode-languageserver/node';",
      "import { Diagnostic } from 'vscode-languageserver-types';",
      "import { readFileSync } from 'node:fs';",
      "import { readFile } from 'fs/promises';",
      "import path from 'path';",
      "import { join } from 'node:path';",
      "export { x } from 'langium';",
      "const fs = await import('node:fs');",
      "const fs = require('fs');",
      "import 'node:fs';",
    ];
    for (const line of offending) {
      expect(forbiddenImports(line), line).toHaveLength(1);
    }
    const allowed = [
      "import { unit } from 'mathjs';",
      "import type { Pipe } from '../network/model.js';",
      "export * from './network/model.js';",
      "import { pathTo } from './graph/path-to.js';",
      "import { fsync } from './fs-like.js';",
    ];
    for (const line of allowed) {
      expect(forbiddenImports(line), line).toEqual([]);
    }
  });

  it('finds source files to check', () => {
    expect(sourceFiles(engineSrc).length).toBeGreaterThan(0);
  });

  it('no file in packages/engine/src imports langium, vscode, the language server, fs or path', () => {
    const offenders = sourceFiles(engineSrc).flatMap((file) =>
      forbiddenImports(readFileSync(file, 'utf8')).map((specifier) => `${relative(engineSrc, file)}: ${specifier}`),
    );
    expect(offenders).toEqual([]);
  });
});
