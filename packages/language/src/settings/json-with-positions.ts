import type { SourcePosition, SourceRange } from '../diagnostic.js';

/**
 * JSON text parsed with the place of every value and key, so that a settings
 * file's problems can be shown at the line and column where they are
 * written. Strict JSON (RFC 8259): no comments, no trailing commas; a
 * leading byte-order mark is skipped. Positions are 0-based lines and UTF-16
 * columns, as in the shared diagnostic shape.
 */
export type JsonNode =
  | { kind: 'object'; range: SourceRange; members: JsonMember[] }
  | { kind: 'array'; range: SourceRange; items: JsonNode[] }
  | { kind: 'string'; range: SourceRange; value: string }
  | { kind: 'number'; range: SourceRange; value: number }
  | { kind: 'boolean'; range: SourceRange; value: boolean }
  | { kind: 'null'; range: SourceRange };

export interface JsonMember {
  key: string;
  keyRange: SourceRange;
  value: JsonNode;
}

export type JsonParseResult = { ok: true; value: JsonNode } | { ok: false; message: string; range: SourceRange };

/** How deep objects and arrays may nest; deeper text is refused rather than risk the stack (our own bound). */
const MAX_DEPTH = 200;

class JsonSyntaxError extends Error {
  constructor(
    message: string,
    readonly offset: number,
    readonly length: number,
  ) {
    super(message);
  }
}

/** Parses JSON text; never throws. */
export function parseJsonWithPositions(text: string): JsonParseResult {
  const lines = lineStarts(text);
  const at = (offset: number): SourcePosition => positionOf(lines, offset);
  const parser = new Parser(text, at);
  try {
    const value = parser.document();
    return { ok: true, value };
  } catch (error) {
    if (error instanceof JsonSyntaxError) {
      return { ok: false, message: error.message, range: { start: at(error.offset), end: at(Math.min(text.length, error.offset + error.length)) } };
    }
    return { ok: false, message: error instanceof Error ? error.message : String(error), range: { start: at(0), end: at(0) } };
  }
}

class Parser {
  private offset = 0;

  constructor(
    private readonly text: string,
    private readonly at: (offset: number) => SourcePosition,
  ) {
    if (text.charCodeAt(0) === 0xfeff) this.offset = 1;
  }

  document(): JsonNode {
    this.skipWhitespace();
    if (this.offset >= this.text.length) throw new JsonSyntaxError('The file is empty; write a JSON object such as { "rules": {} }.', this.offset, 0);
    const value = this.value(0);
    this.skipWhitespace();
    if (this.offset < this.text.length) throw new JsonSyntaxError('Unexpected text after the end of the JSON value.', this.offset, 1);
    return value;
  }

  private value(depth: number): JsonNode {
    if (depth > MAX_DEPTH) throw new JsonSyntaxError(`Nested more than ${MAX_DEPTH} levels deep.`, this.offset, 1);
    const c = this.text[this.offset];
    switch (c) {
      case '{':
        return this.object(depth);
      case '[':
        return this.array(depth);
      case '"': {
        const start = this.offset;
        const value = this.string();
        return { kind: 'string', value, range: this.range(start) };
      }
      case 't':
      case 'f':
      case 'n':
        return this.literal();
      default:
        if (c === '-' || (c !== undefined && c >= '0' && c <= '9')) return this.number();
        if (c === undefined) throw new JsonSyntaxError('The text ends where a value was expected.', this.offset, 0);
        if (c === '/') throw new JsonSyntaxError('Comments are not allowed in JSON.', this.offset, 2);
        if (c === "'") throw new JsonSyntaxError('Strings take double quotes in JSON.', this.offset, 1);
        throw new JsonSyntaxError(`Unexpected '${c}' where a value was expected.`, this.offset, 1);
    }
  }

  private object(depth: number): JsonNode {
    const start = this.offset;
    this.offset++; // {
    const members: JsonMember[] = [];
    this.skipWhitespace();
    if (this.text[this.offset] === '}') {
      this.offset++;
      return { kind: 'object', members, range: this.range(start) };
    }
    for (;;) {
      this.skipWhitespace();
      if (this.text[this.offset] !== '"') {
        const trailing = this.text[this.offset] === '}' && members.length > 0;
        throw new JsonSyntaxError(trailing ? 'A comma before } is not allowed in JSON.' : 'A key in double quotes was expected.', this.offset, 1);
      }
      const keyStart = this.offset;
      const key = this.string();
      const keyRange = this.range(keyStart);
      this.skipWhitespace();
      if (this.text[this.offset] !== ':') throw new JsonSyntaxError(`A ':' was expected after the key "${key}".`, this.offset, 1);
      this.offset++;
      this.skipWhitespace();
      const value = this.value(depth + 1);
      members.push({ key, keyRange, value });
      this.skipWhitespace();
      const next = this.text[this.offset];
      if (next === ',') {
        this.offset++;
        continue;
      }
      if (next === '}') {
        this.offset++;
        return { kind: 'object', members, range: this.range(start) };
      }
      throw new JsonSyntaxError(next === undefined ? 'The text ends inside an object; a } is missing.' : "A ',' or '}' was expected.", this.offset, next === undefined ? 0 : 1);
    }
  }

