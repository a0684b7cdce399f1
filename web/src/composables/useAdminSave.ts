import { useQueryClient } from '@tanstack/vue-query';
import type { SaveEntity } from './useEntityForm';

/** Saving one admin entity (a new one when the id is null); every admin list and option list reloads. */
export function useAdminSave<Entity, Create, Update>(
  create: (body: Create) => Promise<Entity>,
  update: (id: number, body: Update) => Promise<Entity>,
): SaveEntity<Entity, Create, Update> {
  const queryClient = useQueryClient();
  return async (id, body) => {
    const saved = id === null ? await create(body as Create) : await update(id, body as Update);
    await queryClient.invalidateQueries({ queryKey: ['admin'] });
    return saved;
  };
}
