// Forty invented demo tickets across the accounts, with conversations and generated photos.
import { createHash, randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { count, eq, sql } from 'drizzle-orm';
import type { Db } from '../client';
import {
  attachments,
  contractorAccounts,
  equipmentModels,
  replySnippets,
  staffBranches,
  ticketEvents,
  ticketMessages,
  tickets,
  users,
} from '../schema/index';
import type { FileStorage } from '../../features/attachments/storage';
import { DEMO_EQUIPMENT } from './equipment';

const PROBLEMS: {
  subject: string;
  description: string;
  urgency: 'emergency' | 'job-held' | 'question';
  model: string;
  desk: string;
  reply: string;
}[] = [
  {
    subject: 'Furnace lights then shuts off after a few seconds',
    description:
      'Inducer starts, igniter glows, burners light and drop out after about 4 seconds. Three tries then lockout.',
    urgency: 'emergency',
    model: 'CV-S80-80',
    desk: 'Sounds like flame sense. What microamps do you read on the flame rod?',
    reply: 'Reading 0.4 µA. Rod looks sooty.',
  },
  {
    subject: 'Manifold pressure will not come up to spec on high fire',
    description: 'Two-stage, natural gas. High fire manifold reads 3.0 in. w.c. Inlet is 6.8 static.',
    urgency: 'job-held',
    model: 'CV-T96-100',
    desk: 'Check the inlet under fire first; if it drops more than an inch the supply is undersized.',
    reply: 'Under fire inlet drops to 4.9.',
  },
  {
    subject: 'Converting to LP: which orifices and spring?',
    description: 'Customer is switching to propane. Need the conversion kit and the orifice drill size.',
    urgency: 'question',
    model: 'CV-M98-80',
    desk: 'The kit includes the orifices and the valve spring. Set manifold for LP after conversion; I will post the procedure.',
    reply: 'Got the kit, thanks.',
  },
  {
    subject: 'Pressure switch fault code, inducer runs',
    description: 'Control flashes 3. Inducer runs, switch never closes. Hose looks fine.',
    urgency: 'emergency',
    model: 'CV-T96-80',
    desk: 'Check the condensate trap and the vent for blockage, then measure the switch with a manometer.',
    reply: 'Trap was full of sludge. Cleaned, runs now.',
  },
  {
    subject: 'Boiler short cycling on a mild day',
    description: 'Combi boiler fires for 30 seconds, shuts off, repeats.',
    urgency: 'job-held',
    model: 'HB-C110',
    desk: 'What is the minimum firing rate set to and what is the zone load? Check the outdoor reset curve.',
    reply: 'Reset curve was set too high.',
  },
  {
    subject: 'Water heater pilot will not stay lit',
    description: 'Atmospheric 40 gallon, pilot lights, goes out when knob released after 60 seconds.',
    urgency: 'emergency',
    model: 'HW-A40',
    desk: 'Thermocouple output? Should be well over 20 mV with the pilot lit.',
    reply: 'Reading 9 mV. Replacing the thermocouple.',
  },
  {
    subject: 'Temperature rise over the rating plate range',
    description: 'Measured 78 °F rise on high fire. Plate says 40-70.',
    urgency: 'job-held',
    model: 'CV-S80-100',
    desk: 'Check the filter and static pressure, then bump the blower tap up one speed.',
    reply: 'Filter was packed. Rise is 62 now.',
  },
  {
    subject: 'High altitude job: do I need to derate?',
    description: 'Install at 5,200 ft. Natural gas.',
    urgency: 'question',
    model: 'CV-T96-60',
    desk: 'Yes: follow the high-altitude section of the installation instructions; the usual rule is 4% per 1,000 ft above sea level.',
    reply: 'Thanks, will order the orifices.',
  },
  {
    subject: 'Heat pump iced over, no defrost',
    description: 'Outdoor coil solid ice. Unit keeps running in heat.',
    urgency: 'emergency',
    model: 'HP-36',
    desk: 'Check the defrost sensor and run a forced defrost from the board.',
    reply: 'Sensor was off the tube. Clipped back on.',
  },
  {
    subject: 'Tankless flashes an ignition fault',
    description: 'Tankless unit, propane, error on every hot water call.',
    urgency: 'job-held',
    model: 'HW-T199',
    desk: 'Confirm the unit is set for propane and measure inlet pressure while running full fire.',
    reply: 'Inlet sagging to 8 in. w.c. — regulator issue.',
  },
];

const ACCOUNT_ORDER = ['HV-KEA-1001', 'HV-BRL-1002', 'HV-SUM-1003', 'HV-RDG-1004'];
const STATUSES = [
  'new',
  'open',
  'waiting-on-contractor',
  'resolved',
  'open',
  'resolved',
  'new',
  'closed',
] as const;

/** A picture that stands for a job-site photo: warm gradient blocks, no product, no text. */
async function demoPhoto(seed: number): Promise<Buffer> {
  const hue = (seed * 47) % 360;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="900">
    <defs><linearGradient id="g" x1="0" y1="0" x2="1" y2="1"><stop offset="0" stop-color="hsl(${hue},45%,35%)"/><stop offset="1" stop-color="hsl(${(hue + 40) % 360},35%,15%)"/></linearGradient></defs>
    <rect width="1200" height="900" fill="url(#g)"/>
    <rect x="300" y="180" width="600" height="540" rx="24" fill="hsl(${hue},10%,70%)" stroke="#222" stroke-width="8"/>
    <circle cx="600" cy="450" r="${90 + (seed % 5) * 12}" fill="hsl(${(hue + 180) % 360},60%,45%)"/>
    <rect x="360" y="240" width="${120 + (seed % 7) * 20}" height="40" fill="#333"/></svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
}

/** Adds missing models, and fills in the spec of a model that has none yet (never overwrites one). */
export async function seedEquipment(db: Db) {
  await db
    .insert(equipmentModels)
    .values(DEMO_EQUIPMENT)
    .onConflictDoUpdate({
      target: equipmentModels.modelNumber,
      set: { spec: sql`coalesce(${equipmentModels.spec}, excluded.spec)` },
    });
}

/** Adds the demo tickets once (skipped when any ticket exists). */
export async function seedTickets(db: Db, storage: FileStorage): Promise<number> {
  const [existing] = await db.select({ n: count() }).from(tickets);
  if ((existing?.n ?? 0) > 0) return 0;
  const accounts = await db.select().from(contractorAccounts);
  const models = await db
    .select({ id: equipmentModels.id, modelNumber: equipmentModels.modelNumber })
    .from(equipmentModels);
  const contractors = await db
    .select({ id: users.id, accountId: users.accountId })
    .from(users)
    .where(eq(users.role, 'contractor'));
  const staff = await db
    .select({ id: users.id, branchId: staffBranches.branchId })
    .from(users)
    .innerJoin(staffBranches, eq(staffBranches.userId, users.id))
    .where(eq(users.role, 'tech'));
  let made = 0;
  for (let i = 0; i < 40; i++) {
    const account = accounts.find((a) => a.accountNumber === ACCOUNT_ORDER[i % 4]);
    if (!account) continue;
    const problem = PROBLEMS[i % PROBLEMS.length]!;
    const opener =
      contractors.filter((c) => c.accountId === account.id)[i % 2] ??
      contractors.find((c) => c.accountId === account.id);
    const tech = staff.find((s) => s.branchId === account.homeBranchId);
    if (!opener) continue;
    const status = STATUSES[i % STATUSES.length]!;
    const opened = new Date(Date.now() - (40 - i) * 5.5 * 3600 * 1000);
    const answered = status !== 'new' && tech;
    const model = models.find((m) => m.modelNumber === problem.model);
    await db.transaction(async (tx) => {
      const [t] = await tx
        .insert(tickets)
        .values({
          accountId: account.id,
          openedById: opener.id,
          branchId: account.homeBranchId,
          subject: problem.subject,
          description: problem.description,
          equipmentModelId: model?.id ?? null,
          serial: `DEMO${(100000 + i * 7919).toString().slice(0, 6)}`,
          fuel:
            problem.model === 'HW-T199' || i % 5 === 0
              ? 'propane'
              : problem.model.startsWith('HP')
                ? 'other'
                : 'natural-gas',
          urgency: problem.urgency,
          status,
          assigneeId: answered ? tech.id : null,
          firstResponseAt: answered ? new Date(opened.getTime() + 9 * 60 * 1000) : null,
          resolvedAt:
            status === 'resolved' || status === 'closed'
              ? new Date(opened.getTime() + 3 * 3600 * 1000)
              : null,
          resolutionSummary:
            status === 'resolved' || status === 'closed'
              ? `${problem.reply} Confirmed with the contractor.`
              : null,
          lastMessageAt: opened,
          createdAt: opened,
          updatedAt: opened,
        })
        .returning({ id: tickets.id });
      const ticketId = t!.id;
      const at = (min: number) => new Date(opened.getTime() + min * 60 * 1000);
      const [first] = await tx
        .insert(ticketMessages)
        .values({
          ticketId,
          authorId: opener.id,
          body: problem.description,
          clientId: randomUUID(),
          createdAt: at(1),
        })
        .returning({ id: ticketMessages.id });
      if (i % 3 === 0) {
        const photo = await demoPhoto(i);
        const thumb = await sharp(photo).resize(320, 320, { fit: 'inside' }).jpeg().toBuffer();
        const key = `tickets/${ticketId}/demo-${i}.jpg`;
        await storage.put(key, photo, 'image/jpeg');
        await storage.put(`tickets/${ticketId}/demo-${i}.thumb.jpg`, thumb, 'image/jpeg');
        await tx.insert(attachments).values({
          ticketId,
          messageId: first!.id,
          uploadedById: opener.id,
          storageKey: key,
          fileName: 'job-site.jpg',
          contentType: 'image/jpeg',
          bytes: photo.length,
          width: 1200,
          height: 900,
          thumbnailKey: `tickets/${ticketId}/demo-${i}.thumb.jpg`,
          sha256: createHash('sha256').update(photo).digest('hex'),
        });
      }
      await tx.insert(ticketEvents).values({
        ticketId,
        actorId: opener.id,
        field: 'status',
        fromValue: null,
        toValue: 'new',
        createdAt: opened,
      });
      if (answered) {
        await tx.insert(ticketMessages).values([
          {
            ticketId,
            authorId: tech.id,
            body: problem.desk,
            clientId: randomUUID(),
            createdAt: at(9),
            deliveredAt: at(9),
            readAt: at(11),
          },
          {
            ticketId,
            authorId: tech.id,
            kind: 'internal-note',
            body: 'Checked the account: unit installed by this contractor, under warranty.',
            clientId: randomUUID(),
            createdAt: at(10),
          },
          { ticketId, authorId: opener.id, body: problem.reply, clientId: randomUUID(), createdAt: at(25) },
        ]);
        await tx
          .update(tickets)
          .set({ lastMessageAt: at(25) })
          .where(eq(tickets.id, ticketId));
      }
    });
    made++;
  }
  await db.insert(replySnippets).values([
    {
      title: 'Ask for manifold readings',
      body: 'Could you send the manifold pressure at each stage, and the inlet pressure static and under fire?',
    },
    {
      title: 'Ask for the rating plate',
      body: 'Please send a photo of the rating plate with the model and serial number.',
    },
    {
      title: 'Gas safety reminder',
      body: 'Shut the gas off before opening a test port, leak-test every fitting you opened, and check for CO before you leave.',
    },
  ]);
  return made;
}
