import { ROLES, STAFF_ROLES, type Role } from '@shared/roles';

// From the zod-free module, so the first page does not load the schemas.
export const ALL_ROLES: readonly Role[] = ROLES;
export { STAFF_ROLES };
export const isStaffRole = (role: Role): boolean => STAFF_ROLES.includes(role);
