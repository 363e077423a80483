import { AstUtils, type AstNode, type ValidationAcceptor, type ValidationChecks } from 'langium';
import type {
  Accept,
  Document,
  Inlet,
  Cleanout,
  Pipe,
  Quantity,
  RuleLine,
  System,
  Use,
  VacnetAstType,
} from '../generated/ast.js';
import { isMeasure, isPlant, isProducerUnit } from '../generated/ast.js';
import type { VacnetServices } from '../vacnet-module.js';
import { expectationFor } from '../semantics/quantity-expectations.js';
import { readQuantity } from '../semantics/read-quantity.js';
import { StructureCodes } from './codes.js';
import { ELEMENT_SHAPES, propertyKey, propertyWord } from './element-properties.js';
import { checkCurve } from './curve-checks.js';
import { checkRuleReference } from './rule-reference-checks.js';
import { checkSystemGraph } from './graph-checks.js';
import { usedUris, unquote } from '../references/use-paths.js';

/** Registers the checks the language makes on a file before any airflow is computed. */
export function registerValidationChecks(services: VacnetServices): void {
  const registry = services.validation.ValidationRegistry;
  const validator = services.validation.VacnetValidator;
  validator.bind(services);
  const checks: ValidationChecks<VacnetAstType> = {
    Document: [validator.checkOneSystem, validator.checkDuplicateDefinitions],
    Use: validator.checkUse,
    Quantity: validator.checkQuantity,
    PipeSpec: validator.checkProperties,
    HoseKind: validator.checkProperties,
    ToolKind: validator.checkProperties,
    ProducerModel: validator.checkProperties,
    SeparatorModel: validator.checkProperties,
    FilterModel: validator.checkProperties,
    Site: validator.checkProperties,
    Defaults: validator.checkProperties,
    Pipe: [validator.checkProperties, validator.checkPipeEnds],
    Inlet: [validator.checkProperties, validator.checkPositionOnPipe],
    Cleanout: validator.checkPositionOnPipe,
    Curve: checkCurve,
    Accept: validator.checkAccept,
    RuleLine: validator.checkRuleLine,
    Threshold: checkRuleReference,
    System: [validator.checkSystemNames, validator.checkProducer, validator.checkGraph],
  };
  registry.register(checks, validator);
}

/** Structural checks of a file: names, properties, units, equipment and piping shape. */
export class VacnetValidator {
  private services?: VacnetServices;

  bind(services: VacnetServices): void {
    this.services = services;
  }

  checkOneSystem = (document: Document, accept: ValidationAcceptor): void => {
    for (const extra of document.systems.slice(1)) {
      accept('error', 'A file describes one system; move this one to a file of its own.', {
        node: extra,
        keyword: 'system',
        code: StructureCodes.oneSystemPerFile,
      });
    }
  };

  checkDuplicateDefinitions = (document: Document, accept: ValidationAcceptor): void => {
    reportDuplicates(document.definitions, accept, 'defined');
  };

  checkUse = (use: Use, accept: ValidationAcceptor): void => {
    const documents = this.services?.shared.workspace.LangiumDocuments;
    if (!documents) return;
    const document = AstUtils.getDocument(use);
    const root = document.parseResult.value as Document;
    const index = root.uses.indexOf(use);
    const target = usedUris(root, document.uri).find((_, i) => i === index);
    if (!target || !documents.hasDocument(target)) {
      accept('error', `Cannot find the file '${unquote(use.path ?? '')}' (paths are relative to this file).`, {
        node: use,
        property: 'path',
        code: StructureCodes.useNotFound,
      });
    }
  };

  checkQuantity = (quantity: Quantity, accept: ValidationAcceptor): void => {
    const expectation = expectationFor(quantity);
    if (!expectation) return;
    const reading = readQuantity(quantity, expectation);
    if (reading.ok) return;
    accept('error', reading.message, {
      node: quantity,
      property: reading.onUnit && quantity.unit ? 'unit' : 'value',
      code: reading.code,
    });
  };

  checkProperties = (element: AstNode & { properties?: AstNode[]; measures?: AstNode[]; name?: string }, accept: ValidationAcceptor): void => {
    const shape = ELEMENT_SHAPES[element.$type];
    if (!shape) return;
    const properties = element.properties ?? element.measures ?? [];
    const seen = new Map<string, AstNode>();
    for (const property of properties) {
      const key = propertyKey(property);
      if (!shape.allowed.has(key)) {
        accept('error', `${withArticle(shape.noun)} does not take '${propertyWord(property)}'.`, {
          node: property,
          code: StructureCodes.propertyNotAllowed,
        });
        continue;
      }
      if (seen.has(key) && !shape.repeatable?.has(key)) {
        accept('error', `'${propertyWord(property)}' is given twice on this ${shape.noun}; keep one.`, {
          node: property,
          code: StructureCodes.duplicateProperty,
        });
      }
      seen.set(key, property);
    }
    for (const alternatives of shape.required) {
      if (alternatives.some((key) => seen.has(key)) || this.suppliedElsewhere(element, alternatives)) continue;
      const words = alternatives.map(requiredWord).join(' or ');
      accept('error', `This ${shape.noun} needs ${words}.`, {
        node: element,
        ...(element.name !== undefined ? { property: 'name' } : {}),
        code: StructureCodes.missingProperty,
        data: { missing: alternatives },
      });
    }
  };

