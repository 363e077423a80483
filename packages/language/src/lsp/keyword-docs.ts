/**
 * What each keyword of the language means, for hovers. A keyword that means
 * different things in different places has an entry per element type (the
 * AST type of the element it stands in), with `default` for the rest.
 *
 * Words about combustible dust and explosion protection defer to the NFPA
 * standards, the authority having jurisdiction and a licensed engineer: the
 * file records a design decision, it does not make one safe.
 */
export type KeywordDoc = string | { default: string; [elementType: string]: string };

const DUST_DEFERS =
  'The dust hazard analysis, the NFPA standards and the authority having jurisdiction govern the design; a licensed engineer designs the protection. The checks here do not replace them.';

export const KEYWORD_DOCS: Readonly<Record<string, KeywordDoc>> = {
  // ----------------------------------------------------------- files and catalogs
  use: 'Makes the names another .vacnet file defines (pipe specs, hoses, tools, equipment models) usable here. The path is relative to this file.',
  system: 'One central vacuum system: site, design basis, plant, piping, inlets and scenarios. One per file.',
  spec: {
    default: 'A pipe spec: material, how nominal sizes map to inside diameters (a steel schedule, a tubing wall, or the nominal size is the bore), roughness, and whether the pipe conducts.',
    SpecRef: 'The pipe spec this pipe is made of: its schedule or wall turns the nominal `size` into an inside diameter, and it gives the roughness.',
  },
  material: 'The pipe material, a plain word (steel, pvc, copper...). It informs the reader; the roughness and the schedule or wall do the work.',
  schedule: 'The ASME B36.10M wall schedule of a steel pipe spec (5, 10, 40, 80): with the nominal size it gives the inside diameter.',
  sizes: 'The nominal sizes this spec is made in, used when a size is suggested.',
  wall: 'The wall thickness of tubing whose nominal size is its outside diameter: the bore is the size less twice the wall.',
  roughness: 'The absolute roughness of the bore (45 um for commercial steel), used for the friction factor.',
  conductive: 'The pipe or hose conducts electricity, so it can be bonded and grounded against static: it matters where the dust is combustible.',
  nonconductive: 'The pipe or hose does not conduct electricity and cannot be bonded; where the dust is combustible this is flagged.',
  hose: {
    default: 'A hose kind: its length, its bore, and a roughness or one measured loss point.',
    HoseRef: 'The hose an operator uses at this inlet (on `defaults`: at every inlet that names none).',
  },
  tool: {
    default: 'A tool kind: how it passes air when working on the surface and when lifted off it, and the vacuum it needs at the hose end.',
    ToolRef: 'The cleaning tool used at this inlet (on `defaults`: at every inlet that names none).',
  },
  working: {
    default: 'The tool on the surface being cleaned: the design state for vacuum and for carrying debris.',
    Opening: 'The inlet is open with its tool working on the surface (the default).',
  },
  lifted: {
    default: 'The tool lifted off the surface and open to the room: the state that draws the most air.',
    Opening: 'The inlet is open with its tool lifted off the surface: it draws the most air.',
  },
  orifice: 'The tool as an equivalent sharp-edged orifice of this diameter, with an optional discharge coefficient `cd`.',
  cd: 'The discharge coefficient of the equivalent orifice, a plain number; 0.61 (a sharp-edged orifice) when not given.',
  curve: 'Measured points, one `at` line each: flow, then vacuum (then shaft power, for a producer).',
  needs: 'The vacuum the tool needs at the hose end to clean well; an inlet that cannot give it is flagged.',
  producer: {
    default: 'A producer (exhauster) model: its performance curve, an efficiency or a power column, and an optional relief set point.',
    ProducerUnit: 'The producer in this plant, by model, with an optional exhaust line loss.',
  },
  efficiency: 'The producer\'s overall efficiency, for its shaft power where the curve has no power column.',
  relief: 'The vacuum at which the producer\'s relief valve opens and bleeds room air in, capping the vacuum.',
  separator: {
    default: 'A separator model with its rated loss: `separator cyclone-24 loss 2 inH2O at 300 scfm`.',
    SeparatorUnit: 'The separator in this plant, by model; where it stands, and whether it has explosion protection.',
  },
  filter: {
    default: 'A filter model with its rated losses clean and loaded.',
    FilterUnit: 'A filter in this plant, by model.',
  },
  loss: 'A rated pressure loss at a stated flow (`loss 2 inH2O at 300 scfm`), scaled with the square of the flow at other flows.',
  clean: 'The filter\'s rated loss when clean, at a stated flow.',
  loaded: 'The filter\'s rated loss when loaded with dust, at a stated flow: the design uses this one.',
  at: {
    default: 'The flow at which the loss was rated.',
    CurvePoint: 'One measured point: flow, then vacuum, then (for a producer) shaft power.',
    InletAtPoint: 'The point where it sits: the plant, or the far end of a pipe.',
    InletOnPipe: 'The distance along the pipe from its `from` end.',
  },
  // -------------------------------------------------------------------- plant
  plant: 'The plant room equipment, listed from the producer toward the network. Pipes start from the plant by its name.',
  exhaust: 'The loss of the producer\'s exhaust line at a stated flow: `exhaust 1 inH2O at 250 scfm`.',
  indoors: 'The separator stands inside the building. With combustible dust this is checked: ' + DUST_DEFERS,
  outdoors: 'The separator stands outside the building.',
  protected: 'The separator has the explosion protection (venting, suppression or isolation) the dust hazard analysis calls for. The file only records it: ' + DUST_DEFERS,
  // -------------------------------------------------------------- site, basis
  site: 'Site air: elevation (or ambient pressure) and air temperature.',
  elevation: 'The site elevation above sea level; it sets the ambient pressure (standard atmosphere) when no `pressure` is given.',
  pressure: 'The ambient absolute pressure at the site, given instead of an elevation.',
  temperature: 'The air temperature in the piping.',
  units: 'The units results are shown in: `imperial` (inHg, scfm, fpm) or `si` (kPa, m3/h, m/s). Values in the file may use either.',
  imperial: 'Results in inches of mercury, cubic feet per minute and feet per minute.',
  si: 'Results in kilopascals, cubic metres per hour and metres per second.',
  operators: 'Simultaneous design operators: how many inlets are in use at once in the worst case.',
  area: 'A floor area to clean, by surface, with an optional hourly rate per operator; with the cleaning window it gives the operator count.',
  rate: 'The floor area one operator cleans in an hour on this surface.',
  carpet: 'Carpeted floor.',
  'small-rooms': 'Small rooms (offices, bedrooms), where cleaning goes slower.',
  bare: 'Bare hard floor.',
  'open-bare': 'Large open bare floor (halls, warehouses).',
  window: 'The time in which the areas must be cleaned; with the areas it gives the operator count.',
  debris: 'What the system carries: it sets the carrying velocity the pipes must keep with one operator (ACGIH material groups).',
  fine: 'Light fine dust (office dust, lint, paper): the lowest carrying velocity.',
  dry: 'Dry dust and light granular material.',
  general: 'General building and industrial debris.',
  heavy: 'Heavy material (shot, sand, chips, turnings): a high carrying velocity.',
  moist: 'Moist or sticky material: the highest carrying velocity.',
  dust: 'The dust hazard: `ordinary`, `combustible` or `metal`; `bonded` declares every conductive part bonded and grounded.',
  ordinary: 'Dust that is not combustible.',
  combustible: 'Combustible dust: it can burn and explode. ' + DUST_DEFERS,
  metal: 'Combustible metal dust (aluminium, magnesium...), the most severe case: NFPA 484 (now within NFPA 660) applies. ' + DUST_DEFERS,
  bonded: 'Declares every conductive part bonded and grounded against static discharge (see NFPA 77). ' + DUST_DEFERS,
  margin: 'The producer margin required over the design demand.',
  'test-orifice': 'The orifice used for commissioning readings at the inlets.',
  defaults: 'The hose, tool and tool vacuum for inlets that name none.',
  // -------------------------------------------------------------------- rules
  rule: 'A system-wide setting of a design rule: a threshold, a severity, or `off` with a reason.',
  severity: 'How the rule\'s findings are reported: `error`, `warning` or `info`.',
  error: 'Report the rule\'s findings as errors: the design does not pass.',
  warning: 'Report the rule\'s findings as warnings.',
  info: 'Report the rule\'s findings as information only.',
  off: 'Turns the rule off for the whole system; say why with `because`.',
  because: 'The written reason for turning a rule off or accepting a finding, kept with the design for review.',
  threshold: 'A rule threshold for this element only: `threshold slow-carrying-velocity min-velocity 3500 fpm`.',
  accept: 'Accepts a known finding of a rule on this element, with a written reason after `because`.',
  // ------------------------------------------------------------------- piping
  pipe: 'A pipe, written from the producer side outward: from an existing point to a new point (`to`) or into an existing one (`into`).',
  from: 'The existing point this pipe starts from, on the producer side: the plant, or the far end of another pipe.',
  to: 'Names the new point at this pipe\'s far end; later pipes, inlets and cleanouts refer to it.',
  into: 'Ends this pipe at an existing point, closing a loop.',
  horizontal: 'The pipe runs level from its `from` end to its far end.',
  up: 'The far end is higher than the `from` end; written from the producer outward, so air flows down this pipe.',
  down: 'The far end is lower than the `from` end; written from the producer outward, so air flows up this pipe and lifts the debris.',
  size: 'The nominal pipe size; the spec\'s schedule or wall gives the inside diameter.',
  bore: 'An inside diameter: a hose\'s bore, or a pipe\'s actual inside diameter given instead of a nominal size.',
  length: {
    default: 'A length.',
    Pipe: 'The pipe\'s length from its `from` end to its far end, along the pipe; bends and entries are counted as fittings.',
    HoseKind: 'The hose length.',
  },
  bend: 'Bends on this pipe, by angle and radius: `bend 90 deg radius 1.5 D`, `bend 2 x 45 deg`.',
  x: 'A count of identical bends: `bend 2 x 45 deg`.',
  radius: 'The centre-line radius of the bend, as a length or in pipe diameters (`1.5 D`).',
  reducer: 'A reducer at the pipe\'s producer-side end, with an optional included angle.',
  joins: 'How this pipe joins the pipe it discharges into: a wye at an angle, a tee, or a sweep.',
  wye: 'A wye (lateral) entry at the stated angle: the branch air turns in gently.',
  tee: 'A straight tee entry at 90 deg: the branch air meets the main head-on, with the highest loss of the three.',
  sweep: 'A sweep (long-radius) tee entry.',
  inlet: 'An inlet valve where an operator plugs in a hose: at a point, or on a pipe at a distance from its `from` end.',
  on: 'The pipe it sits on; `at` gives the distance from the pipe\'s `from` end.',
  room: 'The room or area the inlet covers: a label for people.',
  public: 'The inlet is in a public area, where it should have a locking cover.',
  locked: 'The inlet has a locking cover.',
  cleanout: 'A cleanout (an access for rodding out a blockage) at a point, or on a pipe at a distance from its `from` end.',
  scenario: 'A named set of inlets open at once, each working (the default) or lifted; it is checked exactly as written.',
  open: 'The inlets open in this scenario, separated by commas.',
};

/** The text for a keyword standing in an element of the given type, if the language documents it. */
export function keywordDoc(keyword: string, elementType: string): string | undefined {
  const doc = KEYWORD_DOCS[keyword];
  if (doc === undefined) return undefined;
  if (typeof doc === 'string') return doc;
  return doc[elementType] ?? doc.default;
}
