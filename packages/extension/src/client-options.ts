import { Uri, workspace, type ExtensionContext } from 'vscode';
import type { LanguageClientOptions } from 'vscode-languageclient';

/** The `vacnet` settings section the server reads (workspace/configuration). */
export const SETTINGS_SECTION = 'vacnet';

/**
 * What the language client sends the server. Documents of every scheme
 * (files, untitled, virtual workspaces): the server works on the text the
 * editor gives it. On the desktop, `.vacnet` and `vacnet.json` files
 * changed on disk (a catalog edited elsewhere, a git checkout, the project
 * settings) are reported so the systems they concern are checked again. In the browser, where the server cannot
 * read the extension's files, rule pages link to the copies the extension
 * ships unless the settings name another place.
 */
export function clientOptions(context: ExtensionContext, host: 'desktop' | 'web'): LanguageClientOptions {
  const options: LanguageClientOptions = {
    documentSelector: [{ language: 'vacnet' }],
  };
  if (host === 'desktop') {
    // Project settings files (vacnet.json) too: the server reads them as `vacnet check` does.
    const watchers = ['**/*.vacnet', '**/vacnet.json'].map((glob) => workspace.createFileSystemWatcher(glob));
    context.subscriptions.push(...watchers);
    options.synchronize = { fileEvents: watchers };
  } else {
    const shipped = Uri.joinPath(context.extensionUri, 'docs', 'rules').toString();
    options.middleware = {
      workspace: {
        configuration: async (params, token, next) => {
          const answers = await next(params, token);
          if (!Array.isArray(answers)) return answers;
          return answers.map((answer: unknown, i: number) =>
            params.items[i]?.section === SETTINGS_SECTION ? withRulePages(answer, shipped) : answer,
          );
        },
      },
    };
  }
  return options;
}

/** The settings with `rulesDocsBaseUrl` filled in when the user left it empty. */
function withRulePages(settings: unknown, base: string): unknown {
  if (!settings || typeof settings !== 'object') return { rulesDocsBaseUrl: base };
  const given = (settings as { rulesDocsBaseUrl?: unknown }).rulesDocsBaseUrl;
  return typeof given === 'string' && given.trim() !== '' ? settings : { ...settings, rulesDocsBaseUrl: base };
}
