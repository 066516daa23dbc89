import * as foundation from './20261201-0001-foundation';
import * as workbench from './20261201-0002-workbench';
import * as peerReview from './20261201-0003-peer-review';
import * as publishing from './20261201-0004-publishing';
import * as directionAndChecks from './20261202-01-direction-and-checks';
import * as hardening from './20261202-02-hardening';
import * as evidenceWatch from './20261202-05-evidence-watch';
import * as pendingSignUps from './20261203-01-pending-sign-ups';
import * as mailRequests from './20261203-02-mail-requests';

/**
 * Every migration in the order it runs. Listed by hand (not globbed) so the same list works
 * under tsx, vitest and the Next.js server bundle. Append only: an applied migration is never
 * edited; a change is a new file.
 */
export const migrations = [
  { name: '20261201-0001-foundation', ...foundation },
  { name: '20261201-0002-workbench', ...workbench },
  { name: '20261201-0003-peer-review', ...peerReview },
  { name: '20261201-0004-publishing', ...publishing },
  { name: '20261202-01-direction-and-checks', ...directionAndChecks },
  { name: '20261202-02-hardening', ...hardening },
  { name: '20261202-05-evidence-watch', ...evidenceWatch },
  { name: '20261203-01-pending-sign-ups', ...pendingSignUps },
  { name: '20261203-02-mail-requests', ...mailRequests },
];
