// The invented demo catalogue: Corvane furnaces and Halden boilers, water heaters and heat pumps.
import type { Fuel } from '../../../../shared/src/index';

type Type = 'furnace' | 'boiler' | 'water-heater' | 'heat-pump' | 'air-conditioner' | 'controls';
const gas: Fuel[] = ['natural-gas', 'propane'];

export const DEMO_EQUIPMENT: {
  brand: string;
  modelNumber: string;
  family: string;
  type: Type;
  fuels: Fuel[];
}[] = [
  ...[60, 80, 100, 120].map((k) => ({
    brand: 'Corvane',
    modelNumber: `CV-S80-${k}`,
    family: 'Corvane S80 single-stage furnace',
    type: 'furnace' as const,
    fuels: gas,
  })),
  ...[60, 80, 100, 120].map((k) => ({
    brand: 'Corvane',
    modelNumber: `CV-T96-${k}`,
    family: 'Corvane T96 two-stage furnace',
    type: 'furnace' as const,
    fuels: gas,
  })),
  ...[60, 80, 100].map((k) => ({
    brand: 'Corvane',
    modelNumber: `CV-M98-${k}`,
    family: 'Corvane M98 modulating furnace',
    type: 'furnace' as const,
    fuels: gas,
  })),
  {
    brand: 'Corvane',
    modelNumber: 'CV-IFC-2',
    family: 'Corvane integrated furnace control',
    type: 'controls',
    fuels: [],
  },
  ...[80, 110, 155].map((k) => ({
    brand: 'Halden',
    modelNumber: `HB-C${k}`,
    family: 'Halden combi condensing boiler',
    type: 'boiler' as const,
    fuels: gas,
  })),
  ...[100, 150].map((k) => ({
    brand: 'Halden',
    modelNumber: `HB-F${k}`,
    family: 'Halden cast-iron boiler',
    type: 'boiler' as const,
    fuels: gas,
  })),
  ...[40, 50].map((g) => ({
    brand: 'Halden',
    modelNumber: `HW-A${g}`,
    family: 'Halden atmospheric tank water heater',
    type: 'water-heater' as const,
    fuels: gas,
  })),
  {
    brand: 'Halden',
    modelNumber: 'HW-T199',
    family: 'Halden tankless water heater',
    type: 'water-heater',
    fuels: gas,
  },
  ...[24, 36, 48].map((k) => ({
    brand: 'Halden',
    modelNumber: `HP-${k}`,
    family: 'Halden ducted heat pump',
    type: 'heat-pump' as const,
    fuels: [],
  })),
  {
    brand: 'Halden',
    modelNumber: 'HA-30',
    family: 'Halden split air conditioner',
    type: 'air-conditioner',
    fuels: [],
  },
];
