import { randomUUID } from 'node:crypto';
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import { packageStepStart, type PackageStep } from '../../../contract/package.js';
import type { Database } from '../db/database.js';
import { DomainError } from '../domain-errors.js';
import type { ProjectRole } from '../db/tables.js';
import {
  failAbandonedPackageJobs,
  finishPackageJob,
  packageJobStep,
  queuePackageJob,
  startPackageJob,
  type PackageJobRecord,
} from './package-jobs.repository.js';
import { makePackage } from './package.service.js';
import type { FileStorage } from './storage.js';

export interface PackageJobSettings {
  /** The database pg-boss keeps its queue in (its own schema, `pgboss`). */
  databaseUrl: string;
  appUrl: string;
  /** Told when making a package queued mail (the issue of an accepted design). */
  mailQueued: () => void;
  /** How often an idle worker looks for a job, in seconds (pg-boss's least is 0.5). */
  pollSeconds?: number;
}

interface JobData {
  jobId: string;
  projectId: string;
  actor: { userId: string; name: string; role: ProjectRole | null; isAdmin: boolean };
}

const queue = 'package-build';

/** A job the worker could not finish because the server stopped: said so on the next start. */
const abandonedWords = 'The server stopped while the package was being made. Make the package again.';
const unexpectedWords =
  'The package could not be made because of a fault on the server. Try again; if it fails again, tell your administrator.';

/**
 * Makes large projects' packages in the background: a request queues a row in `package_jobs` and
 * a pg-boss job naming it; the worker runs `makePackage`, keeping the row's step and progress, and
 * ends it done (with the revision) or failed (with the reason in words). One job per project at a
 * time. Start beside the mail sender; `stop` lets a job under way finish first.
 */
export class PackageJobs {
  private boss: PgBoss | null = null;

  constructor(
    private readonly db: Database,
    private readonly storage: FileStorage,
    private readonly settings: PackageJobSettings,
    private readonly logger?: Logger,
  ) {}

  async start(): Promise<void> {
    const abandoned = await failAbandonedPackageJobs(this.db, abandonedWords);
    if (abandoned > 0) this.logger?.warn({ abandoned }, 'package jobs left running by a stopped server are failed');
    const boss = new PgBoss({ connectionString: this.settings.databaseUrl, schema: 'pgboss', max: 2 });
    boss.on('error', (error: Error) => this.logger?.error({ err: error }, 'package job queue'));
    await boss.start();
    // No retry: a failed package says why, and the engineer asks again.
    await boss.createQueue(queue, { name: queue, retryLimit: 0, expireInSeconds: 3600 });
    await boss.work<JobData>(queue, { pollingIntervalSeconds: this.settings.pollSeconds ?? 2, batchSize: 1 }, async ([job]) => {
      if (job) await this.run(job.data);
    });
    this.boss = boss;
  }

  /** Queues a package of the project, or answers the job already queued or running for it. */
  async request(projectId: string, actor: JobData['actor']): Promise<PackageJobRecord> {
    const boss = this.boss;
    if (boss === null) throw new Error('the package job queue is not started');
    const { job, created } = await queuePackageJob(this.db, { id: randomUUID(), projectId, requestedBy: actor.userId });
    if (created) {
      try {
        await boss.send(queue, { jobId: job.id, projectId, actor } satisfies JobData);
      } catch (error) {
        await finishPackageJob(this.db, job.id, { error: unexpectedWords });
        throw error;
      }
    }
    return job;
  }

  private async run(data: JobData): Promise<void> {
    if (!(await startPackageJob(this.db, data.jobId))) return;
    try {
      const made = await makePackage(
        this.db,
        this.storage,
        data.projectId,
        data.actor,
        { appUrl: this.settings.appUrl },
        (step: PackageStep) => packageJobStep(this.db, data.jobId, step, packageStepStart[step]),
      );
      this.settings.mailQueued();
      await finishPackageJob(this.db, data.jobId, { revisionId: made.id });
    } catch (error) {
      if (!(error instanceof DomainError)) this.logger?.error({ err: error, jobId: data.jobId }, 'a package job failed');
      await finishPackageJob(this.db, data.jobId, { error: failureWords(error) });
    }
  }

  /** Stops taking jobs and waits up to `timeoutMs` for the one under way. */
  async stop(timeoutMs = 8000): Promise<void> {
    const boss = this.boss;
    this.boss = null;
    if (boss) await boss.stop({ graceful: true, wait: true, timeout: timeoutMs });
  }
}

/** A refusal's own words (with its details' words, never their field paths); anything else, plain words. */
export function failureWords(error: unknown): string {
  if (!(error instanceof DomainError)) return unexpectedWords;
  const details = [...new Set(error.details.map((detail) => detail.message))].slice(0, 3);
  return [error.message, ...details].join(' ').slice(0, 500);
}
