import { Uri, workspace } from 'vscode';

/**
 * The rule pages (docs/rules/<code>.md, shipped in the extension) of the
 * given codes, by code, for the report's appendix. Read through the
 * editor's file system, so the browser reads them too; a code without a
 * page is left out.
 */
export async function readRulePages(extensionUri: Uri, codes: readonly string[]): Promise<Map<string, string>> {
  const pages = new Map<string, string>();
  const wanted = [...new Set(codes)].filter((code) => /^[a-z][a-z0-9-]*$/.test(code));
  await Promise.all(
    wanted.map(async (code) => {
      try {
        const bytes = await workspace.fs.readFile(Uri.joinPath(extensionUri, 'docs', 'rules', `${code}.md`));
        pages.set(code, new TextDecoder().decode(bytes));
      } catch {
        // No page for this code: the report lists it by title.
      }
    }),
  );
  return pages;
}
