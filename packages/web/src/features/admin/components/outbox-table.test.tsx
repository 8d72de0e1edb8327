import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { OutboxMessage } from '../api/get-outbox';
import { OutboxTable } from './outbox-table';

const messages: OutboxMessage[] = [
  {
    id: 'm1',
    from: 'Limbus <no-reply@limbus.invalid>',
    to: ['observer@example.org'],
    subject: 'Reset your Limbus password',
    text: 'Open http://127.0.0.1:8080/reset-password/abc to choose a new password.',
    html: '<p>Open <a href="#">the link</a></p>',
    date: '2026-12-01T22:00:00.000Z',
  },
  {
    id: 'm2',
    from: 'Limbus <no-reply@limbus.invalid>',
    to: ['new.member@example.org', 'copy@example.org'],
    subject: 'You are invited to Outer Belt Timing Group',
    text: 'Accept at http://127.0.0.1:8080/invitations/xyz',
    html: null,
    date: '2026-12-01T23:00:00.000Z',
  },
];

describe('OutboxTable', () => {
  it('OutboxTable lists one row per captured e-mail, newest first', () => {
    render(<OutboxTable messages={messages} />);
    const table = screen.getByRole('table', { name: 'Captured e-mails' });
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(3);
    expect(rows[1]).toHaveTextContent('You are invited to Outer Belt Timing Group');
    expect(rows[1]).toHaveTextContent('new.member@example.org, copy@example.org');
    expect(rows[2]).toHaveTextContent('Reset your Limbus password');
  });

  it('OutboxTable shows a body as plain text on request and hides it again', async () => {
    const user = userEvent.setup();
    render(<OutboxTable messages={messages} />);
    const show = screen.getByRole('button', { name: 'Show body of "Reset your Limbus password"' });
    expect(show).toHaveAttribute('aria-expanded', 'false');
    await user.click(show);
    expect(screen.getByText(/reset-password\/abc/)).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'the link' })).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Hide body of "Reset your Limbus password"' }));
    expect(screen.queryByText(/reset-password\/abc/)).not.toBeInTheDocument();
  });

  it('OutboxTable says so when nothing was captured', () => {
    render(<OutboxTable messages={[]} />);
    expect(screen.getByText('No e-mails captured yet')).toBeInTheDocument();
    expect(screen.queryByRole('table')).not.toBeInTheDocument();
  });
});
