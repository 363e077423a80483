import { Uri, window, workspace, type ExtensionContext } from 'vscode';
import { inlineCatalog } from './inline-catalog.js';

/** The examples the extension ships (examples/ in the package), with what each shows. */
const EXAMPLES = [
  { file: 'detached-house.vacnet', label: 'Detached house', detail: 'One operator, a residential power unit, 2 in tubing through three floors.' },
  { file: 'primary-school.vacnet', label: 'Primary school', detail: 'Three operators on two corridor wings, a multistage exhauster.' },
  { file: 'harbour-offices.vacnet', label: 'Harbour offices', detail: 'Five floors over a basement, two risers, three operators.' },
  { file: 'grinding-plant.vacnet', label: 'Grinding plant', detail: 'Heavy debris and combustible metal dust: the cautions that come with it.' },
];
const CATALOG = 'catalog/equipment.vacnet';

/**
 * Opens an example system as a new untitled document, its catalog written
 * into it, so it works anywhere (no folder needed) and editing it changes
 * nothing on disk.
 */
export async function openExample(context: ExtensionContext): Promise<void> {
  const picked = await window.showQuickPick(
    EXAMPLES.map((example) => ({ ...example, description: example.file })),
    { placeHolder: 'Open which example system?' },
  );
  if (!picked) return;
  const folder = Uri.joinPath(context.extensionUri, 'examples');
  const read = async (path: string) => new TextDecoder().decode(await workspace.fs.readFile(Uri.joinPath(folder, ...path.split('/'))));
  const content = inlineCatalog(await read(picked.file), CATALOG, await read(CATALOG));
  const document = await workspace.openTextDocument({ language: 'vacnet', content });
  await window.showTextDocument(document);
}
