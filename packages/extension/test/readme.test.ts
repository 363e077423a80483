// The extension's README is its marketplace page: it must list every
// command and every setting the manifest declares, show only images that
// ship in the package (PNG: vsce refuses SVG images in a README), and keep
// the cautions (licensed engineer, local codes, NFPA 652 for combustible dust).
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const extensionRoot = fileURLToPath(new URL('..', import.meta.url));
const readme = readFileSync(join(extensionRoot, 'README.md'), 'utf8');
const manifest = JSON.parse(readFileSync(join(extensionRoot, 'package.json'), 'utf8')) as {
  contributes: { commands: { command: string; title: string; category: string }[]; configuration: { properties: Record<string, { default?: unknown }> } };
};

/** The rows of the Markdown table under a heading. */
function tableRows(heading: string): string[] {
  const section = readme.split(/^## /m).find((s) => s.startsWith(`${heading}\n`)) ?? '';
  return section.split('\n').filter((l) => l.startsWith('| ') && !/^\|\s*-/.test(l)).slice(1);
}

describe('the extension README', () => {
  it('lists every command with its palette title and id', () => {
    const rows = tableRows('Commands');
    expect(rows).toHaveLength(manifest.contributes.commands.length);
    for (const command of manifest.contributes.commands) {
      expect(rows.some((r) => r.includes(`\`${command.category}: ${command.title}\` (\`${command.command}\`)`)), command.command).toBe(true);
    }
  });

  it('lists every setting', () => {
    const rows = tableRows('Settings');
    const keys = Object.keys(manifest.contributes.configuration.properties);
    expect(rows.map((r) => /^\| `([^`]+)`/.exec(r)?.[1]).sort()).toEqual([...keys].sort());
  });

  it('shows only PNG images that exist in the package', () => {
    const images = [...readme.matchAll(/!\[[^\]]*\]\(([^)]+)\)/g)].map((m) => m[1]!);
    expect(images.length).toBeGreaterThanOrEqual(2);
    for (const image of images) {
      expect(image).toMatch(/^images\/[a-z0-9-]+\.png$/);
      expect(existsSync(join(extensionRoot, image)), image).toBe(true);
    }
  });

  it('keeps the cautions', () => {
    const cautions = readme.split(/^## /m).find((s) => s.startsWith('Cautions')) ?? '';
    expect(cautions).toMatch(/licensed engineer/);
    expect(cautions).toMatch(/authority having\s+jurisdiction/);
    expect(cautions).toMatch(/NFPA 652/);
  });
});
