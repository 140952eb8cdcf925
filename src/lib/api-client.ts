/**
 * The one way the client talks to the Nestkeeper API: same-origin fetch with
 * the session cookie, JSON in and out, the CSRF header on every write, and the
 * server's error body `{error:{code,message,details}}` turned into an ApiError.
 */

import { noticeDatabaseAway } from './database-outage';

export type FieldErrors = Record<string, string>;

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: unknown;
  /** Per-field messages from `details.fields`, keyed by the payload's field name. */
  readonly fieldErrors: FieldErrors;
  /** The request id on the server's log lines for this request (`error.ref`), shown with a server fault so support can find it. */
  readonly ref: string | undefined;

  constructor(init: { status: number; code: string; message: string; details?: unknown; ref?: string }) {
    // A fault on the server's side names its ref; a refusal the person can fix (4xx) or the database outage (the banner) does not need one.
    super(init.ref && init.status >= 500 && init.code !== 'unavailable' ? `${init.message} (error ref ${init.ref})` : init.message);
    this.name = 'ApiError';
    this.status = init.status;
    this.code = init.code;
    this.details = init.details;
    this.fieldErrors = readFieldErrors(init.details);
    this.ref = init.ref;
  }

  /** The server is up but cannot reach its database; the outage banner speaks for it. */
  get isDatabaseAway(): boolean {
    return this.status === 503 && this.code === 'unavailable';
  }

  get isClientError(): boolean {
    return this.status >= 400 && this.status < 500;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

/** Accepts `{fields: {name: "msg"}}` or `{fields: {name: ["msg", …]}}`. */
function readFieldErrors(details: unknown): FieldErrors {
  if (!details || typeof details !== 'object' || !('fields' in details)) return {};
  const fields = (details as { fields: unknown }).fields;
  if (!fields || typeof fields !== 'object') return {};
  const out: FieldErrors = {};
  for (const [name, value] of Object.entries(fields as Record<string, unknown>)) {
    const message = Array.isArray(value) ? value.find((v) => typeof v === 'string') : value;
    if (typeof message === 'string' && message) out[name] = message;
  }
  return out;
}

export const csrfCookieName = 'nk_csrf';

/** The double-submit token the server wants echoed on every write (the field outbox sends with it too). */
export const csrfToken = (): string | undefined => readCookie(csrfCookieName);

function readCookie(name: string): string | undefined {
  if (typeof document === 'undefined') return undefined;
  for (const part of document.cookie.split(';')) {
    const [key, ...rest] = part.trim().split('=');
    if (key === name) return decodeURIComponent(rest.join('='));
  }
  return undefined;
}

type Query = Record<string, string | number | boolean | null | undefined>;

export interface RequestOptions {
  query?: Query;
  body?: unknown;
  signal?: AbortSignal;
}

function buildUrl(path: string, query?: Query): string {
  const url = path.startsWith('/api') ? path : `/api${path.startsWith('/') ? '' : '/'}${path}`;
  if (!query) return url;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null) params.set(key, String(value));
  }
  const qs = params.toString();
  return qs ? `${url}?${qs}` : url;
}

async function readErrorBody(response: Response): Promise<ApiError> {
  let body: unknown;
  try {
    body = await response.json();
  } catch {
    body = undefined;
  }
  return apiErrorFromBody(response.status, body, response.headers.get('Retry-After'), response.headers.get('X-Request-Id'));
}

export function apiErrorFromBody(status: number, body: unknown, retryAfter: string | null = null, requestId: string | null = null): ApiError {
  const response = { status };
  const error = (body as { error?: { code?: unknown; message?: unknown; details?: unknown; ref?: unknown } } | undefined)?.error;
  const ref = typeof error?.ref === 'string' ? error.ref : (requestId ?? undefined);
  const apiError =
    error && typeof error.code === 'string'
      ? new ApiError({
          status: response.status,
          code: error.code,
          message: typeof error.message === 'string' && error.message ? error.message : fallbackMessage(response.status),
          details: error.details,
          ref,
        })
      : new ApiError({ status: response.status, code: 'http_error', message: fallbackMessage(response.status), ref });
  if (apiError.isDatabaseAway) noticeDatabaseAway(Number(retryAfter));
  return apiError;
}

