import { loadLocalEnv, migrateDatabase } from './boot';

// `npm run db:migrate`
loadLocalEnv();
migrateDatabase({ seedDemo: false }).catch((error) => {
  console.error(error);
  process.exit(1);
});
