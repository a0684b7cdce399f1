// Imports the seed articles of kb/*.md (front matter + Markdown) as published articles; an article
// whose slug already exists is left as it is, so the import can run on every start.
import { readdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import matter from 'gray-matter';
import { inArray } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { articles, equipmentModels } from '../schema/index';
import { kbFrontMatterSchema, type SessionUser } from '../../../../shared/src/index';
import { createArticle } from '../../features/articles/index';

export class KbImportError extends Error {
  override name = 'KbImportError';
}

export interface KbFile {
  file: string;
  data: ReturnType<typeof kbFrontMatterSchema.parse>;
  body: string;
}

/** Reads and validates every article file; a bad one stops the import naming the file and field. */
export async function readKb(dir: string): Promise<KbFile[]> {
  const files = (await readdir(dir)).filter((f) => f.endsWith('.md') && f !== 'README.md').sort();
  const out: KbFile[] = [];
  for (const file of files) {
    const parsed = matter(await readFile(join(dir, file), 'utf8'));
    const result = kbFrontMatterSchema.safeParse(parsed.data);
    if (!result.success) {
      const issue = result.error.issues[0]!;
      throw new KbImportError(`${file}: ${issue.path.join('.') || 'front matter'}: ${issue.message}`);
    }
    if (`${result.data.slug}.md` !== file)
      throw new KbImportError(`${file}: slug "${result.data.slug}" must match the file name`);
    out.push({ file, data: result.data, body: parsed.content.trim() });
  }
  return out;
}

export async function importKb(
  ctx: Pick<AppContext, 'db'>,
  author: SessionUser,
  dir: string,
): Promise<number> {
  const files = await readKb(dir);
  const existing = new Set(
    (
      await ctx.db
        .select({ slug: articles.slug })
        .from(articles)
        .where(inArray(articles.slug, files.map((f) => f.data.slug).concat('')))
    ).map((r) => r.slug),
  );
  const numbers = [...new Set(files.flatMap((f) => f.data.models))];
  const models = numbers.length
    ? await ctx.db
        .select({ id: equipmentModels.id, n: equipmentModels.modelNumber })
        .from(equipmentModels)
        .where(inArray(equipmentModels.modelNumber, numbers))
    : [];
  let added = 0;
  for (const f of files) {
    if (existing.has(f.data.slug)) continue;
    await createArticle(
      ctx,
      author,
      {
        title: f.data.title,
        summary: f.data.summary,
        body: f.body,
        kind: f.data.kind,
        audience: f.data.audience,
        equipmentModelIds: models.filter((m) => f.data.models.includes(m.n)).map((m) => m.id),
      },
      { slug: f.data.slug, status: 'published' },
    );
    added++;
  }
  return added;
}
