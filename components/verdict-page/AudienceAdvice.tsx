import type { RecommendationsDTO } from '@/lib/reviews/types';

const PARTS: { key: keyof RecommendationsDTO; title: string; empty: string }[] = [
  {
    key: 'whoMightTry',
    title: 'Who might try it',
    empty: 'The team did not name anyone who should try this protocol.',
  },
  {
    key: 'whoShouldNot',
    title: 'Who should not',
    empty: 'The team named no group that should avoid it; the cautions below still apply.',
  },
  { key: 'whatInstead', title: 'What to do instead', empty: 'The team suggested no alternative; ask your coach.' },
];

/** The team's recommendations per audience, written by the coach. */
export function AudienceAdvice({ recommendations }: { recommendations: RecommendationsDTO }) {
  return (
    <div className="grid gap-3 sm:grid-cols-3">
      {PARTS.map((part) => (
        <section
          key={part.key}
          aria-labelledby={`advice-${part.key}`}
          className="border-line bg-paper-raised break-inside-avoid rounded-lg border p-4"
        >
          <h3 id={`advice-${part.key}`} className="font-semibold">
            {part.title}
          </h3>
          <p className="mt-1.5 whitespace-pre-line">
            {recommendations[part.key] || <span className="text-ink-muted">{part.empty}</span>}
          </p>
        </section>
      ))}
    </div>
  );
}
