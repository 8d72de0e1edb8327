// One place for client URLs, so links and the router cannot drift apart.
export const paths = {
  signIn: '/sign-in',
  forgotPassword: '/forgot-password',
  resetPassword: (token: string) => `/reset-password/${encodeURIComponent(token)}`,
  invitation: (token: string) => `/invitations/${encodeURIComponent(token)}`,
  events: '/events',
  event: (eventId: string) => `/events/${encodeURIComponent(eventId)}`,
  /** The desk opened on one section, optionally on one fit. */
  eventSection: (eventId: string, section: string, fitId?: string) =>
    `/events/${encodeURIComponent(eventId)}?section=${encodeURIComponent(section)}${
      fitId === undefined ? '' : `&fit=${encodeURIComponent(fitId)}`
    }`,
  /** The link e-mails give for a fit (packages/api/src/fits/fit-link.ts); it opens the desk's Fits section. */
  fit: (eventId: string, fitId: string) =>
    `/events/${encodeURIComponent(eventId)}/fits/${encodeURIComponent(fitId)}`,
  bodies: '/bodies',
  body: (bodyId: string) => `/bodies/${encodeURIComponent(bodyId)}`,
  team: '/team',
  account: '/account',
  adminOutbox: '/admin/outbox',
  comparison: '/comparison',
  plotsPreview: '/plots/preview',
} as const;
