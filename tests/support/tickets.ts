// Helpers for ticket tests: a contractor with a ticket, and a tech at its branch.
import { randomUUID } from 'node:crypto';
import { makeAccount, makeUser, type MadeUser } from './fixtures';
import { signedInClient, type TestClient } from './server';
import type { RunningServer } from '../../api/src/server';
import type { Ticket } from '../../shared/src/index';

export interface TicketWorld {
  contractor: MadeUser;
  contractorClient: TestClient;
  tech: MadeUser;
  techClient: TestClient;
  ticket: Ticket;
}

export async function ticketWorld(
  server: RunningServer,
  ticketBody: Partial<Record<string, unknown>> = {},
): Promise<TicketWorld> {
  const account = await makeAccount();
  const contractor = await makeUser({ accountId: account.id });
  const tech = await makeUser({ role: 'tech', branchIds: [account.homeBranchId] });
  const contractorClient = await signedInClient(server, contractor);
  const techClient = await signedInClient(server, tech);
  const res = await contractorClient.post('/api/tickets', {
    subject: 'Furnace locks out after three tries',
    description: 'Igniter glows, burners light, then shuts off after a few seconds.',
    fuel: 'natural-gas',
    urgency: 'emergency',
    modelText: 'CV-T96 test',
    ...ticketBody,
  });
  if (res.status !== 201) throw new Error(`ticket create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { contractor, contractorClient, tech, techClient, ticket: res.body.ticket };
}

export const newClientId = () => randomUUID().replace(/-/g, '');
