/** Query parameters whose value opens something by itself: an access token or a progress-stream ticket. */
const SECRET_QUERY_KEYS = new Set(['access_token', 'ticket']);

/**
 * Paths whose last segment is a secret token: an invitation (API and client route) and a password-reset
 * link (client route). Whoever reads the log could otherwise join the team or set the password.
 */
const SECRET_PATHS = /^((?:\/api)?\/invitations\/|\/reset-password\/)[^/?#]+/;

export const REDACTED = '[redacted]';

function decodedKey(rawKey: string): string {
  try {
    return decodeURIComponent(rawKey.replace(/\+/g, ' ')).toLowerCase();
  } catch {
    return rawKey.toLowerCase();
  }
}

/**
 * A request URL as the request log may keep it: the values of secret query parameters and the tokens of
 * secret paths replaced by "[redacted]", everything else as it came (so the line still says which route
 * and which parameters were asked for).
 */
export function redactUrl(url: string): string {
  const queryAt = url.indexOf('?');
  const pathPart = queryAt < 0 ? url : url.slice(0, queryAt);
  const path = pathPart.replace(SECRET_PATHS, `$1${REDACTED}`);
  if (queryAt < 0) return path;
  const query = url
    .slice(queryAt + 1)
    .split('&')
    .map((pair) => {
      const eq = pair.indexOf('=');
      const rawKey = eq < 0 ? pair : pair.slice(0, eq);
      return SECRET_QUERY_KEYS.has(decodedKey(rawKey)) ? `${rawKey}=${REDACTED}` : pair;
    })
    .join('&');
  return `${path}?${query}`;
}
