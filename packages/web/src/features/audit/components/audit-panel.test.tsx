import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AUDIT_PAGE_SIZE, AuditPanel } from './audit-panel';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

vi.setConfig({ testTimeout: 30_000 });

// An invented event's log, oldest first as the server sends it.
const ENTRIES = [
  {
    id: 'a1',
    actorId: 'u1',
    actorName: 'Ada Brightwater',
    action: 'event.import',
    objectType: 'event',
    objectId: 'e1',
    detail: { body: 'Quillon', chords: 12 },
    createdAt: '2029-05-17T09:00:00.000Z',
  },
  {
    id: 'a2',
    actorId: 'u1',
    actorName: 'Ada Brightwater',
    action: 'report.accept',
    objectType: 'report',
    objectId: '7c0d5e2a-41f9-4b7e-9d55-0f2c31a8e6b1',
    detail: { chord: 'positive', ringEvents: 0 },
    createdAt: '2029-05-18T07:15:00.000Z',
  },
  {
    id: 'a3',
    actorId: null,
    actorName: null,
    action: 'fit.solved',
    objectType: 'fit',
    objectId: '0b9f3c1e-2d4a-4f6b-8e7d-5a1c9b3e2f40',
    detail: { engineVersion: '0.1.0' },
    createdAt: '2029-05-18T10:00:04.000Z',
  },
  {
    id: 'a4',
    actorId: 'u2',
    actorName: 'Noor Calder',
    action: 'fit.review-request',
    objectType: 'fit',
    objectId: '0b9f3c1e-2d4a-4f6b-8e7d-5a1c9b3e2f40',
    detail: { message: 'Please check the ring pole.' },
    createdAt: '2029-05-18T10:05:00.000Z',
  },
];

describe('AuditPanel', () => {
  it('AuditPanel lists who did what to the event, newest first, with the system for the worker', async () => {
    const calls = stubFetch(() => jsonResponse(200, ENTRIES));
    renderWithProviders(<AuditPanel eventId="e1" />);
    const table = await screen.findByRole('table', { name: 'Audit log' });
    expect(calls.map((c) => c.url)).toEqual(['/api/events/e1/audit']);
    const rows = within(table).getAllByRole('row').slice(1);
    expect(
      rows.map((row) =>
        within(row)
          .getAllByRole('cell')
          .map((cell) => cell.textContent),
      ),
    ).toEqual([
      [
        '2029-05-18 10:05:00 UTC',
        'Noor Calder',
        'asked for review of a fit',
        'fit 0b9f3c1e',
        'message Please check the ring pole.',
      ],
      ['2029-05-18 10:00:04 UTC', 'system', 'fit solved', 'fit 0b9f3c1e', 'engineVersion 0.1.0'],
      [
        '2029-05-18 07:15:00 UTC',
        'Ada Brightwater',
        'accepted a report',
        'report 7c0d5e2a',
        'chord positive · ringEvents 0',
      ],
      [
        '2029-05-17 09:00:00 UTC',
        'Ada Brightwater',
        'imported the event',
        'the event',
        'body Quillon · chords 12',
      ],
    ]);
    expect(within(rows[0] as HTMLElement).getByRole('link', { name: 'fit 0b9f3c1e' })).toHaveAttribute(
      'href',
      '/events/e1?section=fits&fit=0b9f3c1e-2d4a-4f6b-8e7d-5a1c9b3e2f40',
    );
    expect(screen.queryByRole('button', { name: /more/ })).not.toBeInTheDocument();
  });

  it('AuditPanel shows a long log a page at a time', async () => {
    const many = Array.from({ length: AUDIT_PAGE_SIZE + 5 }, (_, k) => ({
      ...ENTRIES[1],
      id: `m${String(k).padStart(3, '0')}`,
      createdAt: new Date(Date.UTC(2029, 4, 18, 7, 0, k)).toISOString(),
    }));
    stubFetch(() => jsonResponse(200, many));
    renderWithProviders(<AuditPanel eventId="e1" />);
    const table = await screen.findByRole('table', { name: 'Audit log' });
    expect(within(table).getAllByRole('row')).toHaveLength(AUDIT_PAGE_SIZE + 1);
    expect(
      screen.getByText(`Showing ${AUDIT_PAGE_SIZE} of ${AUDIT_PAGE_SIZE + 5} entries, newest first.`),
    ).toBeInTheDocument();
    await userEvent.setup().click(screen.getByRole('button', { name: 'Show 5 more' }));
    expect(within(table).getAllByRole('row')).toHaveLength(AUDIT_PAGE_SIZE + 6);
    expect(within(table).getAllByRole('row').at(-1)).toHaveTextContent('2029-05-18 07:00:00 UTC');
  });

  it('AuditPanel says what failed when the server refuses the log', async () => {
    stubFetch(() =>
      jsonResponse(403, { statusCode: 403, message: 'Only coordinators may read the audit log' }),
    );
    renderWithProviders(<AuditPanel eventId="e1" />);
    expect(await screen.findByRole('alert')).toHaveTextContent('Could not load the audit log');
  });
});
