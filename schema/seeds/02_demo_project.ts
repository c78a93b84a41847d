import type { Knex } from 'knex';
import { createExteriorApplication, createLuminaireType, createSpaces } from '../../service/src/design/design.repository.js';
import { saveScheduleSettings } from '../../service/src/exterior-schedule/schedule-settings.repository.js';
import { exteriorApplicationInputSchema, luminaireTypeInputSchema, spaceInputSchema } from '../../service/src/design/design.schema.js';
import { demoProjectName } from './demo-data.js';
import { demoExterior, demoLuminaireTypes, demoSetup, demoSpaces } from './demo-project.js';

/** Fills the demo project's design once; a project that already has spaces is left as it is. */
export async function seed(knex: Knex): Promise<void> {
  const project = await knex('projects')
    .where({ name: demoProjectName })
    .first<{ id: string; created_by: string } | undefined>('id', 'created_by');
  if (!project) return;
  if (await knex('spaces').where({ project_id: project.id }).first('id')) return;
  const engineerId = project.created_by;
  await knex('projects')
    .where({ id: project.id })
    .update({ ...demoSetup, updated_by: engineerId });
  for (const type of demoLuminaireTypes) {
    await createLuminaireType(knex, project.id, luminaireTypeInputSchema.parse(type), engineerId);
  }
  await createSpaces(
    knex,
    project.id,
    demoSpaces.map((space) => spaceInputSchema.parse(space)),
    engineerId,
  );
  for (const application of demoExterior) {
    await createExteriorApplication(
      knex,
      project.id,
      exteriorApplicationInputSchema.parse({ ...application, controls: exteriorControls(application.key) }),
      engineerId,
    );
  }
  // The schedule the exterior controls above describe: set back from 11 p.m. to 6 a.m., by 50 %.
  await saveScheduleSettings(
    knex,
    project.id,
    { onMinutesBeforeSunset: 10, offMinutesAfterSunrise: 10, setback: { start: '23:00', end: '06:00', reductionPercent: 50 } },
    0,
    engineerId,
  );
}

function exteriorControls(key: string) {
  const daylightOff = { strategy: 'exterior-daylight-off', provided: true, device: 'Astronomical time switch with photocell override' };
  if (key === 'building-facades') {
    return [daylightOff, { strategy: 'exterior-facade-landscape-off', provided: true, device: 'Schedule: off from 11 p.m. to 6 a.m.' }];
  }
  return [daylightOff, { strategy: 'exterior-setback', provided: true, device: 'Schedule: 50 % from 11 p.m. to 6 a.m.' }];
}
