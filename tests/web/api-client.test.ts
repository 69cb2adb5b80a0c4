import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import {
  ApiError,
  errorMessage,
  request,
  setTokenSource,
  setUnauthorizedHandler,
} from '../../web/src/api/client';

type FetchArgs = [input: string, init: RequestInit];

function jsonResponse(
  status: number,
  body: unknown,
  headers: Record<string, string> = {},
): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json', ...headers },
  });
}

let fetchMock: ReturnType<typeof vi.fn<(...args: FetchArgs) => Promise<Response>>>;

beforeEach(() => {
  fetchMock = vi.fn<(...args: FetchArgs) => Promise<Response>>();
  vi.stubGlobal('fetch', fetchMock);
  setTokenSource(() => null);
  setUnauthorizedHandler(null);
});

afterEach(() => {
  vi.unstubAllGlobals();
});

async function caught(promise: Promise<unknown>): Promise<ApiError> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof ApiError) return error;
    throw new Error(`expected an ApiError, got ${String(error)}`, { cause: error });
  }
  throw new Error('expected the request to fail');
}

describe('request', () => {
  it('prefixes /api/v1, sends JSON and returns the parsed body', async () => {
    fetchMock.mockResolvedValue(jsonResponse(201, { id: 'p1', name: 'Weir outlet' }));
    const result = await request<{ id: string; name: string }>('/projects', {
      method: 'POST',
      body: { name: 'Weir outlet', units: 'SI' },
    });
    expect(result).toEqual({ id: 'p1', name: 'Weir outlet' });
    const [url, init] = fetchMock.mock.calls[0]!;
    expect(url).toBe('/api/v1/projects');
    expect(init.method).toBe('POST');
    expect(init.body).toBe(JSON.stringify({ name: 'Weir outlet', units: 'SI' }));
    const headers = init.headers as Record<string, string>;
    expect(headers['Content-Type']).toBe('application/json');
    expect(headers.Authorization).toBeUndefined();
  });

  it('adds the bearer token when there is one', async () => {
    setTokenSource(() => 'tok-123');
    fetchMock.mockResolvedValue(jsonResponse(200, { items: [] }));
    await request('/members');
    const headers = fetchMock.mock.calls[0]![1].headers as Record<string, string>;
    expect(headers.Authorization).toBe('Bearer tok-123');
  });

  it('builds the query string and leaves out empty values', async () => {
    fetchMock.mockResolvedValue(jsonResponse(200, { items: [], total: 0, page: 2, pageSize: 20 }));
    await request('/projects', {
      query: { search: 'mill pond', page: 2, sort: undefined, order: '' },
    });
    expect(fetchMock.mock.calls[0]![0]).toBe('/api/v1/projects?search=mill+pond&page=2');
  });

  it('resolves undefined for 204 No Content', async () => {
    fetchMock.mockResolvedValue(new Response(null, { status: 204 }));
    await expect(request('/projects/p1', { method: 'DELETE' })).resolves.toBeUndefined();
  });

  it('turns a 422 into an ApiError carrying the field details', async () => {
    fetchMock.mockResolvedValue(
      jsonResponse(422, {
        code: 'validation_error',
        message: 'Please correct the highlighted fields.',
        details: { name: 'Enter a project name.', units: 'Choose SI or US customary units.' },
      }),
    );
    const error = await caught(request('/projects', { method: 'POST', body: {} }));
    expect(error.status).toBe(422);
    expect(error.code).toBe('validation_error');
    expect(error.message).toBe('Please correct the highlighted fields.');
    expect(error.details).toEqual({
      name: 'Enter a project name.',
      units: 'Choose SI or US customary units.',
    });
    expect(error.isValidation).toBe(true);
  });

  it('keeps the code of a 403 plan limit', async () => {
    fetchMock.mockResolvedValue(
      jsonResponse(403, {
        code: 'plan_limit',
        message: 'The Concept plan holds up to 3 projects.',
      }),
    );
    const error = await caught(request('/projects', { method: 'POST', body: {} }));
    expect(error.status).toBe(403);
    expect(error.code).toBe('plan_limit');
    expect(error.details).toBeUndefined();
    expect(error.isValidation).toBe(false);
  });

  it('reads Retry-After on a 429', async () => {
    fetchMock.mockResolvedValue(
      jsonResponse(
        429,
        { code: 'rate_limited', message: 'Too many attempts.' },
        { 'Retry-After': '120' },
      ),
    );
    const error = await caught(request('/auth/login', { method: 'POST', body: {} }));
    expect(error.code).toBe('rate_limited');
    expect(error.retryAfter).toBe(120);
  });

  it('gives a readable error when the body is not the API error shape', async () => {
    fetchMock.mockResolvedValue(new Response('<html>Bad gateway</html>', { status: 502 }));
    const error = await caught(request('/projects'));
    expect(error.status).toBe(502);
    expect(error.code).toBe('internal_error');
    expect(error.message).toMatch(/went wrong/i);
  });

  it('reports a network failure as status 0', async () => {
    fetchMock.mockRejectedValue(new TypeError('Failed to fetch'));
    const error = await caught(request('/projects'));
    expect(error.status).toBe(0);
    expect(error.code).toBe('network_error');
    expect(errorMessage(error)).toMatch(/could not reach the server/i);
  });

  it('calls the unauthorized handler on a 401 for a request that carried a token', async () => {
    const handler = vi.fn();
    setUnauthorizedHandler(handler);
    setTokenSource(() => 'expired');
    fetchMock.mockResolvedValue(
      jsonResponse(401, { code: 'unauthorized', message: 'Please sign in again.' }),
    );
    const error = await caught(request('/projects'));
    expect(error.status).toBe(401);
    expect(handler).toHaveBeenCalledTimes(1);
    expect(handler.mock.calls[0]![0]).toBe(error);
  });

  it('does not call the unauthorized handler for a failed sign-in (no token sent)', async () => {
    const handler = vi.fn();
    setUnauthorizedHandler(handler);
    fetchMock.mockResolvedValue(
      jsonResponse(401, { code: 'unauthorized', message: 'Incorrect e-mail or password.' }),
    );
    const error = await caught(request('/auth/login', { method: 'POST', body: {} }));
    expect(error.message).toBe('Incorrect e-mail or password.');
    expect(handler).not.toHaveBeenCalled();
  });
});
