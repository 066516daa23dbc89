import { spawn } from 'node:child_process';
import path from 'node:path';
import { ensureLocalSecret, loadLocalEnv, migrateDatabase, printDemoSignIns } from './boot';

// `npm run dev`: secret, migrations and demo seed on first start, the local SMTP fake, then Next.
async function main() {
  ensureLocalSecret();
  loadLocalEnv();
  await migrateDatabase({ seedDemo: true });

  const { startFakeSmtp } = await import('../lib/mail/fake-smtp');
  const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
  const smtp = await startFakeSmtp({ port: smtpPort, dropDir: process.env.MAIL_DROP_DIR ?? 'db/data/mail' });
  console.log(`Mail fake listening on 127.0.0.1:${smtp.port}; read it at /dev/mail`);

  const port = process.env.PORT ?? '3000';
  const next = spawn(process.execPath, [path.resolve('node_modules/next/dist/bin/next'), 'dev', '-p', port], {
    stdio: 'inherit',
    env: { ...process.env, NEXT_TELEMETRY_DISABLED: '1', SMTP_PORT: String(smtp.port) },
  });
  await printDemoSignIns(`http://localhost:${port}`);

  const stop = () => next.kill('SIGTERM');
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  next.on('exit', async (code) => {
    await smtp.close();
    process.exit(code ?? 0);
  });
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
