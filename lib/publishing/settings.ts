import { QueryTypes, type Transaction } from 'sequelize';
import { db } from '@/lib/db';

export interface TeamPublishingSettings {
  teamId: number;
  name: string;
  slug: string;
  /** Only an approved review (a closed peer-review round) may be published. */
  requirePeerReview: boolean;
  /** Coaches may publish, not only the owner. */
  coachesMayPublish: boolean;
}

/**
 * The team's publishing settings (columns added by migration 0004). Read with a query rather than
 * the Team model, which is another change's file; the model can gain the two attributes later.
 */
export async function teamSettings(teamId: number, transaction?: Transaction): Promise<TeamPublishingSettings | null> {
  const rows = await db().query<{
    id: number;
    name: string;
    slug: string;
    requirePeerReview: number | boolean;
    coachesMayPublish: number | boolean;
  }>('SELECT id, name, slug, "requirePeerReview", "coachesMayPublish" FROM teams WHERE id = ?', {
    replacements: [teamId],
    type: QueryTypes.SELECT,
    transaction,
  });
  const row = rows[0];
  if (!row) return null;
  return {
    teamId: row.id,
    name: row.name,
    slug: row.slug,
    requirePeerReview: Boolean(row.requirePeerReview),
    coachesMayPublish: Boolean(row.coachesMayPublish),
  };
}

/** For tests, the seed and (later) the team settings form. */
export async function updateTeamSettings(
  teamId: number,
  values: Partial<Pick<TeamPublishingSettings, 'requirePeerReview' | 'coachesMayPublish'>>,
): Promise<void> {
  const sets: Record<string, boolean> = {};
  for (const key of ['requirePeerReview', 'coachesMayPublish'] as const) {
    if (values[key] !== undefined) sets[key] = values[key];
  }
  if (!Object.keys(sets).length) return;
  // Through the query interface: it quotes the camel-case columns and writes booleans as each engine wants.
  await db().getQueryInterface().bulkUpdate('teams', sets, { id: teamId });
}
