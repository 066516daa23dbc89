import Link from 'next/link';

/** The mark: a rope between two anchors, sagging under a load. */
export function LogoMark({ className = 'size-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect width="32" height="32" rx="7" fill="#274a41" />
      <path d="M7 10.5Q16 25.5 25 10.5" fill="none" stroke="#f38536" strokeWidth="2.6" strokeLinecap="round" />
      <path d="M16 18v3.5" stroke="#fbf9f5" strokeWidth="1.8" strokeLinecap="round" />
      <rect x="12.5" y="21.5" width="7" height="5" rx="1.2" fill="#fbf9f5" />
      <circle cx="7" cy="10.5" r="2.4" fill="#fbf9f5" />
      <circle cx="25" cy="10.5" r="2.4" fill="#fbf9f5" />
    </svg>
  );
}

export function Logo({ href = '/' }: { href?: string }) {
  return (
    <Link
      href={href}
      className="group inline-flex items-center gap-2 rounded-md sm:gap-2.5"
      aria-label="Loadbearing, home"
    >
      <LogoMark />
      {/* On the narrowest phones the mark alone leaves the header row room for its buttons. */}
      <span className="font-display text-ink group-hover:text-brand text-lg font-semibold tracking-tight max-[359px]:hidden sm:text-xl">
        Loadbearing
      </span>
    </Link>
  );
}
