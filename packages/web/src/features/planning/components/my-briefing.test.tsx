import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { testBriefing } from '../testing/test-briefing';
import { MyBriefing } from './my-briefing';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

describe('MyBriefing', () => {
  it('MyBriefing shows the observer their own stations with times, window, pointing and the cautions', async () => {
    stubFetch(() => jsonResponse(200, testBriefing()));
    renderWithProviders(<MyBriefing eventId="event-1" userId="u-observer" />);
    const card = await screen.findByRole('group', { name: 'Briefing for amberfield' });
    // Only the stations the observer observes from: brackenhill has no observer.
    expect(screen.queryByRole('group', { name: 'Briefing for brackenhill' })).toBeNull();
    expect(card).toHaveTextContent('Disappearance2029-09-07 21:32:55.60 UTC ± 0.45 s');
    expect(card).toHaveTextContent('Record from … to (3σ)2029-09-07 21:32:30 – 21:33:32 UTC');
    expect(card).toHaveTextContent('altitude 48.3°, azimuth 131.9° (from north through east)');
    expect(card).toHaveTextContent('74.6° from the star, 42 % lit, altitude 12.1°');
    expect(screen.getByRole('link', { name: 'Link to this event' })).toHaveAttribute(
      'href',
      'http://limbus.test/events/event-1?section=shadow-path',
    );
    const prediction = screen.getByRole('list', { name: 'About the prediction' });
    expect(within(prediction).getByText(/the path may lie 1σ = 20.4 km to either side/)).toBeVisible();
    const safety = screen.getByRole('list', { name: 'Safety' });
    expect(within(safety).getAllByRole('listitem')).toHaveLength(4);
    expect(safety).toHaveTextContent('Never point a telescope near the Sun in twilight.');
    expect(safety).toHaveTextContent('Local rules come first.');
  });

  it('MyBriefing tells an observer without a station so, and still gives the cautions', async () => {
    stubFetch(() => jsonResponse(200, testBriefing({ stations: [] })));
    renderWithProviders(<MyBriefing eventId="event-1" userId="u-observer" />);
    expect(await screen.findByText(/You observe from no station of this event yet/)).toBeVisible();
    expect(screen.getByRole('list', { name: 'Safety' })).toBeVisible();
  });
});
