// Writes the TextMate grammar (syntaxes/vacnet.tmLanguage.json) from the
// Langium grammar (packages/language/src/vacnet.langium). Langium's own
// TextMate output scopes every keyword alike and nothing else; this one
// scopes comments, keywords by role, declared and referenced names, numbers,
// units, strings, rule codes and their parameters, as editors colour them.
//
// The keywords and the ID, NUMBER and STRING terminals are read from the
// Langium grammar, so the two cannot drift apart: a keyword added to the
// grammar without a role here stops the build. Run by `npm run
// langium:generate` after Langium; CI checks the committed file is what this
// writes. Scope names follow the TextMate naming conventions
// (macromates.com/manual/en/language_grammars, "Naming Conventions").
import '../../../scripts/object-groupby-shim.mjs';
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { AstUtils, EmptyFileSystem, GrammarAST, GrammarUtils, URI } from 'langium';
import { createLangiumGrammarServices } from 'langium/grammar';

const langiumFile = fileURLToPath(new URL('../../language/src/vacnet.langium', import.meta.url));
const outFile = fileURLToPath(new URL('../syntaxes/vacnet.tmLanguage.json', import.meta.url));

/** The role of every word keyword of the grammar, as a scope name without the `.vacnet` suffix. */
const KEYWORD_ROLES = {
  'keyword.control.import': ['use'],
  // Words that open an element or a catalog definition.
  'keyword.other.element': ['system', 'spec', 'hose', 'tool', 'producer', 'separator', 'filter', 'plant', 'pipe', 'inlet', 'cleanout', 'scenario'],
  // Words that open a design-basis line of a system.
  'keyword.other.setting': ['site', 'units', 'operators', 'area', 'window', 'debris', 'dust', 'margin', 'test-orifice', 'defaults'],
  // Rule settings and accepted findings.
  'keyword.other.rule': ['rule', 'threshold', 'accept', 'because', 'severity'],
  // Property and connection words inside an element.
  'keyword.other.property': [
    'from', 'to', 'into', 'on', 'at', 'open', 'material', 'schedule', 'sizes', 'length', 'size', 'bore', 'roughness',
    'wall', 'elevation', 'pressure', 'temperature', 'efficiency', 'relief', 'needs', 'orifice', 'cd', 'curve',
    'exhaust', 'rate', 'bend', 'x', 'radius', 'reducer', 'joins', 'room', 'loss', 'clean', 'loaded',
  ],
  // Plain trade words the language takes as values (they may also name things: the grammar's Name rule).
  'constant.language': [
    'carpet', 'small-rooms', 'bare', 'open-bare', 'fine', 'dry', 'general', 'heavy', 'moist', 'ordinary', 'combustible',
    'metal', 'bonded', 'imperial', 'si', 'wye', 'tee', 'sweep', 'working', 'lifted', 'indoors', 'outdoors', 'protected',
    'error', 'warning', 'info', 'off', 'horizontal', 'up', 'down', 'conductive', 'nonconductive', 'public', 'locked',
  ],
};

/** Parses the Langium grammar with Langium's own grammar services. */
function loadLangiumGrammar(text) {
  const services = createLangiumGrammarServices(EmptyFileSystem).grammar;
  const document = services.shared.workspace.LangiumDocumentFactory.fromString(text, URI.file(langiumFile));
  const { value, parserErrors, lexerErrors } = document.parseResult;
  if (parserErrors.length || lexerErrors.length) throw new Error(`${langiumFile}: the grammar does not parse`);
  return value;
}

const escape = (word) => word.replace(/[.*+?^${}()|[\]\\/-]/g, '\\$&');
/** Longest first, so `open-bare` is tried before `open`. */
const alternation = (words) => [...words].sort((a, b) => b.length - a.length || a.localeCompare(b)).map(escape).join('|');

/**
 * The TextMate grammar as a JSON value, from the text of the Langium grammar.
 * Throws when a grammar keyword has no role here, or a role names a word the
 * grammar no longer has.
 */
