import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Publishing: the team's two publishing settings, one publication per published review
 * (its public address, who may read it, whether it was withdrawn), the immutable versions under
 * it, and who follows a team's new verdicts by e-mail.
 *
 * A version's snapshot is one JSON document, written once and never updated: the verdict page
 * reads only it, so later edits of the review, its mechanisms or the library cannot change what
 * an athlete was shown.
 */

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true };
const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};

export async function up({ context: q }: { context: QueryInterface }) {
  // Safer defaults: a verdict needs a closed peer-review round, and only the owner publishes.
  await q.addColumn('teams', 'requirePeerReview', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true });
  await q.addColumn('teams', 'coachesMayPublish', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });

  await q.createTable('publications', {
    id,
    reviewId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      unique: true,
      references: { model: 'reviews', key: 'id' },
      onDelete: 'CASCADE',
    },
    teamId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'teams', key: 'id' },
      onDelete: 'CASCADE',
    },
    // Global (the page is /v/<slug>), fixed at the first publish so shared links keep working.
    slug: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    visibility: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'team' },
    latestNumber: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    lastPublishedAt: { type: DataTypes.DATE, allowNull: false },
    withdrawnAt: { type: DataTypes.DATE, allowNull: true },
    withdrawnReason: { type: DataTypes.TEXT, allowNull: true },
    withdrawnById: { type: DataTypes.INTEGER, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('publications', ['teamId', 'lastPublishedAt'], { name: 'publications_team_published' });

  await q.createTable('published_versions', {
    id,
    publicationId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'publications', key: 'id' },
      onDelete: 'CASCADE',
    },
    number: { type: DataTypes.INTEGER, allowNull: false },
    publishedById: { type: DataTypes.INTEGER, allowNull: true },
    changeNote: { type: DataTypes.TEXT, allowNull: true },
    snapshot: { type: DataTypes.JSON, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await q.addIndex('published_versions', ['publicationId', 'number'], {
    unique: true,
    name: 'published_versions_number',
  });

  await q.createTable('follows', {
    id,
    teamId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'teams', key: 'id' },
      onDelete: 'CASCADE',
    },
    userId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    // Random per follow; the unsubscribe token is an HMAC over it, so a new follow voids old links.
    tokenSalt: { type: DataTypes.STRING(32), allowNull: false },
    ...timestamps,
  });
  await q.addIndex('follows', ['teamId', 'userId'], { unique: true, name: 'follows_team_user' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('follows');
  await q.dropTable('published_versions');
  await q.dropTable('publications');
  await q.removeColumn('teams', 'coachesMayPublish');
  await q.removeColumn('teams', 'requirePeerReview');
}
