import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { findRulesFolder } from '../src/rules-folder.js';
import { REPO_ROOT } from './run-bin.js';

describe('findRulesFolder', () => {
  it('finds the checkout\'s docs/rules from a file in a package', () => {
    expect(findRulesFolder(join(REPO_ROOT, 'packages/cli/dist/chunks/some-chunk.mjs'))).toBe(join(REPO_ROOT, 'docs/rules'));
  });

  it('finds docs/rules beside an installed copy, and nothing where there is none', () => {
    const root = mkdtempSync(join(tmpdir(), 'vacnet-rules-folder-'));
    try {
      mkdirSync(join(root, 'pkg/dist'), { recursive: true });
      expect(findRulesFolder(join(root, 'pkg/dist/vacnet.mjs'))).toBeUndefined();
      mkdirSync(join(root, 'pkg/docs/rules'), { recursive: true });
      writeFileSync(join(root, 'pkg/docs/rules/hose-loss.md'), '# hose-loss\n');
      expect(findRulesFolder(join(root, 'pkg/dist/vacnet.mjs'))).toBe(join(root, 'pkg/docs/rules'));
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });
});
