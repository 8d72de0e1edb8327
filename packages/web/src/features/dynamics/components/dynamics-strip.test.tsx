import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { DynamicsStrip } from './dynamics-strip';
import { stripExtentKm, stripMarks } from './strip-marks';
import { TEST_CONTEXT, TEST_RING_FIT } from './test-context';
import { renderWithProviders } from '@/testing/test-utils';

const INNER_WIDTH_PX = 760 - 24 - 24;

describe('DynamicsStrip', () => {
  it('stripExtentKm() reaches a quarter beyond the outermost ring, Roche limit or synchronous orbit', () => {
    const marks = stripMarks(TEST_CONTEXT, 560, [TEST_RING_FIT]);
    // The ring's outer 1σ edge, 2030 + 40 km, is the outermost anchor: 1.25 × 2070 = 2587.5 km.
    expect(stripExtentKm(marks)).toBeCloseTo(2587.5, 9);
  });

  it('DynamicsStrip places each radius on one linear axis with its 1σ bar and the ring ± 1σ', () => {
    renderWithProviders(
      <DynamicsStrip result={TEST_CONTEXT} bodyRadiusKm={560} ringFits={[TEST_RING_FIT]} />,
    );
    const svg = screen.getByRole('img', { name: /^Dynamics strip: Roche fluid 1689 km, rigid 872 km/ });
    const pxPerKm = INNER_WIDTH_PX / 2587.5;
    const at = (key: string) => Number(svg.querySelector(`[data-mark="${key}"] circle`)?.getAttribute('cx'));
    expect(at('roche-fluid')).toBeCloseTo(1688.9 * pxPerKm, 6);
    expect(at('roche-rigid')).toBeCloseTo(872.4 * pxPerKm, 6);
    expect(at('synchronous')).toBeCloseTo(1400 * pxPerKm, 6);
    expect(at('ring-R1')).toBeCloseTo(2030 * pxPerKm, 6);
    const bar = svg.querySelector('[data-mark="ring-R1"] line.sigma-bar');
    expect(Number(bar?.getAttribute('x2')) - Number(bar?.getAttribute('x1'))).toBeCloseTo(80 * pxPerKm, 6);
    const roche = svg.querySelector('[data-mark="roche-fluid"] line.sigma-bar');
    expect(Number(roche?.getAttribute('x2')) - Number(roche?.getAttribute('x1'))).toBeCloseTo(
      140 * pxPerKm,
      6,
    );
    expect(Number(svg.querySelector('rect.body')?.getAttribute('width'))).toBeCloseTo(560 * pxPerKm, 6);
    expect(svg.querySelector('[data-mark="spin-orbit-2"]')).not.toBeNull();
    // The 1:3 spin–orbit radius (2912 km) and both resonances with Oru lie beyond 2587.5 km.
    expect(svg.querySelector('[data-mark="spin-orbit-3"]')).toBeNull();
    expect(svg.getAttribute('aria-label')).toContain(
      'beyond the strip: 1:3 spin–orbit, 3:1 with Oru, 2:1 with Oru',
    );
    expect(svg.getAttribute('aria-label')).toContain('ring R1 at 2030 ± 40 km, 1.20 fluid Roche limits');
    expect([...svg.querySelectorAll('text')].map((t) => t.textContent)).toContain(
      'Distance from the body centre (km)',
    );
  });
});
