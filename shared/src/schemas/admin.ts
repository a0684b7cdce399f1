import { z } from 'zod';
import { emailSchema, listQuerySchema, nameSchema, pageOf } from './common';
import { passwordSchema, roleSchema } from './auth';

// Branches -------------------------------------------------------------------
export const branchSchema = z.object({
  id: z.number().int(),
  code: z.string(),
  name: z.string(),
  deskEmail: z.string().nullable(),
  active: z.boolean(),
});
export type Branch = z.infer<typeof branchSchema>;

export const branchCodeSchema = z
  .string()
  .trim()
  .min(2, 'Use 2 to 8 letters')
  .max(8, 'Use 2 to 8 letters')
  .regex(/^[A-Za-z]+$/, 'Letters only')
  .transform((v) => v.toUpperCase());

export const branchCreateSchema = z.object({
  code: branchCodeSchema,
  name: nameSchema,
  deskEmail: emailSchema.nullable().optional(),
});
export type BranchCreate = z.infer<typeof branchCreateSchema>;
export const branchUpdateSchema = branchCreateSchema
  .extend({ active: z.boolean() })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type BranchUpdate = z.infer<typeof branchUpdateSchema>;
export const branchListSchema = pageOf(branchSchema);

// Contractor accounts ----------------------------------------------------------
export const accountSchema = z.object({
  id: z.number().int(),
  company: z.string(),
  accountNumber: z.string(),
  homeBranchId: z.number().int(),
  homeBranchName: z.string(),
  active: z.boolean(),
  userCount: z.number().int(),
});
export type Account = z.infer<typeof accountSchema>;

export const accountCreateSchema = z.object({
  company: nameSchema,
  accountNumber: z
    .string()
    .trim()
    .min(3, 'Use 3 to 20 letters, digits or dashes')
    .max(20, 'Use 3 to 20 letters, digits or dashes')
    .regex(/^[A-Za-z0-9-]+$/, 'Letters, digits and dashes only')
    .transform((v) => v.toUpperCase()),
  homeBranchId: z.number().int().positive(),
});
export type AccountCreate = z.infer<typeof accountCreateSchema>;
export const accountUpdateSchema = accountCreateSchema
  .extend({ active: z.boolean() })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type AccountUpdate = z.infer<typeof accountUpdateSchema>;
export const accountListSchema = pageOf(accountSchema);

// Users -----------------------------------------------------------------------
export const adminUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  active: z.boolean(),
  accountId: z.number().int().nullable(),
  accountCompany: z.string().nullable(),
  isAccountOwner: z.boolean(),
  branchIds: z.array(z.number().int()),
  lastSignInAt: z.string().nullable(),
  createdAt: z.string(),
});
export type AdminUser = z.infer<typeof adminUserSchema>;

const userFields = {
  email: emailSchema,
  name: nameSchema,
  role: roleSchema,
  password: passwordSchema,
  accountId: z.number().int().positive().nullable().optional(),
  isAccountOwner: z.boolean().optional(),
  branchIds: z.array(z.number().int().positive()).max(50).optional(),
};

/** A contractor belongs to an account; staff belong to one or more branches. */
function checkRoleLinks(
  v: { role?: string; accountId?: number | null; branchIds?: number[] },
  ctx: z.RefinementCtx,
) {
  if (v.role === 'contractor' && !v.accountId) {
    ctx.addIssue({ code: 'custom', path: ['accountId'], message: 'A contractor needs an account' });
  }
  if (v.role && v.role !== 'contractor' && (!v.branchIds || v.branchIds.length === 0)) {
    ctx.addIssue({ code: 'custom', path: ['branchIds'], message: 'Staff need at least one branch' });
  }
}

export const userCreateSchema = z.object(userFields).superRefine(checkRoleLinks);
export type UserCreate = z.infer<typeof userCreateSchema>;

export const userUpdateSchema = z
  .object({ ...userFields, active: z.boolean() })
  .omit({ password: true })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UserUpdate = z.infer<typeof userUpdateSchema>;
export const userListSchema = pageOf(adminUserSchema);

export const userListQuerySchema = listQuerySchema.extend({
  role: roleSchema.optional(),
  accountId: z.coerce.number().int().positive().optional(),
});
export type UserListQuery = z.infer<typeof userListQuerySchema>;

export const itemResponse = <K extends string, T extends z.ZodType>(key: K, item: T) =>
  z.object({ [key]: item } as Record<K, T>);
