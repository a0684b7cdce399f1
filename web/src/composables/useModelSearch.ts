import { ref } from 'vue';
import type { EquipmentModel } from '@shared/schemas/tickets';
import { equipmentApi } from '@/api/tickets';

/** Catalogue search for a picker: the latest answer wins, earlier ones are dropped. */
export function useModelSearch() {
  const models = ref<EquipmentModel[]>([]);
  const searching = ref(false);
  let controller: AbortController | null = null;

  async function search(q: string): Promise<void> {
    controller?.abort();
    const mine = new AbortController();
    controller = mine;
    searching.value = true;
    try {
      models.value = (await equipmentApi.search(q.trim(), mine.signal)).items;
    } catch {
      if (!mine.signal.aborted) models.value = [];
    } finally {
      if (controller === mine) searching.value = false;
    }
  }

  return { models, searching, search };
}
