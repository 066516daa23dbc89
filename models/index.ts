import { Appraisal } from './appraisal';
import { Comment } from './comment';
import { AuditEvent } from './audit-event';
import { Invitation } from './invitation';
import { Mechanism } from './mechanism';
import { Membership } from './membership';
import { PasswordResetToken } from './password-reset-token';
import { Review } from './review';
import { ReviewRound } from './review-round';
import { RoundInvitation } from './round-invitation';
import { Scorecard } from './scorecard';
import { Study } from './study';
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
// The review workbench.
Team.hasMany(Review, { foreignKey: 'teamId', as: 'reviews' });
Review.belongsTo(Team, { foreignKey: 'teamId', as: 'team' });
Review.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
Review.hasMany(Mechanism, { foreignKey: 'reviewId', as: 'mechanisms', onDelete: 'CASCADE' });
Mechanism.belongsTo(Review, { foreignKey: 'reviewId', as: 'review' });
Review.hasMany(Appraisal, { foreignKey: 'reviewId', as: 'appraisals', onDelete: 'CASCADE' });
Appraisal.belongsTo(Review, { foreignKey: 'reviewId', as: 'review' });
Mechanism.hasMany(Appraisal, { foreignKey: 'mechanismId', as: 'appraisals', onDelete: 'CASCADE' });
Appraisal.belongsTo(Mechanism, { foreignKey: 'mechanismId', as: 'mechanism' });
Team.hasMany(Study, { foreignKey: 'teamId', as: 'studies' });
Study.belongsTo(Team, { foreignKey: 'teamId', as: 'team' });
Study.hasMany(Appraisal, { foreignKey: 'studyId', as: 'appraisals' });
Appraisal.belongsTo(Study, { foreignKey: 'studyId', as: 'study' });
// Peer review.
Review.hasMany(ReviewRound, { foreignKey: 'reviewId', as: 'rounds', onDelete: 'CASCADE' });
ReviewRound.belongsTo(Review, { foreignKey: 'reviewId', as: 'review' });
ReviewRound.hasMany(RoundInvitation, { foreignKey: 'roundId', as: 'invitations', onDelete: 'CASCADE' });
RoundInvitation.belongsTo(ReviewRound, { foreignKey: 'roundId', as: 'round' });
RoundInvitation.belongsTo(User, { foreignKey: 'reviewerId', as: 'reviewer' });
ReviewRound.hasMany(Scorecard, { foreignKey: 'roundId', as: 'scorecards', onDelete: 'CASCADE' });
Scorecard.belongsTo(ReviewRound, { foreignKey: 'roundId', as: 'round' });
Review.hasMany(Comment, { foreignKey: 'reviewId', as: 'comments', onDelete: 'CASCADE' });
Comment.belongsTo(User, { foreignKey: 'authorId', as: 'author' });

export { Comment, ReviewRound, RoundInvitation, Scorecard };
export { Appraisal, AuditEvent, Invitation, Mechanism, Membership, PasswordResetToken, Review, Study, Team, User };
export { ROLES, type Role } from './roles';

// Publishing and following.
import { Follow } from './follow';
import { Publication, PublishedVersion } from './published-version';
Review.hasOne(Publication, { foreignKey: 'reviewId', as: 'publication' });
Publication.belongsTo(Review, { foreignKey: 'reviewId', as: 'review' });
Publication.belongsTo(Team, { foreignKey: 'teamId', as: 'team' });
Publication.hasMany(PublishedVersion, { foreignKey: 'publicationId', as: 'versions', onDelete: 'CASCADE' });
PublishedVersion.belongsTo(Publication, { foreignKey: 'publicationId', as: 'publication' });
Team.hasMany(Follow, { foreignKey: 'teamId', as: 'follows' });
Follow.belongsTo(Team, { foreignKey: 'teamId', as: 'team' });
Follow.belongsTo(User, { foreignKey: 'userId', as: 'user' });
export { Follow, Publication, PublishedVersion };
export { SignInThrottle } from './sign-in-throttle';
export { PendingSignUp } from './pending-sign-up';
export { MailRequest } from './mail-request';
