import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { fixtureEvent } from '../fixtures/solution-fixture';
import { ResidualsPlot, residualPoints } from './residuals-plot';
import { renderWithProviders } from '@/testing/test-utils';

describe('ResidualsPlot', () => {
  it('residualPoints() pairs each residual with the sigma of its endpoint', () => {
    const points = residualPoints(fixtureEvent.solution);
    expect(points).toHaveLength(10);
    const chord = fixtureEvent.solution.chords[0];
    expect(points[0]).toMatchObject({
      station: chord?.station,
      event: 'disappearance',
      sigmaKm: chord?.points[0]?.sigmaKm,
    });
  });

  it('ResidualsPlot draws one mark with an error bar per endpoint, D and R by shape', () => {
    renderWithProviders(<ResidualsPlot solution={fixtureEvent.solution} />);
    const svg = screen.getByRole('img', { name: /^Residuals plot: radial residual of 10 chord endpoints/ });
    expect(svg.querySelectorAll('[data-endpoint]')).toHaveLength(10);
    expect(svg.querySelectorAll('.error-bar')).toHaveLength(10);
    const zeroY = Number(svg.querySelector('line.zero')?.getAttribute('y1'));
    for (const point of residualPoints(fixtureEvent.solution)) {
      const mark = svg.querySelector(`[data-endpoint="${point.key}"] .residual-marker`);
      const y = Number(/translate\(0,([-\d.]+)\)/.exec(mark?.getAttribute('transform') ?? '')?.[1]);
      // Screen y grows downwards: a positive residual (outside the limb) sits above the zero line.
      if (point.residualKm > 0) expect(y).toBeLessThan(zeroY);
      else expect(y).toBeGreaterThanOrEqual(zeroY);
      expect(
        mark?.getAttribute('d')?.startsWith(point.event === 'disappearance' ? 'M-4,0a' : 'M-4,-4h'),
      ).toBe(true);
    }
    expect([...svg.querySelectorAll('text')].map((t) => t.textContent)).toContain('Radial residual (km)');
  });

  it('ResidualsPlot says there is nothing to plot without a limb fit', () => {
    renderWithProviders(<ResidualsPlot solution={{ ...fixtureEvent.solution, limb: null }} />);
    expect(screen.getByText('No limb fit yet, so there are no residuals to plot.')).toBeInTheDocument();
    expect(screen.queryByRole('img')).not.toBeInTheDocument();
  });
});
