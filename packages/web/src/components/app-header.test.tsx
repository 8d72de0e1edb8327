import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { AppHeader, type AppHeaderProps } from './app-header';

const team = { id: 't1', name: 'Outer Belt Timing Group', roles: ['coordinator'] };

function props(overrides: Partial<AppHeaderProps> = {}): AppHeaderProps {
  return {
    userName: 'Mara Quell',
    isAdmin: true,
    teams: [team],
    currentTeamId: 't1',
    onTeamChange: vi.fn(),
    onSignOut: vi.fn(),
    nav: null,
    accountLink: <a href="/account">Account</a>,
    ...overrides,
  };
}

describe('AppHeader', () => {
  it("AppHeader shows the user's name and roles in the current team", () => {
    render(<AppHeader {...props()} />);
    const banner = screen.getByRole('banner');
    expect(within(banner).getByText('Mara Quell')).toBeInTheDocument();
    expect(within(banner).getByText('site admin, coordinator')).toBeInTheDocument();
    expect(within(banner).getByText('Outer Belt Timing Group')).toBeInTheDocument();
    expect(screen.queryByRole('combobox', { name: 'Team' })).not.toBeInTheDocument();
  });

  it('AppHeader shows the account link in the user block, beside the sign-out button', () => {
    render(<AppHeader {...props()} />);
    const banner = screen.getByRole('banner');
    expect(within(banner).getByRole('link', { name: 'Account' })).toHaveAttribute('href', '/account');
  });

  it('AppHeader calls onSignOut from the sign-out button', async () => {
    const onSignOut = vi.fn();
    render(<AppHeader {...props({ onSignOut })} />);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Sign out' }));
    expect(onSignOut).toHaveBeenCalledTimes(1);
  });

  it('AppHeader offers a team switcher when the user has several teams, with that team’s roles', async () => {
    const onTeamChange = vi.fn();
    const second = { id: 't2', name: 'Kuiper Chord Club', roles: ['observer', 'modeller'] };
    render(
      <AppHeader {...props({ isAdmin: false, teams: [team, second], currentTeamId: 't2', onTeamChange })} />,
    );
    expect(screen.getByText('observer, modeller')).toBeInTheDocument();
    const select = screen.getByRole('combobox', { name: 'Team' });
    expect(select).toHaveValue('t2');
    await userEvent.setup().selectOptions(select, 'Outer Belt Timing Group');
    expect(onTeamChange).toHaveBeenCalledWith('t1');
  });
});
