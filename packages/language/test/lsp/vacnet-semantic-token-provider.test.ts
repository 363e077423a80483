// Semantic tokens use the standard token types and modifiers of LSP 3.17
// (SemanticTokenTypes / SemanticTokenModifiers), so any theme colours them.
import { expectSemanticToken, highlightHelper } from 'langium/test';
import { SemanticTokenModifiers, SemanticTokenTypes } from 'vscode-languageserver';
import { describe, expect, it } from 'vitest';
import { Vacnet } from '../helpers.js';

const highlight = highlightHelper(Vacnet);
// The legend maps each modifier to its bit.
const DECLARATION = Vacnet.lsp.SemanticTokenProvider!.tokenModifiers[SemanticTokenModifiers.declaration]!;

describe('semantic tokens', () => {
  it('sets a quantity\'s number and unit apart, and reads a trade fraction as one number', async () => {
    const tokens = await highlight(`hose h <|length|> <|50|> <|ft|> bore <|1-1/2|> <|in|> roughness 0.3 mm
producer p { curve { at 0 <|ft^3/min|> 15 inHg } efficiency 55 <|%|> }`);
    expectSemanticToken(tokens, { rangeIndex: 0, tokenType: SemanticTokenTypes.keyword });
    expectSemanticToken(tokens, { rangeIndex: 1, tokenType: SemanticTokenTypes.number });
    expectSemanticToken(tokens, { rangeIndex: 2, tokenType: SemanticTokenTypes.type });
    expectSemanticToken(tokens, { rangeIndex: 3, tokenType: SemanticTokenTypes.number });
    expectSemanticToken(tokens, { rangeIndex: 4, tokenType: SemanticTokenTypes.type });
    expectSemanticToken(tokens, { rangeIndex: 5, tokenType: SemanticTokenTypes.type });
    expectSemanticToken(tokens, { rangeIndex: 6, tokenType: SemanticTokenTypes.type });
  });

  it('marks names where they are declared and where they are used, trade words as names included', async () => {
    const tokens = await highlight(`tool <|carpet|> working orifice 7/8 in
system "S" {
  plant <|pr|> { }
  pipe <|up|> from <|pr|> to <|j-1|> size 3 in length 40 ft <|up|>
  inlet A1 on <|up|> at 3 ft tool <|carpet|>
}`);
    for (const index of [0, 1, 2, 4]) {
      expectSemanticToken(tokens, { rangeIndex: index, tokenType: SemanticTokenTypes.variable });
    }
    expectSemanticToken(tokens, { rangeIndex: 3, tokenType: SemanticTokenTypes.variable });
    // The orientation word after the length is a value, the pipe's name the same word is a name.
    expectSemanticToken(tokens, { rangeIndex: 5, tokenType: SemanticTokenTypes.enumMember });
    expectSemanticToken(tokens, { rangeIndex: 6, tokenType: SemanticTokenTypes.variable });
    expectSemanticToken(tokens, { rangeIndex: 7, tokenType: SemanticTokenTypes.variable });

    const declared = (text: string, offset: number) =>
      tokens.tokens.find((t) => t.text === text && t.offset === offset)!.tokenModifiers & DECLARATION;
    const [carpet, pr, pipeName, prUse, point] = tokens.ranges;
    expect(declared('carpet', carpet![0])).not.toBe(0);
    expect(declared('pr', pr![0])).not.toBe(0);
    expect(declared('up', pipeName![0])).not.toBe(0);
    expect(declared('j-1', point![0])).not.toBe(0);
    expect(declared('pr', prUse![0])).toBe(0);
  });

  it('gives rule codes, parameters, value words and strings their own types', async () => {
    const tokens = await highlight(`use <|"a.vacnet"|>
system "S" {
  debris <|general|>
  rule <|missing-cleanout|> <|spacing|> 64 ft
  rule short-radius-bend severity <|info|>
  plant pr { }
  pipe main from pr to j-1 size 3 in length 40 ft joins <|wye|> 45 deg <|accept|> <|slow-carrying-velocity|> because "reason"
}`);
    expectSemanticToken(tokens, { rangeIndex: 0, tokenType: SemanticTokenTypes.string });
    expectSemanticToken(tokens, { rangeIndex: 1, tokenType: SemanticTokenTypes.enumMember });
    expectSemanticToken(tokens, { rangeIndex: 2, tokenType: SemanticTokenTypes.macro });
    expectSemanticToken(tokens, { rangeIndex: 3, tokenType: SemanticTokenTypes.property });
    expectSemanticToken(tokens, { rangeIndex: 4, tokenType: SemanticTokenTypes.enumMember });
    expectSemanticToken(tokens, { rangeIndex: 5, tokenType: SemanticTokenTypes.enumMember });
    expectSemanticToken(tokens, { rangeIndex: 6, tokenType: SemanticTokenTypes.keyword });
    expectSemanticToken(tokens, { rangeIndex: 7, tokenType: SemanticTokenTypes.macro });
  });

  it('gives every token one type only', async () => {
    const tokens = await highlight(`system "S" {
  plant pr { producer exh exhaust 1 inH2O at 250 scfm }
  pipe main from pr to j-1 spec s size 3 in length 40 ft bend 2 x 45 deg radius 1.5 D
}`);
    const offsets = tokens.tokens.map((t) => t.offset);
    expect(new Set(offsets).size).toBe(offsets.length);
    expect(tokens.tokens.find((t) => t.text === 'D')?.tokenType).toBe(SemanticTokenTypes.type);
    expect(tokens.tokens.find((t) => t.text === '2')?.tokenType).toBe(SemanticTokenTypes.number);
  });
});
