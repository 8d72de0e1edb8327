import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { ShapeView } from '../api/fit-shape';
import { ShapePanel } from './shape-panel';
import { Silhouettes } from './silhouettes';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Invented numbers for an invented body; only what the panel sends, shows and draws is under test.
const limb = (radiusKm: number, oblateness: number, paDeg: number) => ({
  equatorialRadiusKm: { value: radiusKm, sigma: 3 },
  oblateness: { value: oblateness, sigma: 0.01 },
  positionAngleDeg: { value: paDeg, sigma: 1 },
});
const row = (
  fitId: string,
  event: string,
  reviewState: string,
  finishedAt: string,
  fitLimb: ReturnType<typeof limb> | null,
) => ({
  fitId,
  eventId: `e-${event}`,
  eventTitle: `Event ${event}`,
  eventDateUtc: '2029-05-17T03:12:30.000Z',
  reviewState,
  finishedAt,
  createdBy: { id: 'u-m', name: 'Mira Modeller' },
  limb: fitLimb,
});
// Event a has two fits: the approved one (a) and a newer one not yet reviewed (a2); only a is ticked.
const COMPARISON = {
  selection: 'all',
  ringLabels: [],
  fits: [
    row('a', 'a', 'approved', '2029-05-18T10:00:00.000Z', limb(600, 0.12, 30)),
    row('a2', 'a', 'none', '2029-05-19T08:30:00.000Z', limb(601, 0.12, 30)),
    row('b', 'b', 'none', '2029-05-18T11:00:00.000Z', limb(580, 0.2, 95)),
    row('c', 'c', 'approved', '2029-05-18T12:00:00.000Z', null),
    row('d', 'd', 'approved', '2029-05-18T13:00:00.000Z', limb(610, 0.05, 140)),
  ],
};
const apparent = (r: number, e: number, p: number) => ({
  equatorialRadiusKm: r,
  oblateness: e,
  positionAngleDeg: p,
});
const residualEvent = (id: string, a: number | null) => ({
  id,
  rotationAngleDeg: 12.5,
  aspectAngleDeg: 71.25,
  model: apparent(598, 0.13, 31),
  normalizedResiduals: { equatorialRadius: a, oblateness: 0.5, positionAngle: null },
  chi2: 1.2,
  rmsRadialKm: 2.34,
});
const VIEW: ShapeView = {
  pole: { raDeg: 52, decDeg: 24, source: 'entered', jointPoleId: null },
  fits: ['a', 'b', 'd'].map((id) => ({
    fitId: id,
    eventTitle: `Event ${id}`,
    seenUtc: '2030-01-01T00:00:00.000Z',
    emittedUtc: '2029-12-31T18:30:00.000Z',
  })),
  result: {
    model: 'triaxial',
    semiAxesKm: { aKm: 612.34, bKm: 501.2, cKm: 418.9 },
    uncertainty: { aKm: 4.12, bKm: 3.3, cKm: 6.05, phaseDeg: 2.2, periodHours: 0 },
    phaseDeg: 70.4,
    phaseFitted: true,
    periodHours: 6.71,
    chi2: 3.5,
    dof: 5,
    events: [residualEvent('a', -0.75), residualEvent('b', 1.5), residualEvent('d', null)],
    equilibrium: {
      sequence: 'Jacobi',
      omega2OverPiGRho: 0.28,
      densityKgM3: 1243.4,
      densityKgM3Sigma: 56.2,
      cOverAOnSequence: 0.62,
      cOverAFitted: 0.68,
      caution: 'Assumes hydrostatic equilibrium.',
    },
    warnings: ['c/a is 0.06 off the Jacobi sequence'],
  },
  cautions: [],
};

function server(shapeReply: () => Response = () => jsonResponse(200, VIEW)) {
  return stubFetch((call) => {
    if (call.url === '/api/bodies/b1/comparison?fits=all') return jsonResponse(200, COMPARISON);
    if (call.url === '/api/bodies/b1/shape' && call.method === 'POST') return shapeReply();
    return jsonResponse(404, { message: 'no route' });
  });
}

async function fillForm() {
  await userEvent.type(await screen.findByRole('textbox', { name: 'Pole RA (°)' }), '52');
  await userEvent.type(screen.getByRole('textbox', { name: 'Pole Dec (°)' }), '24');
  await userEvent.type(screen.getByRole('textbox', { name: 'Rotation period (h)' }), '6.71');
  await userEvent.type(screen.getByRole('textbox', { name: /Reference epoch/ }), '2028-01-01T00:00:00Z');
}

