import type { z } from 'zod';
import { altitudeDerate, altitudeInputSchema } from './altitude';
import { coAirFree, coAirFreeInputSchema } from './coAirFree';
import { combustionAir, combustionAirInputSchema } from './combustionAir';
import { firingRate, firingRateInputSchema } from './firingRate';
import { orificeFlow, orificeInputSchema } from './orifice';
import { pipeSize, pipeSizeInputSchema, pipeSystem, pipeSystemInputSchema } from './pipeSize';
import { temperatureRise, temperatureRiseInputSchema } from './temperatureRise';
import { convertInputSchema, convertPressure } from './units';

export * from './common';
export * from './units';
export * from './gasPressure';
export * from './firingRate';
export * from './altitude';
export * from './temperatureRise';
export * from './pipeSize';
export * from './combustionAir';
export * from './coAirFree';
export * from './orifice';

/**
 * The checks that need nothing but their input, by the name their API route uses. The gas-pressure
 * check also reads a spec (from the unit or an article), so it is run by its own route.
 */
export const PURE_CHECKS = {
  convert: { schema: convertInputSchema, run: convertPressure },
  'firing-rate': { schema: firingRateInputSchema, run: firingRate },
  'altitude-derate': { schema: altitudeInputSchema, run: altitudeDerate },
  'temperature-rise': { schema: temperatureRiseInputSchema, run: temperatureRise },
  'pipe-size': { schema: pipeSizeInputSchema, run: pipeSize },
  'pipe-system': { schema: pipeSystemInputSchema, run: pipeSystem },
  'combustion-air': { schema: combustionAirInputSchema, run: combustionAir },
  'co-air-free': { schema: coAirFreeInputSchema, run: coAirFree },
  orifice: { schema: orificeInputSchema, run: orificeFlow },
} as const satisfies Record<string, { schema: z.ZodType; run: (input: never) => object }>;
export type PureCheckKind = keyof typeof PURE_CHECKS;
