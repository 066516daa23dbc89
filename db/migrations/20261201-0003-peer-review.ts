import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Peer review: rounds of blind scoring on a review, who was invited to each, the
 * reviewers' scorecards, and the threaded comments of the settling discussion.
 *
 * A scorecard's per-mechanism ratings and a round's resolutions are JSON: each is read and
 * written whole with its parent row and never queried by part (a round has a handful of
 * reviewers and mechanisms).
 */

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true };
const user = (allowNull: boolean, onDelete: 'CASCADE' | 'SET NULL' | 'RESTRICT') => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: 'users', key: 'id' },
  onDelete,
});

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('review_rounds', {
    id,
    reviewId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'reviews', key: 'id' },
      onDelete: 'CASCADE',
    },
    // Kept beside the review so the policy's facts (team) come from one row.
    teamId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'teams', key: 'id' },
      onDelete: 'CASCADE',
    },
    openedById: user(true, 'SET NULL'),
    openedAt: { type: DataTypes.DATE, allowNull: false },
    dueAt: { type: DataTypes.DATE, allowNull: false },
    // 'open' | 'closed'
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'open' },
    closedAt: { type: DataTypes.DATE, allowNull: true },
    closedById: user(true, 'SET NULL'),
    // The review status the close led to: 'approved' or 'draft' (a "do not publish" stood).
    outcome: { type: DataTypes.STRING(16), allowNull: true },
    // [{ mechanismId, kind, reason, byId, at }]: the author's settlement of each flagged mechanism.
    resolutions: { type: DataTypes.JSON, allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ...timestamps,
  });
  await q.addIndex('review_rounds', ['reviewId', 'status'], { name: 'review_rounds_review_status' });
  await q.addIndex('review_rounds', ['status', 'dueAt'], { name: 'review_rounds_status_due' });

  await q.createTable('round_invitations', {
    id,
    roundId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'review_rounds', key: 'id' },
      onDelete: 'CASCADE',
    },
    reviewerId: user(false, 'CASCADE'),
    invitedAt: { type: DataTypes.DATE, allowNull: false },
    submittedAt: { type: DataTypes.DATE, allowNull: true },
    // The author closed the round without this reviewer's scorecard, and why.
    closedWithoutReason: { type: DataTypes.TEXT, allowNull: true },
    // The 24-hour reminder went out (scripts/remind-due-rounds.ts sends it once).
    remindedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('round_invitations', ['roundId', 'reviewerId'], { unique: true, name: 'round_invitations_unique' });
  await q.addIndex('round_invitations', ['reviewerId'], { name: 'round_invitations_reviewer' });

  await q.createTable('scorecards', {
    id,
    roundId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'review_rounds', key: 'id' },
      onDelete: 'CASCADE',
    },
    reviewerId: user(false, 'CASCADE'),
    // [{ mechanismId, band: 0…6 | null, contribution: none|small|moderate|large | null, comment }]
    ratings: { type: DataTypes.JSON, allowNull: false },
    overallComment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    // 'approve' | 'approve-with-changes' | 'do-not-publish' | null while a draft
    signOff: { type: DataTypes.STRING(24), allowNull: true },
    submittedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('scorecards', ['roundId', 'reviewerId'], { unique: true, name: 'scorecards_unique' });

  await q.createTable('review_comments', {
    id,
    reviewId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'reviews', key: 'id' },
      onDelete: 'CASCADE',
    },
    roundId: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'review_rounds', key: 'id' },
      onDelete: 'CASCADE',
    },
    // NULL: about the whole review.
    mechanismId: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'mechanisms', key: 'id' },
      onDelete: 'CASCADE',
    },
    authorId: user(true, 'SET NULL'),
    parentId: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'review_comments', key: 'id' },
      onDelete: 'CASCADE',
    },
    body: { type: DataTypes.TEXT, allowNull: false },
    resolved: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    resolvedById: user(true, 'SET NULL'),
    resolvedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('review_comments', ['reviewId', 'createdAt'], { name: 'review_comments_review' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const table of ['review_comments', 'scorecards', 'round_invitations', 'review_rounds']) await q.dropTable(table);
}
