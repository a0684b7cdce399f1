// The one fetch wrapper: JSON in and out, same-origin cookies, the CSRF header on every change,
// one error type (ApiError) and one path for a lost session (401).
import type { ApiError as ApiErrorBody } from '@shared/schemas/common';
import { i18n } from '@/i18n';

const BASE = '/api';
const CSRF_HEADER = 'X-CSRF-Token';
const MUTATING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
/** A 401 from these means "not signed in" or "wrong password", not "your session ended". */
const OWN_401_PATHS = new Set(['/auth/me', '/auth/login', '/auth/logout']);

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
export type Query = Record<string, string | number | boolean | null | undefined>;

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;

  constructor(status: number, code: string, message: string, fields: Record<string, string> = {}) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

let csrfToken: Promise<string> | null = null;
let onUnauthenticated: (() => void) | null = null;

/** Who to call when the server says the session is gone (set once by the router). */
export function setUnauthenticatedHandler(handler: (() => void) | null): void {
  onUnauthenticated = handler;
}

/** Forget the CSRF token (after sign-out the session, and so the token, is new). */
export function resetCsrfToken(): void {
  csrfToken = null;
}

function csrf(): Promise<string> {
  csrfToken ??= send('GET', '/auth/csrf').then(async (res) => {
    if (!res.ok) throw await toApiError(res);
    return ((await res.json()) as { token: string }).token;
  });
  // A failed fetch must not stay cached.
  csrfToken.catch(() => resetCsrfToken());
  return csrfToken;
}

function url(path: string, query?: Query): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query ?? {})) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const search = params.toString();
  return `${BASE}${path}${search ? `?${search}` : ''}`;
}

async function send(method: Method, path: string, init: RequestInit = {}, query?: Query) {
  try {
    return await fetch(url(path, query), { ...init, method, credentials: 'same-origin' });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network_error', i18n.global.t('errors.network'));
  }
}

/** The API's error body. Checked by hand: zod would triple the size of the first page load. */
function isErrorBody(body: unknown): body is ApiErrorBody {
  const error = (body as { error?: unknown } | null)?.error as Record<string, unknown> | undefined;
  if (typeof error !== 'object' || error === null) return false;
  const { code, message, fields } = error;
  return (
    typeof code === 'string' &&
    typeof message === 'string' &&
    (fields === undefined || (typeof fields === 'object' && fields !== null))
  );
}

async function toApiError(res: Response): Promise<ApiError> {
  const body: unknown = await res.json().catch(() => null);
  if (isErrorBody(body)) {
    const { code, message, fields } = body.error;
    return new ApiError(res.status, code, message, fields);
  }
  return new ApiError(res.status, 'http_error', i18n.global.t('errors.unexpected', { status: res.status }));
}

export interface RequestOptions {
  body?: unknown;
  query?: Query;
  signal?: AbortSignal;
}

export async function request<T>(method: Method, path: string, options: RequestOptions = {}): Promise<T> {
  const attempt = async () => {
    const headers: Record<string, string> = { Accept: 'application/json' };
    const isForm = typeof FormData !== 'undefined' && options.body instanceof FormData;
    if (options.body !== undefined && !isForm) headers['Content-Type'] = 'application/json';
    if (MUTATING.has(method)) headers[CSRF_HEADER] = await csrf();
    const init: RequestInit = { headers };
    if (options.body !== undefined)
      init.body = isForm ? (options.body as FormData) : JSON.stringify(options.body);
    if (options.signal) init.signal = options.signal;
    return send(method, path, init, options.query);
  };

  let res = await attempt();
  let error = res.ok ? null : await toApiError(res);
  if (error?.code === 'csrf_invalid') {
    resetCsrfToken();
    res = await attempt();
    error = res.ok ? null : await toApiError(res);
  }
  if (error) {
    if (error.status === 401 && !OWN_401_PATHS.has(path)) onUnauthenticated?.();
    throw error;
  }
  if (res.status === 204) return undefined as T;
  return (await res.json()) as T;
}

export interface UploadOptions {
  /** Called with the share of the body sent so far, 0 to 1. */
  onProgress?: (sent: number) => void;
  signal?: AbortSignal;
}

/** One multipart POST through XMLHttpRequest: fetch cannot report upload progress. */
function sendForm(path: string, form: FormData, token: string, options: UploadOptions) {
  return new Promise<Response>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    const abort = () => xhr.abort();
    const done = () => options.signal?.removeEventListener('abort', abort);
    xhr.open('POST', url(path));
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader(CSRF_HEADER, token);
    xhr.upload.addEventListener('progress', (e) => {
      if (e.lengthComputable && e.total > 0) options.onProgress?.(e.loaded / e.total);
    });
    xhr.addEventListener('load', () => {
      done();
      if (xhr.status < 200 || xhr.status > 599) {
        reject(new ApiError(0, 'network_error', i18n.global.t('errors.network')));
        return;
      }
      const body = xhr.status === 204 ? null : xhr.responseText;
      resolve(new Response(body, { status: xhr.status }));
    });
    xhr.addEventListener('error', () => {
      done();
      reject(new ApiError(0, 'network_error', i18n.global.t('errors.network')));
    });
    xhr.addEventListener('timeout', () => {
      done();
      reject(new ApiError(0, 'network_error', i18n.global.t('errors.network')));
    });
    xhr.addEventListener('abort', () => {
      done();
      reject(new DOMException('The upload was stopped', 'AbortError'));
    });
    if (options.signal?.aborted) return abort();
    options.signal?.addEventListener('abort', abort);
    xhr.send(form);
  });
}

/** POST a form with files, reporting progress; same CSRF, errors and 401 path as `request`. */
export async function upload<T>(path: string, form: FormData, options: UploadOptions = {}): Promise<T> {
  let res = await sendForm(path, form, await csrf(), options);
  let error = res.ok ? null : await toApiError(res);
  if (error?.code === 'csrf_invalid') {
    resetCsrfToken();
    res = await sendForm(path, form, await csrf(), options);
    error = res.ok ? null : await toApiError(res);
  }
  if (error) {
    if (error.status === 401) onUnauthenticated?.();
    throw error;
  }
  return (await res.json()) as T;
}

export const http = {
  get: <T>(path: string, query?: Query, signal?: AbortSignal) =>
    request<T>('GET', path, signal ? { query, signal } : { query }),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, { body }),
  put: <T>(path: string, body?: unknown) => request<T>('PUT', path, { body }),
  patch: <T>(path: string, body?: unknown) => request<T>('PATCH', path, { body }),
  delete: <T>(path: string) => request<T>('DELETE', path),
  upload,
};
