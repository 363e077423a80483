/** The manifest's shape as the tests read it, and the files it points to. */
export interface ManifestFiles {
  main: string;
  browser: string;
  icon: string;
  contributes: {
    languages: { configuration: string; icon: { light: string; dark: string } }[];
    grammars: { path: string }[];
    snippets: { path: string }[];
    jsonValidation: { url: string }[];
    walkthroughs: { steps: { media: { markdown?: string; image?: string } }[] }[];
  };
}

/** Every file the manifest points to, relative to the extension folder. */
export function referencedFiles(m: ManifestFiles): string[] {
  const c = m.contributes;
  return [
    m.main,
    m.browser,
    m.icon,
    ...c.languages.flatMap((l) => [l.configuration, l.icon.light, l.icon.dark]),
    ...c.grammars.map((g) => g.path),
    ...c.snippets.map((s) => s.path),
    ...c.jsonValidation.map((v) => v.url),
    ...c.walkthroughs.flatMap((w) => w.steps.map((s) => s.media.markdown ?? s.media.image ?? '')),
    'README.md',
    'LICENSE',
  ]
    .filter(Boolean)
    .map((file) => file.replace(/^\.\//, ''));
}
