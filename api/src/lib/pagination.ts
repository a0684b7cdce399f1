import type { ListQuery } from '../../../shared/src/schemas/common';

export const offsetOf = (q: Pick<ListQuery, 'page' | 'pageSize'>) => (q.page - 1) * q.pageSize;

/** `%text%` for ILIKE with the user's own % and _ taken literally. */
export const likePattern = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
