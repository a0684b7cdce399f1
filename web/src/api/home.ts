import type { HomeResponse } from '@shared/schemas/home';
import { http } from './http';

export const homeApi = {
  /** GET /api/home: the contractor's company, or the staff member's branches. */
  get: (signal?: AbortSignal) => http.get<HomeResponse>('/home', undefined, signal),
};
