// Links from diagnostics to their rule pages (LSP Diagnostic.codeDescription).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { RuleLinks } from '../../src/lsp/rule-links.js';

const here = fileURLToPath(new URL('.', import.meta.url));

describe('rule page links', () => {
  it('finds docs/rules above the install folder and links a code to its page', () => {
    const links = new RuleLinks(here);
    const href = links.href('slow-carrying-velocity');
    expect(href).toMatch(/^file:\/\/.*\/docs\/rules\/slow-carrying-velocity\.md$/);
    expect(existsSync(fileURLToPath(href!))).toBe(true);
  });

  it('gives no link for a code without a page, a number, or text that is not a code', () => {
    const links = new RuleLinks(here);
    expect(links.href('no-such-code')).toBeUndefined();
    expect(links.href(42)).toBeUndefined();
    expect(links.href('../../etc/passwd')).toBeUndefined();
  });

  it('uses the configured base URL when one is set, and nothing without an install folder', () => {
    expect(new RuleLinks(here).href('hose-loss', 'https://docs.example.org/rules')).toBe('https://docs.example.org/rules/hose-loss.md');
    expect(new RuleLinks(undefined).href('hose-loss')).toBeUndefined();
  });
});
