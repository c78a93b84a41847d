import type { Knex } from 'knex';

/**
 * Background jobs that make a large project's submittal package: what the route answers while
 * pg-boss (its own schema, `pgboss`) carries the work to a worker. One job per project at a time:
 * a second request while one is queued or running finds that one (the partial unique index).
 * `step` is the builder's step (evaluate, docx, xlsx, pdf, store) and `progress` 0–100; a done job
 * names the revision it made, a failed one says why in words (at most 500 characters).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('package_jobs', (table) => {
    table.uuid('id').primary();
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.string('state', 8).notNullable().defaultTo('queued');
    table.string('step', 8);
    table.smallint('progress').notNullable().defaultTo(0);
    table.uuid('revision_id').references('package_revisions.id').onDelete('SET NULL');
    table.string('error', 500);
    table.uuid('requested_by').references('users.id').onDelete('SET NULL');
    table.timestamp('requested_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('finished_at', { useTz: true });
    table.index(['project_id', 'requested_at']);
  });
  await knex.raw(
    `alter table package_jobs add constraint package_jobs_state_check check (state in ('queued', 'running', 'done', 'failed'))`,
  );
  await knex.raw(
    `alter table package_jobs add constraint package_jobs_step_check check (step is null or step in ('evaluate', 'docx', 'xlsx', 'pdf', 'store'))`,
  );
  await knex.raw(`alter table package_jobs add constraint package_jobs_progress_check check (progress between 0 and 100)`);
  await knex.raw(`create unique index package_jobs_one_open on package_jobs (project_id) where state in ('queued', 'running')`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('package_jobs');
}
