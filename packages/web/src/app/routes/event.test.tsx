import { screen, within } from '@testing-library/react';
import type { MeView } from '@limbus/schema/views';
import { Outlet, Route, Routes } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SignedInContext } from './app-layout';
import { EventRoute } from './event';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';
import { TEST_SOLUTION } from '@/testing/test-solution';

afterEach(() => vi.unstubAllGlobals());

// The desk mounts Fluent tabs, tables and forms; in jsdom on a shared machine that takes seconds.
vi.setConfig({ testTimeout: 30_000 });

// An invented event of the invented body Quillon.
const EVENT = {
  id: 'e1',
  title: 'Quillon occults a field star, September 2029',
  teamId: 't1',
  bodyId: 'b1',
  bodyName: 'Quillon',
  bodyDesignation: '2031 QX',
  eventTimeUtc: '2029-09-07T21:38:00Z',
  dataSha256: 'c'.repeat(64),
  star: { raDeg: 301.234567, decDeg: -21.5 },
  ephemeris: { timeScale: 'UTC', rows: [] },
  earthRotation: { dut1Seconds: 0.1 },
  stations: [],
};

const FIT_BASE = {
  state: 'solved',
  progress: 100,
  createdBy: { id: 'u2', name: 'Noor Calder' },
  options: {},
  dataSha256: 'c'.repeat(64),
  inputMatchesEvent: true,
};
const FITS = [
  { ...FIT_BASE, id: 'f1', reviewState: 'returned', createdAt: '2029-09-08T10:00:00.000Z' },
  { ...FIT_BASE, id: 'f2', reviewState: 'in_review', createdAt: '2029-09-09T08:30:00.000Z' },
];

function meWith(roles: MeView['teams'][number]['roles'], isAdmin = false): MeView {
  return {
    id: 'u5',
    email: 'someone@example.org',
    name: 'Tamsin Orr',
    isAdmin,
    teams: [{ id: 't1', name: 'Outer Belt Timing Group', roles }],
    noticeOptOuts: [],
  };
}

function stubDesk() {
  return stubFetch(({ url }) => {
    if (url === '/api/events/e1') return jsonResponse(200, EVENT);
    if (url === '/api/events/e1/fits') return jsonResponse(200, FITS);
    const fit = FITS.find((f) => url === `/api/fits/${f.id}`);
    if (fit !== undefined) return jsonResponse(200, { ...fit, solution: TEST_SOLUTION });
    if (url === '/api/events/e1/chords') return jsonResponse(200, []);
    if (url === '/api/events/e1/reviews') return jsonResponse(200, []);
    if (url === '/api/events/e1/audit')
      return jsonResponse(200, [
        {
          id: 'a1',
          actorId: 'u1',
          actorName: 'Ada Brightwater',
          action: 'event.import',
          objectType: 'event',
          objectId: 'e1',
          detail: null,
          createdAt: '2029-09-01T09:00:00.000Z',
        },
      ]);
    return jsonResponse(404, { statusCode: 404, message: `no stub for ${url}` });
  });
}

/** The desk at `url`, inside the signed-in layout's context as the router gives it. */
function renderDesk(me: MeView, url: string) {
  const context: SignedInContext = { me, team: me.teams[0] ?? null };
  return renderWithProviders(
    <Routes location={url}>
      <Route element={<Outlet context={context} />}>
        <Route path="/events/:eventId" element={<EventRoute />} />
      </Route>
    </Routes>,
  );
}

const EVERY_ROLE_SECTIONS = [
  'Setup',
  'Stations & reports',
  'Shadow path',
  'Briefing',
  'Chords',
  'Sky plane',
  'Light curves',
  'Fits',
  'Review',
  'Figures',
];

/** The tabs by accessible name (a Fluent tab repeats its label in a hidden sizing copy). */
function tabNames(): string[] {
  const tabs = within(screen.getByRole('tablist', { name: 'Event sections' }));
  const names = [...EVERY_ROLE_SECTIONS, 'Audit'].filter(
    (name) => tabs.queryByRole('tab', { name }) !== null,
  );
  expect(tabs.getAllByRole('tab')).toHaveLength(names.length);
  return names;
}

