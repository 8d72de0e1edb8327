import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ReviewPanel } from './review-panel';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

const HISTORY = [
  {
    id: 'r1',
    decision: 'return',
    comment: 'Fit the clock offset of brackenmoor',
    reviewer: { id: 'u4', name: 'Oren Vale' },
    createdAt: '2029-05-18T11:00:00.000Z',
  },
];

describe('ReviewPanel', () => {
  it('ReviewPanel lets a reviewer approve a fit in review and shows the history', async () => {
    const calls = stubFetch((call) =>
      call.method === 'POST' ? jsonResponse(201, {}) : jsonResponse(200, HISTORY),
    );
    renderWithProviders(
      <ReviewPanel fitId="f1" fitState="solved" reviewState="in_review" canRequest={false} canDecide />,
    );
    expect(await screen.findByRole('list', { name: 'Review history' })).toHaveTextContent(
      'Oren Vale returned — “Fit the clock offset of brackenmoor”',
    );
    await userEvent.setup().click(screen.getByRole('button', { name: 'Approve fit' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST')).toBe(true));
    const post = calls.find((c) => c.method === 'POST');
    expect(post?.url).toBe('/api/fits/f1/reviews');
    expect(post?.body).toEqual({ decision: 'approve', comment: '' });
  });

  it('ReviewPanel will not return a fit without a comment', async () => {
    const calls = stubFetch(() => jsonResponse(200, []));
    renderWithProviders(
      <ReviewPanel fitId="f1" fitState="solved" reviewState="in_review" canRequest={false} canDecide />,
    );
    const user = userEvent.setup();
    await user.click(screen.getByRole('radio', { name: 'Return to the modeller' }));
    await user.click(screen.getByRole('button', { name: 'Return fit' }));
    expect(await screen.findByText('say what must change before it can be approved')).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);
  });

  it('ReviewPanel offers the modeller a review request and nothing to decide', async () => {
    const calls = stubFetch((call) =>
      call.method === 'POST' ? jsonResponse(201, {}) : jsonResponse(200, []),
    );
    renderWithProviders(
      <ReviewPanel fitId="f1" fitState="solved" reviewState="none" canRequest canDecide={false} />,
    );
    expect(screen.queryByRole('button', { name: 'Approve fit' })).not.toBeInTheDocument();
    await userEvent.setup().click(screen.getByRole('button', { name: 'Request review' }));
    await waitFor(() => expect(calls.map((c) => c.url)).toContain('/api/fits/f1/review-request'));
  });
});
