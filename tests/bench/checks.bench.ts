// Micro-benchmark of the heaviest checks, as the browser and the API run them. Baseline in the same
// process: a pressure conversion (one multiply and divide through the same result shape), so the
// ratio says how much heavier each check is than the lightest one. Budget: under 1 ms a call.
//   npm run bench:checks
import { performance } from 'node:perf_hooks';
import {
  checkGasPressure,
  convertPressure,
  gasPressureInputSchema,
  pipeSize,
  pipeSystem,
  TYPICAL_SPEC,
} from '../../shared/src/calc/index';

const RUN_MS = 1000;

// Every result is kept in a sink that is read at the end, so no call can be optimized away.
const sink: unknown[] = new Array(256);
let slot = 0;

function opsPerSecond(fn: () => unknown): number {
  for (let i = 0; i < 2000; i++) fn(); // warm up the JIT
  let n = 0;
  const start = performance.now();
  let elapsed = 0;
  while (elapsed < RUN_MS) {
    for (let i = 0; i < 200; i++) sink[slot++ & 255] = fn();
    n += 200;
    elapsed = performance.now() - start;
  }
  return (n / elapsed) * 1000;
}

const gasInput = gasPressureInputSchema.parse({
  fuel: 'natural-gas',
  inletStaticInWc: 7,
  inletUnderFireInWc: 6.2,
  manifold: [
    { stage: 'high', valueInWc: 3.6 },
    { stage: 'low', valueInWc: 1.5 },
  ],
});
const system = {
  fuel: 'natural-gas' as const,
  pressureDropInWc: 0.5,
  sections: [
    { id: 'A', parentId: null, lengthFt: 20, applianceBtuh: 0 },
    { id: 'B', parentId: 'A', lengthFt: 30, applianceBtuh: 100_000 },
    { id: 'C', parentId: 'A', lengthFt: 10, applianceBtuh: 60_000 },
    { id: 'D', parentId: 'C', lengthFt: 15, applianceBtuh: 30_000 },
  ],
};

const cases: [string, () => unknown][] = [
  ['baseline: convert', () => convertPressure({ value: 3.5, from: 'in_wc', to: 'pa' })],
  [
    'pipe-size (one run, 9 sizes)',
    () => pipeSize({ fuel: 'natural-gas', lengthFt: 40, loadBtuh: 100_000, pressureDropInWc: 0.5 }),
  ],
  ['pipe-system (4 sections)', () => pipeSystem(system)],
  ['gas-pressure (4 readings)', () => checkGasPressure(gasInput, TYPICAL_SPEC['natural-gas'], 'typical')],
];

const results = cases.map(([name, fn]) => ({ name, ops: opsPerSecond(fn) }));
const baseline = results[0]!.ops;
console.log('| check | ops/s | µs per call | time vs baseline | under 1 ms |');
console.log('|---|---:|---:|---:|---|');
let over = false;
for (const r of results) {
  const us = 1e6 / r.ops;
  over ||= us >= 1000;
  console.log(
    `| ${r.name} | ${Math.round(r.ops).toLocaleString('en-US')} | ${us.toFixed(3)} | ${(baseline / r.ops).toFixed(1)}× | ${us < 1000 ? 'yes' : 'NO'} |`,
  );
}
if (sink.filter(Boolean).length === 0) throw new Error('no results kept');
process.exit(over ? 1 : 0);
