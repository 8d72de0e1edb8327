import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { exampleEvent, exampleProvenance, exampleSolution } from '../../e2e/exports/example-fixture';
import { comparisonFit } from '../comparisons/comparison-view';
import type { JointPoleDocument } from '../comparisons/joint-pole';
import { comparisonCaptionDraft, renderComparisonFigureSvg } from './comparison-figure-svg';

function twoFits() {
  const a = comparisonFit(
    { id: 'fit-a', reviewState: 'approved', finishedAt: null, createdBy: { id: 'u1', name: 'A. Modeller' } },
    { id: 'ev-a', title: 'Event A' },
    exampleEvent(),
    exampleSolution(),
    true,
  );
  const noLimb = { ...exampleSolution(), limb: null };
  const b = comparisonFit(
    { id: 'fit-b', reviewState: 'none', finishedAt: null, createdBy: { id: 'u1', name: 'A. Modeller' } },
    { id: 'ev-b', title: 'Event <B>' },
    exampleEvent(),
    noLimb,
    true,
  );
  return [a, b];
}

// Invented joint result; the figure only draws it.
const JOINT: JointPoleDocument = {
  format: 'limbus-joint/1',
  ring: 'R1',
  pole: { raDeg: 41, decDeg: 27 },
  uncertainty: { raDeg: 0.5, decDeg: 0.4, correlation: 0 },
  radiusKm: 1080,
  radiusSigmaKm: 1,
  chi2: 30,
  dof: 35,
  reducedChi2: 30 / 35,
  sigmaScale: 1,
  familyDeltaChi2: 270,
  notes: [],
  events: [],
  ambiguityResolved: true,
  alternativePole: { raDeg: 345, decDeg: 8, chi2: 300 },
};

function render(widthMm: number, joint: JointPoleDocument | null) {
  const fits = twoFits();
  return renderComparisonFigureSvg({
    fits,
    ring: 'R1',
    joint,
    caption: comparisonCaptionDraft('Team', 'all', fits, 'R1', joint),
    provenance: [exampleProvenance, { ...exampleProvenance, fitId: 'fit-b', approvalState: 'none' }],
    widthMm,
    embedFont: true,
    sizeUnit: 'mm',
  });
}

describe('renderComparisonFigureSvg', () => {
  it('renderComparisonFigureSvg() draws each limb and ring centred, both poles of each event, and the joint pole', () => {
    const { svg } = render(180, JOINT);
    expect(XMLValidator.validate(svg)).toBe(true);
    expect(svg.match(/data-shape="limb"/g)).toHaveLength(1);
    expect(svg.match(/data-shape="ring R1"/g)).toHaveLength(2);
    expect(svg.match(/data-pole="/g)).toHaveLength(4);
    expect(svg).toContain('data-role="joint-pole"');
    expect(svg).toContain('Event &lt;B&gt; (not approved)');
    expect(svg).toContain('width="180mm"');
  });

  it('renderComparisonFigureSvg() carries the provenance of every fit', () => {
    const { svg } = render(88, null);
    const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '' }).parse(svg) as {
      svg: { metadata: { 'limbus:fits': { 'limbus:provenance': Array<Record<string, string>> } } };
    };
    expect(doc.svg.metadata['limbus:fits']['limbus:provenance'].map((p) => p.fitId)).toEqual([
      exampleProvenance.fitId,
      'fit-b',
    ]);
    expect(svg).not.toContain('data-role="joint-pole"');
  });

  it('renderComparisonFigureSvg() stacks the panels in one column and sets them side by side in two', () => {
    const panelY = (svg: string) =>
      [...svg.matchAll(/<rect x="[\d.]+" y="([\d.]+)" width="([\d.]+)" height="\2" fill="none"/g)].map((m) =>
        Number(m[1]),
      );
    const [a1, a2] = panelY(render(88, null).svg);
    const [b1, b2] = panelY(render(180, null).svg);
    expect(a2).toBeGreaterThan(a1 as number);
    expect(b2).toBe(b1);
  });
});

describe('comparisonCaptionDraft', () => {
  it('comparisonCaptionDraft() says which fits were used and whether the pole ambiguity is resolved', () => {
    const fits = twoFits();
    expect(comparisonCaptionDraft('Team', 'approved', fits, 'R1', JOINT)).toContain('approved fits only');
    expect(comparisonCaptionDraft('Team', 'all', fits, 'R1', JOINT)).toContain(
      'other pole family is ruled out',
    );
    expect(
      comparisonCaptionDraft('Team', 'all', fits, 'R1', { ...JOINT, ambiguityResolved: false }),
    ).toContain('both pole families remain');
  });
});