  /** Inlets may take their hose and tool from the system's defaults line. */
  private suppliedElsewhere(element: AstNode, keys: readonly string[]): boolean {
    if (element.$type !== 'Inlet') return false;
    const system = AstUtils.getContainerOfType(element, (n): n is System => n.$type === 'System');
    return (
      system?.members.some(
        (member) => member.$type === 'Defaults' && member.properties.some((p) => keys.includes(propertyKey(p))),
      ) ?? false
    );
  }

  checkPipeEnds = (pipe: Pipe, accept: ValidationAcceptor): void => {
    const fromName = pipe.from?.$refText;
    const toName = pipe.to?.name ?? pipe.into?.$refText;
    if (fromName && toName && fromName === toName) {
      accept('error', `Pipe '${pipe.name}' runs from '${fromName}' to itself; a pipe joins two different points.`, {
        node: pipe,
        property: pipe.to ? 'to' : 'into',
        code: StructureCodes.selfLoop,
      });
    }
  };

  checkPositionOnPipe = (element: Inlet | Cleanout, accept: ValidationAcceptor): void => {
    const pipe = element.pipe?.ref;
    if (!pipe || !element.distance) return;
    const lengthMeasure = pipe.properties.find((p) => isMeasure(p) && p.key === 'length');
    if (!lengthMeasure || !isMeasure(lengthMeasure) || !lengthMeasure.value) return;
    const length = readQuantity(lengthMeasure.value, expectationFor(lengthMeasure.value)!);
    const distance = readQuantity(element.distance, expectationFor(element.distance)!);
    if (length.ok && distance.ok && distance.si > length.si) {
      accept('error', `This position is beyond the end of pipe '${pipe.name}' (its length is ${lengthMeasure.value.value} ${lengthMeasure.value.unit ?? ''}).`.replace(' )', ')'), {
        node: element,
        property: 'distance',
        code: StructureCodes.inletBeyondPipe,
      });
    }
  };

  checkAccept = (accepted: Accept, accept: ValidationAcceptor): void => {
    checkRuleReference(accepted, accept);
    // Without its code (cut mid-edit) the line is the parser's syntax error already.
    if (accepted.rule && (!accepted.reason || unquote(accepted.reason).trim() === '')) {
      accept('error', `Accepting '${accepted.rule}' needs a written reason: accept ${accepted.rule} because "...".`, {
        node: accepted,
        code: StructureCodes.suppressionWithoutReason,
        data: { rule: accepted.rule },
      });
    }
  };

  checkRuleLine = (line: RuleLine, accept: ValidationAcceptor): void => {
    checkRuleReference(line, accept);
    if (line.rule && line.off && (!line.reason || unquote(line.reason).trim() === '')) {
      accept('error', `Turning '${line.rule}' off needs a written reason: rule ${line.rule} off because "...".`, {
        node: line,
        keyword: 'off',
        code: StructureCodes.suppressionWithoutReason,
        data: { rule: line.rule },
      });
    }
  };

  checkSystemNames = (system: System, accept: ValidationAcceptor): void => {
    const named: AstNode[] = [];
    for (const member of system.members) {
      if ('name' in member && member.name) named.push(member);
      if (member.$type === 'Pipe' && member.to) named.push(member.to);
    }
    reportDuplicates(named, accept, 'used');
  };

  checkProducer = (system: System, accept: ValidationAcceptor): void => {
    const hasProducer = system.members.some((m) => isPlant(m) && m.equipment.some(isProducerUnit));
    if (!hasProducer) {
      accept('error', 'This system has no producer: add a plant with a producer, e.g. `plant room-1 { producer exh-7 }`.', {
        node: system,
        property: 'title',
        code: StructureCodes.noProducer,
      });
    }
  };

  checkGraph = (system: System, accept: ValidationAcceptor): void => {
    checkSystemGraph(system, accept);
  };
}

/** 'A pipe', 'An inlet'. */
function withArticle(noun: string): string {
  return `${/^[aeiou]/i.test(noun) ? 'An' : 'A'} ${noun}`;
}

function requiredWord(key: string): string {
  const words: Record<string, string> = { SpecRef: 'a spec', Curve: 'a curve', HoseRef: 'a hose', ToolRef: 'a tool' };
  return words[key] ?? `'${key}'`;
}

function reportDuplicates(nodes: AstNode[], accept: ValidationAcceptor, verb: string): void {
  const byName = new Map<string, AstNode>();
  for (const node of nodes) {
    const name = (node as AstNode & { name?: string }).name;
    if (!name) continue;
    const first = byName.get(name);
    if (first) {
      accept('error', `The name '${name}' is already ${verb} on line ${(first.$cstNode?.range.start.line ?? 0) + 1}; names must be unique.`, {
        node,
        property: 'name' as never,
        code: StructureCodes.duplicateName,
      });
    } else {
      byName.set(name, node);
    }
  }
}
