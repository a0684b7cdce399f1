import { describe, expect, it } from 'vitest';
import type { Article } from '@shared/schemas/articles';
import { reviewActions, toFormValues } from './useArticleEditor';

const article = (status: Article['status'], authorId = 1): Article => ({
  id: 9,
  slug: 'flame-sensor-checks',
  title: 'Flame sensor checks',
  summary: 'What to check when the flame drops out.',
  kind: 'troubleshooting',
  audience: 'contractor',
  status,
  updatedAt: '2026-01-01T00:00:00Z',
  body: 'Body',
  bodyHtml: '<p>Body</p>',
  models: [{ id: 4, brand: 'Corvane', modelNumber: 'CV-S80-60' }],
  author: { id: authorId, name: 'Writer' },
  publishedAt: null,
  reviewNote: null,
  helpedCount: 0,
  notHelpedCount: 0,
  viewCount: 0,
  touchesGas: false,
});
const writer = { id: 1, role: 'specialist' };
const other = { id: 2, role: 'specialist' };

describe('reviewActions', () => {
  it('When the writer looks at their draft, then they may send it for review but not publish it', () => {
    expect(reviewActions(article('draft'), writer)).toMatchObject({
      submit: true,
      publish: false,
      sendBack: false,
    });
  });

  it('When another specialist looks at an article awaiting review, then they may publish or send it back', () => {
    expect(reviewActions(article('in-review'), other)).toMatchObject({
      submit: false,
      publish: true,
      sendBack: true,
    });
  });

  it('When an admin looks at their own article awaiting review, then they may publish it', () => {
    expect(reviewActions(article('in-review', 3), { id: 3, role: 'admin' }).publish).toBe(true);
  });

  it('When a desk tech looks at a live article, then they may neither publish nor withdraw it', () => {
    expect(reviewActions(article('published', 7), { id: 8, role: 'tech' })).toEqual({
      submit: false,
      publish: false,
      sendBack: false,
      retire: false,
    });
  });

  it('When a specialist looks at a live article, then they may withdraw it; a withdrawn one, not again', () => {
    expect(reviewActions(article('published'), other).retire).toBe(true);
    expect(reviewActions(article('retired'), other).retire).toBe(false);
  });

  it('When the article is not saved yet, then no review step is offered', () => {
    expect(reviewActions(null, writer)).toEqual({
      submit: false,
      publish: false,
      sendBack: false,
      retire: false,
    });
  });
});

describe('toFormValues', () => {
  it('When editing an article, then the form holds its text and the ids of its models', () => {
    expect(toFormValues(article('draft'))).toEqual({
      title: 'Flame sensor checks',
      summary: 'What to check when the flame drops out.',
      body: 'Body',
      kind: 'troubleshooting',
      audience: 'contractor',
      equipmentModelIds: [4],
    });
  });

  it('When writing a new one, then it starts as contractor fault finding with no models', () => {
    expect(toFormValues(null)).toMatchObject({
      kind: 'troubleshooting',
      audience: 'contractor',
      equipmentModelIds: [],
    });
  });
});
