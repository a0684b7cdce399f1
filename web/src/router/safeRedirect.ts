/**
 * The path to go back to after sign-in, if it is a path on this site; otherwise null.
 * Accepts "/x" but not "//host", "/\host" (browsers read "\" as "/"), absolute URLs,
 * control characters, or the sign-in page itself.
 */
export function safeRedirect(value: unknown, signInPath = '/sign-in'): string | null {
  const raw = Array.isArray(value) ? value[0] : value;
  if (typeof raw !== 'string' || raw.length === 0 || raw.length > 2000) return null;
  if (!raw.startsWith('/') || raw.startsWith('//') || raw.startsWith('/\\')) return null;
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f\\]/.test(raw)) return null;
  const base = 'https://lightoff.invalid';
  let parsed: URL;
  try {
    parsed = new URL(raw, base);
  } catch {
    return null;
  }
  if (parsed.origin !== base) return null;
  if (parsed.pathname === signInPath) return null;
  return `${parsed.pathname}${parsed.search}${parsed.hash}`;
}