  private array(depth: number): JsonNode {
    const start = this.offset;
    this.offset++; // [
    const items: JsonNode[] = [];
    this.skipWhitespace();
    if (this.text[this.offset] === ']') {
      this.offset++;
      return { kind: 'array', items, range: this.range(start) };
    }
    for (;;) {
      this.skipWhitespace();
      if (this.text[this.offset] === ']' && items.length > 0) throw new JsonSyntaxError('A comma before ] is not allowed in JSON.', this.offset, 1);
      items.push(this.value(depth + 1));
      this.skipWhitespace();
      const next = this.text[this.offset];
      if (next === ',') {
        this.offset++;
        continue;
      }
      if (next === ']') {
        this.offset++;
        return { kind: 'array', items, range: this.range(start) };
      }
      throw new JsonSyntaxError(next === undefined ? 'The text ends inside an array; a ] is missing.' : "A ',' or ']' was expected.", this.offset, next === undefined ? 0 : 1);
    }
  }

  private string(): string {
    const start = this.offset;
    this.offset++; // "
    let value = '';
    for (;;) {
      const c = this.text[this.offset];
      if (c === undefined || c === '\n' || c === '\r') throw new JsonSyntaxError('The string is not closed on its line.', start, this.offset - start);
      if (c === '"') {
        this.offset++;
        return value;
      }
      if (c < ' ') throw new JsonSyntaxError('A control character must be escaped in a JSON string.', this.offset, 1);
      if (c !== '\\') {
        value += c;
        this.offset++;
        continue;
      }
      const e = this.text[this.offset + 1];
      const simple: Record<string, string> = { '"': '"', '\\': '\\', '/': '/', b: '\b', f: '\f', n: '\n', r: '\r', t: '\t' };
      if (e !== undefined && e in simple) {
        value += simple[e];
        this.offset += 2;
      } else if (e === 'u' && /^[0-9a-fA-F]{4}$/.test(this.text.slice(this.offset + 2, this.offset + 6))) {
        value += String.fromCharCode(parseInt(this.text.slice(this.offset + 2, this.offset + 6), 16));
        this.offset += 6;
      } else {
        throw new JsonSyntaxError('Unknown escape in a JSON string.', this.offset, 2);
      }
    }
  }

  private number(): JsonNode {
    const start = this.offset;
    const match = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(this.text.slice(start, start + 400));
    if (!match) throw new JsonSyntaxError('Not a JSON number.', start, 1);
    this.offset += match[0].length;
    const after = this.text[this.offset];
    if (after !== undefined && /[0-9A-Za-z.]/.test(after)) {
      throw new JsonSyntaxError('Not a JSON number: a value with a unit is written as a string, e.g. "4000 fpm".', start, this.offset - start + 1);
    }
    return { kind: 'number', value: Number(match[0]), range: this.range(start) };
  }

  private literal(): JsonNode {
    const start = this.offset;
    for (const [word, node] of [
      ['true', { kind: 'boolean', value: true }],
      ['false', { kind: 'boolean', value: false }],
      ['null', { kind: 'null' }],
    ] as const) {
      if (this.text.startsWith(word, start)) {
        this.offset += word.length;
        return { ...node, range: this.range(start) } as JsonNode;
      }
    }
    const word = /^[A-Za-z_]\w*/.exec(this.text.slice(start, start + 100))?.[0] ?? this.text[start]!;
    throw new JsonSyntaxError(`Unexpected '${word}': strings take double quotes in JSON.`, start, word.length);
  }

  private skipWhitespace(): void {
    while (this.offset < this.text.length) {
      const c = this.text[this.offset];
      if (c === ' ' || c === '\t' || c === '\n' || c === '\r') this.offset++;
      else break;
    }
  }

  private range(start: number): SourceRange {
    return { start: this.at(start), end: this.at(this.offset) };
  }
}

/** Offsets where each line starts (\n, \r\n and lone \r end a line). */
function lineStarts(text: string): number[] {
  const starts = [0];
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 10) starts.push(i + 1);
    else if (c === 13) {
      if (text.charCodeAt(i + 1) === 10) i++;
      starts.push(i + 1);
    }
  }
  return starts;
}

function positionOf(starts: readonly number[], offset: number): SourcePosition {
  let low = 0;
  let high = starts.length - 1;
  while (low < high) {
    const mid = (low + high + 1) >> 1;
    if (starts[mid]! <= offset) low = mid;
    else high = mid - 1;
  }
  return { line: low, character: offset - starts[low]! };
}
