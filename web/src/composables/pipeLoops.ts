/**
 * The sections whose parent chain never reaches the meter (it comes back to itself). The system
 * sizing walks parents, so a loop has to be caught before it runs.
 */
export function sectionsInLoops(sections: readonly { id: string; parentId: string | null }[]): Set<string> {
  const parentOf = new Map(sections.map((s) => [s.id, s.parentId]));
  const looped = new Set<string>();
  for (const s of sections) {
    const seen = new Set<string>();
    let at: string | null | undefined = s.id;
    while (at !== null && at !== undefined && !seen.has(at)) {
      seen.add(at);
      at = parentOf.get(at);
    }
    if (at !== null && at !== undefined) looped.add(s.id);
  }
  return looped;
}
