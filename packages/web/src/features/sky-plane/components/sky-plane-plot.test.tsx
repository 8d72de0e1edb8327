import { fireEvent, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { fixtureEvent, syntheticEvent } from '../fixtures/solution-fixture';
import { SkyPlanePlot } from './sky-plane-plot';
import { expectClose } from '../../../../../geometry/test/expect-close';
import { renderWithProviders } from '@/testing/test-utils';

function renderPlot(eastLeft = true) {
  renderWithProviders(
    <SkyPlanePlot solution={fixtureEvent.solution} chordInputs={fixtureEvent.chords} eastLeft={eastLeft} />,
  );
  return screen.getByRole('img', { name: /^Sky-plane plot/ });
}

function numberAttr(element: Element | null, name: string): number {
  return Number(element?.getAttribute(name));
}

describe('SkyPlanePlot', () => {
  it('SkyPlanePlot names itself for assistive technology by what it shows', () => {
    const svg = renderPlot();
    expect(svg).toHaveAccessibleName(
      'Sky-plane plot: 5 positive and 2 negative chords, fitted limb of equivalent radius 112.6 ± 2.3 km, 1 ring',
    );
  });

  it('SkyPlanePlot draws one element per chord, tagged with its station', () => {
    const svg = renderPlot();
    const chords = svg.querySelectorAll('[data-chord]');
    expect(chords).toHaveLength(7);
    expect([...chords].map((c) => c.getAttribute('data-chord'))).toEqual(
      fixtureEvent.solution.chords.map((c) => c.station),
    );
    expect(svg.querySelectorAll('.chord-positive')).toHaveLength(5);
    expect(svg.querySelectorAll('.chord-positive .error-bar')).toHaveLength(10);
  });

  it('SkyPlanePlot styles negative chords apart by line and markers, not colour alone', () => {
    const svg = renderPlot();
    const negatives = [...svg.querySelectorAll('.chord-negative')];
    expect(negatives).toHaveLength(2);
    for (const chord of negatives) {
      expect(chord.querySelector('.chord-path')?.getAttribute('stroke-dasharray')).toBe('6 4');
      const ends = chord.querySelectorAll('circle.path-end');
      expect(ends).toHaveLength(2);
      for (const end of ends) expect(end.getAttribute('fill')).toBe('#ffffff');
      expect(chord.querySelector('.endpoint-marker')).toBeNull();
    }
    for (const chord of svg.querySelectorAll('.chord-positive')) {
      expect(chord.querySelector('.chord-path')?.getAttribute('stroke-dasharray')).toBeNull();
      expect(chord.querySelectorAll('.endpoint-marker')).toHaveLength(2);
    }
  });

  it('SkyPlanePlot draws the limb, its 1-sigma band, the ring, its crossings and the centre', () => {
    const svg = renderPlot();
    expect(svg.querySelector('path.limb')?.getAttribute('d')).toMatch(
      /^M[-\d.]+,[-\d.]+(L[-\d.]+,[-\d.]+){359}Z$/,
    );
    // The band is an annulus: outer and inner outline in one even-odd path.
    const band = svg.querySelector('path.limb-band');
    expect(band?.getAttribute('fill-rule')).toBe('evenodd');
    expect(band?.getAttribute('d')?.match(/Z/g)).toHaveLength(2);
    expect(svg.querySelectorAll('path.ring[data-ring="R1"]')).toHaveLength(1);
    expect(svg.querySelectorAll('.ring-crossing')).toHaveLength(
      fixtureEvent.solution.rings[0]?.crossings.length ?? -1,
    );
    expect(svg.querySelectorAll('.ring-crossing').length).toBeGreaterThan(0);
    expect(svg.querySelector('.centre-error-f')).not.toBeNull();
    expect(svg.querySelector('.centre-error-g')).not.toBeNull();
    // The error cross is symmetric about the fixed-size centre mark.
    const cross = svg.querySelector('.centre-error-f');
    const mark = svg.querySelector('.centre-mark');
    expectClose((numberAttr(cross, 'x1') + numberAttr(cross, 'x2')) / 2, numberAttr(mark, 'cx'), 1e-9);
    expect(numberAttr(mark, 'cy')).toBe(numberAttr(cross, 'y1'));
  });

  it('SkyPlanePlot labels its axes and states the sky orientation, with a north/east indicator and km scale', () => {
    const svg = renderPlot();
    const texts = [...svg.querySelectorAll('text')].map((t) => t.textContent);
    expect(texts).toEqual(
      expect.arrayContaining(['f (km)', 'g (km)', 'North up, east left (as seen on the sky)', 'N', 'E']),
    );
    expect(svg.querySelector('.scale-bar text')?.textContent).toMatch(/^\d+ km$/);
  });

  it('SkyPlanePlot draws +f to the left by default and to the right when mirrored', () => {
    // Every chord moves towards −f (velocity f < 0), so the disappearance has the larger f.
    const left = renderPlot(true);
    const d = left.querySelector('[data-event="disappearance"] .endpoint-marker');
    const r = left.querySelector('[data-event="reappearance"] .endpoint-marker');
    expect(numberAttr(d, 'cx')).toBeLessThan(numberAttr(r, 'cx'));
    const east = [...left.querySelectorAll('.compass text')].find((t) => t.textContent === 'E');
    expect(numberAttr(east ?? null, 'x')).toBeLessThan(0);
  });

  it('SkyPlanePlot mirrored puts +f on the right', () => {
    const right = renderPlot(false);
    const d = right.querySelector('[data-event="disappearance"] .endpoint-marker');
    const r = right.querySelector('[data-event="reappearance"] .endpoint-marker');
    expect(numberAttr(d, 'cx')).toBeGreaterThan(numberAttr(r, 'cx'));
  });

  it('SkyPlanePlot shows station, times and residuals when a chord gets focus', () => {
    const svg = renderPlot();
    const first = fixtureEvent.solution.chords[0];
    const residual = fixtureEvent.solution.limb?.radialResidualsKm[0];
    const chord = svg.querySelector(`[data-chord="${first?.station}"]`);
    expect(chord?.getAttribute('tabindex')).toBe('0');
    fireEvent.focus(chord as Element);
    const tip = screen.getByRole('status');
    expect(tip).toHaveTextContent(first?.station ?? '?');
    expect(tip).toHaveTextContent(/Disappearance \d\d:\d\d:\d\d\.\d{3} UTC ± 0\.\d{3} s/);
    expect(tip).toHaveTextContent(
      `Residual (disappearance) ${(residual?.residualKm ?? NaN) >= 0 ? '+' : '−'}${Math.abs(residual?.residualKm ?? NaN).toFixed(2)} km`,
    );
    fireEvent.blur(chord as Element);
    expect(screen.getByRole('status', { hidden: true })).toBeEmptyDOMElement();
  });

  it('SkyPlanePlot zooms in from the keyboard-reachable control and resets', async () => {
    const user = userEvent.setup();
    const svg = renderPlot();
    const before = svg.querySelector('.scale-bar text')?.textContent;
    const limbBefore = svg.querySelector('path.limb')?.getAttribute('d');
    await user.click(screen.getByRole('button', { name: 'Zoom in' }));
    await user.click(screen.getByRole('button', { name: 'Zoom in' }));
    expect(svg.querySelector('path.limb')?.getAttribute('d')).not.toBe(limbBefore);
    expect(svg.querySelector('.scale-bar text')?.textContent).not.toBe(before);
    await user.click(screen.getByRole('button', { name: 'Reset view' }));
    expect(svg.querySelector('path.limb')?.getAttribute('d')).toBe(limbBefore);
  });

  it('SkyPlanePlot draws a single-edge chord as its one point with its error bar, and no segment', () => {
    const solution = fixtureEvent.solution;
    const index = solution.chords.findIndex((c) => c.type === 'positive');
    const chord = solution.chords[index];
    const input = fixtureEvent.chords[index];
    if (chord === undefined || input?.type !== 'positive') throw new Error('a positive chord');
    const single = { ...chord, points: chord.points.filter((p) => p.event === 'reappearance') };
    const { disappearance: _dropped, ...lateStart } = input;
    const chords = solution.chords.map((c, i) => (i === index ? single : c));
    const inputs = fixtureEvent.chords.map((c, i) => (i === index ? lateStart : c));
    renderWithProviders(<SkyPlanePlot solution={{ ...solution, chords }} chordInputs={inputs} />);
    const svg = screen.getByRole('img', { name: /^Sky-plane plot/ });
    const group = svg.querySelector(`[data-chord="${chord.station}"]`);
    expect(group?.querySelector('.chord-segment')).toBeNull();
    expect(group?.querySelectorAll('.endpoint-marker')).toHaveLength(1);
    expect(group?.querySelectorAll('.error-bar')).toHaveLength(1);
    expect(group?.querySelector('[data-event="reappearance"]')).not.toBeNull();
    // The other positive chords keep their segment.
    expect(svg.querySelectorAll('.chord-segment')).toHaveLength(4);
    fireEvent.focus(group as Element);
    expect(screen.getByRole('status')).toHaveTextContent('Disappearance not observed (single-edge chord)');
  });

  it('SkyPlanePlot without a limb fit still draws the chords', () => {
    const { solution } = syntheticEvent(2, 1);
    renderWithProviders(<SkyPlanePlot solution={{ ...solution, limb: null, rings: [] }} />);
    const svg = screen.getByRole('img', { name: 'Sky-plane plot: 2 positive and 1 negative chords' });
    expect(svg.querySelectorAll('[data-chord]')).toHaveLength(3);
    expect(svg.querySelector('path.limb')).toBeNull();
    expect(svg.querySelector('path.limb-band')).toBeNull();
  });
});
