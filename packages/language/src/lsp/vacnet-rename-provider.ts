import { AstUtils, GrammarAST, type LangiumDocument } from 'langium';
import { DefaultRenameProvider, type LangiumServices } from 'langium/lsp';
import { ErrorCodes, ResponseError, type CancellationToken, type RenameParams, type WorkspaceEdit } from 'vscode-languageserver';

/**
 * Rename across files (Langium finds every reference, in this file and in the
 * files that `use` it). Before renaming, the new name is checked: it must be
 * one word the grammar reads as a name (letters, digits, `_`, inner hyphens,
 * or one of the trade words names may take); a keyword such as `pipe` or a
 * number would break every file that mentions the element.
 */
export class VacnetRenameProvider extends DefaultRenameProvider {
  private readonly lexer: LangiumServices['parser']['Lexer'];
  /** Keywords that may also be names (the alternatives of the grammar's `Name` rule). */
  private readonly softKeywords: ReadonlySet<string>;

  constructor(services: LangiumServices) {
    super(services);
    this.lexer = services.parser.Lexer;
    const nameRule = services.Grammar.rules.find((rule) => rule.name === 'Name');
    this.softKeywords = new Set(
      nameRule ? AstUtils.streamAllContents(nameRule).filter(GrammarAST.isKeyword).map((k) => k.value) : [],
    );
  }

  override async rename(document: LangiumDocument, params: RenameParams, cancelToken?: CancellationToken): Promise<WorkspaceEdit | undefined> {
    const problem = this.nameProblem(params.newName);
    if (problem) throw new ResponseError(ErrorCodes.InvalidParams, problem);
    return super.rename(document, params, cancelToken);
  }

  /** Why `name` cannot be a name, or undefined when it can. */
  nameProblem(name: string): string | undefined {
    const lexed = this.lexer.tokenize(name);
    const tokens = lexed.tokens;
    if (lexed.errors.length > 0 || tokens.length !== 1 || (lexed.hidden?.length ?? 0) > 0 || tokens[0]!.image !== name) {
      return `'${name}' is not a name: use one word of letters, digits, '_' and inner hyphens, starting with a letter (like riser-b or L3-east).`;
    }
    const token = tokens[0]!;
    if (token.tokenType.name !== 'ID' && !this.softKeywords.has(token.image)) {
      return `'${name}' is a word of the language and cannot name an element; choose another.`;
    }
    return undefined;
  }
}
