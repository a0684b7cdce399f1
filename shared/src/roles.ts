// Role names without zod, so the web app's first page can use them without loading the schemas.
export const ROLES = ['contractor', 'tech', 'specialist', 'admin'] as const;
export type Role = (typeof ROLES)[number];
export const STAFF_ROLES: readonly Role[] = ['tech', 'specialist', 'admin'];
