import type { ReactNode } from 'react';
import { cn } from '@/components/ui/cn';
import type { VerdictKey } from '@/lib/reviews/types';

/**
 * A verdict as a chip in the product's own palette — granite, rope and chalk — with a shape
 * beside the words, so no verdict is told apart by colour alone (and none borrows the red /
 * amber / green of a traffic light):
 * - supported: solid granite, a filled disc with a tick;
 * - other reasons: rope, a fork (the outcome holds, by another road);
 * - uncertain: chalk, a half-filled disc;
 * - not supported: outlined granite ink, a struck-through disc;
 * - insufficient: dashed chalk outline, an empty dotted disc.
 */
const STYLE: Record<VerdictKey, { className: string; icon: ReactNode }> = {
  supported: {
    className: 'border-granite-700 bg-granite-700 text-white',
    icon: (
      <>
        <circle cx="8" cy="8" r="7" fill="currentColor" opacity="0.25" />
        <path d="M4.5 8.2 7 10.6l4.6-5" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
      </>
    ),
  },
  'other-reasons': {
    className: 'border-rope-300 bg-rope-50 text-rope-800',
    icon: (
      <path
        d="M8 14V8M8 8 4 3.5M8 8l4-4.5M2.8 5.2 4 3.5l1.9.6M10.1 4.1 12 3.5l1.2 1.7"
        fill="none"
        stroke="currentColor"
        strokeWidth="1.6"
        strokeLinecap="round"
        strokeLinejoin="round"
      />
    ),
  },
  uncertain: {
    className: 'border-chalk-400 bg-chalk-100 text-chalk-800',
    icon: (
      <>
        <circle cx="8" cy="8" r="6.2" fill="none" stroke="currentColor" strokeWidth="1.6" />
        <path d="M8 1.8a6.2 6.2 0 0 1 0 12.4Z" fill="currentColor" />
      </>
    ),
  },
  'not-supported': {
    className: 'border-granite-900 bg-paper-raised text-granite-900',
    icon: (
      <>
        <circle cx="8" cy="8" r="6.2" fill="none" stroke="currentColor" strokeWidth="1.6" />
        <path d="M3.6 12.4 12.4 3.6" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
      </>
    ),
  },
  insufficient: {
    className: 'border-dashed border-chalk-500 bg-paper text-chalk-700',
    icon: <circle cx="8" cy="8" r="6" fill="none" stroke="currentColor" strokeWidth="1.6" strokeDasharray="2 2.2" />,
  },
};

export function VerdictChip({
  verdict,
  label,
  className,
}: {
  verdict: VerdictKey;
  label: ReactNode;
  className?: string;
}) {
  const style = STYLE[verdict];
  return (
    <span
      data-verdict-chip={verdict}
      className={cn(
        'inline-flex items-center gap-1.5 rounded-full border px-2.5 py-0.5 text-xs font-semibold tracking-wide whitespace-nowrap',
        style.className,
        className,
      )}
    >
      <svg viewBox="0 0 16 16" aria-hidden="true" className="size-3.5 shrink-0">
        {style.icon}
      </svg>
      {label}
    </span>
  );
}
