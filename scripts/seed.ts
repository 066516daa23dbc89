import { loadLocalEnv, migrateDatabase } from './boot';

// `npm run db:seed`: migrates, then runs the demo seeders that have not run yet.
loadLocalEnv();
migrateDatabase({ seedDemo: true }).catch((error) => {
  console.error(error);
  process.exit(1);
});
