import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The evidence watch (docs/api/publishing.md, "Evidence watch"): what the bibliographic registry
 * last said about each DOI and when it was asked (`doi_checks`), the notice a study carries
 * (`studies.evidenceNotice`), published verdicts whose evidence changed (`evidence_flags`),
 * studies offered to a verdict's authors as new evidence (`evidence_suggestions`), and each run
 * of the watch with its progress (`watch_runs`). Written with the query interface only, so it
 * runs on SQLite and PostgreSQL alike.
 */

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true };
const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const teamId = {
  type: DataTypes.INTEGER,
  allowNull: false,
  references: { model: 'teams', key: 'id' },
  onDelete: 'CASCADE',
};
const publicationId = {
  type: DataTypes.INTEGER,
  allowNull: false,
  references: { model: 'publications', key: 'id' },
  onDelete: 'CASCADE',
};
const studyId = {
  type: DataTypes.INTEGER,
  allowNull: false,
  references: { model: 'studies', key: 'id' },
  onDelete: 'CASCADE',
};

export async function up({ context: q }: { context: QueryInterface }) {
  // One row per DOI, shared by every team: the registry's answer is public and the same for all.
  await q.createTable('doi_checks', {
    id,
    doi: { type: DataTypes.STRING(300), allowNull: false, unique: true },
    found: { type: DataTypes.BOOLEAN, allowNull: false },
    notices: { type: DataTypes.JSON, allowNull: false },
    checkedAt: { type: DataTypes.DATE, allowNull: false },
    ...timestamps,
  });

  await q.addColumn('studies', 'evidenceNotice', { type: DataTypes.JSON, allowNull: true });

  await q.createTable('evidence_flags', {
    id,
    teamId,
    publicationId,
    // The version flagged: the flag stands until a later version is published.
    versionNumber: { type: DataTypes.INTEGER, allowNull: false },
    studyId,
    kind: { type: DataTypes.STRING(40), allowNull: false },
    noticeDoi: { type: DataTypes.STRING(300), allowNull: false },
    noticeDate: { type: DataTypes.STRING(10), allowNull: true },
    reason: { type: DataTypes.TEXT, allowNull: false },
    dryRun: { type: DataTypes.JSON, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('evidence_flags', ['publicationId', 'versionNumber', 'studyId', 'noticeDoi'], {
    unique: true,
    name: 'evidence_flags_once',
  });
  await q.addIndex('evidence_flags', ['teamId'], { name: 'evidence_flags_team' });

  await q.createTable('evidence_suggestions', {
    id,
    teamId,
    publicationId,
    mechanismId: { type: DataTypes.INTEGER, allowNull: false },
    studyId,
    score: { type: DataTypes.FLOAT, allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: false },
    dismissedAt: { type: DataTypes.DATE, allowNull: true },
    dismissedById: { type: DataTypes.INTEGER, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('evidence_suggestions', ['publicationId', 'mechanismId', 'studyId'], {
    unique: true,
    name: 'evidence_suggestions_once',
  });

  await q.createTable('watch_runs', {
    id,
    teamId: { ...teamId, allowNull: true },
    trigger: { type: DataTypes.STRING(16), allowNull: false },
    startedById: { type: DataTypes.INTEGER, allowNull: true },
    status: { type: DataTypes.STRING(16), allowNull: false },
    total: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    checked: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    error: { type: DataTypes.TEXT, allowNull: true },
    summary: { type: DataTypes.JSON, allowNull: true },
    finishedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('watch_runs', ['teamId', 'createdAt'], { name: 'watch_runs_team' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('watch_runs');
  await q.dropTable('evidence_suggestions');
  await q.dropTable('evidence_flags');
  await q.removeColumn('studies', 'evidenceNotice');
  await q.dropTable('doi_checks');
}
