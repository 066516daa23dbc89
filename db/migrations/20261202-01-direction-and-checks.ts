import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Direction from effects (docs/scoring.md §10) and appraisals stored before each certainty domain
 * had its own column mapping.
 *
 * - Each target records which way its measure is desirable: the claimed outcome on the review,
 *   each mechanism on its row ('higher' unless a coach says otherwise).
 * - An appraisal whose direction differs from the one its study's effect suggests keeps the
 *   coach's reason.
 * - Every appraisal saved so far read all five certainty domains from the publication-bias
 *   column, so none of them can be trusted: they are marked as needing a check, and the workbench
 *   flags them until a coach saves them again.
 * - A ready effect size in the library is stored as { effectSize, variance } (it was { yi, vi }).
 */

type EffectRow = { id: number; effect: unknown };

function parse(value: unknown): Record<string, unknown> | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'string') {
    try {
      return JSON.parse(value) as Record<string, unknown>;
    } catch {
      return null;
    }
  }
  return value as Record<string, unknown>;
}

async function renameEffectKeys(q: QueryInterface, from: [string, string], to: [string, string]) {
  const rows = (await q.select(null, 'studies', { attributes: ['id', 'effect'] } as never)) as unknown as EffectRow[];
  for (const row of rows) {
    const effect = parse(row.effect);
    if (!effect || effect.kind !== 'ready' || !(from[0] in effect)) continue;
    const { [from[0]]: size, [from[1]]: variance, ...rest } = effect;
    const renamed = { ...rest, [to[0]]: size, [to[1]]: variance };
    await q.bulkUpdate('studies', { effect: JSON.stringify(renamed) }, { id: row.id });
  }
}

export async function up({ context: q }: { context: QueryInterface }) {
  await q.addColumn('reviews', 'outcomeDesirable', {
    type: DataTypes.STRING(8),
    allowNull: false,
    defaultValue: 'higher',
  });
  await q.addColumn('mechanisms', 'desirable', { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'higher' });
  await q.addColumn('appraisals', 'directionReason', { type: DataTypes.TEXT, allowNull: true });
  await q.addColumn('appraisals', 'needsCheck', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await q.bulkUpdate('appraisals', { needsCheck: true }, {});
  await renameEffectKeys(q, ['yi', 'vi'], ['effectSize', 'variance']);
}

export async function down({ context: q }: { context: QueryInterface }) {
  await renameEffectKeys(q, ['effectSize', 'variance'], ['yi', 'vi']);
  await q.removeColumn('appraisals', 'needsCheck');
  await q.removeColumn('appraisals', 'directionReason');
  await q.removeColumn('mechanisms', 'desirable');
  await q.removeColumn('reviews', 'outcomeDesirable');
}
