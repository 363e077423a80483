// Child process of the `parse` benchmark group: loads one generated system
// on fresh language services and prints, as JSON, the heap used with it
// loaded and the heap it adds, after full collections. A process of its own
// so nothing from earlier runs is counted.
//
//   node --expose-gc bench/hold-system.mjs <inlets>
import { EmptyFileSystem, URI } from 'langium';
import { createVacnetServices } from '@vacnet/language';
import { generateSystem } from './generate-system.mjs';

const inlets = Number(process.argv[2] ?? 5000);
if (typeof globalThis.gc !== 'function') throw new Error('run with --expose-gc');
const { shared } = createVacnetServices(EmptyFileSystem);
const documents = shared.workspace.LangiumDocuments;
const builder = shared.workspace.DocumentBuilder;
const text = generateSystem(inlets).text;

// A small system first, so code and caches that any system needs are in the baseline.
const warm = documents.createDocument(URI.parse('memory:///bench/warm.vacnet'), generateSystem(10).text);
await builder.build([warm], { validation: true });
globalThis.gc();
const before = process.memoryUsage().heapUsed;

const held = documents.createDocument(URI.parse('memory:///bench/held.vacnet'), text);
await builder.build([held], { validation: true });
globalThis.gc();
const after = process.memoryUsage().heapUsed;

const errors = (held.diagnostics ?? []).filter((d) => d.severity === 1).length;
process.stdout.write(JSON.stringify({ inlets, heapUsedMB: after / 2 ** 20, documentMB: (after - before) / 2 ** 20, errors }) + '\n');