function fallbackMessage(status: number): string {
  if (status === 401) return 'You are not signed in.';
  if (status === 403) return 'Your role does not allow this.';
  if (status === 404) return 'That was not found.';
  if (status === 429) return 'Too many attempts. Wait a minute and try again.';
  if (status >= 500) return 'The server could not finish that. Try again in a moment.';
  return `The request failed (HTTP ${status}).`;
}

export async function request<T>(method: string, path: string, options: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';
  if (method !== 'GET' && method !== 'HEAD') {
    const csrf = readCookie(csrfCookieName);
    if (csrf) headers['X-CSRF-Token'] = csrf;
  }

  let response: Response;
  try {
    response = await fetch(buildUrl(path, options.query), {
      method,
      headers,
      credentials: 'include',
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError({
      status: 0,
      code: 'network_error',
      message: 'Could not reach the Nestkeeper server. Check the connection and try again.',
    });
  }

  if (!response.ok) throw await readErrorBody(response);
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

export const apiClient = {
  get: <T>(path: string, options?: Omit<RequestOptions, 'body'>) => request<T>('GET', path, options),
  post: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'body'>) => request<T>('POST', path, { ...options, body }),
  patch: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'body'>) => request<T>('PATCH', path, { ...options, body }),
  put: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'body'>) => request<T>('PUT', path, { ...options, body }),
  delete: <T>(path: string, options?: Omit<RequestOptions, 'body'>) => request<T>('DELETE', path, options),
};

export interface UploadOptions {
  query?: Query;
  /** Sent as the request's Content-Type (the file is the raw body). */
  contentType?: string;
  /** Called with 0…1 as the body goes up. */
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
}

/**
 * POSTs a file as the raw request body with upload progress (fetch cannot
 * report upload progress, XMLHttpRequest can). Same cookie, CSRF header and
 * error shape as `request`.
 */
export function uploadFile<T>(path: string, file: Blob, options: UploadOptions = {}): Promise<T> {
  return sendWithProgress<T>(path, file, options.contentType ?? (file.type || 'application/octet-stream'), options);
}

/**
 * POSTs a multipart form (text fields and files) with upload progress; the
 * browser writes the multipart boundary itself.
 */
export function uploadForm<T>(path: string, form: FormData, options: Omit<UploadOptions, 'contentType'> = {}): Promise<T> {
  return sendWithProgress<T>(path, form, undefined, options);
}

function sendWithProgress<T>(path: string, body: Blob | FormData, contentType: string | undefined, options: Omit<UploadOptions, 'contentType'>): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', buildUrl(path, options.query));
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    if (contentType) xhr.setRequestHeader('Content-Type', contentType);
    const csrf = readCookie(csrfCookieName);
    if (csrf) xhr.setRequestHeader('X-CSRF-Token', csrf);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) options.onProgress?.(event.loaded / event.total);
    };
    xhr.onload = () => {
      let parsed: unknown;
      try {
        parsed = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        parsed = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        options.onProgress?.(1);
        resolve(parsed as T);
      } else reject(apiErrorFromBody(xhr.status, parsed, xhr.getResponseHeader('Retry-After'), xhr.getResponseHeader('X-Request-Id')));
    };
    xhr.onerror = () =>
      reject(
        new ApiError({
          status: 0,
          code: 'network_error',
          message: 'Could not reach the Nestkeeper server. Check the connection and try again.',
        }),
      );
    xhr.onabort = () => reject(new DOMException('Upload cancelled', 'AbortError'));
    options.signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(body);
  });
}

/** A same-origin API address with a query string (for links: CSV exports, PDFs). */
export function apiUrl(path: string, query?: Query): string {
  return buildUrl(path, query);
}
