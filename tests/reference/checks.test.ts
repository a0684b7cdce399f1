// The other checks against worked examples and the facts of the trade, each with its source.
import { describe, expect, it } from 'vitest';
import {
  altitudeDerate,
  checkGasPressure,
  coAirFree,
  combustionAir,
  firingRate,
  gasPressureInputSchema,
  orificeFlow,
  temperatureRise,
  temperatureRiseInputSchema,
  coAirFreeInputSchema,
  TYPICAL_SPEC,
  GAS_CAUTION,
  type GasPressureSpec,
} from '../../shared/src/calc/index';

describe('clocking the gas meter', () => {
  it('When a ½ ft³ dial turns in 29 s, then the flow is 62 cfh', () => {
    // The meter-timing example in NFPA 54's annex, as quoted in training material.
    const r = firingRate({ dialCuFt: 0.5, secondsPerRev: 29, heatingValueBtuPerCuFt: 1000 });
    expect(Math.round(r.cfh)).toBe(62);
    expect(r.inputBtuh).toBe(62_069);
  });

  it('When a 2 ft³ dial turns in 72 s at 1,030 Btu/ft³ on a 100,000 Btu/h furnace, then it fires at 103,000 Btu/h, on rate', () => {
    // Arithmetic of the same method: 2 × 3600 ÷ 72 = 100 cfh × 1030. ±5 % band: common practice (no source).
    const r = firingRate({
      dialCuFt: 2,
      secondsPerRev: 72,
      heatingValueBtuPerCuFt: 1030,
      ratedInputBtuh: 100_000,
    });
    expect(r).toMatchObject({ cfh: 100, inputBtuh: 103_000, percentOfRated: 103, verdict: 'ok' });
    expect(r.cautions).toContain(GAS_CAUTION);
  });
});

describe('sensible heat and temperature rise', () => {
  it('When 80,000 Btu/h of output makes a 50 °F rise, then the airflow is about 1,481 cfm', () => {
    // Q = 1.08 × cfm × ΔT (standard air): 80,000 ÷ (1.08 × 50) = 1,481 cfm.
    const r = temperatureRise({ outputBtuh: 80_000, supplyF: 120, returnF: 70 });
    expect(r).toMatchObject({ riseF: 50, airflowCfm: 1481 });
  });

  it('When a 100,000 Btu/h, 80 % furnace moves 1,000 cfm against a 40–70 °F range, then the rise is 74 °F, too high', () => {
    // 80,000 ÷ (1.08 × 1,000) = 74.1 °F; rated range from the rating plate (invented demo values).
    const r = temperatureRise({
      inputBtuh: 100_000,
      efficiencyPct: 80,
      airflowCfm: 1000,
      riseMinF: 40,
      riseMaxF: 70,
    });
    expect(r).toMatchObject({ riseF: 74.1, verdict: 'high' });
  });

  it('When the return is warmer than the supply, then the input is refused on supplyF', () => {
    const parsed = temperatureRiseInputSchema.safeParse({ outputBtuh: 80_000, supplyF: 60, returnF: 70 });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues.map((i) => i.path.join('.'))).toContain('supplyF');
  });
});

describe('combustion air, NFPA 54 section 9.3', () => {
  it('When appliances total 140,000 Btu/h, then the standard method needs 7,000 ft³', () => {
    // NFPA 54 §9.3.2.1: 50 ft³ per 1,000 Btu/h.
    const r = combustionAir({
      appliances: [
        { inputBtuh: 100_000, draft: 'fan-assisted' },
        { inputBtuh: 40_000, draft: 'natural' },
      ],
      method: 'standard',
    });
    expect(r.requiredVolumeCuFt).toBe(7000);
  });

  it('When 140,000 Btu/h sits in a 5,000 ft³ room, then it is not enough and the openings are sized', () => {
    // NFPA 54 §9.3.3 and §9.3.4: indoor 1 in² per 1,000 Btu/h (≥ 100), outdoor vertical 1 per 4,000,
    // horizontal 1 per 2,000, single opening 1 per 3,000.
    const r = combustionAir({
      appliances: [{ inputBtuh: 140_000, draft: 'natural' }],
      roomVolumeCuFt: 5000,
      method: 'standard',
    });
    expect(r.adequate).toBe(false);
    expect(r.openings).toEqual({
      indoorEachIn2: 140,
      outdoorVerticalEachIn2: 35,
      outdoorHorizontalEachIn2: 70,
      singleIn2: 47,
    });
  });

  it('When a small appliance needs openings, then each indoor opening is still at least 100 in²', () => {
    const r = combustionAir({ appliances: [{ inputBtuh: 40_000, draft: 'natural' }], method: 'standard' });
    expect(r.openings.indoorEachIn2).toBe(100);
  });

  it('When the infiltration rate is known at 0.40 ACH, then 21 ft³/ACH and 15 ft³/ACH per 1,000 Btu/h apply', () => {
    // NFPA 54 §9.3.2.2 (from memory): 21/0.4 × 40 + 15/0.4 × 100 = 2,100 + 3,750 = 5,850 ft³.
    const r = combustionAir({
      appliances: [
        { inputBtuh: 40_000, draft: 'natural' },
        { inputBtuh: 100_000, draft: 'fan-assisted' },
      ],
      method: 'known-infiltration',
      ach: 0.4,
    });
    expect(r.requiredVolumeCuFt).toBe(5850);
  });
});

