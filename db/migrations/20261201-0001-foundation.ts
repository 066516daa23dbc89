import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true };

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('users', {
    id,
    name: { type: DataTypes.STRING(120), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    passwordHash: { type: DataTypes.STRING, allowNull: false },
    ...timestamps,
  });
  await q.createTable('teams', {
    id,
    name: { type: DataTypes.STRING(120), allowNull: false },
    slug: { type: DataTypes.STRING(140), allowNull: false, unique: true },
    ...timestamps,
  });
  await q.createTable('memberships', {
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
    role: { type: DataTypes.STRING(16), allowNull: false },
    ...timestamps,
  });
  await q.addIndex('memberships', ['teamId', 'userId'], { unique: true });
  await q.createTable('invitations', {
    id,
    teamId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'teams', key: 'id' },
      onDelete: 'CASCADE',
    },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    invitedById: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    acceptedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.createTable('password_reset_tokens', {
    id,
    userId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.createTable('audit_events', {
    id,
    teamId: { type: DataTypes.INTEGER, allowNull: true },
    actorId: { type: DataTypes.INTEGER, allowNull: true },
    action: { type: DataTypes.STRING(64), allowNull: false },
    subjectType: { type: DataTypes.STRING(32), allowNull: true },
    subjectId: { type: DataTypes.INTEGER, allowNull: true },
    data: { type: DataTypes.JSON, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await q.addIndex('audit_events', ['teamId', 'createdAt']);
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const table of [
    'audit_events',
    'password_reset_tokens',
    'invitations',
    'memberships',
    'teams',
    'users',
  ]) {
    await q.dropTable(table);
  }
}
