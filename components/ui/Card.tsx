import type { ComponentProps, ReactNode } from 'react';
import { cn } from './cn';

export function Card({ className, ...props }: ComponentProps<'section'>) {
  return <section className={cn('border-line bg-paper-raised shadow-card rounded-lg border', className)} {...props} />;
}

/** A card's title row; `actions` sit to the right on wide screens and wrap under on phones. */
export function CardHeader({
  title,
  description,
  actions,
  as: Heading = 'h2',
  id,
}: {
  title: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
  as?: 'h2' | 'h3';
  id?: string;
}) {
  return (
    <div className="border-line flex flex-wrap items-start justify-between gap-3 border-b px-5 py-4">
      <div className="min-w-0 space-y-1">
        <Heading id={id} className="text-lg font-semibold">
          {title}
        </Heading>
        {description && <p className="text-ink-muted text-sm">{description}</p>}
      </div>
      {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
    </div>
  );
}

export function CardBody({ className, ...props }: ComponentProps<'div'>) {
  return <div className={cn('px-5 py-5', className)} {...props} />;
}
