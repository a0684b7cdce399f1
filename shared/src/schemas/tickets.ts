import { z } from 'zod';
import { listQuerySchema } from './common';

export const EQUIPMENT_TYPES = [
  'furnace',
  'boiler',
  'water-heater',
  'heat-pump',
  'air-conditioner',
  'controls',
] as const;
export const FUELS = ['natural-gas', 'propane', 'other'] as const;
/** emergency: no heat or no cooling; job-held: the job cannot go on; question: anything else. */
export const URGENCIES = ['emergency', 'job-held', 'question'] as const;
export const TICKET_STATUSES = ['new', 'open', 'waiting-on-contractor', 'resolved', 'closed'] as const;
export const MESSAGE_KINDS = ['message', 'internal-note', 'event'] as const;

export const equipmentTypeSchema = z.enum(EQUIPMENT_TYPES);
export const fuelSchema = z.enum(FUELS);
export const urgencySchema = z.enum(URGENCIES);
export const ticketStatusSchema = z.enum(TICKET_STATUSES);
export type Fuel = z.infer<typeof fuelSchema>;
export type Urgency = z.infer<typeof urgencySchema>;
export type TicketStatus = z.infer<typeof ticketStatusSchema>;

export const MAX_MESSAGE_LENGTH = 10_000;

// Equipment --------------------------------------------------------------------
export const equipmentModelSchema = z.object({
  id: z.number().int(),
  brand: z.string(),
  modelNumber: z.string(),
  family: z.string(),
  type: equipmentTypeSchema,
  fuels: z.array(fuelSchema),
});
export type EquipmentModel = z.infer<typeof equipmentModelSchema>;
export const equipmentQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  limit: z.coerce.number().int().min(1).max(50).default(15),
});

// Tickets ----------------------------------------------------------------------
const personSchema = z.object({ id: z.number().int(), name: z.string() });

export const ticketSchema = z.object({
  id: z.number().int(),
  number: z.string(),
  accountId: z.number().int(),
  accountCompany: z.string(),
  openedBy: personSchema,
  branchId: z.number().int(),
  branchName: z.string(),
  subject: z.string(),
  description: z.string(),
  equipmentModel: equipmentModelSchema
    .pick({ id: true, brand: true, modelNumber: true, family: true, type: true })
    .nullable(),
  modelText: z.string().nullable(),
  serial: z.string().nullable(),
  fuel: fuelSchema,
  urgency: urgencySchema,
  status: ticketStatusSchema,
  assignee: personSchema.nullable(),
  firstResponseAt: z.string().nullable(),
  firstResponseDueAt: z.string(),
  resolvedAt: z.string().nullable(),
  resolutionSummary: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  lastMessageAt: z.string().nullable(),
  messageCount: z.number().int(),
});
export type Ticket = z.infer<typeof ticketSchema>;

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `Use at most ${max} characters`)
    .optional()
    .transform((v) => (v ? v : undefined));

export const ticketCreateSchema = z
  .object({
    subject: z
      .string()
      .trim()
      .min(3, 'Say in a few words what is wrong')
      .max(160, 'Use at most 160 characters'),
    description: z
      .string()
      .trim()
      .max(MAX_MESSAGE_LENGTH, `Use at most ${MAX_MESSAGE_LENGTH} characters`)
      .default(''),
    equipmentModelId: z.number().int().positive().optional(),
    modelText: optionalText(80),
    serial: optionalText(40),
    fuel: fuelSchema,
    urgency: urgencySchema,
  })
  .refine((v) => !(v.equipmentModelId && v.modelText), {
    path: ['modelText'],
    message: 'Pick a model from the catalogue or type one, not both',
  });
export type TicketCreate = z.infer<typeof ticketCreateSchema>;

