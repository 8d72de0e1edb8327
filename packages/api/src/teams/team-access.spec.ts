import { describe, expect, it } from 'vitest';
import { decideTeamAccess } from './team-access';

// The rules are our own product decisions (docs/authorization.md), common practice, no source.
describe('decideTeamAccess', () => {
  it('decideTeamAccess() hides a team from a non-member as not-found', () => {
    expect(decideTeamAccess({ isAdmin: false, memberRoles: null, required: [] })).toBe('not-found');
    expect(decideTeamAccess({ isAdmin: false, memberRoles: null, required: ['coordinator'] })).toBe(
      'not-found',
    );
  });

  it('decideTeamAccess() lets any member through when no role is required', () => {
    expect(decideTeamAccess({ isAdmin: false, memberRoles: ['observer'], required: [] })).toBe('allow');
  });

  it('decideTeamAccess() forbids a member without one of the required roles', () => {
    expect(
      decideTeamAccess({ isAdmin: false, memberRoles: ['observer', 'modeller'], required: ['coordinator'] }),
    ).toBe('forbidden');
  });

  it('decideTeamAccess() allows a member holding any one of the required roles', () => {
    expect(
      decideTeamAccess({ isAdmin: false, memberRoles: ['modeller'], required: ['coordinator', 'modeller'] }),
    ).toBe('allow');
  });

  it('decideTeamAccess() lets a site admin act in a team they do not belong to', () => {
    expect(decideTeamAccess({ isAdmin: true, memberRoles: null, required: ['coordinator'] })).toBe('allow');
  });

  it('decideTeamAccess() treats a membership with no roles as member but not role holder', () => {
    expect(decideTeamAccess({ isAdmin: false, memberRoles: [], required: [] })).toBe('allow');
    expect(decideTeamAccess({ isAdmin: false, memberRoles: [], required: ['reviewer'] })).toBe('forbidden');
  });
});
