/**
 * The report's Content-Security-Policy: nothing may load or run; the one
 * style sheet is allowed by its SHA-256 hash (or a nonce the caller gives),
 * so even inline style attributes are refused. Uses Web Crypto, present in
 * Node 20, browsers and web workers alike.
 */
export async function styleHash(css: string): Promise<string> {
  const digest = await globalThis.crypto.subtle.digest('SHA-256', new TextEncoder().encode(css));
  let binary = '';
  for (const byte of new Uint8Array(digest)) binary += String.fromCharCode(byte);
  return `'sha256-${btoa(binary)}'`;
}

/** `default-src 'none'` with only the style sheet allowed (by hash or nonce) and data: images. */
export function reportPolicy(styleSource: string): string {
  return `default-src 'none'; style-src ${styleSource}; img-src data:; base-uri 'none'; form-action 'none'`;
}
