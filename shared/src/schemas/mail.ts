import { z } from 'zod';

/** The e-mails a user may turn off; the rest (account and address changes) always go out. */
export const MAIL_KINDS = ['ticketReceived', 'replies', 'resolved'] as const;
export const mailKindSchema = z.enum(MAIL_KINDS);
export type MailKind = z.infer<typeof mailKindSchema>;

export const mailPreferencesSchema = z.object({
  ticketReceived: z.boolean(),
  replies: z.boolean(),
  resolved: z.boolean(),
});
export type MailPreferences = z.infer<typeof mailPreferencesSchema>;

export const mailPreferencesUpdateSchema = mailPreferencesSchema
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Say which e-mails to turn on or off' });
export type MailPreferencesUpdate = z.infer<typeof mailPreferencesUpdateSchema>;

export const mailPreferencesResponseSchema = z.object({ preferences: mailPreferencesSchema });
export type MailPreferencesResponse = z.infer<typeof mailPreferencesResponseSchema>;

/** The signed token from an e-mail's "stop these e-mails" link. */
export const unsubscribeBodySchema = z.object({ token: z.string().trim().min(1, 'Required').max(300) });
export type UnsubscribeBody = z.infer<typeof unsubscribeBodySchema>;

export const unsubscribeResponseSchema = z.object({ kind: mailKindSchema });
export type UnsubscribeResponse = z.infer<typeof unsubscribeResponseSchema>;
