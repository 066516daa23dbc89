import * as demoTeam from './20261201-0001-demo-team';
import * as demoReviews from './20261201-0002-demo-reviews';
import * as demoRounds from './20261201-0003-demo-rounds';
import * as demoVerdicts from './20261201-0004-demo-verdicts';
import * as demoEvidenceWatch from './20261202-05-demo-evidence-watch';

/** Demo seeders in order; each runs once per database (recorded in schema_seeds). */
export const seeders = [
  { name: '20261201-0001-demo-team', ...demoTeam },
  { name: '20261201-0002-demo-reviews', ...demoReviews },
  { name: '20261201-0003-demo-rounds', ...demoRounds },
  { name: '20261201-0004-demo-verdicts', ...demoVerdicts },
  { name: '20261202-05-demo-evidence-watch', ...demoEvidenceWatch },
];
