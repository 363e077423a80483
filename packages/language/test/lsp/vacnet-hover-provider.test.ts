// Hovers on keywords, quantities, names and rule codes. Unit conversions are
// checked against NIST SP 811 (2008) appendix B: 1 in = 25.4 mm exactly;
// 1 ft = 0.3048 m exactly; 1 inHg (conventional, 32 degF) = 3.386389 kPa;
// 1 ft3/min = 4.719474E-04 m3/s; degC = (degF - 32) / 1.8.
import { EmptyFileSystem, type AstNode } from 'langium';
import { clearDocuments, expectHover, parseHelper } from 'langium/test';
import { beforeEach, describe, expect, it } from 'vitest';
import { shared, Vacnet } from '../helpers.js';
import { createVacnetServices } from '../../src/vacnet-module.js';
import { VacnetHoverProvider } from '../../src/lsp/vacnet-hover-provider.js';
import { KEYWORD_DOCS } from '../../src/lsp/keyword-docs.js';

const hover = expectHover(Vacnet);
const parse = parseHelper(Vacnet);

beforeEach(() => clearDocuments(shared));

async function hoverText(text: string, uri?: string): Promise<string | undefined> {
  const marker = text.indexOf('<|>');
  const clean = text.replace('<|>', '');
  const document = await parse(clean, uri ? { documentUri: uri } : {});
  const result = await Vacnet.lsp.HoverProvider!.getHoverContent(document, {
    textDocument: { uri: document.uri.toString() },
    position: document.textDocument.positionAt(marker),
  });
  const contents = result?.contents as { value?: string } | undefined;
  return contents?.value;
}

const SYSTEM = (body: string) => `system "H" {
  plant pr { }
  pipe main from pr to j-1 size 3 in length 35 ft horizontal
${body}
}`;

describe('hover on a quantity: the other unit system', () => {
  it('shows inches in millimetres and feet in metres (1 in = 25.4 mm, 1 ft = 0.3048 m)', async () => {
    await hover({ text: SYSTEM('  pipe b from j-1 to e size <|>3 in length 10 ft'), index: 0, hover: /^\*\*3 in\*\* = 76\.2 mm\n\nA pipe size\.$/, disposeAfterCheck: true });
    await hover({ text: SYSTEM('  pipe b from j-1 to e size 3 in length 3<|>5 ft'), index: 0, hover: /^\*\*35 ft\*\* = 10\.7 m\n\nA length\.$/, disposeAfterCheck: true });
  });

  it('shows a trade fraction read as one number: 1-1/2 in = 38.1 mm', async () => {
    expect(await hoverText('hose h length 50 ft bore 1-1/<|>2 in roughness 0.3 mm')).toBe('**1-1/2 in** = 38.1 mm\n\nAn inside diameter.');
  });

  it('shows SI pressures in inHg and inHg in kPa (1 inHg = 3.386389 kPa)', async () => {
    // 15 kPa / 3.386389 = 4.4295 inHg; 5 inHg x 3.386389 = 16.93 kPa.
    expect(await hoverText('tool t working orifice 7/8 in needs 15 k<|>Pa')).toBe('**15 kPa** = 4.43 inHg\n\nA tool vacuum.');
    expect(await hoverText('tool t working orifice 7/8 in needs <|>5 inHg')).toBe('**5 inHg** = 16.9 kPa\n\nA tool vacuum.');
  });

  it('keeps the flow basis: actual m3/h to acfm, standard scfm to Sm3/h (1 cfm = 4.719474E-04 m3/s)', async () => {
    // 250 m3/h = 0.069444 m3/s = 147.1 cfm; 300 scfm = 509.7 Sm3/h.
    expect(await hoverText('separator s loss 2 inH2O at 250 m<|>3/h')).toBe('**250 m3/h** = 147 acfm\n\nAn air flow.');
    expect(await hoverText('separator s loss 2 inH2O at 300 sc<|>fm')).toBe('**300 scfm** = 510 Sm3/h (standard air)\n\nAn air flow.');
  });

  it('converts a temperature with its offset: 68 degF = 20 degC', async () => {
    expect(await hoverText(SYSTEM('  site temperature 6<|>8 degF'))).toBe('**68 degF** = 20.0 degC\n\nAn air temperature.');
  });

  it('explains a radius in pipe diameters, an angle, a plain number and a bad unit without converting', async () => {
    expect(await hoverText(SYSTEM('  pipe b from j-1 to e size 3 in length 10 ft bend 90 deg radius 1.<|>5 D'))).toBe('**1.5 D**\n\nA bend radius of 1.5 pipe diameters.');
    expect(await hoverText(SYSTEM('  pipe b from j-1 to e size 3 in length 10 ft bend 9<|>0 deg'))).toBe('**90 deg**\n\nA bend angle.');
    expect(await hoverText('tool t working orifice 7/8 in cd 0.6<|>1')).toBe('**0.61**\n\nA discharge coefficient: a plain number.');
    expect(await hoverText('hose h length 50 fur<|>longs')).toMatch(/^\*\*50 furlongs\*\*\n\nA length\. Unknown unit 'furlongs'/);
  });
});