describe('ShapePanel', () => {
  it('ShapePanel shows the fit\u2019s cautions (χ²/dof above 3, an axis order held) in a warning', async () => {
    const caution =
      'χ²/dof is 15101.6 (χ² = 75508.0 for 5 degrees of freedom), above 3: the limb ellipses differ from this ellipsoid by more than their 1-sigma allow.';
    server(() => jsonResponse(200, { ...VIEW, cautions: [caution] }));
    renderWithProviders(<ShapePanel bodyId="b1" />);
    await fillForm();
    await userEvent.click(screen.getByRole('button', { name: 'Fit shape' }));
    const list = await screen.findByRole('list', { name: 'Shape cautions' });
    expect(list).toHaveTextContent(caution);
  });

  it(
    'ShapePanel sends one fit per event from the body route, the pole and rotation, and tables a, b, c ± 1σ and residuals',
    { timeout: 20_000 },
    async () => {
      const calls = server();
      renderWithProviders(<ShapePanel bodyId="b1" />);
      // Each fit is named by event, event date, fit date and author; event c has no limb, so it is not offered.
      expect(
        await screen.findByRole('checkbox', {
          name: 'Event b · event 2029-05-17 03:12:30 UTC · fit of 2029-05-18 11:00:00 UTC by Mira Modeller · not approved',
        }),
      ).toBeChecked();
      expect(
        screen.getByRole('checkbox', { name: /^Event a · .* fit of 2029-05-18 10:00:00 UTC .* approved$/ }),
      ).toBeChecked();
      expect(
        screen.getByRole('checkbox', { name: /^Event a · .* fit of 2029-05-19 08:30:00 UTC/ }),
      ).not.toBeChecked();
      expect(screen.queryByRole('checkbox', { name: /Event c/ })).toBeNull();
      await fillForm();
      await userEvent.click(screen.getByRole('button', { name: 'Fit shape' }));
      const axes = await screen.findByRole('table', { name: 'Semi-axes' });
      const row = within(axes).getAllByRole('row')[1];
      expect(row).toHaveTextContent('612.3 ± 4.1');
      expect(row).toHaveTextContent('501.2 ± 3.3');
      expect(row).toHaveTextContent('418.9 ± 6.0');
      expect(row).toHaveTextContent('70.4 ± 2.2 (fitted)');
      const residuals = within(screen.getByRole('table', { name: 'Residuals by event' })).getAllByRole('row');
      expect(residuals).toHaveLength(4);
      expect(residuals[2]).toHaveTextContent('Event b');
      expect(residuals[2]).toHaveTextContent('1.50');
      // A parameter the limb fit held fixed measures nothing: a dash, not a zero.
      expect(residuals[3]).toHaveTextContent('—');
      expect(calls.find((c) => c.method === 'POST')?.body).toEqual({
        fitIds: ['a', 'b', 'd'],
        pole: { raDeg: 52, decDeg: 24 },
        periodHours: 6.71,
        epochUtc: '2028-01-01T00:00:00Z',
        model: 'triaxial',
      });
    },
  );

  it(
    'ShapePanel writes the table of the result on screen, from the input that gave it, not from later edits',
    { timeout: 20_000 },
    async () => {
      const saved: string[] = [];
      vi.stubGlobal(
        'URL',
        Object.assign(URL, { createObjectURL: () => 'blob:test/1', revokeObjectURL: () => undefined }),
      );
      const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (
        this: HTMLAnchorElement,
      ) {
        saved.push(this.download);
      });
      const calls = stubFetch((call) => {
        if (call.url === '/api/bodies/b1/comparison?fits=all') return jsonResponse(200, COMPARISON);
        if (call.url === '/api/bodies/b1/shape' && call.method === 'POST') return jsonResponse(200, VIEW);
        if (call.url === '/api/bodies/b1/shape/table?format=csv' && call.method === 'POST')
          return new Response('parameter,value,sigma,unit', { status: 200 });
        return jsonResponse(404, { message: 'no route' });
      });
      renderWithProviders(<ShapePanel bodyId="b1" />);
      await fillForm();
      await userEvent.click(screen.getByRole('button', { name: 'Fit shape' }));
      await screen.findByRole('table', { name: 'Semi-axes' });
      const period = screen.getByRole('textbox', { name: 'Rotation period (h)' });
      await userEvent.clear(period);
      await userEvent.type(period, '9');
      await userEvent.click(screen.getByRole('button', { name: 'Download shape table as CSV' }));
      await vi.waitFor(() => expect(saved).toEqual(['limbus-shape.csv']));
      expect(calls.find((c) => c.url.startsWith('/api/bodies/b1/shape/table'))?.body).toMatchObject({
        fitIds: ['a', 'b', 'd'],
        periodHours: 6.71,
      });
      click.mockRestore();
    },
  );

  it(
    'ShapePanel shows the equilibrium density only beside its caution, and draws each event against the model',
    { timeout: 20_000 },
    async () => {
      server();
      renderWithProviders(<ShapePanel bodyId="b1" />);
      await fillForm();
      await userEvent.click(screen.getByRole('button', { name: 'Fit shape' }));
      const density = await screen
        .findByRole('group', { name: 'Equilibrium density' })
        .catch(() => screen.getByText(/Jacobi density/).closest('[aria-label="Equilibrium density"]'));
      expect(density).toHaveTextContent('Jacobi density 1243 ± 56 kg/m³');
      expect(density).toHaveTextContent('Assumes hydrostatic equilibrium.');
      expect(screen.getByText('c/a is 0.06 off the Jacobi sequence')).toBeInTheDocument();
      const cell = screen.getByRole('img', { name: 'Model silhouette against the limb of Event d' });
      expect(cell.querySelector('[data-shape="observed"]')).not.toBeNull();
      expect(cell.querySelector('[data-shape="model"]')).not.toBeNull();
    },
  );

  it(
    'ShapePanel names the event a refused fit belongs to, and a field the client cannot read',
    { timeout: 20_000 },
    async () => {
      const calls = server(() =>
        jsonResponse(400, {
          message: 'Validation failed',
          issues: [{ path: 'fitIds.1', message: 'fit is queued, not solved' }],
        }),
      );
      renderWithProviders(<ShapePanel bodyId="b1" />);
      await userEvent.type(await screen.findByRole('textbox', { name: 'Pole RA (°)' }), 'north');
      await userEvent.click(screen.getByRole('button', { name: 'Fit shape' }));
      expect(screen.getAllByText('enter a number').length).toBeGreaterThan(1);
      expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);
      await userEvent.clear(screen.getByRole('textbox', { name: 'Pole RA (°)' }));
      await userEvent.type(screen.getByRole('textbox', { name: 'Pole RA (°)' }), '52');
      await userEvent.type(screen.getByRole('textbox', { name: 'Pole Dec (°)' }), '24');
      await userEvent.type(screen.getByRole('textbox', { name: 'Rotation period (h)' }), '6.71');
      await userEvent.type(screen.getByRole('textbox', { name: /Reference epoch/ }), '2028-01-01 00:00');
      await userEvent.click(screen.getByRole('button', { name: 'Fit shape' }));
      expect(await screen.findByText('ISO 8601 UTC ending in Z')).toBeInTheDocument();
      expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);
      for (const name of ['Pole RA (°)', 'Pole Dec (°)', 'Rotation period (h)'])
        await userEvent.clear(screen.getByRole('textbox', { name }));
      await userEvent.clear(screen.getByRole('textbox', { name: /Reference epoch/ }));
      await fillForm();
      await userEvent.click(screen.getByRole('button', { name: 'Fit shape' }));
      expect(await screen.findByText('Event b: fit is queued, not solved')).toBeInTheDocument();
    },
  );
});

