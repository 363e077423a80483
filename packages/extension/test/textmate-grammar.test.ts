// The TextMate grammar, run by the libraries VS Code colours files with
// (vscode-textmate + vscode-oniguruma). Two kinds of check:
//  - on every example, each token the language's own parser reads (Langium's
//    concrete syntax tree) gets a scope of the same kind: a keyword a keyword
//    scope, a declared name an entity.name scope, a referenced name a
//    variable.other scope, a number constant.numeric, a unit
//    keyword.other.unit, a comment and a string theirs;
//  - chosen lines, scope by scope.
// Scope names follow the TextMate naming conventions (macromates.com manual,
// "Language Grammars", naming conventions) that VS Code themes target.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { EmptyFileSystem, GrammarAST, GrammarUtils, AstUtils, CstUtils, isLeafCstNode, type LeafCstNode } from 'langium';
import { createVacnetServices } from '@vacnet/language';
import { describe, expect, it } from 'vitest';
import { grammarPath, innermost, tokenise, type Token } from './textmate-tokens.js';

const examplesDir = fileURLToPath(new URL('../../../examples/', import.meta.url));
const { Vacnet } = createVacnetServices(EmptyFileSystem);

function vacnetFiles(dir: string): string[] {
  return readdirSync(dir)
    .flatMap((entry) => {
      const full = join(dir, entry);
      if (statSync(full).isDirectory()) return vacnetFiles(full);
      return entry.endsWith('.vacnet') ? [full] : [];
    })
    .sort();
}
const examples = vacnetFiles(examplesDir);

/** What a token is to the parser, as the kind of scope it must get. */
type Kind = 'comment' | 'keyword' | 'punctuation' | 'declared' | 'referenced' | 'rule-code' | 'parameter' | 'material' | 'number' | 'unit' | 'string';

/** The scope prefixes each kind may take (the innermost scope of every token the leaf spans). */
const SCOPES: Record<Kind, RegExp> = {
  comment: /^(comment\.(line\.double-slash|block)|punctuation\.definition\.comment)$/,
  keyword: /^(keyword\.(control\.import|other\.(element|setting|rule|property))|constant\.language)$/,
  punctuation: /^punctuation\.(section\.block\.(begin|end)|separator\.comma)$/,
  declared: /^entity\.name\.(type|variable)\.[a-z]+$/,
  referenced: /^variable\.other\.[a-z]+$/,
  'rule-code': /^support\.constant\.rule-code$/,
  parameter: /^variable\.parameter\.rule-parameter$/,
  material: /^constant\.other\.material$/,
  number: /^constant\.numeric$/,
  unit: /^keyword\.other\.unit$/,
  string: /^(string\.quoted\.double|punctuation\.definition\.string\.(begin|end)|constant\.character\.escape)$/,
};

function kindOf(leaf: LeafCstNode): Kind | undefined {
  if (leaf.hidden) return /COMMENT/.test(leaf.tokenType.name) ? 'comment' : undefined;
  const source = leaf.grammarSource;
  const rule = source ? AstUtils.getContainerOfType(source, GrammarAST.isParserRule)?.name : undefined;
  if (rule === 'Unit' || rule === 'UnitFactor') return 'unit';
  if (GrammarAST.isKeyword(source) && rule !== 'Name') return /^[A-Za-z]/.test(source.value) ? 'keyword' : 'punctuation';
  if (leaf.tokenType.name === 'NUMBER') return 'number';
  if (leaf.tokenType.name === 'STRING') return 'string';
  const assignment = GrammarUtils.findAssignment(leaf);
  if (!assignment) return undefined;
  if (GrammarAST.isCrossReference(assignment.terminal)) return 'referenced';
  if (assignment.feature === 'name') return 'declared';
  if (assignment.feature === 'rule') return 'rule-code';
  if (assignment.feature === 'parameter') return 'parameter';
  if (assignment.feature === 'material') return 'material';
  return undefined;
}

/** The tokens that overlap a range of one line. */
const tokensIn = (lines: Token[][], line: number, start: number, end: number) =>
  (lines[line] ?? []).filter((t) => t.end > start && t.start < end && t.text.trim() !== '');

/** Line and column of an offset. */
function positionOf(text: string, offset: number): { line: number; character: number } {
  const before = text.slice(0, offset);
  const line = before.split('\n').length - 1;
  return { line, character: offset - (before.lastIndexOf('\n') + 1) };
}

/** The scopes, innermost, of the tokens of one line, as `text<scope>` (no `.vacnet`). */
async function scopesOf(text: string, line = 0): Promise<string[]> {
  const lines = await tokenise(text);
  return lines[line]!.filter((t) => t.text.trim() !== '').map((t) => `${t.text.trim()}<${innermost(t)}>`);
}

