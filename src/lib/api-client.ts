/**
 * The one place that calls `fetch`. It sends the session cookie and the CSRF token, retries once when
 * the token has gone stale (after sign-in or sign-out), and turns the server's error body into an
 * `ApiError` the forms can read field by field.
 */

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
    readonly details: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

let csrfToken: string | null = null;
const unauthorizedListeners = new Set<() => void>();

/** Called whenever the server says the session is gone, so the app can send the user to sign-in. */
export function onUnauthorized(listener: () => void): () => void {
  unauthorizedListeners.add(listener);
  return () => unauthorizedListeners.delete(listener);
}

/** Sign-in and password change rotate the token and return the new one. */
export function setCsrfToken(token: string | null): void {
  csrfToken = token;
}

async function fetchCsrfToken(): Promise<string> {
  const response = await fetch('/api/auth/csrf', { credentials: 'same-origin' });
  const body = (await response.json()) as { csrfToken: string };
  csrfToken = body.csrfToken;
  return csrfToken;
}

async function toApiError(response: Response): Promise<ApiError> {
  const body = (await response.json().catch(() => null)) as {
    error?: { code?: string; message?: string; fields?: Record<string, string> } & Record<string, unknown>;
  } | null;
  const error = body?.error;
  if (!error) return new ApiError(response.status, 'http_error', `The server answered ${response.status} ${response.statusText}.`);
  const { code, message, fields, ...details } = error;
  return new ApiError(response.status, code ?? 'http_error', message ?? 'The request failed.', fields ?? {}, details);
}

async function send(method: Method, path: string, body: unknown, token: string | null): Promise<Response> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  // A FormData body (file uploads) sets its own multipart Content-Type with the boundary.
  const isForm = body instanceof FormData;
  if (body !== undefined && !isForm) headers['Content-Type'] = 'application/json';
  if (method !== 'GET' && token) headers['X-CSRF-Token'] = token;
  return fetch(`/api${path}`, {
    method,
    headers,
    credentials: 'same-origin',
    body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
  });
}

/** Sends a request to `/api{path}` and returns the parsed JSON body (undefined for 204). */
export async function apiRequest<T>(method: Method, path: string, body?: unknown): Promise<T> {
  const token = method === 'GET' ? null : (csrfToken ?? (await fetchCsrfToken()));
  let response = await send(method, path, body, token);
  if (response.status === 403 && method !== 'GET') {
    const error = await toApiError(response.clone());
    if (error.code === 'csrf_invalid') response = await send(method, path, body, await fetchCsrfToken());
  }
  if (!response.ok) {
    const error = await toApiError(response);
    if (response.status === 401 && !path.startsWith('/auth/')) unauthorizedListeners.forEach((listener) => listener());
    throw error;
  }
  if (response.status === 204) return undefined as T;
  return (await response.json()) as T;
}

export const api = {
  get: <T>(path: string) => apiRequest<T>('GET', path),
  post: <T>(path: string, body?: unknown) => apiRequest<T>('POST', path, body ?? {}),
  /** Posts files and fields as multipart/form-data. */
  postForm: <T>(path: string, form: FormData) => apiRequest<T>('POST', path, form),
  patch: <T>(path: string, body: unknown) => apiRequest<T>('PATCH', path, body),
  put: <T>(path: string, body: unknown) => apiRequest<T>('PUT', path, body),
  delete: <T>(path: string) => apiRequest<T>('DELETE', path),
};
