// The invented demo catalogue: Corvane furnaces and Halden boilers, water heaters and heat pumps,
// with plausible, invented spec tables. Real units are set by their own rating plate.
import type { EquipmentFuelSpec, EquipmentSpec, Fuel } from '../../../../shared/src/index';

type Type = 'furnace' | 'boiler' | 'water-heater' | 'heat-pump' | 'air-conditioner' | 'controls';
const gas: Fuel[] = ['natural-gas', 'propane'];
type Manifold = EquipmentFuelSpec['manifold'];

const ng = (manifold: Manifold, orificeDrill?: number) => ({
  inletMinInWc: 4.5,
  inletMaxInWc: 10.5,
  manifold,
  orificeDrill,
});
const lp = (manifold: Manifold, orificeDrill?: number) => ({
  inletMinInWc: 11,
  inletMaxInWc: 13,
  manifold,
  orificeDrill,
});

const furnaceSpec = (staging: EquipmentSpec['staging'], kBtuh: number): EquipmentSpec => {
  const input = kBtuh * 1000;
  if (staging === 'single') {
    return {
      staging,
      inputBtuh: { high: input },
      outputBtuh: Math.round(input * 0.8),
      afuePct: 80,
      riseRangeF: { min: 35, max: 65 },
      fuels: {
        'natural-gas': ng([{ stage: 'single', targetInWc: 3.5, toleranceInWc: 0.3 }], 45),
        propane: lp([{ stage: 'single', targetInWc: 10, toleranceInWc: 0.5 }], 55),
      },
      notes: 'Convert to propane with the matching kit only; set the manifold after conversion.',
    };
  }
  if (staging === 'two-stage') {
    return {
      staging,
      inputBtuh: { high: input, low: Math.round(input * 0.65) },
      outputBtuh: Math.round(input * 0.96),
      afuePct: 96,
      riseRangeF: { min: 30, max: 60 },
      fuels: {
        'natural-gas': ng(
          [
            { stage: 'high', targetInWc: 3.5, toleranceInWc: 0.3 },
            { stage: 'low', targetInWc: 1.7, toleranceInWc: 0.2 },
          ],
          44,
        ),
        propane: lp(
          [
            { stage: 'high', targetInWc: 10, toleranceInWc: 0.5 },
            { stage: 'low', targetInWc: 4.9, toleranceInWc: 0.3 },
          ],
          55,
        ),
      },
      notes: 'Set high fire first, then low fire; recheck high fire after adjusting low.',
    };
  }
  return {
    staging,
    minModulationPct: 40,
    inputBtuh: { high: input, low: Math.round(input * 0.4) },
    outputBtuh: Math.round(input * 0.98),
    afuePct: 98,
    riseRangeF: { min: 30, max: 60 },
    fuels: {
      'natural-gas': ng(
        [
          { stage: 'high', targetInWc: 3.5, toleranceInWc: 0.3 },
          { stage: 'low', targetInWc: 0.56, toleranceInWc: 0.1 },
        ],
        44,
      ),
      propane: lp(
        [
          { stage: 'high', targetInWc: 10, toleranceInWc: 0.5 },
          { stage: 'low', targetInWc: 1.6, toleranceInWc: 0.2 },
        ],
        55,
      ),
    },
    notes: 'Use the control’s service mode to hold high fire and minimum fire while measuring.',
  };
};

const boilerSpec = (kBtuh: number, modulating: boolean): EquipmentSpec => ({
  staging: modulating ? 'modulating' : 'single',
  ...(modulating ? { minModulationPct: 10 } : {}),
  inputBtuh: modulating ? { high: kBtuh * 1000, low: kBtuh * 100 } : { high: kBtuh * 1000 },
  afuePct: modulating ? 95 : 84,
  fuels: {
    'natural-gas': {
      inletMinInWc: 3.5,
      inletMaxInWc: 10.5,
      manifold: modulating ? [] : [{ stage: 'single', targetInWc: 3.5, toleranceInWc: 0.3 }],
    },
    propane: {
      inletMinInWc: 8,
      inletMaxInWc: 13,
      manifold: modulating ? [] : [{ stage: 'single', targetInWc: 10, toleranceInWc: 0.5 }],
    },
  },
  notes: modulating
    ? 'Premix burner without a manifold tap: set combustion by the flue-gas CO₂/O₂ table in the instructions.'
    : 'Check the low-water cutoff and relief valve on every call.',
});

