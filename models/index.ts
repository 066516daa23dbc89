import { AuditEvent } from './audit-event';
import { Invitation } from './invitation';
import { Membership } from './membership';
import { PasswordResetToken } from './password-reset-token';
import { Team } from './team';
import { User } from './user';

// Associations live here, once, so every importer of `@/models` sees the same graph.
User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });
Team.hasMany(Membership, { foreignKey: 'teamId', as: 'memberships' });
Membership.belongsTo(Team, { foreignKey: 'teamId', as: 'team' });
Team.hasMany(Invitation, { foreignKey: 'teamId', as: 'invitations' });
Invitation.belongsTo(Team, { foreignKey: 'teamId', as: 'team' });
Invitation.belongsTo(User, { foreignKey: 'invitedById', as: 'invitedBy' });
User.hasMany(PasswordResetToken, { foreignKey: 'userId', as: 'resetTokens' });
PasswordResetToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });
AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });

export { AuditEvent, Invitation, Membership, PasswordResetToken, Team, User };
export { ROLES, type Role } from './roles';
