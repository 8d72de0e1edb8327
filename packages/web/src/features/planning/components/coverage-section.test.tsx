import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { testBriefing } from '../testing/test-briefing';
import { CoverageSection } from './coverage-section';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

describe('CoverageSection', () => {
  it('CoverageSection draws each predicted chord across the outlines and tables every number with its ± and unit', async () => {
    const calls = stubFetch(() => jsonResponse(200, testBriefing()));
    renderWithProviders(<CoverageSection eventId="event-1" rings={[{ ring: 'R1', radiusKm: 333 }]} />);
    const plot = await screen.findByRole('img', { name: /^Coverage on the sky plane/ });
    expect(calls[0]?.url).toBe('/api/events/event-1/briefing');
    expect(plot).toHaveAccessibleName(
      'Coverage on the sky plane: 2 predicted chords, 1 across the body of radius 111 km and ring R1 (333 km)',
    );
    expect(plot.querySelector('[data-ring="R1"]')).not.toBeNull();
    // Up is left of the motion: amberfield (+42.5 km) lies above the centre, brackenhill (−190.2 km) below.
    const centreY = Number(plot.querySelector('circle.body-outline')?.getAttribute('cy'));
    const lineY = (code: string) =>
      Number(plot.querySelector(`[data-chord="${code}"] line`)?.getAttribute('y1'));
    expect(lineY('amberfield')).toBeLessThan(centreY);
    expect(lineY('brackenhill')).toBeGreaterThan(centreY);
    expect(plot.querySelector('[data-chord="brackenhill"]')?.getAttribute('data-outlook')).toBe('ring-only');

    const table = screen.getByRole('table', { name: 'Predicted chords' });
    const row = within(table).getByRole('row', { name: /amberfield/ });
    expect(row).toHaveTextContent('+43 ± 20 km');
    expect(row).toHaveTextContent('2029-09-07 21:32:55.60 UTC ± 0.45 s');
    expect(row).toHaveTextContent('2029-09-07 21:33:06.90 UTC ± 0.45 s');
    expect(row).toHaveTextContent('R1: 2029-09-07 21:32:44 – 21:33:19 UTC');
    expect(row).toHaveTextContent('48.3°');
    expect(row).toHaveTextContent('74.6°');
    expect(row).toHaveTextContent('42 %');
    const planned = within(table).getByRole('row', { name: /brackenhill/ });
    expect(planned).toHaveTextContent('Planned');
    expect(planned).toHaveTextContent('−190 ± 20 km');
    expect(within(table).getByRole('columnheader', { name: 'Cross-track offset (km, ±1σ)' })).toBeVisible();
  });
});
