import { describe, expect, it } from 'vitest';
import { slugify } from '@/lib/teams/slug';

describe('slugify', () => {
  it('ends a long slug on a whole word', () => {
    const slug = slugify('Band pull-aparts every morning fix shoulder impingement for overhead athletes in four weeks');
    expect(slug.length).toBeLessThanOrEqual(60);
    expect(slug).toBe('band-pull-aparts-every-morning-fix-shoulder-impingement-for');
  });
  it('keeps a word that ends exactly at the limit', () => {
    const sixty = 'a'.repeat(28) + ' ' + 'b'.repeat(31);
    expect(slugify(`${sixty} more`)).toBe(`${'a'.repeat(28)}-${'b'.repeat(31)}`);
  });
  it('cuts a single word longer than the limit rather than returning nothing', () => {
    expect(slugify('x'.repeat(80))).toBe('x'.repeat(60));
  });
  it('leaves short names alone', () => {
    expect(slugify('Granite Hollow Training Lab')).toBe('granite-hollow-training-lab');
    expect(slugify('!!!')).toBe('team');
  });
});
