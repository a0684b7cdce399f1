import { z } from 'zod';
import { ARTICLE_STATUSES, AUDIENCES, articleSchema, removedItemSchema } from './articles';
import { idSchema } from './common';

// Turning a resolved ticket into a draft article: the desk marks the messages that answered it,
// then writes it up; contact details are taken out before anything is saved.

/** PATCH /api/tickets/:id/messages/:messageId — staff: mark a message as part of the answer, or not. */
export const messageMarkSchema = z.object({ partOfAnswer: z.boolean() });
export type MessageMark = z.infer<typeof messageMarkSchema>;

export const messageParamsSchema = z.object({ id: idSchema, messageId: idSchema });

/** POST /api/tickets/:id/write-up — staff, on a resolved ticket. */
export const writeUpCreateSchema = z.object({
  /** The messages (and internal notes) that make up the answer, in any order; shown oldest first. */
  messageIds: z.array(z.number().int().positive()).max(200, 'Choose at most 200 messages').default([]),
  /** Photos sent on the ticket to copy into the article. */
  attachmentIds: z.array(z.number().int().positive()).max(20, 'Choose at most 20 photos').default([]),
  /** Keep the unit's serial number in the article (off: it is removed like contact details). */
  keepSerial: z.boolean().default(false),
  audience: z.enum(AUDIENCES).default('contractor'),
});
export type WriteUpCreate = z.infer<typeof writeUpCreateSchema>;

export const writeUpResultSchema = z.object({
  article: articleSchema,
  /** What was taken out of the ticket's text before the draft was saved. */
  removed: z.array(removedItemSchema),
});
export type WriteUpResult = z.infer<typeof writeUpResultSchema>;

/** An article a ticket was written up as, as far as the reader may see it. */
export const writeUpLinkSchema = z.object({
  id: z.number().int(),
  slug: z.string(),
  title: z.string(),
  status: z.enum(ARTICLE_STATUSES),
});
export type WriteUpLink = z.infer<typeof writeUpLinkSchema>;
