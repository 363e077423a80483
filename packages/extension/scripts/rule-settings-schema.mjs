// JSON schemas made from the engine's rule table (every code, its default
// severity, each parameter with its default, source and sane range):
//  - the `vacnet.rules` setting, so the Settings editor offers exactly what
//    the language server reads (packages/language/src/engine-bridge/
//    workspace-settings.ts);
//  - the project settings file `vacnet.json` (docs/settings.md), for the
//    editor's JSON validation and completion.
// The tests compare the committed files with these, so they cannot drift
// from the engine. `node scripts/rule-settings-schema.mjs` (after
// `npx tsc -b packages/engine`) writes both: package.json and
// schemas/vacnet.schema.json.
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** Severities an editor setting may give; `off` needs a written reason, so only a file can say it. */
const SEVERITIES = ['error', 'warning', 'info'];
const UNIT_EXAMPLE = { velocity: 'fpm', pressure: 'inHg', length: 'ft', angle: 'deg' };

/** Where the project settings schema is written, relative to the extension folder. */
export const PROJECT_SCHEMA_FILE = 'schemas/vacnet.schema.json';

/** `minVelocity` -> `min-velocity`, as files write parameters. */
const kebab = (name) => name.replace(/[A-Z]/g, (c) => '-' + c.toLowerCase());

/**
 * The schema. `rules`: the engine's RULES; `formatQuantity`: the engine's
 * formatter, to print defaults in trade units.
 */
export function ruleSettingsSchema(rules, formatQuantity) {
  const valueText = (value, dimension) => {
    if (dimension === 'ratio' || dimension === 'count') return String(value);
    if (dimension === 'fraction') return `${+(value * 100).toPrecision(3)} %`;
    const imperial = formatQuantity(value, dimension, 'imperial');
    const si = formatQuantity(value, dimension, 'si');
    return imperial === si ? imperial : `${imperial} (${si})`;
  };
  const properties = {};
  for (const rule of [...rules].sort((a, b) => a.code.localeCompare(b.code))) {
    const ruleProperties = {
      severity: {
        type: 'string',
        enum: SEVERITIES,
        markdownDescription: `Severity of \`${rule.code}\` findings (default: ${rule.defaultSeverity}). To turn the rule off, write \`rule ${rule.code} off because "..."\` in the file, or give the reason in \`vacnet.json\`.`,
      },
    };
    for (const parameter of rule.parameters) {
      const { dimension } = parameter;
      const byDebris = parameter.defaultByDebris
        ? `; by debris: ${Object.entries(parameter.defaultByDebris).map(([debris, value]) => `${debris} ${valueText(value, dimension)}`).join(', ')}`
        : '';
      const description = `${parameter.description} Default: ${valueText(parameter.default, dimension)}${byDebris}. Source: ${parameter.source}.`;
      const [low, high] = parameter.range ?? [];
      if (dimension === 'ratio' || dimension === 'count') {
        ruleProperties[kebab(parameter.name)] = {
          type: 'number',
          ...(low !== undefined ? { minimum: low, maximum: high } : {}),
          markdownDescription: description,
        };
      } else if (dimension === 'fraction') {
        ruleProperties[kebab(parameter.name)] = {
          type: ['string', 'number'],
          markdownDescription: `${description} A share as \`"15 %"\` or a fraction as \`0.15\`.`,
        };
      } else {
        ruleProperties[kebab(parameter.name)] = {
          type: 'string',
          // A number and a unit, as a file writes the value.
          pattern: '^\\s*\\S+\\s*[^\\s\\d].*$',
          patternErrorMessage: `A number with its unit, e.g. "${valueText(parameter.default, dimension).split(' (')[0]}".`,
          markdownDescription: `${description} Write the value with its unit, e.g. \`"${valueText(parameter.default, dimension).split(' (')[0]}"\` (any ${UNIT_EXAMPLE[dimension] ? `${dimension} unit, such as ${UNIT_EXAMPLE[dimension]}` : 'unit of the quantity'}).`,
        };
      }
    }
    properties[rule.code] = {
      type: 'object',
      markdownDescription: `**${rule.title}**: the rule's page is docs/rules/${rule.code}.md.`,
      properties: ruleProperties,
      additionalProperties: false,
    };
  }
  return {
    type: 'object',
    default: {},
    scope: 'resource',
    markdownDescription:
      'Rule severities and thresholds for every system, by rule code, as a `rule` line in a file would set them: ' +
      '`{ "slow-carrying-velocity": { "severity": "error", "min-velocity": "4000 fpm" } }`. ' +
      'A file\'s own `rule` and `threshold` lines, then the project settings file `vacnet.json`, win over these.',
    properties,
    additionalProperties: false,
  };
}

