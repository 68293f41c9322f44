import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { api, ApiError, buildUrl, resetUnauthorizedRedirect, setUnauthorizedHandler } from '../api-client';

function jsonResponse(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

describe('api client', () => {
  const fetchMock = vi.fn<typeof fetch>();

  beforeEach(() => {
    vi.stubGlobal('fetch', fetchMock);
    resetUnauthorizedRedirect();
  });

  afterEach(() => {
    fetchMock.mockReset();
    vi.unstubAllGlobals();
  });

  it('turns the server error body into an ApiError with status, code and fields', async () => {
    fetchMock.mockResolvedValueOnce(
      jsonResponse(400, { error: { code: 'VALIDATION', message: 'Check the form', fields: { email: 'E-mail is required' } } }),
    );

    const error = await api.patch('/api/members/u1', { status: 'active' }).catch((caught: unknown) => caught);

    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 400, code: 'VALIDATION', message: 'Check the form', fields: { email: 'E-mail is required' } });
  });

  it('sends cookies and JSON', async () => {
    fetchMock.mockResolvedValueOnce(jsonResponse(200, { ok: true }));
    await api.put('/api/farms/f1/members/u1', { farmRole: 'lead' });
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe('/api/farms/f1/members/u1');
    expect(init).toMatchObject({ method: 'PUT', credentials: 'include', body: JSON.stringify({ farmRole: 'lead' }) });
    expect((init?.headers as Record<string, string>)['Content-Type']).toBe('application/json');
  });

  it('gives a readable error when the body is not the API shape', async () => {
    fetchMock.mockResolvedValueOnce(new Response('<html>Bad gateway</html>', { status: 502 }));
    const error = await api.get('/api/members').catch((caught: unknown) => caught);
    expect(error).toMatchObject({ status: 502, code: 'HTTP_502', fields: {} });
    expect((error as ApiError).message).toMatch(/server/i);
  });

  it('reports a dropped connection as status 0', async () => {
    fetchMock.mockRejectedValueOnce(new TypeError('Failed to fetch'));
    await expect(api.get('/api/mail')).rejects.toMatchObject({ status: 0, code: 'NETWORK' });
  });

  it('returns nothing for 204', async () => {
    fetchMock.mockResolvedValueOnce(new Response(null, { status: 204 }));
    await expect(api.delete('/api/farms/f1/members/u1')).resolves.toBeUndefined();
  });

  it('sends the person to sign in once when several calls find the session gone', async () => {
    const handler = vi.fn();
    setUnauthorizedHandler(handler);
    fetchMock.mockImplementation(async () => jsonResponse(401, { error: { code: 'UNAUTHENTICATED', message: 'Sign in first' } }));

    await Promise.allSettled([api.get('/api/members'), api.get('/api/mail'), api.get('/api/farms')]);

    expect(handler).toHaveBeenCalledTimes(1);
  });

  it('does not redirect when /api/me says nobody is signed in', async () => {
    const handler = vi.fn();
    setUnauthorizedHandler(handler);
    fetchMock.mockResolvedValueOnce(jsonResponse(401, { error: { code: 'UNAUTHENTICATED', message: 'Sign in first' } }));

    await expect(api.get('/api/me')).rejects.toMatchObject({ status: 401 });
    expect(handler).not.toHaveBeenCalled();
  });

  it('leaves out empty query values', () => {
    expect(buildUrl('/api/members', { status: undefined, q: '', page: 2, pageSize: 25 })).toBe('/api/members?page=2&pageSize=25');
  });
});
