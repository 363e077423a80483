import type { LangiumCoreServices } from 'langium';

// The parser library's types, as Langium's services name them (the library is Langium's, not a dependency of ours).
type IParserErrorMessageProvider = LangiumCoreServices['parser']['ParserErrorMessageProvider'];
type MismatchOptions = Parameters<IParserErrorMessageProvider['buildMismatchTokenMessage']>[0];
type NotAllParsedOptions = Parameters<IParserErrorMessageProvider['buildNotAllInputParsedMessage']>[0];
type NoViableAltOptions = Parameters<IParserErrorMessageProvider['buildNoViableAltMessage']>[0];
type EarlyExitOptions = Parameters<IParserErrorMessageProvider['buildEarlyExitMessage']>[0];
type TokenType = MismatchOptions['expected'];
type IToken = MismatchOptions['actual'];
type ILexerErrorMessageProvider = LangiumCoreServices['parser']['LexerErrorMessageProvider'];

/**
 * The parser's error messages in plain words: what was expected where the
 * text stops making sense, and what was found there. The parser library's
 * own wording ("Expecting: one of these possible Token sequences: 1. [to]
 * 2. [into] but found: 'j1'") names token sequences and internal token
 * types; a designer reads "Expected 'to' or 'into' after 'yard', but found
 * 'j1'."
 */
export class VacnetSyntaxErrorMessages implements IParserErrorMessageProvider {
  buildMismatchTokenMessage(options: MismatchOptions): string {
    return `Expected ${describeToken(options.expected)}${after(options.previous)}, but found ${found(options.actual)}.`;
  }

  buildNotAllInputParsedMessage(options: NotAllParsedOptions): string {
    return `${capitalise(found(options.firstRedundant))} cannot start an item here: a file holds \`use\` lines, catalog items and systems.`;
  }

  buildNoViableAltMessage(options: NoViableAltOptions): string {
    const firsts = options.expectedPathsPerAlt.flatMap((paths) => paths.map((path) => path[0])).filter((t): t is TokenType => t !== undefined);
    return `Expected ${choice(firsts)}${after(options.previous)}, but found ${found(options.actual[0])}.`;
  }

  buildEarlyExitMessage(options: EarlyExitOptions): string {
    const firsts = options.expectedIterationPaths.map((path) => path[0]).filter((t): t is TokenType => t !== undefined);
    return `Expected at least one ${choice(firsts)}${after(options.previous)}, but found ${found(options.actual[0])}.`;
  }
}

/** The lexer's messages: a character no token can start with, named, with the usual cause when there is one. */
export class VacnetLexerErrorMessages implements ILexerErrorMessageProvider {
  buildUnexpectedCharactersMessage(fullText: string, startOffset: number, length: number): string {
    const text = fullText.substring(startOffset, startOffset + length);
    if (text.startsWith('"')) return 'This quoted text is not closed: a text in quotes must end with `"` on the same line.';
    const shown = [...text].map((c) => (c.trim() === '' || c.charCodeAt(0) < 32 ? `U+${c.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}` : c)).join('');
    return `Unexpected ${[...text].length === 1 ? 'character' : 'characters'} '${shown}': names are letters, digits, '_' and '-', and comments start with //.`;
  }

  buildUnableToPopLexerModeMessage(token: IToken): string {
    return `Unexpected ${found(token)}.`;
  }
}

/** How a message that expected the end of the file begins (the parser thrown out of a block reads every later line so). */
export const END_OF_FILE_EXPECTED = 'Expected the end of the file';

/** The most choices a message lists before it says how many more there are (our choice: a line's worth). */
const MAX_LISTED = 8;

/** How a kind of token reads in a message: a keyword as written, a terminal by what it holds. */
export function describeToken(type: TokenType): string {
  switch (type.name) {
    case 'ID':
      return 'a name';
    case 'NUMBER':
      return 'a number';
    case 'STRING':
      return 'a quoted text';
    case 'EOF':
      return 'the end of the file';
    default:
      return `'${type.LABEL ?? type.name}'`;
  }
}

/** "'a'", "'a' or 'b'", "one of 'a', 'b' or 'c'", with duplicates dropped and a long list cut short. */
function choice(types: readonly TokenType[]): string {
  const words = [...new Set(types.map(describeToken))];
  if (words.length === 0) return 'more text';
  if (words.length === 1) return words[0]!;
  if (words.length === 2) return `${words[0]} or ${words[1]}`;
  if (words.length > MAX_LISTED) return `one of ${words.slice(0, MAX_LISTED).join(', ')} (or ${words.length - MAX_LISTED} more)`;
  return `one of ${words.slice(0, -1).join(', ')} or ${words.at(-1)}`;
}

/** " after 'x'", from the last token read before the error, when there is one. */
function after(previous: IToken | undefined): string {
  if (!previous || previous.tokenType?.name === 'EOF' || !previous.image || Number.isNaN(previous.startOffset)) return '';
  return ` after ${quoteImage(previous.image)}`;
}

/** What the parser met instead. */
function found(token: IToken | undefined): string {
  if (!token || token.tokenType?.name === 'EOF' || token.image === '') return 'the end of the file';
  return quoteImage(token.image);
}

/** A token's text in quotes, a long one cut short (a runaway string, say). */
function quoteImage(image: string): string {
  const MAX_CHARS = 40; // our choice: a message stays one line in a problem list
  const text = image.length > MAX_CHARS ? `${image.slice(0, MAX_CHARS)}…` : image;
  return image.startsWith('"') ? text : `'${text}'`;
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
