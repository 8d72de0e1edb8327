import { screen, within } from '@testing-library/react';
import { Outlet, Route, Routes } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SignedInContext } from './app-layout';
import { BodyRoute } from './body';
import { QUILLON } from '@/features/bodies/components/test-body';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

const SIGNED_IN: SignedInContext = {
  me: {
    id: 'u-m',
    email: 'modeller@example.org',
    name: 'Mira Modeller',
    isAdmin: false,
    teams: [{ id: 't1', name: 'Outer Belt Timing Group', roles: ['modeller'] }],
    noticeOptOuts: [],
  },
  team: { id: 't1', name: 'Outer Belt Timing Group', roles: ['modeller'] },
};

function renderBodyPage() {
  return renderWithProviders(
    <Routes>
      <Route element={<Outlet context={SIGNED_IN} />}>
        <Route path="/bodies/:bodyId" element={<BodyRoute />} />
      </Route>
    </Routes>,
    { initialEntries: ['/bodies/b1'] },
  );
}

describe('BodyRoute', () => {
  it('BodyRoute shows the body, its events with approved limbs ± 1σ, and asks the body routes for the comparison, shape and parameters', async () => {
    const calls = stubFetch(({ url }) => {
      if (url === '/api/bodies/b1') return jsonResponse(200, QUILLON);
      if (
        url === '/api/bodies/b1/comparison?fits=latest-approved' ||
        url === '/api/bodies/b1/comparison?fits=all'
      )
        return jsonResponse(200, { selection: 'latest-approved', ringLabels: [], fits: [] });
      if (url === '/api/bodies/b1/dynamics')
        return jsonResponse(200, { bodyId: 'b1', input: null, result: null, ringFits: [], updatedAt: null });
      return jsonResponse(404, { statusCode: 404, message: `no stub for ${url}` });
    });
    renderBodyPage();
    expect(await screen.findByRole('heading', { name: 'Quillon', level: 2 })).toBeInTheDocument();
    const table = screen.getByRole('table', { name: 'Events and approved fits' });
    const nightOne = within(table).getByRole('row', { name: /night one/ });
    expect(nightOne).toHaveTextContent('402.3 ± 1.8');
    expect(nightOne).toHaveTextContent('based on older data');
    // A modeller edits the parameters and fits the joint pole; only a coordinator renames the body.
    expect(await screen.findByRole('form', { name: 'Physical parameters' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Edit name and designation' })).not.toBeInTheDocument();
    expect(await screen.findByText(/No approved fits of this body yet/)).toBeInTheDocument();
    expect(await screen.findByRole('form', { name: 'Shape fit' })).toBeInTheDocument();
    expect(new Set(calls.map((c) => c.url))).toEqual(
      new Set([
        '/api/bodies/b1',
        '/api/bodies/b1/comparison?fits=latest-approved',
        '/api/bodies/b1/comparison?fits=all',
        '/api/bodies/b1/dynamics',
      ]),
    );
  });
});
