import { z } from 'zod';

// The single door to the API. The access token lives only in memory (never in storage, so an injected
// script cannot lift it from there); the refresh token is an httpOnly cookie the browser sends to
// /api/auth on its own.

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

/** For EventSource, which cannot send headers: the server reads the token from the query string. */
export function currentAccessToken(): string | null {
  return accessToken;
}

export interface RequestOptions<T> {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** JSON, or FormData for uploads (the browser then sets the multipart boundary itself). */
  body?: unknown;
  /** Validates the response body; omit for responses without one (204). */
  schema?: z.ZodType<T>;
  signal?: AbortSignal;
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

// Requests that must not trigger a refresh: they either are the refresh or establish a session themselves.
const NO_REFRESH_PATHS = ['/api/auth/login', '/api/auth/refresh', '/api/auth/logout'];

export async function apiRequest<T = void>(path: string, options: RequestOptions<T> = {}): Promise<T> {
  const method = options.method ?? 'GET';
  let response = await send(path, method, options.body, options.signal);
  if (response.status === 401 && !NO_REFRESH_PATHS.includes(path)) {
    if (await refreshAccessToken()) {
      response = await send(path, method, options.body, options.signal);
    }
  }
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
  const method = options.method ?? 'GET';
  let response = await send(path, method, options.body, options.signal);
  if (response.status === 401 && (await refreshAccessToken()))
    response = await send(path, method, options.body, options.signal);
  if (!response.ok) throw await toApiError(response);
  return response.blob();
}