describe('TextMate grammar on every example', () => {
  it.each(examples.map((file) => [file.slice(examplesDir.length), file]))('%s: every token gets a scope of the kind the parser reads', async (_name, file) => {
    const text = readFileSync(file, 'utf8');
    const lines = await tokenise(text);
    const parsed = Vacnet.parser.LangiumParser.parse(text);
    const unscoped = lines.flat().filter((t) => t.text.trim() !== '' && t.scopes.length === 0);
    expect(unscoped.map((t) => `${t.line + 1}:${t.start + 1} ${t.text}`)).toEqual([]);
    // A file the parser cannot read has no syntax tree to compare with (its tokens are still all scoped, above).
    if (parsed.parserErrors.length > 0 || parsed.lexerErrors.length > 0) return;

    const wrong: string[] = [];
    let compared = 0;
    for (const node of CstUtils.streamCst(parsed.value.$cstNode!)) {
      if (!isLeafCstNode(node)) continue;
      const kind = kindOf(node);
      if (!kind) continue;
      // A block comment may span lines: compare each line of it.
      for (let offset = node.offset; offset < node.end; ) {
        const lineEnd = text.indexOf('\n', offset);
        const end = lineEnd === -1 || lineEnd > node.end ? node.end : lineEnd;
        const { line, character } = positionOf(text, offset);
        const tokens = tokensIn(lines, line, character, character + (end - offset));
        if (tokens.length === 0 && text.slice(offset, end).trim() !== '') wrong.push(`${line + 1}:${character + 1} '${text.slice(offset, end)}' has no token`);
        for (const token of tokens) {
          compared++;
          if (!SCOPES[kind].test(innermost(token))) wrong.push(`${line + 1}:${token.start + 1} '${token.text}' is ${kind} to the parser, scoped ${innermost(token) || '(none)'}`);
        }
        offset = end + 1;
      }
    }
    expect(wrong).toEqual([]);
    expect(compared).toBeGreaterThan(0);
  });
});

