'use client';

import Link from 'next/link';
import { useState } from 'react';
import { Button } from '@/components/ui/Button';
import { apiFetch, errorMessage } from '@/lib/swr/fetcher';
import type { SuggestionDTO } from '@/lib/watch/types';
import { VerdictPageLink } from '@/components/verdict-page/VerdictPageLink';

/**
 * "New evidence to consider": library studies the evidence watch found close to a mechanism of a
 * verdict this person wrote. Nothing is applied: the author opens the study and appraises it in
 * the review, or dismisses the offer. Nothing is shown when there are none.
 */
export function NewEvidence({ items: initial }: { items: SuggestionDTO[] }) {
  const [items, setItems] = useState(initial);
  const [message, setMessage] = useState('');
  if (!items.length && !message) return null;

  async function dismiss(id: number) {
    setMessage('');
    try {
      await apiFetch(`/api/evidence-suggestions/${id}/dismiss`, { method: 'POST' });
      setItems((all) => all.filter((s) => s.id !== id));
      setMessage('Dismissed.');
    } catch (error) {
      setMessage(errorMessage(error));
    }
  }

  return (
    <section aria-labelledby="new-evidence-heading" className="mb-10 space-y-4" data-testid="new-evidence">
      <h2 id="new-evidence-heading" className="text-xl font-semibold">
        New evidence to consider
      </h2>
      <p className="text-ink-muted text-sm">
        Studies added to the library since you published these verdicts, close to one of their mechanisms. Nothing
        changes until you appraise them.
      </p>
      <ul className="grid gap-3 md:grid-cols-2">
        {items.map((s) => (
          <li key={s.id} className="border-line bg-paper-raised shadow-card space-y-2 rounded-lg border p-4 text-sm">
            <p>
              <Link href={`/library/${s.study.id}`} className="text-brand font-semibold hover:underline">
                {s.study.citation}
              </Link>{' '}
              — {s.study.title}
            </p>
            <p>
              For “{s.mechanism}” in{' '}
              <VerdictPageLink slug={s.slug} className="prose-link">
                {s.verdictTitle}
              </VerdictPageLink>
            </p>
            <p className="text-ink-muted">{s.reason}</p>
            <Button size="sm" variant="secondary" onClick={() => dismiss(s.id)}>
              Dismiss
            </Button>
          </li>
        ))}
      </ul>
      <p aria-live="polite" className="text-ink-muted text-sm">
        {message}
      </p>
    </section>
  );
}
