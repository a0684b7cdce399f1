import { z } from 'zod';
import { emailSchema, nameSchema, pageOf } from './common';
import { passwordSchema, roleSchema } from './auth';

/** The staff roles an admin may invite; contractors are invited by their account's owner. */
export const invitedStaffRoleSchema = z.enum(['tech', 'specialist', 'admin']);

/**
 * Who to invite. An admin sends a staff role and branches; an account owner sends only the
 * e-mail (or their own account's id) and invites a teammate into their own account.
 */
export const invitationCreateSchema = z.object({
  email: emailSchema,
  role: invitedStaffRoleSchema.optional(),
  branchIds: z.array(z.number().int().positive()).max(50).optional(),
  accountId: z.number().int().positive().optional(),
});
export type InvitationCreate = z.infer<typeof invitationCreateSchema>;

/** Where an invitation stands: waiting for the invitee, joined, past its 7 days, or revoked. */
export const INVITATION_STATUSES = ['waiting', 'joined', 'expired', 'revoked'] as const;
export const invitationStatusSchema = z.enum(INVITATION_STATUSES);
export type InvitationStatus = z.infer<typeof invitationStatusSchema>;

export const invitationSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  role: roleSchema,
  accountId: z.number().int().nullable(),
  accountCompany: z.string().nullable(),
  branchIds: z.array(z.number().int()),
  invitedBy: z.object({ id: z.number().int(), name: z.string() }),
  status: invitationStatusSchema,
  expiresAt: z.string(),
  createdAt: z.string(),
  acceptedAt: z.string().nullable(),
});
export type Invitation = z.infer<typeof invitationSchema>;
export const invitationListSchema = pageOf(invitationSchema);

export const invitationListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
  status: invitationStatusSchema.optional(),
});
export type InvitationListQuery = z.infer<typeof invitationListQuerySchema>;

/** A link's token as it arrives from the page: 32 random bytes, base64url (43 characters). */
export const linkTokenSchema = z
  .string({ message: 'The link is missing its code' })
  .trim()
  .min(1, 'The link is missing its code')
  .max(200, 'This link is not one of ours');

export const tokenBodySchema = z.object({ token: linkTokenSchema });
export type TokenBody = z.infer<typeof tokenBodySchema>;

/** What the join page shows before anyone types: who is invited, to what, by whom. */
export const invitationLookupSchema = z.object({
  invitation: z.object({
    email: z.string(),
    role: roleSchema,
    accountCompany: z.string().nullable(),
    branchNames: z.array(z.string()),
    invitedByName: z.string(),
    expiresAt: z.string(),
  }),
});
export type InvitationLookup = z.infer<typeof invitationLookupSchema>;

export const invitationAcceptSchema = z.object({
  token: linkTokenSchema,
  name: nameSchema,
  password: passwordSchema,
});
export type InvitationAccept = z.infer<typeof invitationAcceptSchema>;

// Password reset -----------------------------------------------------------------
export const passwordResetRequestSchema = z.object({ email: emailSchema });
export type PasswordResetRequest = z.infer<typeof passwordResetRequestSchema>;

export const passwordResetConfirmSchema = z.object({ token: linkTokenSchema, password: passwordSchema });
export type PasswordResetConfirm = z.infer<typeof passwordResetConfirmSchema>;

/** The reset page's first look at its link: still usable, and for which sign-in. */
export const passwordResetCheckSchema = z.object({ email: z.string(), expiresAt: z.string() });
export type PasswordResetCheck = z.infer<typeof passwordResetCheckSchema>;
