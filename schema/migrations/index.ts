import type { Knex } from 'knex';
import * as usersProjectsAudit from './20261201000100_users_projects_audit.js';
import * as codeTables from './20261201000200_code_tables.js';
import * as projectDesign from './20261201000300_project_design.js';
import * as lightReductionExemptions from './20261201000400_light_reduction_exemptions.js';
import * as projectResultSummary from './20261201000500_project_result_summary.js';
import * as designIntegrity from './20261202000200_design_integrity.js';
import * as permitFields from './20261202000300_permit_fields.js';
import * as workspaceFields from './20261202000400_workspace_fields.js';
import * as ruleFields from './20261202000500_rule_fields.js';
import * as ruleInputs from './20261202000600_rule_inputs.js';
import * as editionAmendments from './20261202000700_edition_amendments.js';
import * as equalRows from './20261202000800_equal_rows.js';
import * as sessions from './20261202001000_sessions.js';
import * as spaceTypeFormulas from './20261202001100_space_type_formulas.js';
import * as allowanceClaimDeletes from './20261202001200_allowance_claim_deletes.js';
import * as decorativeAndExteriorExemptions from './20261202001500_decorative_and_exterior_exemptions.js';
import * as openingDaylightFields from './20261202001600_opening_daylight_fields.js';
import * as mailOutboxPasswordResets from './20261202002000_mail_outbox_password_resets.js';
import * as userDisable from './20261202002100_user_disable.js';
import * as projectRevision from './20261202003000_project_revision.js';
import * as reviewItems from './20261203001000_review_items.js';
import * as reviewDigest from './20261203002000_review_digest.js';
import * as invitations from './20261203003000_invitations.js';
import * as packageRevisions from './20261203005000_package_revisions.js';
import * as fieldTests from './20261203006000_field_tests.js';
import * as luminaireCutSheets from './20261203007000_luminaire_cut_sheets.js';
import * as packageJobs from './20261203009000_package_jobs.js';
import * as exteriorScheduleSettings from './20261203011000_exterior_schedule_settings.js';
import * as fieldTestPhotos from './20261203008000_field_test_photos.js';
import * as fieldTestSummary from './20261203012000_field_test_summary.js';

interface Migration {
  up(knex: Knex): Promise<void>;
  down(knex: Knex): Promise<void>;
}

/** Every migration in order. Add a new file here as well as in the folder. */
const migrations: Record<string, Migration> = {
  '20261201000100_users_projects_audit': usersProjectsAudit,
  '20261201000200_code_tables': codeTables,
  '20261201000300_project_design': projectDesign,
  '20261201000400_light_reduction_exemptions': lightReductionExemptions,
  '20261201000500_project_result_summary': projectResultSummary,
  '20261202000200_design_integrity': designIntegrity,
  '20261202000300_permit_fields': permitFields,
  '20261202000400_workspace_fields': workspaceFields,
  '20261202000500_rule_fields': ruleFields,
  '20261202000600_rule_inputs': ruleInputs,
  '20261202000700_edition_amendments': editionAmendments,
  '20261202000800_equal_rows': equalRows,
  '20261202001000_sessions': sessions,
  '20261202001100_space_type_formulas': spaceTypeFormulas,
  '20261202001200_allowance_claim_deletes': allowanceClaimDeletes,
  '20261202001500_decorative_and_exterior_exemptions': decorativeAndExteriorExemptions,
  '20261202001600_opening_daylight_fields': openingDaylightFields,
  '20261202002000_mail_outbox_password_resets': mailOutboxPasswordResets,
  '20261202002100_user_disable': userDisable,
  '20261202003000_project_revision': projectRevision,
  '20261203001000_review_items': reviewItems,
  '20261203002000_review_digest': reviewDigest,
  '20261203003000_invitations': invitations,
  '20261203005000_package_revisions': packageRevisions,
  '20261203006000_field_tests': fieldTests,
  '20261203007000_luminaire_cut_sheets': luminaireCutSheets,
  '20261203009000_package_jobs': packageJobs,
  '20261203011000_exterior_schedule_settings': exteriorScheduleSettings,
  '20261203012000_field_test_summary': fieldTestSummary,
  '20261203008000_field_test_photos': fieldTestPhotos,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(migrations).sort(),
  getMigrationName: (name) => name,
  getMigration: async (name) => {
    const migration = migrations[name];
    if (!migration) throw new Error(`Unknown migration ${name}`);
    return migration;
  },
};
