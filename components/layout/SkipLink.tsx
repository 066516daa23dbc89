/** The first stop for keyboard users on every page: straight past the header to `#main`. */
export function SkipLink() {
  return (
    <a
      href="#main"
      className="bg-brand sr-only z-50 rounded-md px-4 py-2 font-semibold text-white focus:not-sr-only focus:fixed focus:top-3 focus:left-3"
    >
      Skip to content
    </a>
  );
}
