import type { ApiErrorBody } from '@meritline/shared';
import { markSignedOut } from './signed-in';

const BASE_URL = '/api';

export class ApiError extends Error {
  readonly status: number;
  readonly body: ApiErrorBody;

  constructor(body: ApiErrorBody) {
    super(body.message);
    this.name = 'ApiError';
    this.status = body.statusCode;
    this.body = body;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  /** JSON-encoded, except FormData, which goes as multipart (file uploads). */
  body?: unknown;
  signal?: AbortSignal;
  /** `blob` for downloads such as CSV templates; JSON otherwise. */
  responseType?: 'json' | 'blob';
  /** Public calls (sign-in, accepting an invitation): their 401 is an answer, not an expired session. */
  public?: boolean;
  /** A password re-entered to sign: its 401 means a wrong password, not an expired session. */
  passwordCheck?: boolean;
}

const UNREACHABLE: ApiErrorBody = {
  statusCode: 0,
  message: 'The server could not be reached. Check the network connection and try again.',
};

async function readErrorBody(response: Response): Promise<ApiErrorBody> {
  try {
    const body = (await response.json()) as Partial<ApiErrorBody>;
    if (typeof body.message === 'string') return { ...body, statusCode: response.status, message: body.message };
  } catch {
    // not JSON: fall through to a generic message
  }
  return { statusCode: response.status, message: `The server answered with an error (${response.status}).` };
}

export async function apiRequest<T>(path: string, options: RequestOptions = {}): Promise<T> {
  // The session cookie goes with every call; the server takes a change signed in by it only with this header.
  const headers: Record<string, string> = { Accept: 'application/json', 'X-Requested-With': 'meritline' };
  const isForm = typeof FormData !== 'undefined' && options.body instanceof FormData;
  if (options.body !== undefined && !isForm) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(`${BASE_URL}${path}`, {
      method: options.method ?? 'GET',
      headers,
      body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(UNREACHABLE);
  }

  if (!response.ok) {
    const body = await readErrorBody(response);
    // Signing out here sends every protected route back to sign-in, remembering where the user was.
    if (response.status === 401 && !options.public && !options.passwordCheck) markSignedOut();
    throw new ApiError(body);
  }

  if (options.responseType === 'blob') return (await response.blob()) as T;
  if (response.status === 204 || response.headers.get('Content-Length') === '0') return undefined as T;
  return (await response.json()) as T;
}

export const api = {
  get: <T>(path: string, options?: Omit<RequestOptions, 'method' | 'body'>) => apiRequest<T>(path, options),
  post: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'POST', body }),
  put: <T>(path: string, body: unknown, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'PUT', body }),
  patch: <T>(path: string, body: unknown, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'PATCH', body }),
  delete: <T>(path: string, options?: Omit<RequestOptions, 'method' | 'body'>) => apiRequest<T>(path, { ...options, method: 'DELETE' }),
  download: (path: string, options?: Omit<RequestOptions, 'method' | 'body' | 'responseType'>) =>
    apiRequest<Blob>(path, { ...options, responseType: 'blob' }),
};
