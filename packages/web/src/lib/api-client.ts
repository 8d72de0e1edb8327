import { z } from 'zod';

// The single door to the API. The access token lives only in memory (never in storage, so an injected
// script cannot lift it from there); the refresh token is an httpOnly cookie the browser sends to
// /api/auth on its own. Beside it the server sets `limbus_session=1`, readable here and carrying no
// secret: it only says whether a refresh is worth trying, so a signed-out visit sends nothing that would
// be refused, and a reload refreshes before its first request instead of after a 401.

export interface ApiIssue {
  path: string;
  message: string;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly issues: ApiIssue[] = [],
    /** The parsed error body as sent, for endpoints whose problems are not `{ path, message }` (CSV rows). */
    readonly body: unknown = null,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

const errorBodySchema = z.object({
  message: z.union([z.string(), z.array(z.string())]).optional(),
  error: z.string().optional(),
  issues: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
});

const tokenResponseSchema = z.object({ accessToken: z.string().min(1) });

let accessToken: string | null = null;
let refreshInFlight: Promise<boolean> | null = null;

export function setAccessToken(token: string | null): void {
  accessToken = token;
}

export function hasAccessToken(): boolean {
  return accessToken !== null;
}

const SESSION_HINT_NAME = 'limbus_session';

/** Whether the server's session hint cookie is present, i.e. the refresh cookie is likely still valid. */
export function hasSessionHint(): boolean {
  return document.cookie.split(';').some((cookie) => cookie.trim() === `${SESSION_HINT_NAME}=1`);
}

/**
 * Drops the hint on this side too, for a sign-out whose server call failed: the user asked to leave, so
 * a reload must not bring the session back.
 */
export function forgetSessionHint(): void {
  document.cookie = `${SESSION_HINT_NAME}=; Max-Age=0; Path=/; SameSite=Strict`;
}

/** The answer to a request that needs a session when there is none; decided here, never sent. */
export const SIGN_IN_REQUIRED = 'Sign-in required';

export interface RequestOptions<T> {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** JSON, or FormData for uploads (the browser then sets the multipart boundary itself). */
  body?: unknown;
  /** Validates the response body; omit for responses without one (204). */
  schema?: z.ZodType<T>;
  signal?: AbortSignal;
  /**
   * A route open to anyone (sign-in, password reset, an invitation link): sent even without a session,
   * and a 401 from it is its answer (a wrong password), not an expired token to refresh.
   */
  anonymous?: boolean;
}

async function toApiError(response: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await response.json();
  } catch {
    // A proxy or a crash may answer with HTML or nothing; the status line is then all we have.
  }
  const parsed = errorBodySchema.safeParse(body);
  if (parsed.success) {
    const raw = parsed.data.message;
    const message = Array.isArray(raw) ? raw.join('; ') : (raw ?? parsed.data.error);
    return new ApiError(
      response.status,
      message ?? `Request failed (${response.status})`,
      parsed.data.issues ?? [],
      body,
    );
  }
  return new ApiError(
    response.status,
    `Request failed (${response.status} ${response.statusText})`.trim(),
    [],
    body,
  );
}

function send(
  path: string,
  method: string,
  body: unknown,
  signal: AbortSignal | undefined,
): Promise<Response> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const isForm = body instanceof FormData;
  if (body !== undefined && !isForm) headers['Content-Type'] = 'application/json';
  if (accessToken !== null) headers.Authorization = `Bearer ${accessToken}`;
  return fetch(path, {
    method,
    headers,
    body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
    credentials: 'same-origin',
    signal,
  });
}

/**
 * Asks for a new access token with the refresh cookie. Concurrent 401s share one refresh, because the
 * server rotates the refresh token and a second parallel call would present an already-revoked one.
 */
export function refreshAccessToken(): Promise<boolean> {
  refreshInFlight ??= (async () => {
    try {
      const response = await send('/api/auth/refresh', 'POST', undefined, undefined);
      if (!response.ok) {
        accessToken = null;
        return false;
      }
      const parsed = tokenResponseSchema.safeParse(await response.json());
      accessToken = parsed.success ? parsed.data.accessToken : null;
      return parsed.success;
    } catch {
      accessToken = null;
      return false;
    } finally {
      refreshInFlight = null;
    }
  })();
  return refreshInFlight;
}

/**
 * Sends a request that needs a session. Without a token in memory it refreshes first when the hint
 * cookie says there is a session, and otherwise answers 401 itself; a 401 from the server (an expired
 * token) gets one refresh and one retry.
 */
async function sendSignedIn(
  path: string,
  method: string,
  body: unknown,
  signal: AbortSignal | undefined,
): Promise<Response> {
  if (accessToken === null && !(hasSessionHint() && (await refreshAccessToken())))
    throw new ApiError(401, SIGN_IN_REQUIRED);
  const response = await send(path, method, body, signal);
  if (response.status === 401 && (await refreshAccessToken())) return send(path, method, body, signal);
  return response;
}

export async function apiRequest<T = void>(path: string, options: RequestOptions<T> = {}): Promise<T> {
  const method = options.method ?? 'GET';
  const response = options.anonymous
    ? await send(path, method, options.body, options.signal)
    : await sendSignedIn(path, method, options.body, options.signal);
  if (!response.ok) throw await toApiError(response);
  if (options.schema === undefined) return undefined as T;
  const json: unknown = await response.json();
  const parsed = options.schema.safeParse(json);
  if (!parsed.success) {
    throw new ApiError(
      response.status,
      `Unexpected response from ${method} ${path}: ${parsed.error.message}`,
    );
  }
  return parsed.data;
}

/**
 * A binary download (a figure, a table) with the same token and refresh as apiRequest; a POST when the
 * file is made from a body (the shape table).
 */
export async function apiBlob(
  path: string,
  options: { method?: 'GET' | 'POST'; body?: unknown; signal?: AbortSignal } = {},
): Promise<Blob> {
  const response = await sendSignedIn(path, options.method ?? 'GET', options.body, options.signal);
  if (!response.ok) throw await toApiError(response);
  return response.blob();
}
