/**
 * Starts the server: connects to MariaDB, applies pending migrations, and serves the API
 * and the built Angular app (dist/assayer/browser) on PORT (default 4280).
 * Run: `DATABASE_URL=mariadb://… npx tsx server/main.ts`. Set MIGRATE_ON_START=0 to skip migrations.
 */
import fs from 'node:fs';
import path from 'node:path';
import { createApp } from './app';
import { loadConfig } from './config';
import { migrate } from './db/migrate';
import { createSequelize } from './db/sequelize';
import { createLogger } from './logger';
import { sendDueSoonReminders } from './services/due-soon';

async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger(config.logLevel);
  const sequelize = createSequelize(config.databaseUrl);
  await sequelize.authenticate();
  if (process.env['MIGRATE_ON_START'] !== '0') {
    const applied = await migrate(sequelize);
    if (applied.length) logger.info({ applied }, 'migrations applied');
  }
  const staticDir = path.resolve(process.env['STATIC_DIR'] ?? 'dist/assayer/browser');
  const hasApp = fs.existsSync(path.join(staticDir, 'index.html'));
  if (!hasApp) logger.warn({ staticDir }, 'built app not found; serving the API only (run ng build)');
  const app = createApp({ sequelize, config, logger, staticDir: hasApp ? staticDir : undefined });
  const server = app.listen(config.port, () => {
    logger.info({ port: config.port, url: config.publicUrl }, `Assayer listening on ${config.publicUrl}`);
  });
  // Hourly due-soon reminders (each goes once per assignment); unref so they never keep the process alive.
  const remind = () => { sendDueSoonReminders().catch((err: unknown) => logger.error({ err }, 'due-soon reminders failed')); };
  setInterval(remind, 3_600_000).unref();
  setTimeout(remind, 60_000).unref();
  const stop = (signal: string) => {
    logger.info({ signal }, 'stopping');
    server.close(() => { void sequelize.close().finally(() => process.exit(0)); });
    setTimeout(() => process.exit(0), 5_000).unref();
  };
  process.once('SIGINT', () => stop('SIGINT'));
  process.once('SIGTERM', () => stop('SIGTERM'));
}

main().catch((err: unknown) => {
  console.error('Assayer failed to start:', err);
  process.exit(1);
});
