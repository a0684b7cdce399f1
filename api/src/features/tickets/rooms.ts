/** Room names, in one place: every emit and join uses these. */
export const rooms = {
  user: (id: number) => `user:${id}`,
  session: (sid: string) => `session:${sid}`,
  account: (id: number) => `account:${id}`,
  desk: (branchId: number) => `desk:${branchId}`,
  ticket: (id: number) => `ticket:${id}`,
  /** Staff sockets in a ticket: internal notes go here only. */
  ticketStaff: (id: number) => `ticket:${id}:staff`,
  /** Contractor sockets in a ticket. */
  ticketContractor: (id: number) => `ticket:${id}:contractor`,
};
