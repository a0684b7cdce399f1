// Pipe capacities against the code's Schedule 40 tables. The table values below are from memory of
// the International Fuel Gas Code, Table 402.4(2) and Table 402.4(28); the formula must reproduce
// them within 2 % (the tables round).
import { describe, expect, it } from 'vitest';
import {
  lowPressureCapacityCfh,
  pipeSize,
  pipeSystem,
  SCHEDULE_40,
  CR,
  TYPICAL_HEATING_VALUE,
} from '../../shared/src/calc/index';

const id = (nominal: string) => SCHEDULE_40.find((p) => p.nominal === nominal)!.insideDiameterIn;
const within = (actual: number, expected: number, pct = 2) =>
  expect(Math.abs(actual - expected) / expected).toBeLessThanOrEqual(pct / 100);

describe('IFGC Table 402.4(2): Schedule 40 metallic pipe, natural gas, 0.5 in. w.c. drop, SG 0.60 (from memory)', () => {
  const rows: [lengthFt: number, nominal: string, cfh: number][] = [
    [10, '1/2', 172],
    [10, '3/4', 360],
    [10, '1', 678],
    [10, '1-1/4', 1390],
    [10, '1-1/2', 2090],
    [10, '2', 4020],
    [100, '1/2', 50],
    [100, '1', 195],
    [100, '2', 1160],
  ];
  for (const [lengthFt, nominal, cfh] of rows) {
    it(`When ${nominal} in. runs ${lengthFt} ft, then it carries ${cfh} cfh within 2 %`, () => {
      within(lowPressureCapacityCfh(id(nominal), lengthFt, 0.5, CR['natural-gas']), cfh);
    });
  }
});

describe('IFGC Table 402.4(28): Schedule 40, propane, 11 in. w.c. inlet, 0.5 in. drop, thousands of Btu/h (from memory)', () => {
  const rows: [lengthFt: number, nominal: string, kBtuh: number][] = [
    [10, '1/2', 291],
    [10, '1', 1150],
    [10, '2', 6790],
  ];
  for (const [lengthFt, nominal, kBtuh] of rows) {
    it(`When ${nominal} in. runs ${lengthFt} ft on propane, then it carries ${kBtuh} kBtu/h within 2 %`, () => {
      const cfh = lowPressureCapacityCfh(id(nominal), lengthFt, 0.5, CR.propane);
      within((cfh * TYPICAL_HEATING_VALUE.propane) / 1000, kBtuh);
    });
  }
});

describe('sizing a run', () => {
  it('When a 100,000 Btu/h furnace is 40 ft from the meter on natural gas, then 3/4 in. is the smallest that carries it', () => {
    // 100 cfh at 40 ft: 1/2 in. carries about 81 cfh, 3/4 in. about 170 (the formula checked above).
    const result = pipeSize({ fuel: 'natural-gas', lengthFt: 40, loadBtuh: 100_000, pressureDropInWc: 0.5 });
    expect(result.loadCfh).toBe(100);
    expect(result.recommended?.nominal).toBe('3/4');
    expect(result.sizes.map((s) => s.nominal)).toEqual(SCHEDULE_40.map((p) => p.nominal));
  });

  it('When the load is more than 4 in. pipe carries at low pressure, then nothing is recommended and the note says why', () => {
    const result = pipeSize({ fuel: 'natural-gas', lengthFt: 2000, loadCfh: 50_000, pressureDropInWc: 0.5 });
    expect(result.recommended).toBeNull();
    expect(result.note).toMatch(/higher pressure/);
  });

  it('When a system has a furnace and a water heater on two branches, then each section is sized at the longest length', () => {
    // Meter → A (20 ft) → B (30 ft, furnace 100k) and C (10 ft, water heater 60k). Longest = 50 ft.
    const result = pipeSystem({
      fuel: 'natural-gas',
      pressureDropInWc: 0.5,
      sections: [
        { id: 'A', parentId: null, lengthFt: 20, applianceBtuh: 0 },
        { id: 'B', parentId: 'A', lengthFt: 30, applianceBtuh: 100_000 },
        { id: 'C', parentId: 'A', lengthFt: 10, applianceBtuh: 60_000 },
      ],
    });
    expect(result.longestLengthFt).toBe(50);
    const byId = Object.fromEntries(result.sections.map((s) => [s.id, s]));
    expect(byId.A!.loadBtuh).toBe(160_000);
    // At 50 ft: 1/2 in. ≈ 72 cfh, 3/4 in. ≈ 151 cfh, 1 in. ≈ 284 cfh (the formula checked above).
    expect(byId.A!.recommended?.nominal).toBe('1');
    expect(byId.B!.recommended?.nominal).toBe('3/4');
    expect(byId.C!.recommended?.nominal).toBe('1/2');
  });
});