describe('Silhouettes', () => {
  it('Silhouettes() draws every event at one scale, a circle of half the largest radius spanning half the width', () => {
    renderWithProviders(
      <Silhouettes
        pairs={[
          { fitId: 'x', title: 'X', observed: apparent(400, 0, 0), model: apparent(200, 0, 0) },
          { fitId: 'y', title: 'Y', observed: apparent(100, 0, 0), model: apparent(100, 0, 0) },
        ]}
      />,
    );
    const span = (d: string) => {
      const xs = [...d.matchAll(/[ML]([-\d.]+),/g)].map((m) => Number(m[1]));
      return Math.max(...xs) - Math.min(...xs);
    };
    const x = screen.getByRole('img', { name: 'Model silhouette against the limb of X' });
    const observed = span(x.querySelector('[data-shape="observed"]')?.getAttribute('d') ?? '');
    const model = span(x.querySelector('[data-shape="model"]')?.getAttribute('d') ?? '');
    expect(Math.abs(model / observed - 0.5)).toBeLessThan(1e-3);
    const y = screen.getByRole('img', { name: 'Model silhouette against the limb of Y' });
    expect(
      Math.abs(span(y.querySelector('[data-shape="observed"]')?.getAttribute('d') ?? '') / observed - 0.25),
    ).toBeLessThan(1e-3);
  });
});