export function buildGrammar(langiumText = readFileSync(langiumFile, 'utf8')) {
  const grammar = loadLangiumGrammar(langiumText);
  const keywords = new Set(
    AstUtils.streamAllContents(grammar)
      .filter(GrammarAST.isKeyword)
      .map((keyword) => keyword.value)
      .filter((value) => /^[A-Za-z]/.test(value)),
  );
  const roleOf = new Map();
  for (const [role, words] of Object.entries(KEYWORD_ROLES)) {
    for (const word of words) {
      if (!keywords.has(word)) throw new Error(`build-grammar: '${word}' (${role}) is no keyword of ${langiumFile}`);
      roleOf.set(word, role);
    }
  }
  const unassigned = [...keywords].filter((word) => !roleOf.has(word));
  if (unassigned.length) throw new Error(`build-grammar: give these keywords a role in KEYWORD_ROLES: ${unassigned.join(', ')}`);

  const terminal = (name) => {
    const rule = grammar.rules.find((r) => GrammarAST.isTerminalRule(r) && r.name === name);
    if (!rule) throw new Error(`build-grammar: terminal ${name} not found`);
    return GrammarUtils.terminalRegex(rule).source;
  };
  // The Name rule: an ID or one of the value words (a tool called `carpet`).
  const nameRule = grammar.rules.find((r) => GrammarAST.isParserRule(r) && r.name === 'Name');
  const nameKeywords = new Set(AstUtils.streamAllContents(nameRule).filter(GrammarAST.isKeyword).map((k) => k.value));

  // Non-capturing versions of the terminals (TextMate captures count groups).
  const ID = terminal('ID').replace(/\((?!\?)/g, '(?:');
  const NUMBER = terminal('NUMBER').replace(/\((?!\?)/g, '(?:');
  // Word boundaries that treat `-` as part of a word, as ID does: `up` is not found in `j-up`.
  const START = '(?<![A-Za-z0-9_-])';
  const END = '(?![A-Za-z0-9_-])';
  const word = (words) => `${START}(?:${alternation(words)})${END}`;
  const notKeyword = (words) => `(?!(?:${alternation(words)})${END})`;
  // A name as the grammar's Name rule reads it: an ID that is no keyword, or a value word.
  const NAME = `${notKeyword([...keywords].filter((k) => !nameKeywords.has(k)))}${ID}`;
  // A unit: factors of an ID that is no keyword, or %, with powers, joined by / or * (the Unit rule).
  const FACTOR = `(?:%|${notKeyword(keywords)}${ID})(?:\\^${NUMBER})?`;
  const UNIT = `${FACTOR}(?:\\s*[/*]\\s*${FACTOR})*`;

  const s = (scope) => `${scope}.vacnet`;
  const keywordPattern = (w) => `${START}(${w})${END}`;
  /** A keyword followed by a name: `pipe main-1`, `from j-1`. */
  const keywordThenName = (words, nameScope) => ({
    match: `${START}(${alternation(words)})\\s+(${NAME})${END}`,
    captures: { 1: { name: s(roleOf.get(words[0])) }, 2: { name: s(nameScope) } },
  });
  const perKeyword = (words, scopeOf) => words.map((w) => keywordThenName([w], scopeOf(w)));

  const repository = {
    comments: {
      patterns: [
        {
          name: s('comment.block'),
          begin: '/\\*',
          end: '\\*/',
          beginCaptures: { 0: { name: s('punctuation.definition.comment') } },
          endCaptures: { 0: { name: s('punctuation.definition.comment') } },
        },
        {
          name: s('comment.line.double-slash'),
          begin: '//',
          end: '$',
          beginCaptures: { 0: { name: s('punctuation.definition.comment') } },
        },
      ],
    },
    string: {
      name: s('string.quoted.double'),
      begin: '"',
      // A string ends at its quote or, unterminated, at the end of the line (STRING holds no line break).
      end: '"|$',
      beginCaptures: { 0: { name: s('punctuation.definition.string.begin') } },
      endCaptures: { 0: { name: s('punctuation.definition.string.end') } },
      patterns: [{ name: s('constant.character.escape'), match: '\\\\.' }],
    },
    quantity: {
      match: `(?<![A-Za-z0-9_.-])(${NUMBER})(?:\\s*(${UNIT}))?(?![A-Za-z0-9_-])`,
      captures: { 1: { name: s('constant.numeric') }, 2: { name: s('keyword.other.unit') } },
    },
    keywords: {
      patterns: Object.entries(KEYWORD_ROLES).map(([role, words]) => ({ name: s(role), match: word(words) })),
    },
    punctuation: {
      patterns: [
        { name: s('punctuation.section.block.begin'), match: '\\{' },
        { name: s('punctuation.section.block.end'), match: '\\}' },
        { name: s('punctuation.separator.comma'), match: ',' },
      ],
    },
    // A word nothing above placed (a continuation line, a half-typed element): a reference at best.
    'other-name': { name: s('variable.other'), match: `${START}${ID}${END}` },
    // Rule settings: `rule <code> <parameter> <value>`, `rule <code> severity ...`, `rule <code> off ...`.
    'rule-line': {
      match: `${START}(rule)\\s+(${ID})${END}(?:\\s+(?!(?:severity|off)${END})(${NAME})${END})?`,
      captures: { 1: { name: s(roleOf.get('rule')) }, 2: { name: s('support.constant.rule-code') }, 3: { name: s('variable.parameter.rule-parameter') } },
    },
    threshold: {
      match: `${START}(threshold)\\s+(${ID})${END}(?:\\s+(${NAME})${END})?`,
      captures: { 1: { name: s(roleOf.get('threshold')) }, 2: { name: s('support.constant.rule-code') }, 3: { name: s('variable.parameter.rule-parameter') } },
    },
    accept: {
      match: `${START}(accept)\\s+(${ID})${END}`,
      captures: { 1: { name: s(roleOf.get('accept')) }, 2: { name: s('support.constant.rule-code') } },
    },
    // Inside a system: the network's elements and what they refer to.
    'system-member': {
      patterns: [
        { include: '#plant' },
        { include: '#scenario' },
        ...perKeyword(['pipe', 'inlet', 'plant'], (w) => `entity.name.variable.${w}`),
        keywordThenName(['to'], 'entity.name.variable.point'),
        keywordThenName(['from'], 'variable.other.point'),
        keywordThenName(['into'], 'variable.other.point'),
        keywordThenName(['at'], 'variable.other.point'),
        keywordThenName(['on'], 'variable.other.pipe'),
        ...perKeyword(['spec', 'hose', 'tool'], (w) => `variable.other.${w}`),
        { include: '#rule-line' },
        { include: '#threshold' },
        { include: '#accept' },
      ],
    },
    system: {
      name: s('meta.system'),
      begin: `${START}(system)${END}`,
      beginCaptures: { 1: { name: s(roleOf.get('system')) } },
      end: '\\}',
      endCaptures: { 0: { name: s('punctuation.section.block.end') } },
      patterns: [
        { include: '#comments' },
        { include: '#string' },
        { name: s('punctuation.section.block.begin'), match: '\\{' },
        { include: '#system-member' },
        { include: '#common' },
      ],
    },
    // The plant room: its equipment names catalog models.
    plant: {
      name: s('meta.plant'),
      begin: `${START}(plant)\\s+(${NAME})${END}\\s*(\\{)`,
      beginCaptures: { 1: { name: s(roleOf.get('plant')) }, 2: { name: s('entity.name.variable.plant') }, 3: { name: s('punctuation.section.block.begin') } },
      end: '\\}',
      endCaptures: { 0: { name: s('punctuation.section.block.end') } },
      patterns: [
        { include: '#comments' },
        ...perKeyword(['producer', 'filter', 'separator'], (w) => `variable.other.${w}`),
        { include: '#common' },
      ],
    },
    // `scenario <name> open <inlet> [working|lifted], ...` to the end of the line.
    scenario: {
      name: s('meta.scenario'),
      begin: `${START}(scenario)${END}(?:\\s+(${NAME})${END})?`,
      beginCaptures: { 1: { name: s(roleOf.get('scenario')) }, 2: { name: s('entity.name.variable.scenario') } },
      end: '$',
      patterns: [
        { include: '#comments' },
        { include: '#keywords' },
        { include: '#punctuation' },
        { name: s('variable.other.inlet'), match: `${START}${ID}${END}` },
      ],
    },
    // Outside a system: catalog definitions.
    definition: {
      patterns: [
        ...perKeyword(['spec', 'hose', 'tool', 'producer', 'separator', 'filter'], (w) => `entity.name.type.${w}`),
        keywordThenName(['material'], 'constant.other.material'),
      ],
    },
    common: {
      patterns: [
        { include: '#comments' },
        { include: '#string' },
        { include: '#quantity' },
        { include: '#keywords' },
        { include: '#punctuation' },
        { include: '#other-name' },
      ],
    },
  };

  return {
    $schema: 'https://raw.githubusercontent.com/martinring/tmlanguage/master/tmlanguage.json',
    name: 'vacnet',
    scopeName: 'source.vacnet',
    fileTypes: ['vacnet'],
    comment: 'Generated by packages/extension/scripts/build-grammar.mjs from packages/language/src/vacnet.langium: do not edit.',
    patterns: [
      { include: '#comments' },
      { include: '#string' },
      { include: '#system' },
      { include: '#definition' },
      { include: '#common' },
    ],
    repository,
  };
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  writeFileSync(outFile, JSON.stringify(buildGrammar(), null, 2) + '\n');
  console.log(`build-grammar: wrote ${outFile.slice(fileURLToPath(new URL('../../..', import.meta.url)).length)}`);
}
