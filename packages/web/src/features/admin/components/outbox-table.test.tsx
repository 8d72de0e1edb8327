import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { Route, Routes } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import type { OutboxMessage } from '../api/get-outbox';
import { OutboxTable } from './outbox-table';
import { renderWithProviders } from '@/testing/test-utils';

const FROM = 'Limbus <no-reply@limbus.invalid>';
const here = window.location.origin;

// Listed out of date order on purpose: the table must sort by date, not trust the order received.
const messages: OutboxMessage[] = [
  {
    id: 'm1',
    from: FROM,
    to: ['observer@example.org'],
    subject: 'Reset your Limbus password',
    text: `Open ${here}/reset-password/abc to choose a new password.`,
    html: '<p>Open <a href="#">the link</a></p>',
    date: '2029-12-01T22:00:00.000Z',
    kind: 'password-reset',
  },
  {
    id: 'm3',
    from: FROM,
    to: ['coordinator@example.org'],
    subject: 'A report awaits your decision',
    text: `See ${here}/events/e1?section=reports. Field guide: https://example.net/guide.`,
    html: '',
    date: '2029-12-02T08:15:30.000Z',
    kind: 'report-submitted',
  },
  {
    id: 'm2',
    from: FROM,
    to: ['new.member@example.org', 'copy@example.org'],
    subject: 'You are invited to Outer Belt Timing Group',
    text: `Accept at ${here}/invitations/xyz`,
    html: '',
    date: '2029-12-01T23:00:00.000Z',
    kind: 'invitation',
  },
];

function renderTable(list: OutboxMessage[] = messages) {
  return renderWithProviders(
    <Routes>
      <Route path="/" element={<OutboxTable messages={list} />} />
      <Route path="/invitations/:token" element={<p>Invitation page</p>} />
    </Routes>,
  );
}

function subjects(): string[] {
  const table = screen.getByRole('table', { name: 'Captured e-mails' });
  return within(table)
    .getAllByRole('row')
    .slice(1)
    .map((row) => within(row).getAllByRole('cell')[3]?.textContent ?? '');
}

describe('OutboxTable', () => {
  it('OutboxTable lists the e-mails newest first by date, with kind, recipients and UTC time', () => {
    renderTable();
    expect(subjects()).toEqual([
      'A report awaits your decision',
      'You are invited to Outer Belt Timing Group',
      'Reset your Limbus password',
    ]);
    const row = screen.getByRole('row', { name: /You are invited/ });
    expect(row).toHaveTextContent('2029-12-01 23:00:00 UTC');
    expect(row).toHaveTextContent('invitation');
    expect(row).toHaveTextContent('new.member@example.org, copy@example.org');
  });

  it('OutboxTable filters by part of a recipient address and by kind', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.type(screen.getByRole('searchbox', { name: 'Recipient' }), 'EXAMPLE.org');
    expect(subjects()).toHaveLength(3);
    await user.clear(screen.getByRole('searchbox', { name: 'Recipient' }));
    await user.type(screen.getByRole('searchbox', { name: 'Recipient' }), 'copy@');
    expect(subjects()).toEqual(['You are invited to Outer Belt Timing Group']);
    await user.clear(screen.getByRole('searchbox', { name: 'Recipient' }));
    await user.selectOptions(screen.getByRole('combobox', { name: 'Kind' }), 'password-reset');
    expect(subjects()).toEqual(['Reset your Limbus password']);
    expect(screen.getByRole('status')).toHaveTextContent('1 of 3 e-mails');
    await user.type(screen.getByRole('searchbox', { name: 'Recipient' }), 'coordinator');
    expect(screen.queryByRole('table')).not.toBeInTheDocument();
    expect(screen.getByText('No captured e-mail matches these filters.')).toBeInTheDocument();
  });

  it('OutboxTable shows a body as plain text whose links are anchors, never the mail HTML', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.click(screen.getByRole('button', { name: 'Show body of "A report awaits your decision"' }));
    const inApp = screen.getByRole('link', { name: `${here}/events/e1?section=reports` });
    expect(inApp).toHaveAttribute('href', '/events/e1?section=reports');
    // The sentence's full stop stays outside the link.
    expect(screen.getByRole('link', { name: 'https://example.net/guide' })).toHaveAttribute(
      'href',
      'https://example.net/guide',
    );
    await user.click(screen.getByRole('button', { name: 'Show body of "Reset your Limbus password"' }));
    expect(screen.getByRole('link', { name: `${here}/reset-password/abc` })).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'the link' })).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Hide body of "Reset your Limbus password"' }));
    expect(screen.queryByText(/to choose a new password/)).not.toBeInTheDocument();
  });

  it('OutboxTable opens a link into the app with the router', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.click(
      screen.getByRole('button', { name: 'Show body of "You are invited to Outer Belt Timing Group"' }),
    );
    await user.click(screen.getByRole('link', { name: `${here}/invitations/xyz` }));
    expect(await screen.findByText('Invitation page')).toBeInTheDocument();
  });

  it('OutboxTable says so when nothing was captured', () => {
    renderTable([]);
    expect(screen.getByText('No e-mails captured yet')).toBeInTheDocument();
    expect(screen.queryByRole('table')).not.toBeInTheDocument();
  });
});
