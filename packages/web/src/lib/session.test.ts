import { QueryClient, QueryObserver } from '@tanstack/react-query';
import { afterEach, describe, expect, it } from 'vitest';
import { hasAccessToken, hasSessionHint, setAccessToken } from './api-client';
import { endSession, startSession } from './session';

afterEach(() => setAccessToken(null));

describe('session', () => {
  it('startSession() keeps the token and drops cached data nobody is looking at', () => {
    const client = new QueryClient();
    client.setQueryData(['me'], { name: 'previous user' });
    client.setQueryData(['invitations', 't'], { teamName: 'Outer Belt Timing Group' });
    const observer = new QueryObserver(client, { queryKey: ['invitations', 't'], enabled: false });
    const unsubscribe = observer.subscribe(() => undefined);
    startSession(client, 'token-1');
    expect(hasAccessToken()).toBe(true);
    expect(client.getQueryData(['me'])).toBeUndefined();
    expect(client.getQueryData(['invitations', 't'])).toEqual({ teamName: 'Outer Belt Timing Group' });
    unsubscribe();
  });

  it('endSession() drops the token, the session cookie and every cached query', () => {
    const client = new QueryClient();
    setAccessToken('token-1');
    document.cookie = 'limbus_session=1; Path=/';
    client.setQueryData(['me'], { name: 'someone' });
    endSession(client);
    expect(hasAccessToken()).toBe(false);
    expect(hasSessionHint()).toBe(false);
    expect(client.getQueryCache().getAll()).toHaveLength(0);
  });
});
