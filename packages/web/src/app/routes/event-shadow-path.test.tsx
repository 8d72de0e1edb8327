import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { MeView } from '@limbus/schema/views';
import { Outlet, Route, Routes } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SignedInContext } from './app-layout';
import { EventBriefingSection, EventShadowPathSection } from './event-shadow-path';
import { eventDetailSchema, type EventDetail } from '@/features/event-setup/api/get-event';
import { testBriefing } from '@/features/planning/testing/test-briefing';
import { testMap } from '@/features/shadow-path/testing/test-map';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// An invented event of the invented body Quillon, with an observing station and a proposed one.
const EVENT: EventDetail = eventDetailSchema.parse({
  id: 'event-1',
  title: 'Quillon occults a test star',
  teamId: 't1',
  bodyId: 'b1',
  bodyName: 'Quillon',
  bodyDesignation: null,
  eventTimeUtc: '2029-09-07T21:33:00Z',
  dataSha256: 'c'.repeat(64),
  star: { raDeg: 301.2, decDeg: -21.5 },
  ephemeris: { timeScale: 'UTC', rows: [] },
  stations: [
    { id: 's1', code: 'amberfield', latDeg: 10.2, lonDeg: 62, heightM: 410, observerId: 'u-observer' },
    {
      id: 's3',
      code: 'cindervale',
      latDeg: 14,
      lonDeg: 64,
      heightM: 120,
      observerId: 'u-other',
      observerName: 'Tomas Quell',
      status: 'proposed',
      notes: 'A hill behind the school.',
    },
  ],
});

function me(roles: MeView['teams'][number]['roles'], id = 'u-observer'): MeView {
  return {
    id,
    email: 'someone@example.org',
    name: 'Ilse Darrow',
    isAdmin: false,
    teams: [{ id: 't1', name: 'Outer Belt Timing Group', roles }],
    noticeOptOuts: [],
  };
}

function render(ui: React.ReactElement, user: MeView) {
  const context: SignedInContext = { me: user, team: user.teams[0] ?? null };
  return renderWithProviders(
    <Routes location="/events/event-1">
      <Route element={<Outlet context={context} />}>
        <Route path="/events/:eventId" element={ui} />
      </Route>
    </Routes>,
  );
}

function stubPlanning(mapAnswer = () => jsonResponse(200, testMap())) {
  return stubFetch(({ url }) => {
    if (url === '/api/events/event-1/prediction/map') return mapAnswer();
    if (url === '/api/events/event-1/briefing') return jsonResponse(200, testBriefing());
    return jsonResponse(404, { message: `no stub for ${url}` });
  });
}

describe('EventShadowPathSection', () => {
  it('EventShadowPathSection gives a coordinator the map beside the coverage, the placement and the proposed sites', async () => {
    stubPlanning();
    render(<EventShadowPathSection event={EVENT} />, me(['coordinator'], 'u-coordinator'));
    const map = await screen.findByRole('img', { name: /^Shadow path map / });
    expect(map.querySelectorAll('[data-path-line]').length).toBeGreaterThan(0);
    expect(await screen.findByRole('img', { name: /^Coverage on the sky plane/ })).toBeVisible();
    expect(screen.getByRole('form', { name: 'Suggest sites' })).toBeVisible();
    const proposals = screen.getByRole('table', { name: 'Proposed sites' });
    const row = within(proposals).getByRole('row', { name: /cindervale/ });
    expect(row).toHaveTextContent('Tomas Quell');
    expect(row).toHaveTextContent('A hill behind the school.');
    expect(screen.queryByRole('form', { name: 'Propose a site' })).toBeNull();
  });

  it('EventShadowPathSection gives an observer the map and a site to propose, not the coordinator’s tools', async () => {
    stubPlanning();
    render(<EventShadowPathSection event={EVENT} />, me(['observer']));
    expect(await screen.findByRole('img', { name: /^Shadow path map / })).toBeVisible();
    expect(screen.getByRole('form', { name: 'Propose a site' })).toBeVisible();
    expect(screen.queryByRole('form', { name: 'Suggest sites' })).toBeNull();
    expect(screen.queryByRole('table', { name: 'Proposed sites' })).toBeNull();
    expect(screen.queryByRole('img', { name: /^Coverage/ })).toBeNull();
  });

  it('EventShadowPathSection sends a coordinator to Setup while the event has no prediction settings', async () => {
    stubPlanning(() =>
      jsonResponse(409, {
        message: 'the event has no prediction settings',
        issues: [{ path: 'prediction', message: 'the event has no prediction settings' }],
      }),
    );
    render(<EventShadowPathSection event={EVENT} />, me(['coordinator'], 'u-coordinator'));
    expect(await screen.findByText(/This event has no prediction settings yet/)).toBeVisible();
    expect(screen.getByRole('link', { name: 'Setup' })).toHaveAttribute(
      'href',
      '/events/event-1?section=setup',
    );
  });
});

describe('EventBriefingSection', () => {
  it('EventBriefingSection shows an observer their own briefing with the cautions, and no sending', async () => {
    stubPlanning();
    render(<EventBriefingSection event={EVENT} />, me(['observer']));
    expect(await screen.findByRole('group', { name: 'Briefing for amberfield' })).toBeVisible();
    expect(screen.getByRole('list', { name: 'Safety' })).toBeVisible();
    expect(screen.getByRole('list', { name: 'About the prediction' })).toBeVisible();
    expect(screen.queryByRole('button', { name: 'Send the briefing to every observer' })).toBeNull();
  });

  it('EventBriefingSection counts a coordinator’s observers without the proposed sites', async () => {
    const user = userEvent.setup();
    stubPlanning();
    render(<EventBriefingSection event={EVENT} />, me(['coordinator'], 'u-coordinator'));
    // amberfield's observer only: cindervale is proposed, and a proposal is not briefed.
    await user.click(screen.getByRole('button', { name: 'Send the briefing to every observer' }));
    expect(
      await screen.findByRole('alertdialog', { name: 'Send the briefing to 1 observer?' }),
    ).toBeVisible();
    expect(screen.queryByRole('region', { name: 'Your briefing' })).toBeNull();
  });
});
