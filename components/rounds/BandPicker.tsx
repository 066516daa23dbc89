'use client';

import { cn } from '@/components/ui/cn';
import { BAND_TERMS, bandLabel, bandRange } from './labels';

/**
 * The 0…6 likelihood control: seven labelled radio buttons (arrow keys move between them, as
 * for any radio group). Each shows its number, its words and the probabilities it covers.
 */
export function BandPicker({
  name,
  value,
  onChange,
  legend,
  error,
  disabled,
}: {
  name: string;
  value: number | null;
  onChange: (band: number) => void;
  legend: string;
  error?: string;
  disabled?: boolean;
}) {
  return (
    <fieldset className="min-w-0" aria-invalid={error ? true : undefined} disabled={disabled}>
      <legend className="mb-2 text-sm font-semibold">{legend}</legend>
      <div className="grid grid-cols-1 gap-1.5 sm:grid-cols-7">
        {BAND_TERMS.map((term, band) => {
          const checked = value === band;
          return (
            <label
              key={term}
              className={cn(
                'flex cursor-pointer items-center gap-2 rounded-md border px-2.5 py-2 text-sm transition-colors sm:flex-col sm:items-start sm:gap-1 sm:px-2',
                'has-[:focus-visible]:outline-rope-500 has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2',
                checked
                  ? 'border-granite-700 bg-granite-700 text-white'
                  : 'border-line-strong bg-paper-raised hover:border-granite-400',
                disabled && 'cursor-not-allowed opacity-70',
              )}
            >
              <input
                type="radio"
                className="sr-only"
                name={name}
                value={band}
                checked={checked}
                onChange={() => onChange(band)}
              />
              <span
                className={cn(
                  'font-display text-lg leading-none font-semibold',
                  checked ? 'text-white' : 'text-granite-700',
                )}
              >
                {band}
              </span>
              <span className="leading-tight font-medium">{bandLabel(band)}</span>
              <span className={cn('text-xs', checked ? 'text-granite-100' : 'text-ink-muted')}>{bandRange(band)}</span>
            </label>
          );
        })}
      </div>
      {error && <p className="text-danger-700 mt-1.5 text-sm font-medium">{error}</p>}
    </fieldset>
  );
}
