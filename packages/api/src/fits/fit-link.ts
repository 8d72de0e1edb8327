/**
 * The client page of one fit, as e-mails link to it. The client's router answers this path (it opens
 * the event desk's Fits section on that fit), so a link in an old e-mail keeps working.
 */
export function fitLinkPath(eventId: string, fitId: string): string {
  return `/events/${encodeURIComponent(eventId)}/fits/${encodeURIComponent(fitId)}`;
}
