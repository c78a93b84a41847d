import { pino } from 'pino';
import { createApp } from './app.js';
import { loadConfig } from './config.js';
import { createDatabase } from './db/database.js';
import type { ProjectChanges } from './live/project-changes.js';
import { ReviewDigest, digestSettingsFrom } from './mail/digest.js';
import { MailSender, mailSettingsFrom } from './mail/mail-sender.js';
import { PackageJobs } from './package/package-jobs.js';
import { s3Storage } from './package/storage.js';

const config = loadConfig();
const logger = pino({ level: config.LOG_LEVEL });
const db = createDatabase(config.DATABASE_URL);
const mail = new MailSender(db, mailSettingsFrom(config), logger);
const digest = new ReviewDigest(db, digestSettingsFrom(config), () => mail.kick(), logger);
const storage = s3Storage(config);
const packageJobs = new PackageJobs(
  db,
  storage,
  { databaseUrl: config.DATABASE_URL, appUrl: config.APP_URL, mailQueued: () => mail.kick() },
  logger,
);
await packageJobs.start();
const app = createApp({ db, config, logger, mailQueued: () => mail.kick(), storage, packageJobs });

const server = app.listen(config.PORT, config.HOST, () => {
  logger.info({ url: `http://${config.HOST}:${config.PORT}` }, 'Allowlight is listening');
  mail.start();
  digest.start();
});

function shutdown(signal: string): void {
  logger.info({ signal }, 'shutting down');
  // Open event streams would hold the server open: end them first.
  void (app.locals['changes'] as ProjectChanges).close();
  void digest.stop().then(() => mail.stop());
  // A package under way is given 8 s to finish (the supervisor's SIGKILL comes at 10 s); one cut
  // short shows as failed, in words, when the server starts again.
  const jobsStopped = packageJobs.stop().catch((error: unknown) => logger.error({ err: error }, 'stopping the package jobs'));
  server.close(() => {
    void jobsStopped.then(() => db.destroy()).finally(() => process.exit(0));
  });
  setTimeout(() => process.exit(0), 9000).unref();
}

process.on('SIGINT', () => shutdown('SIGINT'));
process.on('SIGTERM', () => shutdown('SIGTERM'));
