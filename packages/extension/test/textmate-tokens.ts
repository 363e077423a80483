/**
 * Tokenises text with the extension's TextMate grammar through
 * vscode-textmate and vscode-oniguruma, the two libraries VS Code itself
 * colours files with (the regular-expression engine is Oniguruma compiled to
 * WebAssembly, loaded from the package's onig.wasm).
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';

const require = createRequire(import.meta.url);

// The slice of the two libraries' APIs used here (their packages ship no type declarations).
interface RawToken {
  startIndex: number;
  endIndex: number;
  scopes: string[];
}
interface Grammar {
  tokenizeLine(line: string, stack: unknown): { tokens: RawToken[]; ruleStack: unknown };
}
const textmate = require('vscode-textmate') as {
  INITIAL: unknown;
  Registry: new (options: unknown) => { loadGrammar(scope: string): Promise<Grammar | null> };
  parseRawGrammar(content: string, path: string): unknown;
};
const oniguruma = require('vscode-oniguruma') as {
  loadWASM(data: ArrayBuffer): Promise<void>;
  OnigScanner: new (patterns: string[]) => unknown;
  OnigString: new (text: string) => unknown;
};

export const grammarPath = fileURLToPath(new URL('../syntaxes/vacnet.tmLanguage.json', import.meta.url));

/** One token: its text, where it is, and its scopes innermost last (the root `source.vacnet` left out). */
export interface Token {
  line: number;
  start: number;
  end: number;
  text: string;
  scopes: string[];
}

let loaded: Promise<Grammar> | undefined;

function loadGrammar(): Promise<Grammar> {
  loaded ??= (async () => {
    const wasm = readFileSync(require.resolve('vscode-oniguruma/release/onig.wasm'));
    await oniguruma.loadWASM(wasm.buffer.slice(wasm.byteOffset, wasm.byteOffset + wasm.byteLength));
    const registry = new textmate.Registry({
      onigLib: Promise.resolve({
        createOnigScanner: (patterns: string[]) => new oniguruma.OnigScanner(patterns),
        createOnigString: (text: string) => new oniguruma.OnigString(text),
      }),
      loadGrammar: async (scopeName: string) =>
        scopeName === 'source.vacnet' ? textmate.parseRawGrammar(readFileSync(grammarPath, 'utf8'), grammarPath) : null,
    });
    const grammar = await registry.loadGrammar('source.vacnet');
    if (!grammar) throw new Error('the grammar source.vacnet did not load');
    return grammar;
  })();
  return loaded;
}

/** Every token of a text, line by line (lines split as VS Code splits them: \n, \r\n). */
export async function tokenise(text: string): Promise<Token[][]> {
  const grammar = await loadGrammar();
  let stack = textmate.INITIAL;
  return text.split(/\r?\n/).map((line, index) => {
    const result = grammar.tokenizeLine(line, stack);
    stack = result.ruleStack;
    return result.tokens.map((token) => ({
      line: index,
      start: token.startIndex,
      end: Math.min(token.endIndex, line.length),
      text: line.slice(token.startIndex, token.endIndex),
      scopes: token.scopes.slice(1),
    }));
  });
}

/** The innermost scope of a token, without the `.vacnet` suffix; '' for plain text. */
export const innermost = (token: Token): string => (token.scopes.at(-1) ?? '').replace(/\.vacnet$/, '');
