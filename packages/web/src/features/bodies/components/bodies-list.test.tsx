import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { BodySummary } from '../api/get-bodies';
import { BodiesList } from './bodies-list';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// The demo body and an invented second one.
const QUILLON: BodySummary = {
  id: 'b1',
  teamId: 't1',
  name: 'Quillon',
  designation: '2031 QL7',
  eventCount: 3,
  approvedFitCount: 2,
  hasContext: true,
  updatedAt: '2031-08-01T10:00:00.000Z',
};
const BRASK: BodySummary = {
  ...QUILLON,
  id: 'b2',
  name: 'Brask',
  designation: null,
  eventCount: 0,
  approvedFitCount: 0,
  hasContext: false,
};

describe('BodiesList', () => {
  it("BodiesList tables the team's bodies with their events, approved fits and whether parameters are entered", async () => {
    const calls = stubFetch(() => jsonResponse(200, [QUILLON, BRASK]));
    renderWithProviders(<BodiesList teamId="t1" teamName="Outer Belt Timing Group" canCreate={false} />);
    const table = await screen.findByRole('table', { name: 'Bodies of Outer Belt Timing Group' });
    expect(calls[0]?.url).toBe('/api/teams/t1/bodies');
    const [, quillon, brask] = within(table).getAllByRole('row');
    expect(within(quillon as HTMLElement).getByRole('link', { name: 'Quillon' })).toHaveAttribute(
      'href',
      '/bodies/b1',
    );
    expect(quillon).toHaveTextContent('2031 QL7');
    expect(quillon).toHaveTextContent(/32entered$/);
    expect(brask).toHaveTextContent('Brask—00not entered');
    expect(screen.queryByRole('form', { name: 'New body' })).not.toBeInTheDocument();
  });

  it('BodiesList lets a coordinator add a body, and shows a taken name on the Name field', async () => {
    let bodies: BodySummary[] = [QUILLON];
    const calls = stubFetch((call) => {
      if (call.method === 'GET') return jsonResponse(200, bodies);
      const body = call.body as { name: string; designation?: string };
      if (body.name === 'Quillon')
        return jsonResponse(400, {
          statusCode: 400,
          message: 'Validation failed',
          issues: [{ path: 'name', message: 'the team already has a body named "Quillon"' }],
        });
      bodies = [QUILLON, { ...BRASK, name: body.name, designation: body.designation ?? null }];
      return jsonResponse(201, bodies[1]);
    });
    const user = userEvent.setup();
    renderWithProviders(<BodiesList teamId="t1" teamName="Outer Belt Timing Group" canCreate />);
    const form = await screen.findByRole('form', { name: 'New body' });
    const name = within(form).getByRole('textbox', { name: /^Name/ });
    await user.type(name, 'Quillon');
    await user.click(within(form).getByRole('button', { name: 'Add body' }));
    expect(await within(form).findByText('the team already has a body named "Quillon"')).toBeInTheDocument();
    expect(name).toHaveValue('Quillon');
    expect(name).toHaveAttribute('aria-invalid', 'true');
    await user.clear(name);
    await user.type(name, 'Brask');
    await user.type(within(form).getByRole('textbox', { name: /^Designation/ }), '2032 BR');
    await user.click(within(form).getByRole('button', { name: 'Add body' }));
    expect(await within(form).findByRole('link', { name: 'Brask' })).toHaveAttribute('href', '/bodies/b2');
    const posts = calls.filter((c) => c.method === 'POST');
    expect(posts.map((c) => c.url)).toEqual(['/api/teams/t1/bodies', '/api/teams/t1/bodies']);
    expect(posts[0]?.body).toEqual({ name: 'Quillon' });
    expect(posts[1]?.body).toEqual({ name: 'Brask', designation: '2032 BR' });
    await waitFor(() =>
      expect(screen.getByRole('table', { name: 'Bodies of Outer Belt Timing Group' })).toHaveTextContent(
        'Brask',
      ),
    );
  });

  it('BodiesList refuses an empty name on its field without asking the server', async () => {
    const calls = stubFetch(() => jsonResponse(200, [QUILLON]));
    renderWithProviders(<BodiesList teamId="t1" teamName="Outer Belt Timing Group" canCreate />);
    const form = await screen.findByRole('form', { name: 'New body' });
    await userEvent.click(within(form).getByRole('button', { name: 'Add body' }));
    expect(await within(form).findByText('body name must not be empty')).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);
  });
});
