/**
 * Expands a VS Code snippet body with every placeholder at its default, as
 * accepting a snippet without typing leaves it. Follows the snippet grammar
 * of the VS Code documentation ("Snippets in Visual Studio Code", snippet
 * syntax): tabstops `$1` `${1}`, placeholders `${1:default}` (nested),
 * choices `${1|one,two|}` (the first is the default), `\$` `\}` `\\` escapes.
 * Variables (`$TM_FILENAME`) are not used by our snippets and are refused.
 */
export function expandSnippet(body: string | string[]): string {
  const text = Array.isArray(body) ? body.join('\n') : body;
  let at = 0;
  const parse = (until: string | undefined): string => {
    let out = '';
    while (at < text.length) {
      const c = text[at]!;
      if (until !== undefined && c === until) return out;
      if (c === '\\' && at + 1 < text.length && '$}\\,|'.includes(text[at + 1]!)) {
        out += text[at + 1];
        at += 2;
        continue;
      }
      if (c !== '$') {
        out += c;
        at++;
        continue;
      }
      const simple = /^\$(\d+)/.exec(text.slice(at));
      if (simple) {
        at += simple[0].length;
        continue;
      }
      const open = /^\$\{(\d+)([:|}])/.exec(text.slice(at));
      if (!open) throw new Error(`unsupported snippet syntax at ${at}: ${text.slice(at, at + 20)}`);
      at += open[0].length;
      if (open[2] === '}') continue;
      if (open[2] === ':') {
        out += parse('}');
        at++; // the closing brace
        continue;
      }
      const end = text.indexOf('|}', at);
      if (end < 0) throw new Error('unterminated choice');
      out += text.slice(at, end).split(',')[0];
      at = end + 2;
    }
    if (until !== undefined) throw new Error(`unterminated placeholder, expected '${until}'`);
    return out;
  };
  return parse(undefined);
}

/** Where `$0` (the final cursor) is in the expansion, as an offset; undefined without one. */
export function finalCursor(body: string | string[]): number | undefined {
  const text = Array.isArray(body) ? body.join('\n') : body;
  const marker = '\u0000';
  if (!/\$0(?!\d)|\$\{0\}/.test(text)) return undefined;
  const expanded = expandSnippet(text.replace(/\$0(?!\d)|\$\{0\}/, marker));
  return expanded.indexOf(marker);
}
