import { describe, expect, it } from 'vitest';
import { safeRedirect } from './safeRedirect';

describe('safeRedirect', () => {
  it('When the target is a path on this site, then it is kept with its query and hash', () => {
    expect(safeRedirect('/admin/users?page=2#top')).toBe('/admin/users?page=2#top');
    expect(safeRedirect('/company')).toBe('/company');
  });

  it('When the query has the value twice, then the first one is used', () => {
    expect(safeRedirect(['/desk', '/company'])).toBe('/desk');
  });

  it.each([
    ['another site', 'https://elsewhere.example/'],
    ['a protocol-relative URL', '//elsewhere.example/path'],
    ['a backslash trick', '/\\elsewhere.example'],
    ['a backslash inside', '/a\\b'],
    ['a javascript: URL', 'javascript:alert(1)'],
    ['a relative path', 'company'],
    ['an encoded newline', '/a\nb'],
    ['the sign-in page itself', '/sign-in?redirect=/x'],
    ['nothing', ''],
    ['not a string', 42],
    ['undefined', undefined],
  ])('When the target is %s, then there is no redirect', (_what, value) => {
    expect(safeRedirect(value)).toBeNull();
  });
});
