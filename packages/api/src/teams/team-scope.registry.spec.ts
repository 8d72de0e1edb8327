import { describe, expect, it } from 'vitest';
import { TeamScopeRegistry } from './team-scope.registry';

describe('TeamScopeRegistry', () => {
  it('find() picks the registered parameter present in the route', () => {
    const registry = new TeamScopeRegistry();
    registry.register('teamId', async (id) => id);
    registry.register('eventId', async () => 'team-of-event');
    expect(registry.find({ eventId: 'e1' })?.paramName).toBe('eventId');
    expect(registry.find({ teamId: 't1', other: 'x' })?.value).toBe('t1');
    expect(registry.find({ token: 'x' })).toBeNull();
  });

  it('find() prefers the parameter registered first when a route has several', () => {
    const registry = new TeamScopeRegistry();
    registry.register('teamId', async (id) => id);
    registry.register('eventId', async () => 'team-of-event');
    expect(registry.find({ eventId: 'e1', teamId: 't1' })?.paramName).toBe('teamId');
  });

  it('register() refuses a second resolver for the same parameter', () => {
    const registry = new TeamScopeRegistry();
    registry.register('teamId', async (id) => id);
    expect(() => registry.register('teamId', async () => null)).toThrow('already registered');
  });
});
