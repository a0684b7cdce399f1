import type { EquipmentModel } from '@shared/schemas/tickets';
import { http } from './http';

/** A catalogue model with its spec table (free-form here; read it with equipmentSpecSchema). */
export interface EquipmentModelWithSpec extends EquipmentModel {
  spec: unknown;
}

export const equipmentCatalogueApi = {
  /** GET /api/equipment?q=: active models matching the search (model number, family or brand). */
  search: (q: string, limit: number, signal?: AbortSignal) =>
    http.get<{ items: EquipmentModel[] }>('/equipment', { q, limit }, signal),
  /** GET /api/equipment/:id: one model with its spec table. */
  get: (id: number, signal?: AbortSignal) =>
    http.get<{ model: EquipmentModelWithSpec }>(`/equipment/${id}`, undefined, signal),
  /** PUT /api/equipment/:id/spec (specialist, admin): replace the spec table, or clear it with null. */
  saveSpec: (id: number, spec: unknown) =>
    http.put<{ model: EquipmentModelWithSpec }>(`/equipment/${id}/spec`, { spec }),
};
