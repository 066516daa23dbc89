'use client';

import { SelectField } from '@/components/ui/Field';
import { DESIRABLE_DIRECTIONS, type Desirable } from '@/lib/scoring/direction';

/** The two answers in plain words; the effect's sign is flipped for 'lower' (docs/scoring.md §10). */
export const DESIRABLE_LABEL: Record<Desirable, string> = {
  higher: 'A higher number is the claimed effect (strength, hold time, tendon stiffness…)',
  lower: 'A lower number is the claimed effect (pain, injury rate, time lost…)',
};

/**
 * Asks which way a target's measure is the claimed effect, so a study that lowers a pain score is
 * read as supporting a claim about less pain, and the forest plot draws it on the right.
 */
export function DesirableField({
  label,
  name,
  value,
  onChange,
  errors,
}: {
  label: string;
  name: string;
  value: Desirable;
  onChange: (value: Desirable) => void;
  errors?: string[];
}) {
  return (
    <SelectField
      label={label}
      name={name}
      errors={errors}
      help="Studies report a number; this says which way that number moves when the claim is right."
      value={value}
      onChange={(e) => onChange(e.target.value as Desirable)}
      options={DESIRABLE_DIRECTIONS.map((d) => ({ value: d, label: DESIRABLE_LABEL[d] }))}
    />
  );
}
