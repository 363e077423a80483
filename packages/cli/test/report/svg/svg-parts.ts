/** Small readers of the SVG the report writes, for tests: elements by class, their attributes and text. */
export interface SvgElement {
  tag: string;
  attributes: Record<string, string>;
  /** For <text> and <g>: the text inside, tags removed. */
  text: string;
}

/** Every element whose class list holds `className` (self-closing or with content up to its first closing tag). */
export function elementsWithClass(svg: string, className: string): SvgElement[] {
  const out: SvgElement[] = [];
  const open = /<([a-z]+)\b([^>]*?)(\/?)>/g;
  let m: RegExpExecArray | null;
  while ((m = open.exec(svg))) {
    const attributes = parseAttributes(m[2]!);
    if (!(attributes.class ?? '').split(/\s+/).includes(className)) continue;
    let text = '';
    if (m[3] !== '/') {
      const close = svg.indexOf(m[1] === 'g' ? '</g>' : `</${m[1]}>`, open.lastIndex);
      text = svg.slice(open.lastIndex, close === -1 ? undefined : close);
    }
    out.push({ tag: m[1]!, attributes, text: decode(text.replace(/<title>[\s\S]*?<\/title>/g, '').replace(/<[^>]+>/g, '\n')).split('\n').map((s) => s.trim()).filter(Boolean).join('\n') });
  }
  return out;
}

function parseAttributes(text: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const m of text.matchAll(/([a-zA-Z][a-zA-Z0-9:-]*)="([^"]*)"/g)) out[m[1]!] = decode(m[2]!);
  return out;
}

function decode(text: string): string {
  return text.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&');
}

/** The vertices of a path made of M and L commands. */
export function pathPoints(d: string): { x: number; y: number }[] {
  return [...d.matchAll(/[ML]\s*(-?[\d.]+)[ ,](-?[\d.]+)/g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]) }));
}

/** A straight map from pixels to values through two ticks: value = a + b px. */
export function axisMap(ticks: SvgElement[], coordinate: 'x' | 'y'): (px: number) => number {
  const first = ticks[0]!;
  const last = ticks[ticks.length - 1]!;
  // y ticks are drawn 3.5 px below their line so the text centres on it.
  const at = (t: SvgElement) => Number(t.attributes[coordinate]) - (coordinate === 'y' ? 3.5 : 0);
  const b = (Number(last.attributes['data-value']) - Number(first.attributes['data-value'])) / (at(last) - at(first));
  return (px) => Number(first.attributes['data-value']) + b * (px - at(first));
}
