import type { AppContext } from '../../context';
import type {
  RemovedItem,
  SessionUser,
  Ticket,
  WriteUpCreate,
  WriteUpResult,
} from '../../../../shared/src/index';
import { audit } from '../../lib/audit';
import { AppError } from '../../lib/errors';
import { authorize } from '../../lib/policies';
import * as articlesRepo from '../articles/articles.repository';
import { getArticle, uniqueSlug } from '../articles/articles.service';
import { addArticleImage } from '../articles/images.service';
import { listReadings } from '../readings/readings.repository';
import { queueSearchSync } from '../search/search.sync';
import { findTicket } from './tickets.repository';
import { loadScope } from './tickets.service';
import { writeUpBody, type WriteUpParts } from './write-up.body';
import * as repo from './write-up.repository';
import { Scrubber } from './write-up.scrub';

const WRITTEN_UP_STATUSES = new Set(['resolved', 'closed']);
const TITLE_MAX = 160;
const SUMMARY_MAX = 400;

const equipmentOf = (t: Ticket) =>
  t.equipmentModel
    ? `${t.equipmentModel.brand} ${t.equipmentModel.modelNumber} (${t.equipmentModel.family})`
    : t.modelText;
const modelOf = (t: Ticket) => (t.equipmentModel ? t.equipmentModel.modelNumber : t.modelText);
const clip = (s: string, max: number) => (s.length <= max ? s : `${s.slice(0, max - 1).trimEnd()}…`);
const oneLine = (s: string) => s.replace(/\s+/g, ' ').trim();

/**
 * A resolved ticket becomes a draft article in the specialists' review queue: the problem, the
 * readings with their verdicts, the messages chosen as the answer, the resolution and the chosen
 * photos. Contact details are taken out before anything is saved; what went is returned and kept
 * with the write-up so the reviewer can check it.
 *
 * Internal notes may be chosen: only staff can write up, and the draft is reviewed before any
 * contractor reads it; they are labelled as notes in the draft so the reviewer sees them.
 */
