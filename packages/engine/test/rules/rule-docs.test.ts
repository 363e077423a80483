import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { RULES } from '../../src/rules/index.js';

const docs = (code: string) => fileURLToPath(new URL(`../../../../docs/rules/${code}.md`, import.meta.url));
const written = (name: string) => name.replace(/[A-Z]/g, (c) => '-' + c.toLowerCase());

describe('docs/rules', () => {
  for (const rule of RULES) {
    it(`documents ${rule.code}: title, every setting, severity`, () => {
      expect(existsSync(docs(rule.code))).toBe(true);
      const text = readFileSync(docs(rule.code), 'utf8');
      expect(text.startsWith(`# ${rule.code}\n`)).toBe(true);
      for (const p of rule.parameters) expect(text).toContain(`\`${written(p.name)}\``);
      expect(text).toContain(`Default **${rule.defaultSeverity}**`);
    });
  }
});
