// A local stand-in for a Meilisearch server (none can run here), speaking the shapes of its
// documented HTTP API for what Lightoff uses: health, index settings, documents (add, delete,
// list), index stats, tasks, search and multi-search. It keeps documents in memory, records every
// request, and answers searches with a deliberately plain matcher (every query word somewhere in
// the searchable text) so tests can see the engine's requests and how it maps the answers.
import { createServer, type IncomingMessage, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';

export interface RecordedRequest {
  method: string;
  path: string;
  query: Record<string, string>;
  body: unknown;
}

type Doc = Record<string, unknown> & { id: number };

interface SearchBody {
  indexUid?: string;
  q?: string;
  filter?: string;
  facets?: string[];
  limit?: number;
  offset?: number;
  attributesToRetrieve?: string[];
  attributesToHighlight?: string[];
  attributesToCrop?: string[];
  attributesToSearchOn?: string[];
  highlightPreTag?: string;
  highlightPostTag?: string;
  showRankingScore?: boolean;
}

export class FakeMeilisearch {
  readonly requests: RecordedRequest[] = [];
  readonly documents = new Map<string, Map<number, Doc>>();
  readonly settings = new Map<string, Record<string, unknown>>();
  /** When set, every request answers this status with a Meilisearch error body. */
  failWith: number | null = null;
  /** How searches report their total: `estimatedTotalHits` (offset/limit) or `totalHits` (pages). */
  totalAs: 'estimatedTotalHits' | 'totalHits' = 'estimatedTotalHits';
  private tasks = new Map<number, Record<string, unknown>>();
  private nextTask = 0;
  private server: Server | null = null;
  url = '';

  async start(): Promise<this> {
    this.server = createServer((req, res) => {
      void this.handle(req).then(
        ({ status, body }) => {
          res.writeHead(status, { 'content-type': 'application/json' });
          res.end(body === undefined ? '' : JSON.stringify(body));
        },
        (err: Error) => {
          res.writeHead(500, { 'content-type': 'application/json' });
          res.end(JSON.stringify({ message: err.message, code: 'internal', type: 'internal', link: '' }));
        },
      );
    });
    await new Promise<void>((resolve) => this.server!.listen(0, '127.0.0.1', resolve));
    this.url = `http://127.0.0.1:${(this.server.address() as AddressInfo).port}`;
    return this;
  }

  async stop(): Promise<void> {
    this.server?.closeAllConnections();
    await new Promise<void>((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }

  /** The recorded requests of one method and path pattern (e.g. 'POST', /\/documents$/). */
  requestsTo(method: string, path: RegExp): RecordedRequest[] {
    return this.requests.filter((r) => r.method === method && path.test(r.path));
  }

  docs(index: string): Map<number, Doc> {
    let docs = this.documents.get(index);
    if (!docs) this.documents.set(index, (docs = new Map()));
    return docs;
  }

  private enqueue(indexUid: string | null, type: string) {
    const uid = this.nextTask++;
    const at = new Date().toISOString();
    const task = { uid, indexUid, status: 'succeeded', type, enqueuedAt: at, startedAt: at, finishedAt: at };
    this.tasks.set(uid, task);
    return { status: 202, body: { taskUid: uid, indexUid, status: 'enqueued', type, enqueuedAt: at } };
  }

  private async handle(req: IncomingMessage): Promise<{ status: number; body?: unknown }> {
    const url = new URL(req.url ?? '/', 'http://fake');
    const chunks: Buffer[] = [];
    for await (const chunk of req) chunks.push(chunk as Buffer);
    const text = Buffer.concat(chunks).toString('utf8');
    const body: unknown = text ? JSON.parse(text) : undefined;
    const method = req.method ?? 'GET';
    this.requests.push({ method, path: url.pathname, query: Object.fromEntries(url.searchParams), body });
    if (this.failWith)
      return {
        status: this.failWith,
        body: { message: 'unavailable', code: 'internal', type: 'internal', link: '' },
      };

    const route = `${method} ${url.pathname}`;
    let m: RegExpMatchArray | null;
    if (route === 'GET /health') return { status: 200, body: { status: 'available' } };
    if ((m = route.match(/^GET \/tasks\/(\d+)$/))) {
      const task = this.tasks.get(Number(m[1]));
      return task ? { status: 200, body: task } : { status: 404, body: { message: 'no such task' } };
    }
    if ((m = route.match(/^PATCH \/indexes\/([^/]+)\/settings$/))) {
      this.settings.set(m[1]!, { ...this.settings.get(m[1]!), ...(body as object) });
      this.docs(m[1]!);
      return this.enqueue(m[1]!, 'settingsUpdate');
    }
    if ((m = route.match(/^POST \/indexes\/([^/]+)\/documents$/))) {
      const docs = this.docs(m[1]!);
      for (const doc of body as Doc[]) docs.set(Number(doc.id), doc);
      return this.enqueue(m[1]!, 'documentAdditionOrUpdate');
    }
    if ((m = route.match(/^POST \/indexes\/([^/]+)\/documents\/delete-batch$/))) {
      const docs = this.docs(m[1]!);
      for (const id of body as number[]) docs.delete(Number(id));
      return this.enqueue(m[1]!, 'documentDeletion');
    }
    if ((m = route.match(/^GET \/indexes\/([^/]+)\/documents$/))) {
      const all = [...this.docs(m[1]!).values()].sort((a, b) => a.id - b.id);
      const offset = Number(url.searchParams.get('offset') ?? 0);
      const limit = Number(url.searchParams.get('limit') ?? 20);
      const fields = url.searchParams.get('fields')?.split(',');
      const results = all.slice(offset, offset + limit).map((d) => (fields ? pick(d, fields) : d));
      return { status: 200, body: { results, offset, limit, total: all.length } };
    }
    if ((m = route.match(/^GET \/indexes\/([^/]+)\/stats$/))) {
      return {
        status: 200,
        body: { numberOfDocuments: this.docs(m[1]!).size, isIndexing: false, fieldDistribution: {} },
      };
    }
    if ((m = route.match(/^POST \/indexes\/([^/]+)\/search$/)))
      return { status: 200, body: this.search(m[1]!, body as SearchBody) };
    if (route === 'POST /multi-search') {
      const { queries } = body as { queries: SearchBody[] };
      return {
        status: 200,
        body: { results: queries.map((q) => ({ indexUid: q.indexUid, ...this.search(q.indexUid!, q) })) },
      };
    }
    return {
      status: 404,
      body: { message: `no route ${route}`, code: 'not_found', type: 'invalid_request' },
    };
  }

  private search(index: string, q: SearchBody) {
    const words = (q.q ?? '').toLowerCase().match(/[a-z0-9]+/g) ?? [];
    const on = q.attributesToSearchOn ?? ['title', 'summary', 'models', 'body'];
    const matched = [...this.docs(index).values()].filter((doc) => {
      const text = on
        .flatMap((f) => doc[f] ?? [])
        .join(' ')
        .toLowerCase();
      return words.every((w) => text.includes(w)) && passes(doc, q.filter);
    });
    const offset = q.offset ?? 0;
    const limit = q.limit ?? 20;
    const facetDistribution: Record<string, Record<string, number>> = {};
    for (const facet of q.facets ?? []) {
      const counts: Record<string, number> = {};
      for (const doc of matched)
        for (const v of new Set([doc[facet]].flat() as string[])) counts[v] = (counts[v] ?? 0) + 1;
      facetDistribution[facet] = counts;
    }
    const pre = q.highlightPreTag ?? '<em>';
    const post = q.highlightPostTag ?? '</em>';
    const hits = matched.slice(offset, offset + limit).map((doc, i) => {
      const hit: Record<string, unknown> = q.attributesToRetrieve
        ? pick(doc, q.attributesToRetrieve)
        : { ...doc };
      const formatted: Record<string, string> = {};
      for (const f of new Set([...(q.attributesToHighlight ?? []), ...(q.attributesToCrop ?? [])])) {
        let value = String(doc[f] ?? '');
        for (const w of words) value = value.replace(new RegExp(`\\b(${w})`, 'gi'), `${pre}$1${post}`);
        formatted[f] = value;
      }
      hit._formatted = { ...pick(doc, q.attributesToRetrieve ?? Object.keys(doc)), ...formatted };
      if (q.showRankingScore) hit._rankingScore = 1 - (offset + i) / (matched.length + 1);
      return hit;
    });
    return {
      hits,
      query: q.q ?? '',
      processingTimeMs: 0,
      limit,
      offset,
      [this.totalAs]: matched.length,
      ...(q.facets ? { facetDistribution } : {}),
    };
  }
}

function pick(doc: Record<string, unknown>, fields: string[]) {
  return Object.fromEntries(fields.filter((f) => f in doc).map((f) => [f, doc[f]]));
}

/** The filter expressions the engine builds: `field = "value"` clauses joined by AND. */
function passes(doc: Doc, filter: string | undefined): boolean {
  if (!filter) return true;
  return filter.split(' AND ').every((clause) => {
    const m = clause.match(/^(\w+) = "((?:[^"\\]|\\.)*)"$/);
    if (!m) throw new Error(`the fake does not understand the filter clause: ${clause}`);
    const wanted = m[2]!.replace(/\\(.)/g, '$1').toLowerCase();
    return ([doc[m[1]!]].flat() as unknown[]).some((v) => String(v).toLowerCase() === wanted);
  });
}
