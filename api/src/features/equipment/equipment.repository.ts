import { and, asc, eq, ilike, or, sql } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { equipmentModels } from '../../db/schema/index';
import type { EquipmentModel } from '../../../../shared/src/index';
import { likePattern } from '../../lib/pagination';

/** Active catalogue models matching a model number (with or without dashes), family or brand. */
export function searchModels(db: Executor, q: string | undefined, limit: number): Promise<EquipmentModel[]> {
  const squashed = q?.replace(/[^a-z0-9]/gi, '') ?? '';
  const matches = q
    ? or(
        ilike(equipmentModels.modelNumber, likePattern(q)),
        ilike(equipmentModels.family, likePattern(q)),
        ilike(equipmentModels.brand, likePattern(q)),
        squashed
          ? sql`regexp_replace(${equipmentModels.modelNumber}, '[^A-Za-z0-9]', '', 'g') ilike ${likePattern(squashed)}`
          : undefined,
      )
    : undefined;
  return db
    .select({
      id: equipmentModels.id,
      brand: equipmentModels.brand,
      modelNumber: equipmentModels.modelNumber,
      family: equipmentModels.family,
      type: equipmentModels.type,
      fuels: equipmentModels.fuels,
    })
    .from(equipmentModels)
    .where(and(eq(equipmentModels.active, true), matches))
    .orderBy(asc(equipmentModels.brand), asc(equipmentModels.modelNumber))
    .limit(limit);
}

export async function equipmentExists(db: Executor, id: number): Promise<boolean> {
  const [row] = await db
    .select({ id: equipmentModels.id })
    .from(equipmentModels)
    .where(eq(equipmentModels.id, id));
  return !!row;
}

/** One model with its spec table. */
export async function findModel(db: Executor, id: number) {
  const [row] = await db
    .select({
      id: equipmentModels.id,
      brand: equipmentModels.brand,
      modelNumber: equipmentModels.modelNumber,
      family: equipmentModels.family,
      type: equipmentModels.type,
      fuels: equipmentModels.fuels,
      spec: equipmentModels.spec,
    })
    .from(equipmentModels)
    .where(eq(equipmentModels.id, id));
  return row;
}

export async function updateSpec(db: Executor, id: number, spec: Record<string, unknown> | null) {
  const [row] = await db
    .update(equipmentModels)
    .set({ spec })
    .where(eq(equipmentModels.id, id))
    .returning({ id: equipmentModels.id });
  return !!row;
}
