import { DefaultDocumentValidator, type LangiumDocument, type ValidationOptions } from 'langium';
import type { CancellationToken, Diagnostic } from 'vscode-languageserver';
import { StructureCodes } from './codes.js';

/**
 * A file of random bytes can yield a syntax error per character. Past this
 * many, more of them tell the user nothing (our choice).
 */
const MAX_SYNTAX_ERRORS = 100;

/**
 * Gives the parser's and the linker's findings stable codes of our own (so
 * the editor, the command line and the docs name them alike) and keeps a
 * garbage file from flooding the problem list.
 */
export class VacnetDocumentValidator extends DefaultDocumentValidator {
  override async validateDocument(document: LangiumDocument, options?: ValidationOptions, cancelToken?: CancellationToken): Promise<Diagnostic[]> {
    const diagnostics = await super.validateDocument(document, options, cancelToken);
    let syntaxErrors = 0;
    const kept: Diagnostic[] = [];
    for (const diagnostic of diagnostics) {
      const origin = (diagnostic.data as { code?: string } | undefined)?.code;
      if (diagnostic.code === undefined) {
        if (origin === 'linking-error') diagnostic.code = StructureCodes.unresolvedReference;
        else if (origin === 'lexing-error' || origin === 'parsing-error') diagnostic.code = StructureCodes.syntaxError;
      }
      if (diagnostic.code === StructureCodes.syntaxError && ++syntaxErrors > MAX_SYNTAX_ERRORS) continue;
      kept.push(diagnostic);
    }
    if (syntaxErrors > MAX_SYNTAX_ERRORS) {
      kept.push({
        severity: 3,
        code: StructureCodes.syntaxError,
        message: `${syntaxErrors - MAX_SYNTAX_ERRORS} more syntax errors are not shown; fix the first ones and check again.`,
        range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } },
        source: this.getSource(),
      });
    }
    return kept;
  }

  protected override getSource(): string {
    return 'vacnet';
  }
}
