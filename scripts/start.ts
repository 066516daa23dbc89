import { spawn } from 'node:child_process';
import path from 'node:path';
import { loadLocalEnv, migrateDatabase } from './boot';

// `npm start`: production server on a built app. Migrates first; never seeds demo data.
async function main() {
  loadLocalEnv();
  await migrateDatabase({ seedDemo: false });
  const port = process.env.PORT ?? '3000';
  const next = spawn(process.execPath, [path.resolve('node_modules/next/dist/bin/next'), 'start', '-p', port], {
    stdio: 'inherit',
    env: { ...process.env, NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1' },
  });
  for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => next.kill(signal));
  next.on('exit', (code) => process.exit(code ?? 0));
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
