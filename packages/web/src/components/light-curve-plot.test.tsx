import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import {
  fullDomain,
  type LightCurveFigure,
  panDomain,
  secondsAfter,
  zoomDomain,
} from './light-curve-geometry';
import { LightCurvePlot } from './light-curve-plot';
import { TEST_DIP, TEST_EDGES, TEST_SERIES } from '@/testing/test-light-curve';
import { renderWithProviders } from '@/testing/test-utils';

const TEST_RESULT: LightCurveFigure = { ...TEST_EDGES, dips: [TEST_DIP], series: TEST_SERIES };

describe('LightCurvePlot', () => {
  it('secondsAfter() keeps the microseconds that Date.parse drops', () => {
    // Plain arithmetic on the two clock readings: 02:13:48.000250 − 02:13:40 = 8.000250 s.
    expect(
      Math.abs(secondsAfter('2028-03-14T02:13:40.000000Z', '2028-03-14T02:13:48.000250Z') - 8.00025),
    ).toBeLessThan(1e-9);
    expect(secondsAfter('2028-03-14T23:59:59.5Z', '2028-03-15T00:00:00.25Z')).toBeCloseTo(0.75, 9);
  });

  it('zoomDomain() and panDomain() stay inside the full span', () => {
    const full = { fromSeconds: 0, toSeconds: 20 };
    expect(zoomDomain(full, 0.5, full)).toEqual({ fromSeconds: 5, toSeconds: 15 });
    expect(zoomDomain({ fromSeconds: 5, toSeconds: 15 }, 4, full)).toEqual(full);
    expect(panDomain({ fromSeconds: 0, toSeconds: 10 }, -0.25, full)).toEqual({
      fromSeconds: 0,
      toSeconds: 10,
    });
    expect(panDomain({ fromSeconds: 0, toSeconds: 10 }, 0.25, full)).toEqual({
      fromSeconds: 2.5,
      toSeconds: 12.5,
    });
  });

  it('LightCurvePlot draws the samples, the model, residuals, D and R with 1σ spans, and the dips', () => {
    renderWithProviders(<LightCurvePlot result={TEST_RESULT} stationLabel="quillmoor" />);
    const svg = screen.getByRole('img', { name: /^Light curve of quillmoor: 200 samples/ });
    expect(svg.getAttribute('aria-label')).toContain(
      'disappearance at 2028-03-14T02:13:48.000250Z ± 0.120 s',
    );
    expect(svg.querySelectorAll('circle.sample')).toHaveLength(200);
    expect(svg.querySelectorAll('circle.residual')).toHaveLength(200);
    expect(svg.querySelector('path.model')?.getAttribute('d')).toMatch(/^M/);
    expect(svg.querySelectorAll('.edge')).toHaveLength(2);
    expect(svg.querySelectorAll('rect.dip')).toHaveLength(1);
    // The plot spans 0–19.9 s over 680 px, so R's ±0.2 s is 2 × 0.2 × 680 / 19.9 ≈ 13.7 px wide
    // and D's ±0.12 s is 0.6 of that.
    const width = (edge: string) =>
      Number(svg.querySelector(`[data-edge="${edge}"] rect.edge-error`)?.getAttribute('width'));
    expect(width('reappearance')).toBeCloseTo((2 * 0.2 * 680) / 19.9, 6);
    expect(width('disappearance') / width('reappearance')).toBeCloseTo(0.6, 6);
    const labels = [...svg.querySelectorAll('text')].map((t) => t.textContent);
    expect(labels).toContain('Normalised flux');
    expect(labels).toContain('Residual (flux)');
    expect(labels).toContain('Time (s after 02:13:40 UTC)');
  });

  it('LightCurvePlot zooms from the keyboard and draws only the samples in the window', async () => {
    const user = userEvent.setup();
    renderWithProviders(<LightCurvePlot result={TEST_RESULT} stationLabel="quillmoor" />);
    const svg = screen.getByRole('img', { name: /^Light curve/ });
    screen.getByRole('button', { name: 'Zoom in' }).focus();
    await user.keyboard('{Enter}');
    const full = fullDomain(TEST_RESULT);
    const zoomed = zoomDomain(full, 0.5, full);
    expect(Number(svg.getAttribute('data-from-seconds'))).toBeCloseTo(zoomed.fromSeconds, 12);
    const inWindow = TEST_RESULT.series.timesSeconds.filter(
      (t) => t >= zoomed.fromSeconds && t <= zoomed.toSeconds,
    ).length;
    expect(svg.querySelectorAll('circle.sample')).toHaveLength(inWindow);
    expect(inWindow).toBeLessThan(200);
    await user.click(screen.getByRole('button', { name: 'Show all' }));
    expect(svg.querySelectorAll('circle.sample')).toHaveLength(200);
  });

  it('LightCurvePlot draws a raw curve without a model as the samples alone, with the times it is given', () => {
    const raw: LightCurveFigure = {
      series: { ...TEST_SERIES, modelFlux: null },
      disappearance: TEST_EDGES.disappearance,
      reappearance: null,
      dips: [],
    };
    renderWithProviders(<LightCurvePlot result={raw} stationLabel="quillmoor" />);
    const svg = screen.getByRole('img', { name: /^Light curve of quillmoor: 200 samples, disappearance at/ });
    expect(svg.querySelectorAll('circle.sample')).toHaveLength(200);
    expect(svg.querySelector('path.model')).toBeNull();
    expect(svg.querySelectorAll('circle.residual')).toHaveLength(0);
    expect(svg.querySelectorAll('.edge')).toHaveLength(1);
    const labels = [...svg.querySelectorAll('text')].map((t) => t.textContent);
    expect(labels).toContain('Flux (as recorded)');
    expect(labels).toContain('Time (s after 02:13:40 UTC)');
    expect(labels).not.toContain('Residual (flux)');
  });
});
