/**
 * The one way the client talks to the Tallyrun API. It adds the bearer token, turns the
 * server's `{ error: { code, message, field } }` bodies into an `ApiError`, checks each
 * response against the resource's schema, and reports a 401 on an authenticated request to the
 * session (which signs out and returns the user to the sign-in screen).
 */
import type { z } from 'zod';

import { config } from '@/constants/config';

/** A failed API call, with the server's stable error code and, for a bad field, its name. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly field?: string;

  constructor(status: number, code: string, message: string, field?: string) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.field = field;
  }
}

/** @returns whether the error is an ApiError with the given HTTP status */
export function isApiError(error: unknown, status?: number): error is ApiError {
  return error instanceof ApiError && (status === undefined || error.status === status);
}

interface ClientHooks {
  getToken: () => string | null;
  onUnauthorized: () => void;
}

let hooks: ClientHooks = { getToken: () => null, onUnauthorized: () => {} };

/**
 * Connects the client to the session; the session provider calls this once.
 * @param next where to read the token and whom to tell about a 401
 */
export function configureApiClient(next: ClientHooks): void {
  hooks = next;
}

export interface ApiRequest<S extends z.ZodType> {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  /** Path under the API base, starting with `/`, e.g. `/users`. */
  path: string;
  query?: Record<string, string | number | undefined>;
  body?: unknown;
  /** Schema the response body must match. */
  schema: S;
  /** Send the bearer token (default true). Sign-in sends none. */
  authenticated?: boolean;
  signal?: AbortSignal;
}

const fallbackMessages: Record<number, string> = {
  400: 'The server could not accept that request.',
  401: 'Your session has ended. Sign in again.',
  403: 'Your role does not allow this.',
  404: 'Not found.',
  409: 'That conflicts with the current data. Reload and try again.',
  429: 'Too many attempts. Wait a minute, then try again.',
};

function urlFor(path: string, query?: ApiRequest<z.ZodType>['query']): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query ?? {})) {
    if (value !== undefined) params.set(key, String(value));
  }
  const search = params.toString();
  return `${config.apiBaseUrl}${path}${search ? `?${search}` : ''}`;
}

async function errorFrom(response: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await response.json();
  } catch {
    // Not JSON (a proxy's error page, an empty body): fall back to the status.
  }
  const error = (body as { error?: { code?: unknown; message?: unknown; field?: unknown } } | null)?.error;
  const code = typeof error?.code === 'string' ? error.code : `http_${response.status}`;
  const message =
    typeof error?.message === 'string' && error.message
      ? error.message
      : (fallbackMessages[response.status] ?? `The server answered ${response.status}.`);
  const field = typeof error?.field === 'string' ? error.field : undefined;
  return new ApiError(response.status, code, message, field);
}

/**
 * Sends one request to the API.
 * @param request method, path, body and the schema of the expected response
 * @returns the response body, parsed by the schema
 * @throws ApiError for a network failure (status 0), an error status or an unexpected body
 */
export async function apiRequest<S extends z.ZodType>(request: ApiRequest<S>): Promise<z.infer<S>> {
  const token = request.authenticated === false ? null : hooks.getToken();
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (token) headers.Authorization = `Bearer ${token}`;
  if (request.body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(urlFor(request.path, request.query), {
      method: request.method ?? 'GET',
      headers,
      body: request.body === undefined ? undefined : JSON.stringify(request.body),
      signal: request.signal,
    });
  } catch (cause) {
    if ((cause as Error)?.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network_error', 'Cannot reach the Tallyrun server. Check the connection and try again.');
  }

  if (!response.ok) {
    const error = await errorFrom(response);
    // A 401 on a request that carried a token means the session is over (expired, revoked or
    // the user disabled). Sign-in itself carries none, so a wrong password stays on the form.
    if (response.status === 401 && token) hooks.onUnauthorized();
    throw error;
  }

  const body: unknown = response.status === 204 ? null : await response.json().catch(() => null);
  const parsed = request.schema.safeParse(body);
  if (!parsed.success) {
    throw new ApiError(
      response.status,
      'unexpected_response',
      `The server's answer to ${request.method ?? 'GET'} ${request.path} was not in the expected shape.`,
    );
  }
  return parsed.data;
}
