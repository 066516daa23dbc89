const MAX_SLUG = 60;

/**
 * A URL-friendly form of a name: lower case, ASCII letters, digits and single hyphens, at most 60
 * characters, ending on a whole word (a shared link reads "…-for", never "…-imping").
 */
export function slugify(text: string): string {
  const full = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  if (full.length <= MAX_SLUG) return full || 'team';
  const cut = full.slice(0, MAX_SLUG);
  // The cut fell inside a word: go back to the last word boundary, unless that is the only word.
  const wholeWords = full[MAX_SLUG] === '-' ? cut : cut.slice(0, Math.max(cut.lastIndexOf('-'), 0));
  return (wholeWords || cut).replace(/-+$/, '');
}

/** The slug, or the slug with -2, -3 … until `taken` says no. */
export async function uniqueSlug(text: string, taken: (slug: string) => Promise<boolean>): Promise<string> {
  const base = slugify(text);
  for (let n = 1; ; n++) {
    const candidate = n === 1 ? base : `${base}-${n}`;
    if (!(await taken(candidate))) return candidate;
  }
}
