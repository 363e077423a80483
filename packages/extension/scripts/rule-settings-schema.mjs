// The JSON schema of the `vacnet.rules` setting, made from the engine's rule
// table (every code, its default severity, each parameter with its default,
// source and sane range), so the Settings editor offers exactly what the
// language server reads (packages/language/src/engine-bridge/
// workspace-settings.ts) and the two cannot drift apart: the manifest test
// compares package.json with this. `node scripts/rule-settings-schema.mjs`
// (after `npm run build`) writes it into package.json.
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** Severities an editor setting may give; `off` needs a written reason, so only a file can say it. */
const SEVERITIES = ['error', 'warning', 'info'];
const UNIT_EXAMPLE = { velocity: 'fpm', pressure: 'inHg', length: 'ft', angle: 'deg' };

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

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const engine = await import(new URL('../../engine/dist/index.js', import.meta.url).href);
  const manifestFile = new URL('../package.json', import.meta.url);
  const manifest = JSON.parse(readFileSync(manifestFile, 'utf8'));
  manifest.contributes.configuration.properties['vacnet.rules'] = ruleSettingsSchema(engine.RULES, engine.formatQuantity);
  writeFileSync(manifestFile, JSON.stringify(manifest, null, 2) + '\n');
  console.log('rule-settings-schema: wrote contributes.configuration.properties["vacnet.rules"] in packages/extension/package.json');
}