describe('TextMate grammar on chosen lines', () => {
  it('scopes a pipe line: element keyword, declared and referenced names, numbers, units, values', async () => {
    // examples/harbour-offices.vacnet
    const line = '  pipe main-1 from plant-room to j-w spec steel-10 size 3 in length 40 ft horizontal bend 90 deg radius 1.5 D';
    expect(await scopesOf(`system "s" {\n${line}\n}`, 1)).toEqual([
      'pipe<keyword.other.element>',
      'main-1<entity.name.variable.pipe>',
      'from<keyword.other.property>',
      'plant-room<variable.other.point>',
      'to<keyword.other.property>',
      'j-w<entity.name.variable.point>',
      'spec<keyword.other.element>',
      'steel-10<variable.other.spec>',
      'size<keyword.other.property>',
      '3<constant.numeric>',
      'in<keyword.other.unit>',
      'length<keyword.other.property>',
      '40<constant.numeric>',
      'ft<keyword.other.unit>',
      'horizontal<constant.language>',
      'bend<keyword.other.property>',
      '90<constant.numeric>',
      'deg<keyword.other.unit>',
      'radius<keyword.other.property>',
      '1.5<constant.numeric>',
      'D<keyword.other.unit>',
    ]);
  });

  it('scopes catalog definitions as declared types, and the same words in a system as references', async () => {
    const text = [
      'tool carpet working orifice 7/8 in lifted orifice 1-1/4 in needs 3 inHg',
      'system "s" {',
      '  defaults hose std-50 tool carpet',
      '  plant garage { producer home-unit separator home-cyclone indoors }',
      '}',
    ].join('\n');
    expect(await scopesOf(text, 0)).toEqual([
      'tool<keyword.other.element>',
      'carpet<entity.name.type.tool>',
      'working<constant.language>',
      'orifice<keyword.other.property>',
      '7/8<constant.numeric>',
      'in<keyword.other.unit>',
      'lifted<constant.language>',
      'orifice<keyword.other.property>',
      '1-1/4<constant.numeric>',
      'in<keyword.other.unit>',
      'needs<keyword.other.property>',
      '3<constant.numeric>',
      'inHg<keyword.other.unit>',
    ]);
    expect(await scopesOf(text, 2)).toEqual([
      'defaults<keyword.other.setting>',
      'hose<keyword.other.element>',
      'std-50<variable.other.hose>',
      'tool<keyword.other.element>',
      'carpet<variable.other.tool>',
    ]);
    expect(await scopesOf(text, 3)).toEqual([
      'plant<keyword.other.element>',
      'garage<entity.name.variable.plant>',
      '{<punctuation.section.block.begin>',
      'producer<keyword.other.element>',
      'home-unit<variable.other.producer>',
      'separator<keyword.other.element>',
      'home-cyclone<variable.other.separator>',
      'indoors<constant.language>',
      '}<punctuation.section.block.end>',
    ]);
  });

  it('scopes rule codes, their parameters, and comments after code', async () => {
    const text = [
      'system "s" {',
      '  rule slow-carrying-velocity min-velocity 4000 fpm  // [common practice]',
      '  rule missing-cleanout off because "rod access"',
      '  inlet A1 on br-1 at 33 ft threshold fast-velocity limit 40 m/s',
      '  scenario lobby open L1-lobby lifted, W3b',
      '}',
    ].join('\n');
    expect(await scopesOf(text, 1)).toEqual([
      'rule<keyword.other.rule>',
      'slow-carrying-velocity<support.constant.rule-code>',
      'min-velocity<variable.parameter.rule-parameter>',
      '4000<constant.numeric>',
      'fpm<keyword.other.unit>',
      '//<punctuation.definition.comment>',
      '[common practice]<comment.line.double-slash>',
    ]);
    expect(await scopesOf(text, 2)).toEqual([
      'rule<keyword.other.rule>',
      'missing-cleanout<support.constant.rule-code>',
      'off<constant.language>',
      'because<keyword.other.rule>',
      '"<punctuation.definition.string.begin>',
      'rod access<string.quoted.double>',
      '"<punctuation.definition.string.end>',
    ]);
    expect(await scopesOf(text, 3)).toEqual([
      'inlet<keyword.other.element>',
      'A1<entity.name.variable.inlet>',
      'on<keyword.other.property>',
      'br-1<variable.other.pipe>',
      'at<keyword.other.property>',
      '33<constant.numeric>',
      'ft<keyword.other.unit>',
      'threshold<keyword.other.rule>',
      'fast-velocity<support.constant.rule-code>',
      'limit<variable.parameter.rule-parameter>',
      '40<constant.numeric>',
      'm/s<keyword.other.unit>',
    ]);
    expect(await scopesOf(text, 4)).toEqual([
      'scenario<keyword.other.element>',
      'lobby<entity.name.variable.scenario>',
      'open<keyword.other.property>',
      'L1-lobby<variable.other.inlet>',
      'lifted<constant.language>',
      ',<punctuation.separator.comma>',
      'W3b<variable.other.inlet>',
    ]);
  });

  it('keeps hyphenated names and trade fractions whole, and reads compound units and counts', async () => {
    const text = [
      'system "s" {',
      '  pipe j-up from open-bare-x to L3-east bend 2 x 45 deg',
      '  area carpet 40000 sqft rate 2500 sqft/h',
      '  pipe p2 from a to b size 1-1/2 in flow 250 m^3/h wall 45um',
      '}',
    ].join('\n');
    expect(await scopesOf(text, 1)).toEqual([
      'pipe<keyword.other.element>',
      'j-up<entity.name.variable.pipe>',
      'from<keyword.other.property>',
      'open-bare-x<variable.other.point>',
      'to<keyword.other.property>',
      'L3-east<entity.name.variable.point>',
      'bend<keyword.other.property>',
      '2<constant.numeric>',
      'x<keyword.other.property>',
      '45<constant.numeric>',
      'deg<keyword.other.unit>',
    ]);
    expect(await scopesOf(text, 2)).toEqual([
      'area<keyword.other.setting>',
      'carpet<constant.language>',
      '40000<constant.numeric>',
      'sqft<keyword.other.unit>',
      'rate<keyword.other.property>',
      '2500<constant.numeric>',
      'sqft/h<keyword.other.unit>',
    ]);
    const third = await scopesOf(text, 3);
    expect(third).toContain('1-1/2<constant.numeric>');
    expect(third).toContain('m^3/h<keyword.other.unit>');
    expect(third.slice(-2)).toEqual(['45<constant.numeric>', 'um<keyword.other.unit>']);
  });

  it('scopes a block comment across lines and an unterminated string only to the end of its line', async () => {
    const lines = await tokenise('/* a\n   b */ use "x\nsystem "s" {}');
    expect(lines[0]!.map(innermost)).toEqual(['punctuation.definition.comment', 'comment.block']);
    expect(lines[1]!.filter((t) => t.text.trim()).map((t) => `${t.text}<${innermost(t)}>`)).toEqual([
      '   b <comment.block>',
      '*/<punctuation.definition.comment>',
      'use<keyword.control.import>',
      '"<punctuation.definition.string.begin>',
      'x<string.quoted.double>',
    ]);
    expect(innermost(lines[2]![0]!)).toBe('keyword.other.element');
  });
});

describe('the committed grammar', () => {
  it('is what scripts/build-grammar.mjs makes from the Langium grammar', async () => {
    // @ts-expect-error: a plain .mjs script without type declarations
    const { buildGrammar } = (await import('../scripts/build-grammar.mjs')) as { buildGrammar: () => unknown };
    expect(JSON.parse(readFileSync(grammarPath, 'utf8'))).toEqual(buildGrammar());
  });

  it('refuses a Langium grammar with a keyword it gives no role', async () => {
    // @ts-expect-error: a plain .mjs script without type declarations
    const { buildGrammar } = (await import('../scripts/build-grammar.mjs')) as { buildGrammar: (text?: string) => unknown };
    const langium = readFileSync(fileURLToPath(new URL('../../language/src/vacnet.langium', import.meta.url)), 'utf8');
    expect(() => buildGrammar(langium.replace("'window' duration=Quantity", "'window' duration=Quantity 'daily'?"))).toThrow(/daily/);
  });
});
