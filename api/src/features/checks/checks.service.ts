import { eq } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { equipmentModels } from '../../db/schema/index';
import {
  checkGasPressure,
  gasPressureSpecSchema,
  TYPICAL_SPEC,
  type GasPressureInput,
  type GasPressureSpec,
} from '../../../../shared/src/calc/index';
import type { SessionUser } from '../../../../shared/src/index';
import { getArticle } from '../articles/articles.service';
import { extractSpecTables } from '../articles/render';
import { gasSpecOf } from '../../../../shared/src/schemas/equipmentSpec';
import { AppError } from '../../lib/errors';

/**
 * An article's `::: spec gas-pressure` table (fuel | stage | target | tolerance) as the check's
 * spec; the inlet range comes from its `::: spec inlet-pressure` table (fuel | … | min | max), or
 * common practice when it has none. Null when the article has no manifold rows for the fuel.
 */
export function specFromArticle(body: string, fuel: 'natural-gas' | 'propane'): GasPressureSpec | null {
  const tables = extractSpecTables(body);
  const num = (v: string | undefined) =>
    v === undefined || v.trim() === '' ? Number.NaN : Number(v.replace(/[^0-9.]/g, ''));
  const manifold = (tables.find((t) => t.name === 'gas-pressure')?.rows ?? [])
    .filter(
      (r) => r[0]?.toLowerCase() === fuel && ['single', 'high', 'low'].includes(r[1]?.toLowerCase() ?? ''),
    )
    .map((r) => ({
      stage: r[1]!.toLowerCase() as 'single' | 'high' | 'low',
      targetInWc: num(r[2]),
      toleranceInWc: num(r[3]),
    }))
    .filter((m) => Number.isFinite(m.targetInWc) && Number.isFinite(m.toleranceInWc));
  if (manifold.length === 0) return null;
  const inlet = tables
    .find((t) => t.name === 'inlet-pressure')
    ?.rows.find((r) => r[0]?.toLowerCase() === fuel);
  const min = num(inlet?.at(-2));
  const max = num(inlet?.at(-1));
  const typical = TYPICAL_SPEC[fuel];
  const parsed = gasPressureSpecSchema.safeParse({
    inletMinInWc: Number.isFinite(min) ? min : typical.inletMinInWc,
    inletMaxInWc: Number.isFinite(max) ? max : typical.inletMaxInWc,
    manifold,
  });
  return parsed.success ? parsed.data : null;
}

/** The gas-pressure spec to judge by: the body's, an article's, the unit's catalogue spec, else common practice. */
export async function runGasPressure(ctx: AppContext, user: SessionUser, input: GasPressureInput) {
  if (input.spec) return checkGasPressure(input, input.spec, 'body');
  if (input.articleId) {
    const article = await getArticle(ctx, user, input.articleId).catch(() => null);
    if (!article) throw AppError.validation({ articleId: 'No such article, or not one you can read' });
    const fromArticle = specFromArticle(article.body, input.fuel);
    if (!fromArticle)
      throw AppError.validation({ articleId: 'This article has no gas-pressure spec table for this fuel' });
    return checkGasPressure(input, fromArticle, 'article');
  }
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
