// The bench's HTTP clients, in a thread of their own so that sending requests and reading answers
// never competes with the server for its event loop. Gets {base, cookie, paths, concurrency}; each
// client sends one path, waits for the whole answer, then takes the next. Posts the latencies (ms).
import { parentPort, workerData } from 'node:worker_threads';
import { performance } from 'node:perf_hooks';

const { base, cookie, paths, concurrency } = workerData;
const times = [];
let next = 0;
await Promise.all(
  Array.from({ length: concurrency }, async () => {
    while (next < paths.length) {
      const path = paths[next++];
      const started = performance.now();
      const res = await fetch(base + path, { headers: { cookie } });
      await res.arrayBuffer();
      if (!res.ok) throw new Error(`${path} answered ${res.status}`);
      times.push(performance.now() - started);
    }
  }),
);
parentPort.postMessage(times);
