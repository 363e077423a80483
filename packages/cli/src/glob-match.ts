/**
 * A small glob matcher for command-line paths, as shells and build tools
 * read them: `*` any characters within one path segment, `?` one
 * character, `**` as a whole segment any number of segments (none
 * included), `[abc]` / `[a-z]` / `[!abc]` one character of a class, and
 * `{a,b}` alternatives. Paths are matched with `/` separators.
 */

/** True when the text holds a glob character, so it is a pattern rather than a plain path. */
export function hasGlob(text: string): boolean {
  return /[*?[\]{}]/.test(text);
}

/** The leading segments of a pattern that hold no glob character: the folder a search starts from. */
export function globBase(pattern: string): string {
  const segments = toSlashes(pattern).split('/');
  const base: string[] = [];
  for (const segment of segments.slice(0, -1)) {
    if (hasGlob(segment)) break;
    base.push(segment);
  }
  if (base.length === 0) return '.';
  const joined = base.join('/');
  return joined === '' ? '/' : joined;
}

/** The pattern as a regular expression that must match a whole `/`-separated path. */
export function globToRegExp(pattern: string): RegExp {
  return new RegExp(`^${translate(toSlashes(pattern))}$`);
}

export function toSlashes(path: string): string {
  return path.replace(/\\/g, '/');
}

function translate(pattern: string): string {
  let out = '';
  let i = 0;
  while (i < pattern.length) {
    const c = pattern[i]!;
    const atSegmentStart = i === 0 || pattern[i - 1] === '/';
    if (c === '*' && pattern[i + 1] === '*' && atSegmentStart && (pattern[i + 2] === '/' || i + 2 === pattern.length)) {
      // `**/` is any number of whole segments; a final `**` is anything below.
      if (pattern[i + 2] === '/') {
        out += '(?:[^/]+/)*';
        i += 3;
      } else {
        out += '.*';
        i += 2;
      }
      continue;
    }
    if (c === '*') {
      out += '[^/]*';
      i++;
    } else if (c === '?') {
      out += '[^/]';
      i++;
    } else if (c === '[') {
      const close = pattern.indexOf(']', i + 2);
      if (close === -1) {
        out += '\\[';
        i++;
        continue;
      }
      let body = pattern.slice(i + 1, close);
      const negated = body.startsWith('!') || body.startsWith('^');
      if (negated) body = body.slice(1);
      out += `[${negated ? '^' : ''}${body.replace(/[\\\]^]/g, '\\$&')}${negated ? '/' : ''}]`;
      i = close + 1;
    } else if (c === '{') {
      const close = matchingBrace(pattern, i);
      if (close === -1) {
        out += '\\{';
        i++;
        continue;
      }
      out += `(?:${splitTopLevel(pattern.slice(i + 1, close)).map(translate).join('|')})`;
      i = close + 1;
    } else {
      out += c.replace(/[.+^$()|\\/]/g, '\\$&');
      i++;
    }
  }
  return out;
}

function matchingBrace(pattern: string, open: number): number {
  let depth = 0;
  for (let i = open; i < pattern.length; i++) {
    if (pattern[i] === '{') depth++;
    else if (pattern[i] === '}' && --depth === 0) return i;
  }
  return -1;
}

function splitTopLevel(body: string): string[] {
  const parts: string[] = [];
  let depth = 0;
  let start = 0;
  for (let i = 0; i < body.length; i++) {
    if (body[i] === '{') depth++;
    else if (body[i] === '}') depth--;
    else if (body[i] === ',' && depth === 0) {
      parts.push(body.slice(start, i));
      start = i + 1;
    }
  }
  parts.push(body.slice(start));
  return parts;
}