export const ticketUpdateSchema = z
  .object({
    status: ticketStatusSchema,
    assigneeId: z.number().int().positive().nullable(),
    branchId: z.number().int().positive(),
    urgency: urgencySchema,
    resolutionSummary: z.string().trim().min(3, 'Say how it was solved').max(4000),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type TicketUpdate = z.infer<typeof ticketUpdateSchema>;

export const ticketListQuerySchema = listQuerySchema.extend({
  status: z
    .union([ticketStatusSchema, z.literal('active')])
    .optional()
    .describe('active = new, open or waiting-on-contractor'),
  urgency: urgencySchema.optional(),
  branchId: z.coerce.number().int().positive().optional(),
  assignee: z.union([z.literal('me'), z.literal('none'), z.coerce.number().int().positive()]).optional(),
});
export type TicketListQuery = z.infer<typeof ticketListQuerySchema>;
export const ticketListSchema = z.object({ items: z.array(ticketSchema), total: z.number().int() });

// Messages ---------------------------------------------------------------------
export const attachmentSchema = z.object({
  id: z.number().int(),
  ticketId: z.number().int(),
  messageId: z.number().int().nullable(),
  fileName: z.string(),
  contentType: z.string(),
  bytes: z.number().int(),
  width: z.number().int().nullable(),
  height: z.number().int().nullable(),
  hasThumbnail: z.boolean(),
  url: z.string(),
  thumbnailUrl: z.string().nullable(),
  createdAt: z.string(),
});
export type Attachment = z.infer<typeof attachmentSchema>;

export const messageSchema = z.object({
  id: z.number().int(),
  ticketId: z.number().int(),
  clientId: z.string().nullable(),
  kind: z.enum(MESSAGE_KINDS),
  body: z.string(),
  author: personSchema.extend({ role: z.string() }).nullable(),
  attachments: z.array(attachmentSchema),
  createdAt: z.string(),
  deliveredAt: z.string().nullable(),
  readAt: z.string().nullable(),
  /** Structured content of an event message, e.g. a check result card: { type: 'reading', reading }. */
  data: z.record(z.string(), z.unknown()).nullable().optional(),
  /** Marked by the desk as part of the answer (for the write-up); sent to staff readers only. */
  partOfAnswer: z.boolean().optional(),
});
export type Message = z.infer<typeof messageSchema>;

export const clientIdSchema = z
  .string()
  .trim()
  .min(8)
  .max(64)
  .regex(/^[A-Za-z0-9_-]+$/, 'Letters, digits, - and _ only');

export const messageCreateSchema = z
  .object({
    body: z
      .string()
      .trim()
      .max(MAX_MESSAGE_LENGTH, `Use at most ${MAX_MESSAGE_LENGTH} characters`)
      .default(''),
    clientId: clientIdSchema,
    kind: z.enum(['message', 'internal-note']).default('message'),
    attachmentIds: z.array(z.number().int().positive()).max(10).default([]),
  })
  .refine((v) => v.body.length > 0 || v.attachmentIds.length > 0, {
    path: ['body'],
    message: 'Write a message or add a photo',
  });
export type MessageCreate = z.infer<typeof messageCreateSchema>;

export const messageListQuerySchema = z.object({
  after: z.coerce.number().int().min(0).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(200),
});

// Snippets ---------------------------------------------------------------------
export const snippetSchema = z.object({
  id: z.number().int(),
  title: z.string(),
  body: z.string(),
  shared: z.boolean(),
  ownerId: z.number().int().nullable(),
  /** Whether the reader may change or delete it (the policy's answer, so screens need not guess). */
  canEdit: z.boolean(),
  updatedAt: z.string(),
});
export type Snippet = z.infer<typeof snippetSchema>;
export const snippetCreateSchema = z.object({
  title: z.string().trim().min(1, 'Required').max(120),
  body: z.string().trim().min(1, 'Required').max(MAX_MESSAGE_LENGTH),
  shared: z.boolean().default(false),
});
export const snippetUpdateSchema = snippetCreateSchema
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });

// First-response targets (minutes per urgency) ----------------------------------
export const DEFAULT_FIRST_RESPONSE_MINUTES: Record<Urgency, number> = {
  emergency: 15,
  'job-held': 60,
  question: 240,
};
