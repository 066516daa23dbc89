/** A URL-friendly form of a name: lower case, ASCII letters, digits and single hyphens. */
export function slugify(text: string): string {
  return (
    text
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'team'
  );
}

/** The slug, or the slug with -2, -3 … until `taken` says no. */
export async function uniqueSlug(text: string, taken: (slug: string) => Promise<boolean>): Promise<string> {
  const base = slugify(text);
  for (let n = 1; ; n++) {
    const candidate = n === 1 ? base : `${base}-${n}`;
    if (!(await taken(candidate))) return candidate;
  }
}