describe('air-free CO', () => {
  it('When the flue reads 87 ppm CO at 5 % O₂, then air-free CO is about 114 ppm', () => {
    // CO × 20.9 ÷ (20.9 − O₂) = 87 × 20.9 ÷ 15.9 = 114.4.
    expect(coAirFree({ coPpm: 87, o2Pct: 5 }).coAirFreePpm).toBe(114);
  });

  it('When O₂ is 20.9 % or more, then the reading is refused (that is fresh air)', () => {
    expect(coAirFreeInputSchema.safeParse({ coPpm: 10, o2Pct: 20.9 }).success).toBe(false);
  });
});

describe('high-altitude derate', () => {
  it('When a 100,000 Btu/h furnace goes in at 5,000 ft under NFPA 54, then it is derated 20 % to 80,000', () => {
    // NFPA 54/ANSI Z223.1: 4 % per 1,000 ft above sea level over 2,000 ft.
    expect(altitudeDerate({ ratedInputBtuh: 100_000, elevationFt: 5000, rule: 'nfpa54' })).toMatchObject({
      deratedInputBtuh: 80_000,
      reductionPct: 20,
    });
  });

  it('When it goes in at 1,800 ft, then the rating holds', () => {
    expect(altitudeDerate({ ratedInputBtuh: 100_000, elevationFt: 1800, rule: 'nfpa54' }).reductionPct).toBe(
      0,
    );
  });

  it('When CSA B149.1 applies at 3,000 ft, then 10 %; above 4,500 ft the rule defers to the manufacturer', () => {
    // CSA B149.1: 10 % from 2,000 to 4,500 ft.
    expect(
      altitudeDerate({ ratedInputBtuh: 60_000, elevationFt: 3000, rule: 'csa-b149' }).deratedInputBtuh,
    ).toBe(54_000);
    const high = altitudeDerate({ ratedInputBtuh: 60_000, elevationFt: 5200, rule: 'csa-b149' });
    expect(high.deratedInputBtuh).toBeNull();
    expect(high.note).toMatch(/manufacturer/);
  });
});

describe('orifice flow', () => {
  it('When a #43 orifice (0.089 in.) runs at 3.5 in. w.c. on natural gas, then it passes about 22.4 cfh', () => {
    // Q = 1658.5 × A × Cd × √(h/G): A = π/4 × 0.089² = 0.006221 in², Cd 0.9, G 0.60 (from memory).
    const r = orificeFlow({ drill: 43, manifoldInWc: 3.5, specificGravity: 0.6, dischargeCoefficient: 0.9 });
    expect(r.diameterIn).toBe(0.089);
    expect(r.cfh).toBeCloseTo(22.43, 1);
    expect(r.btuh).toBe(22_428); // 22.428 cfh × 1,000 Btu/ft³
  });
});

