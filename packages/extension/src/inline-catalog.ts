/**
 * A system file and the catalog it uses, as one text: the `use` line of the
 * catalog replaced by the catalog's definitions. A file may hold a system
 * and definitions together, so the result reads the same without any other
 * file (an untitled document, a browser without a file system).
 */
export function inlineCatalog(systemText: string, usePath: string, catalogText: string): string {
  const line = new RegExp(`^[ \\t]*use[ \\t]+"${usePath.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}"[^\\n]*\\n?`, 'm');
  if (!line.test(systemText)) return systemText;
  const catalog = catalogText.endsWith('\n') ? catalogText : `${catalogText}\n`;
  return systemText.replace(line, () => `// ---- from ${usePath}\n${catalog}// ---- end of ${usePath}\n`);
}
