import { describe, expect, it } from 'vitest';
import { redactUrl } from './redact-url';

describe('redactUrl()', () => {
  it('redactUrl() replaces the ticket and access_token values and keeps the other parameters', () => {
    expect(redactUrl('/api/fits/f1/events?ticket=abc_DEF-123&since=4')).toBe(
      '/api/fits/f1/events?ticket=[redacted]&since=4',
    );
    expect(redactUrl('/api/fits/f1/events?access_token=eyJhbGciOi.x.y')).toBe(
      '/api/fits/f1/events?access_token=[redacted]',
    );
  });

  it('redactUrl() finds the keys whatever their case or percent-encoding, and repeated ones', () => {
    expect(redactUrl('/x?Access_Token=a&access%5Ftoken=b&TICKET=c&ticket=d')).toBe(
      '/x?Access_Token=[redacted]&access%5Ftoken=[redacted]&TICKET=[redacted]&ticket=[redacted]',
    );
  });

  it('redactUrl() replaces the token of an invitation or a password-reset link in the path', () => {
    expect(redactUrl('/api/invitations/Zm9vYmFy/accept')).toBe('/api/invitations/[redacted]/accept');
    expect(redactUrl('/invitations/Zm9vYmFy')).toBe('/invitations/[redacted]');
    expect(redactUrl('/reset-password/Zm9vYmFy?x=1')).toBe('/reset-password/[redacted]?x=1');
  });

  it('redactUrl() leaves URLs without secrets as they are', () => {
    for (const url of [
      '/api/events?page=2&q=ticket',
      '/api/teams/t1/invitations/i1/resend',
      '/api/me',
      '/api/events?',
      '/api/x?flag&ticketing=1',
    ])
      expect(redactUrl(url)).toBe(url);
  });
});
