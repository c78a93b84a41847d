import type { Knex } from 'knex';

/**
 * An additional allowance row may name its own section (the decorative allowance is item (a) of
 * the section whose item (b) is retail display). An exterior application may leave part of its
 * watts out of the allowance as exempt, with the reason (a key of the edition's list) and a note.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('additional_allowances', (table) => {
    table.text('section');
  });
  await knex.schema.alterTable('exterior_applications', (table) => {
    table.specificType('exempt_watts', 'numeric');
    table.text('exempt_reason');
    table.text('exempt_note');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('exterior_applications', (table) => {
    table.dropColumn('exempt_note');
    table.dropColumn('exempt_reason');
    table.dropColumn('exempt_watts');
  });
  await knex.schema.alterTable('additional_allowances', (table) => {
    table.dropColumn('section');
  });
}