describe('gas pressure (facts of the trade: common practice, no source)', () => {
  const ng = TYPICAL_SPEC['natural-gas'];
  const check = (input: Record<string, unknown>, spec: GasPressureSpec = ng) =>
    checkGasPressure(gasPressureInputSchema.parse({ fuel: 'natural-gas', ...input }), spec, 'body');
  const item = (r: ReturnType<typeof check>, name: string) => r.items.find((i) => i.name === name)!;

  it('When natural gas supply at the appliance reads 8.8 in. w.c., then it is ok (5 to 10.5 is normal)', () => {
    expect(item(check({ inletStaticInWc: 8.8 }), 'inlet-static').verdict).toBe('ok');
  });

  it('When propane supply reads 11 to 13 in. w.c., then it is ok; 10 is low', () => {
    const lp = TYPICAL_SPEC.propane;
    const r = (v: number) =>
      checkGasPressure(gasPressureInputSchema.parse({ fuel: 'propane', inletStaticInWc: v }), lp, 'typical');
    expect(r(11).items[0]!.verdict).toBe('ok');
    expect(r(13).items[0]!.verdict).toBe('ok');
    expect(r(10).items[0]!.verdict).toBe('low');
  });

  it('When high-fire manifold reads 3.72 against 3.5 ± 0.3, then ok, 0.22 above target; 3.5 is ok on target', () => {
    const high = item(check({ manifold: [{ stage: 'high', valueInWc: 3.72 }] }), 'manifold-high');
    expect(high).toMatchObject({ verdict: 'ok', deviationInWc: 0.22, adjust: null, targetInWc: 3.5 });
    expect(high.note).toMatch(/0\.22 in\. w\.c\. above target/);
    expect(item(check({ manifold: [{ stage: 'high', valueInWc: 3.5 }] }), 'manifold-high').note).toMatch(
      /on target/,
    );
  });

  it('When a modulating furnace at low fire reads 0.68 against 0.56 ± 0.1, then high: lower it; 0.55 is ok', () => {
    const modulating: GasPressureSpec = {
      ...ng,
      manifold: [{ stage: 'low', targetInWc: 0.56, toleranceInWc: 0.1 }],
    };
    expect(
      item(check({ manifold: [{ stage: 'low', valueInWc: 0.68 }] }, modulating), 'manifold-low'),
    ).toMatchObject({
      verdict: 'high',
      adjust: 'lower',
    });
    expect(
      item(check({ manifold: [{ stage: 'low', valueInWc: 0.55 }] }, modulating), 'manifold-low').verdict,
    ).toBe('ok');
  });

  it('When propane at low fire reads 1.3 against 1.6 ± 0.2, then low: raise it', () => {
    const lpModulating: GasPressureSpec = {
      ...TYPICAL_SPEC.propane,
      manifold: [{ stage: 'low', targetInWc: 1.6, toleranceInWc: 0.2 }],
    };
    const r = checkGasPressure(
      gasPressureInputSchema.parse({ fuel: 'propane', manifold: [{ stage: 'low', valueInWc: 1.3 }] }),
      lpModulating,
      'body',
    );
    expect(r.items[0]).toMatchObject({ verdict: 'low', adjust: 'raise', deviationInWc: -0.3 });
  });

  it('When the inlet drops from 7.0 static to 5.6 under fire, then the drop is flagged as piping or regulator', () => {
    const r = check({ inletStaticInWc: 7, inletUnderFireInWc: 5.6 });
    expect(item(r, 'inlet-drop')).toMatchObject({ verdict: 'high', valueInWc: 1.4 });
    expect(item(r, 'inlet-under-fire').verdict).toBe('ok');
    expect(item(r, 'inlet-drop').note).toMatch(/piping|regulator/);
  });

  it('When nothing is measured, then the input is refused', () => {
    expect(gasPressureInputSchema.safeParse({ fuel: 'natural-gas' }).success).toBe(false);
  });
});

describe('the demo catalogue', () => {
  it('When the demo specs are read, then every one parses and every gas unit has a natural-gas spec', async () => {
    const { DEMO_EQUIPMENT } = await import('../../api/src/db/seed/equipment');
    const { equipmentSpecSchema, gasSpecOf } = await import('../../shared/src/schemas/equipmentSpec');
    for (const model of DEMO_EQUIPMENT) {
      if (model.spec === null) {
        expect(model.fuels).toEqual([]);
        continue;
      }
      expect(equipmentSpecSchema.safeParse(model.spec).success, model.modelNumber).toBe(true);
      expect(gasSpecOf(model.spec, 'natural-gas'), model.modelNumber).not.toBeNull();
    }
  });
});
