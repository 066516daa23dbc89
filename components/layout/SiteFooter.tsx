import { SAFETY_LINE } from '@/components/ui/SafetyNotice';

export function SiteFooter() {
  return (
    <footer className="border-line bg-paper-sunken border-t">
      <div className="max-w-shell px-gutter text-ink-muted mx-auto flex flex-col gap-3 py-6 text-sm sm:flex-row sm:items-start sm:justify-between">
        <p className="max-w-measure" data-testid="safety-line">
          <span className="text-ink font-semibold">Safety: </span>
          {SAFETY_LINE}
        </p>
        <p className="shrink-0">Loadbearing · evidence before load</p>
      </div>
    </footer>
  );
}
