import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { ApiError, http, resetCsrfToken } from './http';

interface Sent {
  url: string;
  headers: Record<string, string>;
  body: unknown;
}

/**
 * A stand-in XMLHttpRequest: each send takes the next scripted outcome, reporting upload progress
 * first. The CSRF token still comes from the (stubbed) fetch, as in the app.
 */
function fakeXhr(outcomes: ({ status: number; body: unknown } | 'drop')[]) {
  const sent: Sent[] = [];
  class FakeXhr {
    status = 0;
    responseText = '';
    withCredentials = false;
    private url = '';
    private headers: Record<string, string> = {};
    private listeners = new Map<string, () => void>();
    readonly upload = {
      progress: null as ((e: ProgressEvent) => void) | null,
      addEventListener: (_type: 'progress', fn: (e: ProgressEvent) => void) => (this.upload.progress = fn),
    };
    open(_method: string, url: string) {
      this.url = url;
    }
    setRequestHeader(name: string, value: string) {
      this.headers[name] = value;
    }
    addEventListener(type: string, fn: () => void) {
      this.listeners.set(type, fn);
    }
    abort() {
      this.listeners.get('abort')?.();
    }
    send(body: unknown) {
      sent.push({ url: this.url, headers: { ...this.headers }, body });
      const outcome = outcomes.shift() ?? 'drop';
      queueMicrotask(() => {
        for (const loaded of [50, 100])
          this.upload.progress?.({ lengthComputable: true, loaded, total: 100 } as ProgressEvent);
        if (outcome === 'drop') return this.listeners.get('error')?.();
        this.status = outcome.status;
        this.responseText = JSON.stringify(outcome.body);
        this.listeners.get('load')?.();
      });
    }
  }
  vi.stubGlobal('XMLHttpRequest', FakeXhr);
  return sent;
}

function csrfTokens(...tokens: string[]) {
  const fetchMock = vi.fn(async () => Response.json({ token: tokens.shift() }));
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

describe('http upload', () => {
  beforeEach(() => resetCsrfToken());
  afterEach(() => vi.unstubAllGlobals());

  it('When a form is uploaded, then it carries the CSRF token from the shared helper, reports progress and returns the body', async () => {
    const fetchMock = csrfTokens('t1');
    const sent = fakeXhr([{ status: 201, body: { attachments: [{ id: 3 }] } }]);
    const form = new FormData();
    const progress: number[] = [];

    const result = await http.upload('/tickets/4/attachments', form, { onProgress: (p) => progress.push(p) });

    expect(result).toEqual({ attachments: [{ id: 3 }] });
    expect(sent).toEqual([
      {
        url: '/api/tickets/4/attachments',
        headers: { Accept: 'application/json', 'X-CSRF-Token': 't1' },
        body: form,
      },
    ]);
    expect(progress).toEqual([0.5, 1]);
    // A second upload reuses the token: fetched once.
    fakeXhr([{ status: 201, body: { attachments: [] } }]);
    await http.upload('/tickets/4/attachments', form);
    expect(fetchMock).toHaveBeenCalledTimes(1);
  });

  it('When the server says csrf_invalid, then a fresh token is fetched and the upload sent once more with it', async () => {
    csrfTokens('old', 'new');
    const sent = fakeXhr([
      { status: 403, body: { error: { code: 'csrf_invalid', message: 'Stale' } } },
      { status: 201, body: { attachments: [] } },
    ]);

    await http.upload('/tickets/4/attachments', new FormData());

    expect(sent.map((s) => s.headers['X-CSRF-Token'])).toEqual(['old', 'new']);
  });

  it('When the connection drops during the upload, then it throws an ApiError with status 0', async () => {
    csrfTokens('t1');
    fakeXhr(['drop']);
    const error = await http.upload('/tickets/4/attachments', new FormData()).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 0, code: 'network_error' });
  });

  it('When the server refuses the file, then its error body becomes the ApiError', async () => {
    csrfTokens('t1');
    fakeXhr([{ status: 413, body: { error: { code: 'too_large', message: 'Over 15 MB' } } }]);
    const error = await http.upload('/tickets/4/attachments', new FormData()).catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 413, code: 'too_large', message: 'Over 15 MB' });
  });
});
