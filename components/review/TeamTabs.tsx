import Link from 'next/link';
import { cn } from '@/components/ui/cn';

/** For people in several teams: which team's reviews or library the page shows (?team=<id>). */
export function TeamTabs({
  teams,
  currentId,
  basePath,
}: {
  teams: ReadonlyArray<{ id: number; name: string }>;
  currentId: number;
  basePath: string;
}) {
  if (teams.length < 2) return null;
  return (
    <nav aria-label="Choose a team" className="mb-6">
      <ul className="flex flex-wrap gap-2">
        {teams.map((team) => (
          <li key={team.id}>
            <Link
              href={`${basePath}?team=${team.id}`}
              aria-current={team.id === currentId ? 'page' : undefined}
              className={cn(
                'inline-flex min-h-10 items-center rounded-full border px-4 text-sm font-semibold',
                team.id === currentId
                  ? 'border-brand bg-brand text-white'
                  : 'border-line-strong bg-paper-raised hover:border-brand',
              )}
            >
              {team.name}
            </Link>
          </li>
        ))}
      </ul>
    </nav>
  );
}
