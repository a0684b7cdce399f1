/**
 * The words of a group as typed: separated by commas, semicolons, equals signs or new lines
 * ("LP = LPG = propane" and "lp, lpg, propane" are the same group). Case and repeats are left to
 * the shared schema, which folds and drops them the same way the server does.
 */
export function parseTerms(text: string): string[] {
  return text
    .split(/[,;=\n]+/)
    .map((term) => term.trim().replace(/\s+/g, ' '))
    .filter((term) => term.length > 0);
}

/** The terms as they will be stored: lower case, each once, in the order typed. */
export function previewTerms(text: string): string[] {
  return [...new Set(parseTerms(text).map((term) => term.toLowerCase()))];
}
