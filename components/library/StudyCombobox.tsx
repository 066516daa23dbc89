'use client';

import Fuse from 'fuse.js';
import { useId, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { cn } from '@/components/ui/cn';
import { DESIGN_LABEL } from '@/components/review/labels';
import type { StudyDTO } from '@/lib/reviews/types';

interface Searchable {
  study: StudyDTO;
  citation: string;
  title: string;
  journal: string;
  doi: string;
  year: string;
  tags: string;
}

const MAX_RESULTS = 8;

/**
 * Fuzzy search over the team's library with the keyboard: type part of an author, a title word,
 * a year or a DOI; ↑/↓ move, Enter picks, Escape leaves (the dialog around it closes). The input
 * is an ARIA combobox whose active option is announced, so it works with a screen reader too.
 */
export function StudyCombobox({
  studies,
  onPick,
  label = 'Find a study',
  autoFocus = false,
  excludeIds,
  loading = false,
}: {
  studies: readonly StudyDTO[];
  onPick: (study: StudyDTO) => void;
  label?: string;
  autoFocus?: boolean;
  excludeIds?: ReadonlySet<number>;
  loading?: boolean;
}) {
  const [text, setText] = useState('');
  const [active, setActive] = useState(0);
  const listId = useId();
  const inputId = useId();
  const hintId = useId();
  const listRef = useRef<HTMLUListElement>(null);

  const available = useMemo(
    () => (excludeIds ? studies.filter((s) => !excludeIds.has(s.id)) : studies),
    [studies, excludeIds],
  );
  const fuse = useMemo(
    () =>
      new Fuse<Searchable>(
        available.map((study) => ({
          study,
          citation: study.citation,
          title: study.title,
          journal: study.journal ?? '',
          doi: study.doi ?? '',
          year: study.year ? String(study.year) : '',
          tags: study.tags.join(' '),
        })),
        {
          keys: [
            { name: 'citation', weight: 3 },
            { name: 'title', weight: 2 },
            { name: 'year', weight: 1 },
            { name: 'doi', weight: 1 },
            { name: 'journal', weight: 0.5 },
            { name: 'tags', weight: 0.5 },
          ],
          threshold: 0.4,
          ignoreLocation: true,
        },
      ),
    [available],
  );
  const results = useMemo(
    () =>
      text.trim()
        ? fuse.search(text.trim(), { limit: MAX_RESULTS }).map((r) => r.item.study)
        : available.slice(0, MAX_RESULTS),
    [fuse, text, available],
  );
  const current = Math.min(active, Math.max(0, results.length - 1));

  const move = (to: number) => {
    const next = (to + results.length) % Math.max(1, results.length);
    setActive(next);
    listRef.current?.querySelector(`[data-index="${next}"]`)?.scrollIntoView({ block: 'nearest' });
  };

  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === 'ArrowDown') {
      event.preventDefault();
      move(current + 1);
    } else if (event.key === 'ArrowUp') {
      event.preventDefault();
      move(current - 1);
    } else if (event.key === 'Home' && event.ctrlKey) {
      event.preventDefault();
      move(0);
    } else if (event.key === 'End' && event.ctrlKey) {
      event.preventDefault();
      move(results.length - 1);
    } else if (event.key === 'Enter') {
      // Never submit a surrounding form from the search box.
      event.preventDefault();
      const study = results[current];
      if (study) onPick(study);
    }
  };

  return (
    <div className="space-y-2">
      <label htmlFor={inputId} className="block text-sm font-semibold">
        {label}
      </label>
      <p id={hintId} className="text-ink-muted text-sm">
        Author, title word, year or DOI. ↑ ↓ to move, Enter to choose.
      </p>
      <input
        id={inputId}
        type="search"
        role="combobox"
        autoComplete="off"
        autoFocus={autoFocus}
        aria-expanded={results.length > 0}
        aria-controls={listId}
        aria-autocomplete="list"
        aria-describedby={hintId}
        aria-activedescendant={results[current] ? `${listId}-${results[current].id}` : undefined}
        value={text}
        onChange={(e) => {
          setText(e.target.value);
          setActive(0);
        }}
        onKeyDown={onKeyDown}
        className="border-line-strong bg-paper-raised placeholder:text-ink-faint focus:border-brand block w-full rounded-md border px-3 py-2.5 text-base"
        placeholder="e.g. Holt 2024"
      />
      <ul
        id={listId}
        ref={listRef}
        role="listbox"
        aria-label="Matching studies"
        className="divide-line border-line bg-paper-raised max-h-80 divide-y overflow-y-auto rounded-md border"
      >
        {results.map((study, index) => (
          <li
            key={study.id}
            id={`${listId}-${study.id}`}
            data-index={index}
            role="option"
            aria-selected={index === current}
            onMouseDown={(e) => e.preventDefault()}
            onMouseEnter={() => setActive(index)}
            onClick={() => onPick(study)}
            className={cn(
              'cursor-pointer px-3 py-2.5 text-sm',
              index === current
                ? 'bg-granite-50 outline-granite-500 outline-2 -outline-offset-2'
                : 'hover:bg-paper-sunken',
            )}
          >
            <span className="text-ink block font-semibold">{study.citation}</span>
            <span className="text-ink-muted block">{study.title}</span>
            <span className="text-ink-muted block text-xs">
              {[
                study.design ? DESIGN_LABEL[study.design] : 'Design not recorded',
                study.journal,
                study.n ? `n = ${study.n}` : null,
              ]
                .filter(Boolean)
                .join(' · ')}
            </span>
          </li>
        ))}
      </ul>
      <p className="text-ink-muted text-sm" role="status" aria-live="polite">
        {loading
          ? 'Loading the library…'
          : available.length === 0
            ? 'The library has no studies yet (or all are already used here). Add some in the library first.'
            : results.length === 0
              ? `No study matches “${text}”.`
              : `${results.length} of ${available.length} ${available.length === 1 ? 'study' : 'studies'} shown.`}
      </p>
    </div>
  );
}
