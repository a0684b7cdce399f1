import type { Snippet } from '@shared/schemas/tickets';

/** Snippets whose title or text holds every word typed; mine before the shared ones, then by title. */
export function filterSnippets(list: readonly Snippet[], search: string, userId: number | null): Snippet[] {
  const words = search.toLowerCase().split(/\s+/).filter(Boolean);
  const mine = (s: Snippet) => (s.ownerId !== null && s.ownerId === userId ? 0 : 1);
  return list
    .filter((s) => {
      const text = `${s.title}\n${s.body}`.toLowerCase();
      return words.every((w) => text.includes(w));
    })
    .sort((a, b) => mine(a) - mine(b) || a.title.localeCompare(b.title));
}

/** The draft after a snippet goes in: appended on a new paragraph, never replacing what was typed. */
export function appendSnippet(draft: string, body: string): string {
  const typed = draft.trimEnd();
  return typed ? `${typed}\n\n${body}` : body;
}
