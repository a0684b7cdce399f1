import { useQuery } from '@tanstack/vue-query';
import { homeApi } from '@/api/home';

/** What the signed-in person's home shows: their company, or their branches. */
export function useHome() {
  return useQuery({
    queryKey: ['home'],
    queryFn: ({ signal }) => homeApi.get(signal),
  });
}
