/**
 * `npm start`: start MariaDB and the fake mail server, migrate, seed the demo
 * office, build the Angular app and serve app + API on one port. Stops what it
 * started on SIGINT/SIGTERM. (The bootstrap before it installed what was missing.)
 */
import { existsSync, statSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { startMariaDb } from './mariadb';
import { startFakeSmtp } from './fake-smtp';
import { bin, prepareDatabase, runCommand, startChild, stopChild, waitForHttp, onShutdown } from './processes';

const env = process.env;
const runDir = resolve(env['RUN_DIR'] ?? '.run');
const port = Number(env['PORT'] ?? 4280);
const publicUrl = env['PUBLIC_URL'] ?? `http://localhost:${port}`;
const demoPassword = env['DEMO_PASSWORD'] ?? 'assayer-demo';

/** Newest modification time below a folder (for the "is the build stale?" check). */
function newest(path: string): number {
  if (!existsSync(path)) return 0;
  const st = statSync(path);
  if (!st.isDirectory()) return st.mtimeMs;
  let max = st.mtimeMs;
  for (const name of readdirSync(path)) max = Math.max(max, newest(join(path, name)));
  return max;
}

async function main(): Promise<void> {
  const stops: (() => Promise<void>)[] = [];
  onShutdown(async () => {
    console.log('\n[assayer] stopping…');
    for (const stop of stops.reverse()) await stop().catch(() => undefined);
  });

  let databaseUrl = env['DATABASE_URL'];
  if (!databaseUrl) {
    const db = await startMariaDb({
      dir: join(runDir, 'mariadb'),
      port: env['MARIADB_PORT'] ? Number(env['MARIADB_PORT']) : undefined,
      log: (l) => console.log(`[assayer] ${l}`),
    });
    stops.push(() => db.stop());
    databaseUrl = await db.createDatabase('assayer');
  }

  let smtpUrl = env['SMTP_URL'];
  const mailDir = join(runDir, 'mail');
  if (!smtpUrl) {
    const smtp = await startFakeSmtp({ dir: mailDir, port: env['SMTP_PORT'] ? Number(env['SMTP_PORT']) : undefined });
    stops.push(() => smtp.stop());
    smtpUrl = smtp.url;
    console.log(`[assayer] fake mail server on ${smtp.url} (messages kept in ${mailDir})`);
  }

  const childEnv = { ...env, DATABASE_URL: databaseUrl, SMTP_URL: smtpUrl, MAIL_DIR: mailDir, RUN_DIR: runDir, PORT: String(port), PUBLIC_URL: publicUrl, DEMO_PASSWORD: demoPassword };

  await prepareDatabase(childEnv, env['SEED'] !== '0');

  const dist = join('dist', 'assayer', 'browser', 'index.html');
  const stale = !existsSync(dist) || Math.max(newest('src'), newest('shared'), newest('angular.json')) > newest(dist);
  if (env['SKIP_BUILD'] !== '1' && stale) {
    console.log('[assayer] building the web app (ng build)…');
    if ((await runCommand(bin('ng'), ['build'], { env: { ...childEnv, NG_CLI_ANALYTICS: 'false' } })) !== 0) throw new Error('ng build failed');
  }

  const server = startChild(bin('tsx'), ['server/main.ts'], { env: childEnv });
  stops.push(() => stopChild(server));
  server.on('exit', (code) => {
    console.error(`[assayer] the server stopped (code ${code}).`);
    process.kill(process.pid, 'SIGTERM');
  });
  await waitForHttp(`http://127.0.0.1:${port}/api/health`);

  console.log(`
  Assayer is running at ${publicUrl}

  Demo sign-in (password "${demoPassword}", or "Sign in with your institution" for the fake SSO):
    submitter@demo.test   files review requests
    reviewer@demo.test    reviews assigned requests
    reviewer2@demo.test   a second reviewer
    head@demo.test        office head: assigns requests, office settings
    admin@demo.test       administrator: people, roles, audit log

  Press Ctrl+C to stop.
`);
}

main().catch((err: Error) => {
  console.error(`[assayer] ${err.message}`);
  process.kill(process.pid, 'SIGTERM');
});
