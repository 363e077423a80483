/**
 * The Content-Security-Policy of every webview page: nothing may run or load
 * but the extension's own style sheet (by the webview's resource origin) and
 * the page's one style element (by a nonce fresh for each page); images only
 * from the extension or inline data. No 'unsafe-inline', no scripts.
 */
export function webviewPolicy(cspSource: string, nonce: string): string {
  return [
    "default-src 'none'",
    `style-src ${cspSource} 'nonce-${nonce}'`,
    `img-src ${cspSource} data:`,
    "base-uri 'none'",
    "form-action 'none'",
  ].join('; ');
}

/** A nonce: 128 random bits, base64 (the CSP nonce guidance of the W3C CSP3 specification asks for at least 128). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  globalThis.crypto.getRandomValues(bytes);
  let binary = '';
  for (const byte of bytes) binary += String.fromCharCode(byte);
  return btoa(binary);
}

/** Adds a style sheet link at the end of a page's head (after the page's own style, so it can adjust it). */
export function withStylesheet(html: string, href: string): string {
  const link = `<link rel="stylesheet" href="${escapeAttribute(href)}">`;
  const at = html.indexOf('</head>');
  return at < 0 ? `${link}${html}` : `${html.slice(0, at)}${link}\n${html.slice(at)}`;
}

function escapeAttribute(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}
