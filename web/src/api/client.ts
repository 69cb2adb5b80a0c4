// The one fetch wrapper. Every request goes through `request`; components never call fetch.
import { downloadBlob } from '@/download';

export const API_BASE = '/api/v1';

/** Field path → message, as sent in a 422 `validation_error`. */
export type FieldErrors = Record<string, string>;

/** A failed API call, typed after the server's error shape `{ code, message, details? }`. */
export class ApiError extends Error {
  override readonly name = 'ApiError';
  constructor(
    /** HTTP status; 0 when the server could not be reached. */
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: FieldErrors | undefined = undefined,
    /** Seconds from a Retry-After header (429). */
    readonly retryAfter: number | undefined = undefined,
    /** The whole error body (a 409 for a stale copy carries the server's `current` copy). */
    readonly body: unknown = undefined,
  ) {
    super(message);
  }

  get isValidation(): boolean {
    return this.code === 'validation_error' && this.details !== undefined;
  }
}

type TokenSource = () => string | null;
type UnauthorizedHandler = (error: ApiError) => void;

let tokenSource: TokenSource = () => null;
let onUnauthorized: UnauthorizedHandler | null = null;

/** The auth store tells the client where the token lives (avoids a store ↔ client cycle). */
export function setTokenSource(source: TokenSource): void {
  tokenSource = source;
}

/** Called for a 401 on a request that carried a token: the session has ended. */
export function setUnauthorizedHandler(handler: UnauthorizedHandler | null): void {
  onUnauthorized = handler;
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  /** A multipart body (file uploads) instead of JSON. */
  form?: FormData;
  query?: Record<string, string | number | undefined | null>;
  signal?: AbortSignal;
}

const FALLBACK_MESSAGES: Record<number, string> = {
  400: 'The request was not understood.',
  401: 'Please sign in again.',
  403: 'You do not have permission to do that.',
  404: 'Not found.',
  409: 'That conflicts with existing data.',
  413: 'That is too large to upload.',
  422: 'Please check the highlighted fields.',
  429: 'Too many attempts. Please wait a moment and try again.',
};

function fallbackCode(status: number): string {
  if (status >= 500) return 'internal_error';
  return 'http_error';
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function toFieldErrors(value: unknown): FieldErrors | undefined {
  if (!isRecord(value)) return undefined;
  const out: FieldErrors = {};
  for (const [key, message] of Object.entries(value)) {
    if (typeof message === 'string') out[key] = message;
    else if (Array.isArray(message) && typeof message[0] === 'string') out[key] = message[0];
  }
  return out;
}

function parseRetryAfter(header: string | null): number | undefined {
  if (header === null) return undefined;
  const seconds = Number(header);
  return Number.isFinite(seconds) && seconds >= 0 ? seconds : undefined;
}

/** Turns a non-2xx response into an ApiError, whatever its body looks like. */
export async function errorFromResponse(response: Response): Promise<ApiError> {
  let body: unknown = undefined;
  try {
    body = await response.json();
  } catch {
    // Not JSON (a proxy's HTML page, an empty body): fall back to a message by status.
  }
  const status = response.status;
  const retryAfter = parseRetryAfter(response.headers.get('Retry-After'));
  if (isRecord(body) && typeof body.code === 'string' && typeof body.message === 'string') {
    return new ApiError(
      status,
      body.code,
      body.message,
      toFieldErrors(body.details),
      retryAfter,
      body,
    );
  }
  const message =
    FALLBACK_MESSAGES[status] ??
    (status >= 500
      ? 'Something went wrong on our side. Please try again.'
      : `Request failed (${status}).`);
  return new ApiError(status, fallbackCode(status), message, undefined, retryAfter);
}

function buildUrl(path: string, query: RequestOptions['query']): string {
  let url = API_BASE + path;
  if (query) {
    const params = new URLSearchParams();
    for (const [key, value] of Object.entries(query)) {
      if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
    }
    const qs = params.toString();
    if (qs) url += `?${qs}`;
  }
  return url;
}

/** Sends a request to the API; resolves with the parsed JSON (undefined for 204), throws ApiError. */
export async function request<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const token = tokenSource();
  if (token) headers.Authorization = `Bearer ${token}`;
  let body: string | FormData | undefined;
  if (options.form !== undefined) {
    body = options.form; // the browser sets the multipart boundary
  } else if (options.body instanceof FormData) {
    // A file upload: the browser writes the multipart Content-Type with its boundary.
    body = options.body;
  } else if (options.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(options.body);
  }

  let response: Response;
  try {
    response = await fetch(buildUrl(path, options.query), {
      method: options.method ?? 'GET',
      headers,
      body,
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(
      0,
      'network_error',
      'Could not reach the server. Check your connection and try again.',
    );
  }

  if (!response.ok) {
    const error = await errorFromResponse(response);
    if (error.status === 401 && token && onUnauthorized) onUnauthorized(error);
    throw error;
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  if (text === '') return undefined as T;
  try {
    return JSON.parse(text) as T;
  } catch {
    throw new ApiError(
      response.status,
      'bad_response',
      'The server sent a reply we could not read.',
    );
  }
}

/** Fetches a binary answer (an image) with the session's token; throws ApiError like request(). */
export async function requestBlob(path: string, options: RequestOptions = {}): Promise<Blob> {
  const headers: Record<string, string> = {};
  const token = tokenSource();
  if (token) headers.Authorization = `Bearer ${token}`;
  let response: Response;
  try {
    response = await fetch(buildUrl(path, options.query), { headers, signal: options.signal });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network_error', 'Could not reach the server.');
  }
  if (!response.ok) {
    const error = await errorFromResponse(response);
    if (error.status === 401 && token && onUnauthorized) onUnauthorized(error);
    throw error;
  }
  return response.blob();
}

/** Downloads a file the API makes (an export) and hands it to the browser under its name. */
export async function download(
  path: string,
  query: RequestOptions['query'],
  fallbackName: string,
): Promise<void> {
  const headers: Record<string, string> = {};
  const token = tokenSource();
  if (token) headers.Authorization = `Bearer ${token}`;
  let response: Response;
  try {
    response = await fetch(buildUrl(path, query), { headers });
  } catch {
    throw new ApiError(0, 'network_error', 'Could not reach the server. Check your connection.');
  }
  if (!response.ok) throw await errorFromResponse(response);
  const name =
    /filename="([^"]+)"/.exec(response.headers.get('Content-Disposition') ?? '')?.[1] ??
    fallbackName;
  downloadBlob(name, await response.blob());
}

/** A message fit to show a person, for any thrown value. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof Error) return error.message;
  return 'Something went wrong.';
}

/** Fetches a file from the API (a PDF): resolves with its bytes and name, throws ApiError. */
export async function requestFile(
  path: string,
  signal?: AbortSignal,
): Promise<{ blob: Blob; filename: string | null }> {
  const headers: Record<string, string> = {};
  const token = tokenSource();
  if (token) headers.Authorization = `Bearer ${token}`;
  let response: Response;
  try {
    response = await fetch(buildUrl(path, undefined), { headers, signal });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(
      0,
      'network_error',
      'Could not reach the server. Check your connection and try again.',
    );
  }
  if (!response.ok) {
    const error = await errorFromResponse(response);
    if (error.status === 401 && token && onUnauthorized) onUnauthorized(error);
    throw error;
  }
  const disposition = response.headers.get('Content-Disposition') ?? '';
  const filename = /filename="([^"]+)"/.exec(disposition)?.[1] ?? null;
  return { blob: await response.blob(), filename };
}
