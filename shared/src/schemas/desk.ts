import { z } from 'zod';
import { roleSchema } from './auth';

/** Someone on the desk, as a colleague sees them: for assigning and transferring tickets. */
export const deskMemberSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  role: roleSchema,
  branchIds: z.array(z.number().int()),
});
export type DeskMember = z.infer<typeof deskMemberSchema>;

/** A branch a ticket can be transferred to. */
export const deskBranchSchema = z.object({ id: z.number().int(), code: z.string(), name: z.string() });
export type DeskBranch = z.infer<typeof deskBranchSchema>;