/**
 * The schema of a project settings file, vacnet.json (docs/settings.md):
 * display units, rules by code (a severity, `off` with its reason, the
 * parameters as in the setting above) and which hints show.
 */
export function projectSettingsSchema(rules, formatQuantity) {
  const editor = ruleSettingsSchema(rules, formatQuantity);
  const ruleSchemas = {};
  for (const [code, rule] of Object.entries(editor.properties)) {
    const { severity, ...parameters } = rule.properties;
    ruleSchemas[code] = {
      ...rule,
      properties: {
        severity: {
          type: 'string',
          enum: [...SEVERITIES, 'off'],
          markdownDescription: `Severity of \`${code}\` findings; \`"off"\` drops them and needs \`"because"\`.`,
        },
        because: { type: 'string', minLength: 1, markdownDescription: 'Why the rule is off: reviewers read it in the file\'s history.' },
        ...parameters,
      },
      // `"off"` needs a written reason.
      if: { properties: { severity: { const: 'off' } }, required: ['severity'] },
      then: { required: ['because'] },
    };
  }
  const hint = (what) => ({ type: 'boolean', default: true, markdownDescription: `Show ${what} beside the text in the editor.` });
  return {
    $schema: 'http://json-schema.org/draft-07/schema#',
    title: 'vacnet project settings (vacnet.json)',
    markdownDescription: 'Display units, rule severities and thresholds, and hints for every system in the folders below this file. Settings written in a .vacnet file win over these.',
    type: 'object',
    properties: {
      displayUnits: { type: 'string', enum: ['imperial', 'si'], markdownDescription: 'Units of results for systems whose file has no `units` line.' },
      rules: { type: 'object', markdownDescription: 'Rule severities and thresholds by rule code, as `rule` lines in a file set them.', properties: ruleSchemas, additionalProperties: false },
      hints: {
        markdownDescription: 'Which computed results the editor shows beside the text; `false` for none.',
        oneOf: [
          { type: 'boolean' },
          { type: 'object', properties: { inlets: hint("each inlet's vacuum at the tool and flow"), pipes: hint("each pipe's lowest velocity"), producer: hint("the producer's operating point and margin") }, additionalProperties: false },
        ],
      },
    },
    additionalProperties: false,
  };
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const engine = await import(new URL('../../engine/dist/index.js', import.meta.url).href);
  const manifestFile = new URL('../package.json', import.meta.url);
  const manifest = JSON.parse(readFileSync(manifestFile, 'utf8'));
  manifest.contributes.configuration.properties['vacnet.rules'] = ruleSettingsSchema(engine.RULES, engine.formatQuantity);
  writeFileSync(manifestFile, JSON.stringify(manifest, null, 2) + '\n');
  console.log('rule-settings-schema: wrote contributes.configuration.properties["vacnet.rules"] in packages/extension/package.json');
  mkdirSync(new URL('../schemas/', import.meta.url), { recursive: true });
  writeFileSync(new URL(`../${PROJECT_SCHEMA_FILE}`, import.meta.url), JSON.stringify(projectSettingsSchema(engine.RULES, engine.formatQuantity), null, 2) + '\n');
  console.log(`rule-settings-schema: wrote packages/extension/${PROJECT_SCHEMA_FILE}`);
}