describe('EventRoute', () => {
  it('EventRoute names the body with its designation, links to it, and gives the event time in UTC', async () => {
    stubDesk();
    renderDesk(meWith(['modeller']), '/events/e1');
    expect(await screen.findByRole('heading', { name: EVENT.title })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Quillon (2031 QX)' })).toHaveAttribute('href', '/bodies/b1');
    expect(screen.getByText(/event time 2029-09-07 21:38 UTC/)).toBeInTheDocument();
    expect(screen.getByText(/your roles: modeller/)).toBeInTheDocument();
  });

  it('EventRoute shows the Audit tab to a coordinator and opens the audit log there', async () => {
    const calls = stubDesk();
    renderDesk(meWith(['coordinator']), '/events/e1?section=audit');
    await screen.findByRole('tablist', { name: 'Event sections' });
    expect(tabNames()).toEqual([...EVERY_ROLE_SECTIONS, 'Audit']);
    expect(screen.getByRole('tab', { name: 'Audit' })).toHaveAttribute('aria-selected', 'true');
    const log = await screen.findByRole('table', { name: 'Audit log' });
    expect(log).toHaveTextContent('Ada Brightwater');
    expect(calls.map((c) => c.url)).toContain('/api/events/e1/audit');
  });

  it('EventRoute shows the Audit tab to a site admin', async () => {
    stubDesk();
    renderDesk(meWith([], true), '/events/e1');
    await screen.findByRole('tablist', { name: 'Event sections' });
    expect(tabNames()).toEqual([...EVERY_ROLE_SECTIONS, 'Audit']);
  });

  it('EventRoute hides the Audit tab from other roles and falls back to the chords on ?section=audit', async () => {
    const calls = stubDesk();
    renderDesk(meWith(['modeller', 'reviewer', 'observer']), '/events/e1?section=audit');
    await screen.findByRole('tablist', { name: 'Event sections' });
    expect(tabNames()).toEqual(EVERY_ROLE_SECTIONS);
    expect(screen.getByRole('tab', { name: 'Chords' })).toHaveAttribute('aria-selected', 'true');
    expect(calls.map((c) => c.url)).not.toContain('/api/events/e1/audit');
  });

  it("EventRoute opens the fit an e-mail's link names (?section=fits&fit=…)", async () => {
    stubDesk();
    renderDesk(meWith(['reviewer']), '/events/e1?section=fits&fit=f1');
    const shown = await screen.findByRole('region', { name: 'Selected fit' });
    expect(
      within(shown).getByRole('heading', { name: 'Fit of 2029-09-08 10:00:00 UTC' }),
    ).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Open fit of 2029-09-08 10:00:00 UTC' })).toHaveAttribute(
      'aria-pressed',
      'true',
    );
  });

  it('EventRoute fetches the fit again when the chords change, and then warns that it ran on older data', async () => {
    let chordsServed = 0;
    let stale = false;
    const chord = {
      id: 'c1',
      station: 'kestrel-hill',
      type: 'negative',
      disappearance: null,
      reappearance: null,
      start: '2029-09-07T21:36:00Z',
      end: '2029-09-07T21:40:00Z',
      timeOffsetSeconds: 0,
      source: 'report',
    };
    stubFetch(({ url }) => {
      if (url === '/api/events/e1') return jsonResponse(200, EVENT);
      if (url === '/api/events/e1/fits') return jsonResponse(200, FITS);
      if (url === '/api/events/e1/chords') {
        chordsServed += 1;
        // A report accepted elsewhere on the desk adds a chord; from then on the fit is based on older data.
        stale = chordsServed > 1;
        return jsonResponse(200, chordsServed > 1 ? [chord] : []);
      }
      if (url === '/api/fits/f1')
        return jsonResponse(200, { ...FITS[0], inputMatchesEvent: !stale, solution: TEST_SOLUTION });
      return jsonResponse(404, { statusCode: 404, message: `no stub for ${url}` });
    });
    const { queryClient } = renderDesk(meWith(['coordinator']), '/events/e1?section=figures&fit=f1');
    expect(await screen.findByRole('button', { name: 'Download fit figure' })).toBeInTheDocument();
    expect(screen.queryByText('Based on older data')).not.toBeInTheDocument();
    await queryClient.invalidateQueries({ queryKey: ['events', 'e1', 'chords'] });
    expect(await screen.findByText('Based on older data')).toBeInTheDocument();
  });

  it('EventRoute reviews the fit in review even when the Fits section shows another, and says so', async () => {
    stubDesk();
    renderDesk(meWith(['reviewer']), '/events/e1?section=review&fit=f1');
    expect(
      await screen.findByRole('heading', { name: 'Under review: the fit of 2029-09-09 08:30:00 UTC' }),
    ).toBeInTheDocument();
    expect(
      screen.getByText(
        'The Fits section shows the fit of 2029-09-08 10:00:00 UTC; this tab shows the fit of 2029-09-09 08:30:00 UTC, which is in review.',
      ),
    ).toBeInTheDocument();
    expect(screen.getByRole('radiogroup')).toBeInTheDocument();
  });
});