describe('hover on a keyword: what it means', () => {
  it('says which way air flows in a pipe written `up`', async () => {
    expect(await hoverText(SYSTEM('  pipe b from j-1 to e size 3 in length 10 ft u<|>p'))).toBe(
      '**up**\n\nThe far end is higher than the `from` end; written from the producer outward, so air flows down this pipe.',
    );
  });

  it('tells `at` a point from `at` a distance on a pipe', async () => {
    expect(await hoverText(SYSTEM('  inlet A1 a<|>t j-1'))).toMatch(/The point where it sits/);
    expect(await hoverText(SYSTEM('  inlet A1 on main a<|>t 3 ft'))).toMatch(/distance along the pipe/);
  });

  it('gives a debris class its default carrying velocity from the velocity rule (ACGIH: general 3500 fpm = 17.8 m/s)', async () => {
    const text = await hoverText(SYSTEM('  debris gen<|>eral'));
    expect(text).toMatch(/^\*\*general\*\*\n\nGeneral building and industrial debris\./);
    expect(text).toContain('3500 fpm (17.8 m/s)');
  });

  it('defers to the NFPA standards and a licensed engineer on combustible metal dust', async () => {
    expect(await hoverText(SYSTEM('  dust me<|>tal bonded'))).toMatch(/NFPA 484.*licensed engineer/s);
  });

  it('has a text for every word keyword of the grammar', () => {
    const keywords = new Set<string>();
    const visit = (node: unknown): void => {
      if (!node || typeof node !== 'object') return;
      const n = node as { $type?: string; value?: unknown };
      if (n.$type === 'Keyword' && typeof n.value === 'string' && /\p{L}/u.test(n.value)) keywords.add(n.value);
      for (const [key, child] of Object.entries(node)) {
        if (key.startsWith('$')) continue;
        if (Array.isArray(child)) child.forEach(visit);
        else visit(child);
      }
    };
    Vacnet.Grammar.rules.forEach(visit);
    expect(keywords.size).toBeGreaterThan(80);
    expect([...keywords].filter((k) => KEYWORD_DOCS[k] === undefined)).toEqual([]);
  });
});

describe('hover on a name: where it is declared', () => {
  it('shows the line of the pipe that declares a point', async () => {
    expect(await hoverText(SYSTEM('  inlet A1 at j<|>-1'), 'file:///work/h.vacnet')).toBe(
      '**point** `j-1`, the far end of pipe `main` — h.vacnet line 3\n\n```vacnet\npipe main from pr to j-1 size 3 in length 35 ft horizontal\n```',
    );
  });

  it('shows a catalog item from another file with the comment above it', async () => {
    await parse('// Office hose, the trade\'s usual 50 ft.\nhose std-50 length 50 ft bore 1-1/2 in roughness 0.3 mm\n', { documentUri: 'file:///work/catalog.vacnet' });
    const text = await hoverText('use "catalog.vacnet"\nsystem "H" {\n  defaults hose std<|>-50\n}', 'file:///work/h.vacnet');
    expect(text).toBe(
      "**hose** `std-50` — catalog.vacnet line 2\n\nOffice hose, the trade's usual 50 ft.\n\n```vacnet\nhose std-50 length 50 ft bore 1-1/2 in roughness 0.3 mm\n```",
    );
  });

  it('leaves room for computed values of an element, shown first', async () => {
    class WithValues extends VacnetHoverProvider {
      protected override getElementHoverContent(node: AstNode): string | undefined {
        return node.$type === 'Pipe' ? 'computed: 3,900 fpm' : undefined;
      }
    }
    const { Vacnet: services } = createVacnetServices(EmptyFileSystem);
    const provider = new WithValues(services);
    const text = SYSTEM('  inlet A1 on ma<|>in at 3 ft');
    const document = await parseHelper(services)(text.replace('<|>', ''));
    const result = await provider.getHoverContent(document, {
      textDocument: { uri: document.uri.toString() },
      position: document.textDocument.positionAt(text.indexOf('<|>')),
    });
    expect((result?.contents as { value: string }).value).toMatch(/^computed: 3,900 fpm\n\n\*\*pipe\*\* `main`/);
  });
});

describe('hover on a rule code', () => {
  it('gives the rule\'s title and its parameters with their defaults and sources', async () => {
    const text = await hoverText(SYSTEM('  rule missing-clean<|>out spacing 64 ft'));
    expect(text).toMatch(/^\*\*missing-cleanout\*\*: /);
    // The engine's default cleanout spacing: 100 ft (drainage-code analogy) = 30.5 m.
    expect(text).toMatch(/`spacing`: .* Default 100 ft \(30\.5 m\)/);
  });

  it('says so when no rule has the code', async () => {
    expect(await hoverText(SYSTEM('  rule slow-vel<|>ocity severity info'))).toBe('**slow-velocity**\n\nNo design rule has this code.');
  });
});
