import { UriUtils, type URI } from 'langium';
import type { Document } from '../generated/ast.js';

/**
 * The documents a file may refer into: those named by its `use` lines,
 * resolved relative to the file itself.
 */
export function usedUris(document: Document, documentUri: URI): URI[] {
  const base = UriUtils.dirname(documentUri);
  return document.uses
    .filter((use) => typeof use.path === 'string' && unquote(use.path).length > 0)
    .map((use) => UriUtils.resolvePath(base, unquote(use.path)));
}

/** Strips surrounding quotes if present (Langium's value converter usually has), and unescapes. */
export function unquote(text: string): string {
  if (text.length >= 2 && text.startsWith('"') && text.endsWith('"')) {
    return text.slice(1, -1).replace(/\\(.)/g, '$1');
  }
  return text;
}
