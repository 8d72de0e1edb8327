import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { exampleEvent, exampleProvenance, exampleSolution } from '../../e2e/exports/example-fixture';
import { captionDraft } from './caption';
import { niceStep, PT_PER_MM, renderFitFigureSvg, wrapText } from './figure-svg';

function figure(widthMm = 88, embedFont = true) {
  const solution = exampleSolution();
  const caption = captionDraft('the example event', solution, exampleEvent().fit);
  return renderFitFigureSvg({
    solution,
    caption,
    provenance: exampleProvenance,
    widthMm,
    embedFont,
    sizeUnit: 'mm',
  });
}

/** Every element in document order with its attributes, from a parser that knows nothing of our writer. */
function elements(svg: string): Array<{ name: string; attrs: Record<string, string> }> {
  const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', preserveOrder: true });
  const out: Array<{ name: string; attrs: Record<string, string> }> = [];
  const walk = (nodes: Array<Record<string, unknown>>): void => {
    for (const node of nodes)
      for (const [name, children] of Object.entries(node)) {
        if (name === ':@' || name === '#text' || name === '?xml' || name === '#comment') continue;
        out.push({ name, attrs: (node[':@'] as Record<string, string> | undefined) ?? {} });
        if (Array.isArray(children)) walk(children as Array<Record<string, unknown>>);
      }
  };
  walk(parser.parse(svg) as Array<Record<string, unknown>>);
  return out;
}

describe('renderFitFigureSvg', () => {
  it('renderFitFigureSvg() writes well-formed XML with one element per chord, named by station', () => {
    const { svg } = figure();
    expect(XMLValidator.validate(svg)).toBe(true);
    const chords = elements(svg).filter((e) => e.attrs['data-chord'] !== undefined);
    expect(chords.map((e) => e.attrs['data-chord'])).toEqual(exampleSolution().chords.map((c) => c.station));
    const negatives = chords.filter((e) => e.attrs['data-type'] === 'negative').length;
    expect(negatives).toBe(exampleSolution().chords.filter((c) => c.type === 'negative').length);
    expect(negatives).toBeGreaterThan(0);
  });

  it('renderFitFigureSvg() draws the limb, rings, centre, compass, scale bar, legend and axis labels with units', () => {
    const { svg } = figure();
    const roles = new Set(elements(svg).map((e) => e.attrs['data-role']));
    for (const role of ['limb', 'centre', 'compass', 'scale-bar', 'legend', 'axes', 'caption', 'provenance'])
      expect(roles.has(role), role).toBe(true);
    expect(elements(svg).filter((e) => e.attrs['data-ring'] !== undefined)).toHaveLength(
      exampleSolution().rings.length,
    );
    expect(svg).toContain('>f (km)</text>');
    expect(svg).toContain('>g (km)</text>');
    expect(svg).toMatch(/>\d+ km<\/text>/);
  });

  it('renderFitFigureSvg() puts +f (east) to the left: the endpoint with the larger f has the smaller x', () => {
    const { svg } = figure();
    const chord = exampleSolution().chords.find((c) => c.type === 'positive');
    if (chord === undefined) throw new Error('example has no positive chord');
    const station = chord.station;
    const start = svg.indexOf(`data-chord="${station}"`);
    const group = svg.slice(start, svg.indexOf('</g>', start));
    const cx = [...group.matchAll(/<circle cx="([-\d.]+)"/g)].map((m) => Number(m[1]));
    const [p, q] = chord.points;
    if (p === undefined || q === undefined || cx.length !== 2) throw new Error('chord without two endpoints');
    expect(Math.sign((cx[1] as number) - (cx[0] as number))).toBe(-Math.sign(q.fKm - p.fKm));
  });

  it('renderFitFigureSvg() sizes the figure in millimetres at the asked width and embeds Lato as WOFF2', () => {
    const single = figure(88);
    const double = figure(180);
    expect(single.svg).toContain('width="88mm"');
    expect(double.svg).toContain('width="180mm"');
    expect(single.widthPt).toBeCloseTo(88 * PT_PER_MM, 9);
    expect(single.svg).toMatch(
      /@font-face\{font-family:'Lato';font-weight:400;src:url\(data:font\/woff2;base64,d09GMg/,
    );
    expect(figure(88, false).svg).not.toContain('@font-face');
  });

  it('renderFitFigureSvg() carries the provenance in metadata, a comment and a visible footer', () => {
    const { svg } = figure();
    const meta = elements(svg).find((e) => e.name === 'limbus:provenance');
    expect(meta?.attrs).toMatchObject({
      fitId: exampleProvenance.fitId,
      inputSha256: exampleProvenance.inputSha256,
      engineVersion: '0.1.0',
      seed: '1',
      date: exampleProvenance.date,
      approvalState: 'approved',
    });
    expect(svg.slice(0, svg.indexOf('<svg'))).toContain(`fit ${exampleProvenance.fitId}`);
    const footer = svg.slice(svg.indexOf('data-role="provenance"'));
    expect(footer).toContain(exampleProvenance.fitId);
  });

  it('renderFitFigureSvg() escapes a station name that is markup', () => {
    const solution = structuredClone(exampleSolution());
    const first = solution.chords[0];
    if (first === undefined) throw new Error('example has no chords');
    first.station = '<b>"A&B"</b>';
    const { svg } = renderFitFigureSvg({
      solution,
      caption: 'c',
      provenance: exampleProvenance,
      widthMm: 88,
      embedFont: false,
      sizeUnit: 'pt',
    });
    expect(XMLValidator.validate(svg)).toBe(true);
    expect(elements(svg).find((e) => e.attrs['data-chord'] !== undefined)?.attrs['data-chord']).toBe(
      '<b>"A&B"</b>',
    );
  });
});

describe('niceStep', () => {
  it('niceStep() rounds to 1, 2 or 5 times a power of ten', () => {
    expect([0.9, 1.4, 1.6, 3.4, 3.6, 7.4, 7.6, 230, 0.031].map(niceStep)).toEqual([
      1, 1, 2, 2, 5, 5, 10, 200, 0.02,
    ]);
  });
});

describe('wrapText', () => {
  it('wrapText() keeps every word, in order, within the line length', () => {
    const text = 'one two three four five six seven eight nine ten eleven twelve';
    const lines = wrapText(text, 47, 10);
    expect(lines.join(' ')).toBe(text);
    for (const l of lines) expect(l.length).toBeLessThanOrEqual(10);
  });
});
