'use client';

import { cn } from '@/components/ui/cn';

/**
 * A row of radio buttons drawn as chips (the radio itself stays, visually hidden, so keyboard
 * and screen readers work as with any radio group). The surrounding fieldset gives the legend.
 */
export function ChoiceChips<T extends string>({
  name,
  choices,
  label,
  value,
  onChange,
  selectedClassName = () => 'border-granite-700 bg-granite-700 text-white',
}: {
  name: string;
  choices: readonly T[];
  label: (choice: T) => string;
  value: T | null;
  onChange: (choice: T) => void;
  selectedClassName?: (choice: T) => string;
}) {
  return (
    <div className="flex flex-wrap gap-2">
      {choices.map((c) => (
        <label
          key={c}
          className={cn(
            'has-[:focus-visible]:outline-rope-500 flex min-h-11 cursor-pointer items-center rounded-md border px-4 text-sm font-medium has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2',
            value === c ? selectedClassName(c) : 'border-line-strong bg-paper-raised hover:border-granite-400',
          )}
        >
          <input
            type="radio"
            className="sr-only"
            name={name}
            value={c}
            checked={value === c}
            onChange={() => onChange(c)}
          />
          {label(c)}
        </label>
      ))}
    </div>
  );
}
