// JSON with positions: values as JSON.parse reads them (the reference
// reader, ECMA-262 / RFC 8259), and each error placed where it is.
import { describe, expect, it } from 'vitest';
import { parseJsonWithPositions, type JsonNode } from '../../src/settings/json-with-positions.js';

/** Back to plain JSON values, to compare with JSON.parse. */
function plain(node: JsonNode): unknown {
  switch (node.kind) {
    case 'object':
      return Object.fromEntries(node.members.map((m) => [m.key, plain(m.value)]));
    case 'array':
      return node.items.map(plain);
    case 'null':
      return null;
    default:
      return node.value;
  }
}

describe('parseJsonWithPositions', () => {
  // The two example texts of RFC 8259 section 13, and a few edge cases.
  const samples = [
    '{"Image":{"Width":800,"Height":600,"Title":"View from 15th Floor","Thumbnail":{"Url":"http://www.example.com/image/481989943","Height":125,"Width":100},"Animated":false,"IDs":[116,943,234,38793]}}',
    '[{"precision":"zip","Latitude":37.7668,"Longitude":-122.3959,"Address":"","City":"SAN FRANCISCO","State":"CA","Zip":"94107","Country":"US"}]',
    '"\\u00e9t\\u00e9 \\"quoted\\" \\\\ \\/ \\n"',
    '  -0.5e-3 ',
    '\ufeff{"a": [true, false, null, {}, []]}',
  ];
  for (const text of samples) {
    it(`reads ${text.slice(0, 30)}... as JSON.parse does`, () => {
      const parsed = parseJsonWithPositions(text);
      expect(parsed.ok).toBe(true);
      if (parsed.ok) expect(plain(parsed.value)).toEqual(JSON.parse(text.replace(/^\ufeff/, '')));
    });
  }

  it('places keys and values by 0-based line and UTF-16 column, across \\r\\n line ends', () => {
    const parsed = parseJsonWithPositions('{\r\n  "rules": {\r\n    "hose-loss": { "share": "40 %" }\r\n  }\r\n}');
    expect(parsed.ok).toBe(true);
    if (!parsed.ok || parsed.value.kind !== 'object') return;
    const rules = parsed.value.members[0]!;
    expect(rules.keyRange).toEqual({ start: { line: 1, character: 2 }, end: { line: 1, character: 9 } });
    if (rules.value.kind !== 'object') throw new Error('rules is an object');
    const hose = rules.value.members[0]!;
    if (hose.value.kind !== 'object') throw new Error('hose-loss is an object');
    expect(hose.value.members[0]!.value.range).toEqual({ start: { line: 2, character: 28 }, end: { line: 2, character: 34 } });
  });

  const errors: [string, string, { line: number; character: number }][] = [
    ['{"a": 1,}', 'comma before }', { line: 0, character: 8 }],
    ['{"a": 1\n "b": 2}', "',' or '}'", { line: 1, character: 1 }],
    ['{\n  // note\n  "a": 1}', 'A key in double quotes', { line: 1, character: 2 }],
    ["{'a': 1}", 'A key in double quotes', { line: 0, character: 1 }],
    ['{"v": 4000 fpm}', "',' or '}'", { line: 0, character: 11 }],
    ['{"v": 12fpm}', 'written as a string', { line: 0, character: 6 }],
    ['{"a": "open', 'not closed', { line: 0, character: 6 }],
    ['', 'empty', { line: 0, character: 0 }],
    ['{"a": tru}', "Unexpected 'tru'", { line: 0, character: 6 }],
    ['[1, 2', 'ends inside an array', { line: 0, character: 5 }],
    ['{} {}', 'after the end', { line: 0, character: 3 }],
  ];
  for (const [text, message, start] of errors) {
    it(`refuses ${JSON.stringify(text)} (JSON.parse refuses it too) at ${start.line}:${start.character}`, () => {
      expect(() => JSON.parse(text)).toThrow();
      const parsed = parseJsonWithPositions(text);
      expect(parsed.ok).toBe(false);
      if (parsed.ok) return;
      expect(parsed.message).toContain(message);
      expect(parsed.range.start).toEqual(start);
    });
  }

  it('does not overflow the stack on deep nesting', () => {
    const parsed = parseJsonWithPositions('['.repeat(100_000));
    expect(parsed.ok).toBe(false);
  });
});
