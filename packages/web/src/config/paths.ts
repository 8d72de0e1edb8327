// One place for client URLs, so links and the router cannot drift apart.
export const paths = {
  signIn: '/sign-in',
  forgotPassword: '/forgot-password',
  resetPassword: (token: string) => `/reset-password/${encodeURIComponent(token)}`,
  invitation: (token: string) => `/invitations/${encodeURIComponent(token)}`,
  events: '/events',
  event: (eventId: string) => `/events/${encodeURIComponent(eventId)}`,
  adminOutbox: '/admin/outbox',
  comparison: '/comparison',
  plotsPreview: '/plots/preview',
} as const;