const waterHeaterSpec = (kBtuh: number, tankless: boolean): EquipmentSpec => ({
  staging: tankless ? 'modulating' : 'single',
  ...(tankless ? { minModulationPct: 8 } : {}),
  inputBtuh: tankless ? { high: kBtuh * 1000, low: 15_000 } : { high: kBtuh * 1000 },
  fuels: {
    'natural-gas': tankless
      ? { inletMinInWc: 5, inletMaxInWc: 10.5, manifold: [] }
      : ng([{ stage: 'single', targetInWc: 4, toleranceInWc: 0.3 }], 42),
    propane: tankless
      ? { inletMinInWc: 8, inletMaxInWc: 13, manifold: [] }
      : lp([{ stage: 'single', targetInWc: 10, toleranceInWc: 0.5 }], 54),
  },
  notes: tankless
    ? 'Measure inlet pressure at full fire with every fixture open.'
    : 'Test the relief valve yearly.',
});

export const DEMO_EQUIPMENT: {
  brand: string;
  modelNumber: string;
  family: string;
  type: Type;
  fuels: Fuel[];
  spec: EquipmentSpec | null;
}[] = [
  ...[60, 80, 100, 120].map((k) => ({
    brand: 'Corvane',
    modelNumber: `CV-S80-${k}`,
    family: 'Corvane S80 single-stage furnace',
    type: 'furnace' as const,
    fuels: gas,
    spec: furnaceSpec('single', k),
  })),
  ...[60, 80, 100, 120].map((k) => ({
    brand: 'Corvane',
    modelNumber: `CV-T96-${k}`,
    family: 'Corvane T96 two-stage furnace',
    type: 'furnace' as const,
    fuels: gas,
    spec: furnaceSpec('two-stage', k),
  })),
  ...[60, 80, 100].map((k) => ({
    brand: 'Corvane',
    modelNumber: `CV-M98-${k}`,
    family: 'Corvane M98 modulating furnace',
    type: 'furnace' as const,
    fuels: gas,
    spec: furnaceSpec('modulating', k),
  })),
  {
    brand: 'Corvane',
    modelNumber: 'CV-IFC-2',
    family: 'Corvane integrated furnace control',
    type: 'controls',
    fuels: [],
    spec: null,
  },
  ...[80, 110, 155].map((k) => ({
    brand: 'Halden',
    modelNumber: `HB-C${k}`,
    family: 'Halden combi condensing boiler',
    type: 'boiler' as const,
    fuels: gas,
    spec: boilerSpec(k, true),
  })),
  ...[100, 150].map((k) => ({
    brand: 'Halden',
    modelNumber: `HB-F${k}`,
    family: 'Halden cast-iron boiler',
    type: 'boiler' as const,
    fuels: gas,
    spec: boilerSpec(k, false),
  })),
  ...[40, 50].map((g) => ({
    brand: 'Halden',
    modelNumber: `HW-A${g}`,
    family: 'Halden atmospheric tank water heater',
    type: 'water-heater' as const,
    fuels: gas,
    spec: waterHeaterSpec(g === 40 ? 40 : 50, false),
  })),
  {
    brand: 'Halden',
    modelNumber: 'HW-T199',
    family: 'Halden tankless water heater',
    type: 'water-heater',
    fuels: gas,
    spec: waterHeaterSpec(199, true),
  },
  ...[24, 36, 48].map((k) => ({
    brand: 'Halden',
    modelNumber: `HP-${k}`,
    family: 'Halden ducted heat pump',
    type: 'heat-pump' as const,
    fuels: [],
    spec: null,
  })),
  {
    brand: 'Halden',
    modelNumber: 'HA-30',
    family: 'Halden split air conditioner',
    type: 'air-conditioner',
    fuels: [],
    spec: null,
  },
];
