import { VerdictChip } from '@/components/verdict/VerdictChip';

// An invented example (the demo scenario), so a visitor sees the kind of page athletes get.
const MECHANISMS = [
  { name: 'Practice: grip position and pinch technique', term: 'likely', width: 'w-[78%]', tone: 'bg-granite-500' },
  {
    name: 'Expectation and confidence on pinches',
    term: 'about as likely as not',
    width: 'w-[48%]',
    tone: 'bg-granite-300',
  },
  { name: 'Thumb tendon stiffening', term: 'very unlikely at this load', width: 'w-[7%]', tone: 'bg-rope-400' },
];

export function VerdictPreview() {
  return (
    <figure
      className="border-line bg-paper-raised shadow-lift rounded-xl border p-5 sm:p-6"
      aria-label="Example verdict"
    >
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-ink-muted text-xs font-semibold tracking-wide uppercase">Example verdict · invented</p>
        <VerdictChip verdict="not-supported" label="Does not hold up" />
      </div>
      <blockquote className="font-display text-ink mt-3 text-xl leading-snug font-semibold">
        “Four daily sets of light pinch-block lifts stiffen thumb tendons in three weeks.”
      </blockquote>
      <p className="text-ink-muted mt-2 text-sm">
        Dose checked: 20 % of max, 4 × 10 s, daily, 3 weeks. The load is far below what tendon remodelling needs; early
        gains are better explained by practice.
      </p>
      <ul className="mt-5 space-y-3">
        {MECHANISMS.map((m) => (
          <li key={m.name}>
            <div className="flex flex-wrap justify-between gap-x-3 text-sm">
              <span className="text-ink font-medium">{m.name}</span>
              <span className="text-ink-muted">{m.term}</span>
            </div>
            <div className="bg-chalk-100 mt-1.5 h-2 rounded-full" aria-hidden="true">
              <div className={`h-2 rounded-full ${m.width} ${m.tone}`} />
            </div>
          </li>
        ))}
      </ul>
    </figure>
  );
}
