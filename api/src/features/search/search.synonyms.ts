// Synonym groups: specialists and admins keep the trade's words for the same thing.
import type { AppContext } from '../../context';
import type { SearchSynonym, SessionUser, SynonymInput } from '../../../../shared/src/index';
import { audit } from '../../lib/audit';
import { AppError } from '../../lib/errors';
import { authorize } from '../../lib/policies';
import { enginesOf } from './search.engines';
import * as repo from './search.repository';
import { queueSearchSettings } from './search.sync';

export async function listSynonyms(ctx: AppContext, user: SessionUser): Promise<SearchSynonym[]> {
  authorize(user, 'search.synonyms');
  return repo.listSynonyms(ctx.db);
}

/** PostgreSQL reads the new groups at once on this server; Meilisearch gets them through the queue. */
function synonymsChanged(ctx: AppContext) {
  enginesOf(ctx).postgres.forgetSynonyms();
}

export async function createSynonym(ctx: AppContext, user: SessionUser, input: SynonymInput) {
  authorize(user, 'search.synonyms');
  const synonym = await ctx.db.transaction(async (tx) => {
    const row = await repo.insertSynonym(tx, input.terms);
    await audit(tx, {
      actorId: user.id,
      action: 'search.synonym.create',
      targetType: 'search_synonym',
      targetId: row.id,
      details: { terms: row.terms },
    });
    await queueSearchSettings(ctx, tx);
    return row;
  });
  synonymsChanged(ctx);
  return synonym;
}

export async function updateSynonym(ctx: AppContext, user: SessionUser, id: number, input: SynonymInput) {
  authorize(user, 'search.synonyms');
  const synonym = await ctx.db.transaction(async (tx) => {
    const before = await repo.findSynonym(tx, id);
    if (!before) throw AppError.notFound('Synonym group');
    const row = (await repo.updateSynonym(tx, id, input.terms))!;
    await audit(tx, {
      actorId: user.id,
      action: 'search.synonym.update',
      targetType: 'search_synonym',
      targetId: id,
      details: { before: before.terms, after: row.terms },
    });
    await queueSearchSettings(ctx, tx);
    return row;
  });
  synonymsChanged(ctx);
  return synonym;
}

export async function deleteSynonym(ctx: AppContext, user: SessionUser, id: number) {
  authorize(user, 'search.synonyms');
  await ctx.db.transaction(async (tx) => {
    const before = await repo.findSynonym(tx, id);
    if (!before || !(await repo.deleteSynonym(tx, id))) throw AppError.notFound('Synonym group');
    await audit(tx, {
      actorId: user.id,
      action: 'search.synonym.delete',
      targetType: 'search_synonym',
      targetId: id,
      details: { terms: before.terms },
    });
    await queueSearchSettings(ctx, tx);
  });
  synonymsChanged(ctx);
}
