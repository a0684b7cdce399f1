import { z } from 'zod';
import { branchSchema } from './admin';

/** What the signed-in person's home screen shows: their company, or their branches. */
export const homeResponseSchema = z.object({
  account: z
    .object({
      id: z.number().int(),
      company: z.string(),
      accountNumber: z.string(),
      homeBranch: branchSchema,
      teammates: z.array(z.object({ id: z.number().int(), name: z.string(), isAccountOwner: z.boolean() })),
    })
    .nullable(),
  branches: z.array(branchSchema),
});
export type HomeResponse = z.infer<typeof homeResponseSchema>;
