import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { DynamicsPanel, EventDynamicsPanel } from './dynamics-panel';
import { TEST_VIEW } from './test-context';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

const NONE = { bodyId: 'b1', input: null, result: null, ringFits: [], updatedAt: null };

describe('DynamicsPanel', () => {
  it("DynamicsPanel reads the body's route and shows the strip and each event's fitted ring against each limit with 1σ", async () => {
    const calls = stubFetch(() => jsonResponse(200, TEST_VIEW));
    renderWithProviders(<DynamicsPanel bodyId="b1" canEdit={false} />);
    await screen.findByRole('img', { name: /^Dynamics strip/ });
    expect(calls[0]?.url).toBe('/api/bodies/b1/dynamics');
    const table = screen.getByRole('table', { name: 'Fitted ring radius against the context' });
    expect(table).toHaveTextContent('Invented occultation, night one');
    expect(table).toHaveTextContent('2030 ± 40');
    expect(table).toHaveTextContent('1.202 ± 0.050');
    expect(screen.queryByRole('form', { name: 'Physical parameters' })).not.toBeInTheDocument();
  });

  it('DynamicsPanel form names the bad field before sending, then PUTs to the body and shows the refusal on its field', async () => {
    const calls = stubFetch((call) =>
      call.method === 'PUT'
        ? jsonResponse(400, {
            message: 'Validation failed',
            issues: [{ path: 'heliocentricDistanceAu', message: 'must be greater than 0' }],
          })
        : jsonResponse(200, TEST_VIEW),
    );
    const user = userEvent.setup();
    renderWithProviders(<DynamicsPanel bodyId="b1" canEdit />);
    const radius = await screen.findByRole('textbox', { name: 'Body radius (km)' });
    expect(radius).toHaveValue('560');
    await user.clear(radius);
    await user.type(radius, '-1');
    await user.click(screen.getByRole('button', { name: 'Save physical parameters' }));
    expect(await screen.findByText('body.radiusKm: must be a number greater than 0')).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0);
    await user.clear(radius);
    await user.type(radius, '570');
    await user.type(screen.getByRole('textbox', { name: 'Period source' }), 'invented discovery paper');
    await user.click(screen.getByRole('button', { name: 'Save physical parameters' }));
    expect(await screen.findByText('heliocentricDistanceAu: must be greater than 0')).toBeInTheDocument();
    const put = calls.find((c) => c.method === 'PUT');
    expect(put?.url).toBe('/api/bodies/b1/dynamics');
    const sent = put?.body as { body: Record<string, unknown>; satellites: unknown[]; spinOrbitK: number[] };
    expect(sent.spinOrbitK).toEqual([2, 3]);
    expect(sent.body).toEqual({
      radiusKm: 570,
      radiusKmSigma: 10,
      spinPeriodHours: 8.9,
      densityKgM3: 1700,
      densityKgM3Sigma: 200,
    });
    expect(sent.satellites).toEqual([
      {
        name: 'Oru',
        semiMajorAxisKm: 14500,
        semiMajorAxisKmSigma: 50,
        periodDaysSource: 'invented discovery paper',
      },
    ]);
  });

  it('DynamicsPanel shows each fitted ring’s nearest resonances with the distance ± 1σ and in each σ', async () => {
    stubFetch(() => jsonResponse(200, TEST_VIEW));
    renderWithProviders(<DynamicsPanel bodyId="b1" canEdit={false} />);
    const table = await screen.findByRole('table', { name: 'Nearest resonances of each ring' });
    const row = within(table).getByRole('row', { name: /1:2 spin–orbit/ });
    expect(row).toHaveTextContent('Invented occultation, night one');
    expect(row).toHaveTextContent('R1 (fit): 2030 ± 40');
    expect(row).toHaveTextContent('2222 ± 88');
    // formatValueSigma rounds the 1σ to two digits and the value to the same place.
    expect(row).toHaveTextContent('-192 ± 97');
    expect(row).toHaveTextContent('-4.8σ');
    expect(row).toHaveTextContent('-2.2σ');
    expect(row).toHaveTextContent('-2.0σ');
    expect(screen.getByText(/near it, not shown to be in it/)).toBeInTheDocument();
  });

  it('DynamicsPanel form sends the named resonances as p:q pairs and names a malformed one before sending', async () => {
    const calls = stubFetch(() => jsonResponse(200, TEST_VIEW));
    const user = userEvent.setup();
    renderWithProviders(<DynamicsPanel bodyId="b1" canEdit />);
    const field = await screen.findByRole('textbox', { name: /^Resonances to list/ });
    await user.type(field, '6-1');
    await user.click(screen.getByRole('button', { name: 'Save physical parameters' }));
    expect(await screen.findByText(/resonances: write each as p:q/)).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0);
    await user.clear(field);
    await user.type(field, '6:1, 11:2');
    await user.click(screen.getByRole('button', { name: 'Save physical parameters' }));
    await screen.findByRole('status');
    const sent = calls.find((c) => c.method === 'PUT')?.body as { resonances: unknown };
    expect(sent.resonances).toEqual([
      { p: 6, q: 1 },
      { p: 11, q: 2 },
    ]);
  });

  it('DynamicsPanel offers the form when the body has no parameters yet', async () => {
    stubFetch(() => jsonResponse(200, NONE));
    renderWithProviders(<DynamicsPanel bodyId="b1" canEdit />);
    expect(await screen.findByText('No physical parameters entered for this body yet.')).toBeInTheDocument();
    expect(screen.getByRole('form', { name: 'Physical parameters' })).toBeInTheDocument();
  });
});

describe('EventDynamicsPanel', () => {
  it("EventDynamicsPanel reads the event's route, offers no form, and shows the link it is given", async () => {
    const calls = stubFetch(() => jsonResponse(200, TEST_VIEW));
    renderWithProviders(
      <EventDynamicsPanel
        eventId="e1"
        bodyLink={<a href="/bodies/b1">Edit the physical parameters of Quillon</a>}
      />,
    );
    await screen.findByRole('img', { name: /^Dynamics strip/ });
    expect(calls.map((c) => c.url)).toEqual(['/api/events/e1/dynamics']);
    expect(
      screen.getByRole('table', { name: 'Fitted ring radius against the context' }),
    ).not.toHaveTextContent('Invented occultation');
    expect(screen.queryByRole('form')).not.toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Edit the physical parameters of Quillon' })).toHaveAttribute(
      'href',
      '/bodies/b1',
    );
  });
});
