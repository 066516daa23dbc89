/** Joins class names, skipping the falsy ones (conditional classes read better inline). */
export function cn(...parts: Array<string | false | null | undefined>): string {
  return parts.filter(Boolean).join(' ');
}
