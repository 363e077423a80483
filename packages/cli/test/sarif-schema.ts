import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import Ajv from 'ajv';

/**
 * A validator for SARIF 2.1.0 logs, built from the SARIF 2.1.0 JSON schema
 * (sarif-2.1.0-rtm.5.json, the OASIS SARIF TC's schema as published in
 * SchemaStore) shipped by the npm package @microsoft/jest-sarif 1.0.0-beta.0
 * (Microsoft's sarif-js-sdk), lib/schemas/. The schema is draft-04: its root
 * `id` becomes `$id` for ajv 8, and its one pattern that is not a valid
 * Unicode regular expression (the `language` pattern) needs non-Unicode
 * mode. Formats are checked by small stand-ins (ajv-formats is not a
 * dependency): `uri` by the WHATWG URL parser, `date-time` by RFC 3339's grammar.
 */
export function sarifValidator() {
  const require = createRequire(import.meta.url);
  const schema = JSON.parse(readFileSync(require.resolve('@microsoft/jest-sarif/lib/schemas/sarif-2.1.0-rtm.5.json'), 'utf8')) as Record<string, unknown>;
  delete schema.$schema;
  schema.$id = schema.id;
  delete schema.id;
  const AjvClass = ((Ajv as unknown as { default?: typeof Ajv }).default ?? Ajv) as typeof Ajv;
  const ajv = new AjvClass({ strict: false, allErrors: true, unicodeRegExp: false });
  ajv.addFormat('uri', (text: string) => {
    try {
      new URL(text);
      return true;
    } catch {
      return false;
    }
  });
  ajv.addFormat('uri-reference', (text: string) => !/\s/.test(text));
  ajv.addFormat('date-time', /^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d(\.\d+)?(Z|[+-]\d\d:\d\d)$/i);
  return ajv.compile(schema);
}
