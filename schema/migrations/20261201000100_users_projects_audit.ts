import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.text('email').notNullable();
    table.text('name').notNullable();
    table.text('password_hash').notNullable();
    table.boolean('is_admin').notNullable().defaultTo(false);
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw('create unique index users_email_unique on users (lower(email))');

  await knex.schema.createTable('projects', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.text('name').notNullable();
    table.text('state').notNullable().defaultTo('draft');
    table.integer('version').notNullable().defaultTo(1);
    table.uuid('created_by').references('users.id').onDelete('SET NULL');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(
    "alter table projects add constraint projects_state_check check (state in ('draft', 'in-review', 'returned', 'accepted', 'issued'))",
  );

  await knex.schema.createTable('project_members', (table) => {
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    table.text('role').notNullable();
    table.timestamp('added_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.primary(['project_id', 'user_id']);
    table.index(['user_id']);
  });
  await knex.raw(
    "alter table project_members add constraint project_members_role_check check (role in ('engineer', 'reviewer', 'contractor'))",
  );

  await knex.schema.createTable('audit_log', (table) => {
    table.bigIncrements('id').primary();
    table.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.uuid('user_id').references('users.id').onDelete('SET NULL');
    table.uuid('project_id').references('projects.id').onDelete('CASCADE');
    table.text('action').notNullable();
    table.text('entity').notNullable();
    table.text('entity_id');
    table.jsonb('detail');
    table.index(['project_id', 'at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_log');
  await knex.schema.dropTable('project_members');
  await knex.schema.dropTable('projects');
  await knex.schema.dropTable('users');
}
