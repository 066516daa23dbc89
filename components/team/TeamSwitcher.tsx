import Link from 'next/link';
import { cn } from '@/components/ui/cn';
import type { TeamSummary } from '@/lib/teams/teams';
import { ROLE_INFO } from './roles';

/** For people in several teams: which one the page shows, as plain links (?team=<id>). */
export function TeamSwitcher({ teams, currentId }: { teams: TeamSummary[]; currentId: number }) {
  return (
    <nav aria-label="Choose a team" className="mb-6">
      <ul className="flex flex-wrap gap-2">
        {teams.map((team) => {
          const current = team.id === currentId;
          return (
            <li key={team.id}>
              <Link
                href={`/team?team=${team.id}`}
                aria-current={current ? 'page' : undefined}
                className={cn(
                  'inline-flex min-h-10 items-center gap-2 rounded-full border px-4 text-sm font-semibold transition-colors',
                  current
                    ? 'border-brand bg-brand text-white'
                    : 'border-line-strong bg-paper-raised text-ink hover:border-brand',
                )}
              >
                {team.name}
                <span className={cn('text-xs font-normal', current ? 'text-granite-100' : 'text-ink-muted')}>
                  {ROLE_INFO[team.role].label}
                </span>
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