export async function writeUpTicket(
  ctx: AppContext,
  user: SessionUser,
  ticketId: number,
  input: WriteUpCreate,
): Promise<WriteUpResult> {
  const scope = await loadScope(ctx.db, user, ticketId);
  authorize(user, 'ticket.write-up', scope);
  authorize(user, 'article.write');
  if (!WRITTEN_UP_STATUSES.has(scope.status)) {
    throw AppError.conflict('Only a resolved ticket can be written up: resolve it first, with its summary');
  }
  const ticket = (await findTicket(ctx.db, ticketId))!;

  const messageIds = [...new Set(input.messageIds)];
  const attachmentIds = [...new Set(input.attachmentIds)];
  const [chosen, files] = await Promise.all([
    repo.messagesOfTicket(ctx.db, ticketId, messageIds),
    repo.sentFilesOfTicket(ctx.db, ticketId, attachmentIds),
  ]);
  const fields: Record<string, string> = {};
  if (chosen.length !== messageIds.length)
    fields.messageIds = 'Some of these messages are not on this ticket';
  if (files.length !== attachmentIds.length)
    fields.attachmentIds = 'Some of these photos were not sent on this ticket';
  else if (files.some((f) => !f.contentType.startsWith('image/')))
    fields.attachmentIds = 'Only photos go into an article; leave the documents out';
  if (Object.keys(fields).length) throw AppError.validation(fields);

  // Read everything before the transaction, so it stays short.
  const [contacts, readings, photoBytes] = await Promise.all([
    repo.contactsOf(ctx.db, ticket.accountId),
    listReadings(ctx.db, ticketId),
    Promise.all(files.map((f) => ctx.storage.get(f.storageKey))),
  ]);
  const scrubber = new Scrubber({
    names: contacts.people.map((p) => p.name),
    companies: contacts.company ? [contacts.company] : [],
    emails: contacts.people.map((p) => p.email),
    serial: ticket.serial,
    keepSerial: input.keepSerial,
  });
  const clean = (s: string) => scrubber.scrub(s);

  const subject = clean(oneLine(ticket.subject));
  const model = modelOf(ticket);
  const named = clip(model ? `${subject} — ${clean(model)}` : subject, TITLE_MAX);
  const title = named.length >= 5 ? named : `Write-up: ${named}`;
  const resolution = ticket.resolutionSummary ? clean(ticket.resolutionSummary) : null;
  const summary = summaryOf(subject, resolution);
  const equipment = equipmentOf(ticket);
  const parts: WriteUpParts = {
    subject,
    description: clean(ticket.description),
    equipment: equipment ? clean(equipment) : null,
    fuel: ticket.fuel,
    serial: input.keepSerial ? ticket.serial : null,
    readings,
    answer: chosen.map((m) => ({
      side: m.authorRole === 'contractor' ? 'site' : 'desk',
      note: m.kind === 'internal-note',
      body: clean(m.body),
    })),
    resolution,
    photos: [],
  };
  const removed = scrubber.removed;
  const notes = chosen.filter((m) => m.kind === 'internal-note').length;

  const slug = await uniqueSlug(ctx, title);
  // The copied photos' files are stored as the transaction goes; if it rolls back, they go too.
  const storedKeys: string[] = [];
  const articleId = await ctx.db
    .transaction(async (tx) => {
      const id = await articlesRepo.insertArticle(tx, {
        slug,
        title,
        summary,
        body: writeUpBody(parts),
        kind: 'troubleshooting',
        audience: input.audience,
        authorId: user.id,
        sourceTicketId: ticketId,
        // Straight into the specialists' queue; its author may still change it until it is published.
        status: 'in-review',
      });
      const modelText = await articlesRepo.setModels(
        tx,
        id,
        ticket.equipmentModel ? [ticket.equipmentModel.id] : [],
      );
      for (const [i, bytes] of photoBytes.entries()) {
        // A neutral file name: the uploaded one may carry a customer's name.
        const image = await addArticleImage(
          ctx,
          { articleId: id, uploadedById: user.id, bytes, fileName: `photo-${i + 1}` },
          tx,
          storedKeys,
        );
        parts.photos.push({ url: image.url, alt: `Photo ${i + 1} from the job` });
      }
      const body = writeUpBody(parts);
      await articlesRepo.updateArticleRow(tx, id, { body, modelText });
      await articlesRepo.insertRevision(tx, {
        articleId: id,
        title,
        summary,
        body,
        authorId: user.id,
        note: revisionNote(ticket.number, removed, notes),
      });
      // The search index hears of it as of any new article (it shows once published).
      await queueSearchSync(ctx, id, tx);
      await audit(tx, { actorId: user.id, action: 'article.create', targetType: 'article', targetId: id });
      await audit(tx, {
        actorId: user.id,
        action: 'article.write-up',
        targetType: 'article',
        targetId: id,
        details: { ticketId, messageIds, attachmentIds, keepSerial: input.keepSerial, removed },
      });
      return id;
    })
    .catch(async (err: unknown) => {
      await Promise.all(storedKeys.map((key) => ctx.storage.remove(key).catch(() => {})));
      throw err;
    });
  return { article: await getArticle(ctx, user, articleId), removed };
}

/** The articles a ticket was written up as, that this reader may open. */
export async function listWriteUps(ctx: AppContext, user: SessionUser, ticketId: number) {
  await loadScope(ctx.db, user, ticketId);
  return repo.writeUpsOf(ctx.db, user, ticketId);
}

function summaryOf(subject: string, resolution: string | null): string {
  const fromResolution = resolution ? oneLine(resolution) : '';
  const text = fromResolution.length >= 10 ? fromResolution : `How it was solved: ${subject}`;
  return clip(text, SUMMARY_MAX);
}

const KIND_WORDS: Record<RemovedItem['kind'], [string, string]> = {
  name: ['name', 'names'],
  company: ['company name', 'company names'],
  phone: ['phone number', 'phone numbers'],
  email: ['e-mail address', 'e-mail addresses'],
  address: ['street address', 'street addresses'],
  serial: ['serial number', 'serial numbers'],
};

/** The first revision says where the draft came from and how much was removed (not the details). */
export function revisionNote(ticketNumber: string, removed: RemovedItem[], notes: number): string {
  const counts = new Map<RemovedItem['kind'], number>();
  for (const r of removed) counts.set(r.kind, (counts.get(r.kind) ?? 0) + 1);
  const what = [...counts].map(([kind, n]) => `${n} ${KIND_WORDS[kind][n === 1 ? 0 : 1]}`);
  const parts = [`Written up from ticket ${ticketNumber}.`];
  parts.push(what.length ? `Removed before saving: ${what.join(', ')}.` : 'No contact details were found.');
  if (notes)
    parts.push(`Includes ${notes} internal ${notes === 1 ? 'note' : 'notes'}: check before publishing.`);
  return parts.join(' ');
}
