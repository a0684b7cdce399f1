import { eq } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { equipmentModels } from '../../db/schema/index';
import { checkGasPressure, TYPICAL_SPEC, type GasPressureInput } from '../../../../shared/src/calc/index';
import { gasSpecOf } from '../../../../shared/src/schemas/equipmentSpec';
import { AppError } from '../../lib/errors';

/** The gas-pressure spec to judge by: the body's, else the unit's catalogue spec, else common practice. */
export async function runGasPressure(ctx: AppContext, input: GasPressureInput) {
  if (input.spec) return checkGasPressure(input, input.spec, 'body');
  if (input.equipmentModelId) {
    const [model] = await ctx.db
      .select({ spec: equipmentModels.spec })
      .from(equipmentModels)
      .where(eq(equipmentModels.id, input.equipmentModelId));
    if (!model) throw AppError.validation({ equipmentModelId: 'This model is not in the catalogue' });
    const fromModel = gasSpecOf(model.spec, input.fuel);
    if (fromModel) return checkGasPressure(input, fromModel, 'model');
  }
  return checkGasPressure(input, TYPICAL_SPEC[input.fuel], 'typical');
}
