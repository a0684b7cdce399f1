import { describe, expect, it } from 'vitest';
import { formatExact, formatRelative } from './useRelativeTime';

const now = new Date('2026-03-04T15:00:00Z');
const ago = (seconds: number) => new Date(now.getTime() - seconds * 1000);

describe('relative times', () => {
  it('When a time was 12 minutes ago, then it reads "12 minutes ago"', () => {
    expect(formatRelative(ago(12 * 60), now, 'en')).toBe('12 minutes ago');
  });

  it('When a time is under a minute old, then it reads "now"', () => {
    expect(formatRelative(ago(20), now, 'en')).toBe('now');
  });

  it('When a time is one day back, then it reads "yesterday"; three hours back reads "3 hours ago"', () => {
    expect(formatRelative(ago(26 * 3600), now, 'en')).toBe('yesterday');
    expect(formatRelative(ago(3 * 3600 + 100), now, 'en')).toBe('3 hours ago');
  });

  it('When the exact time is asked for, then it has the date and the time of day', () => {
    const text = formatExact(now, 'en');
    expect(text).toMatch(/2026/);
    expect(text).toMatch(/\d{1,2}:\d{2}/);
  });
});
