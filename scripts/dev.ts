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
  // DOI lookups go to a local fake of the DOI service (demo DOIs 10.5555/…) unless DOI_BASE_URL is set.
  const { startFakeDoiServer } = await import('../lib/citations/fake-doi-server');
  const doiFake = process.env.DOI_BASE_URL
    ? null
    : await startFakeDoiServer({ port: Number(process.env.DOI_FAKE_PORT ?? 2580) });
  if (doiFake) console.log(`DOI fake listening on ${doiFake.url}`);
  // The evidence watch asks a local fake of the registry (demo DOIs; one demo retraction) unless CROSSREF_BASE_URL is set.
  const { startFakeCrossrefServer } = await import('../lib/citations/fake-crossref-server');
  const crossrefFake = process.env.CROSSREF_BASE_URL
    ? null
    : await startFakeCrossrefServer({ port: Number(process.env.CROSSREF_FAKE_PORT ?? 2581) });
  if (crossrefFake) console.log(`Registry fake listening on ${crossrefFake.url}`);

  const port = process.env.PORT ?? '3000';
  const next = spawn(process.execPath, [path.resolve('node_modules/next/dist/bin/next'), 'dev', '-p', port], {
    stdio: 'inherit',
    env: {
      ...process.env,
      NEXT_TELEMETRY_DISABLED: '1',
      SMTP_PORT: String(smtp.port),
      DOI_BASE_URL: doiFake?.url ?? process.env.DOI_BASE_URL,
      CROSSREF_BASE_URL: crossrefFake?.url ?? process.env.CROSSREF_BASE_URL,
    },
  });
  await printDemoSignIns(`http://localhost:${port}`);

  const stop = () => next.kill('SIGTERM');
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  next.on('exit', async (code) => {
    await smtp.close();
    await doiFake?.close();
    await crossrefFake?.close();
    process.exit(code ?? 0);
  });
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
