import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { DynamicsPanel } from './dynamics-panel';
import { TEST_VIEW } from './test-context';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

describe('DynamicsPanel', () => {
  it('DynamicsPanel shows the strip and the fitted ring against each limit with 1σ', async () => {
    stubFetch(() => jsonResponse(200, TEST_VIEW));
    renderWithProviders(<DynamicsPanel eventId="e1" canEdit={false} />);
    await screen.findByRole('img', { name: /^Dynamics strip/ });
    const table = screen.getByRole('table', { name: 'Fitted ring radius against the context' });
    expect(table).toHaveTextContent('2030 ± 40');
    expect(table).toHaveTextContent('1.202 ± 0.050');
    expect(screen.queryByRole('form', { name: 'Dynamics context inputs' })).not.toBeInTheDocument();
  });

  it('DynamicsPanel form names the bad field before sending, then shows the server’s refusal on its field', async () => {
    const calls = stubFetch((call) =>
      call.method === 'PUT'
        ? jsonResponse(400, {
            message: 'Validation failed',
            issues: [{ path: 'heliocentricDistanceAu', message: 'must be greater than 0' }],
          })
        : jsonResponse(200, TEST_VIEW),
    );
    const user = userEvent.setup();
    renderWithProviders(<DynamicsPanel eventId="e1" canEdit />);
    const radius = await screen.findByRole('textbox', { name: 'Body radius (km)' });
    expect(radius).toHaveValue('560');
    await user.clear(radius);
    await user.type(radius, '-1');
    await user.click(screen.getByRole('button', { name: 'Save context' }));
    expect(await screen.findByText('body.radiusKm: must be a number greater than 0')).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0);
    await user.clear(radius);
    await user.type(radius, '570');
    await user.click(screen.getByRole('button', { name: 'Save context' }));
    expect(await screen.findByText('heliocentricDistanceAu: must be greater than 0')).toBeInTheDocument();
    const sent = calls.find((c) => c.method === 'PUT')?.body as {
      body: Record<string, unknown>;
      satellites: unknown[];
      spinOrbitK: number[];
    };
    expect(sent.spinOrbitK).toEqual([2, 3]);
    expect(sent.body).toEqual({
      radiusKm: 570,
      radiusKmSigma: 10,
      spinPeriodHours: 8.9,
      densityKgM3: 1700,
      densityKgM3Sigma: 200,
    });
    expect(sent.satellites).toEqual([{ name: 'Oru', semiMajorAxisKm: 14500, semiMajorAxisKmSigma: 50 }]);
  });

  it('DynamicsPanel offers the form when the event has no context yet', async () => {
    stubFetch(() => jsonResponse(200, { input: null, result: null, ringFits: [], updatedAt: null }));
    renderWithProviders(<DynamicsPanel eventId="e1" canEdit />);
    expect(await screen.findByText('No dynamics context for this body yet.')).toBeInTheDocument();
    expect(screen.getByRole('form', { name: 'Dynamics context inputs' })).toBeInTheDocument();
  });
});
