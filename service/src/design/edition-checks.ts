import { loadEditionData } from '../code-tables/code-tables.repository.js';
import { exceptionProblems, exteriorExemptionProblems, salesAreaSpaceType } from '../compliance/document.js';
import { validateDocument, type EditionData } from '../compliance/index.js';
import type { Database } from '../db/database.js';
import { Refused, type ErrorDetail } from '../domain-errors.js';
import { projectSetup } from '../projects/projects.repository.js';
import { listLuminaireTypes, spaceTypeOf } from './design.repository.js';
import type { ExteriorApplicationInput, LuminaireTypeInput, SpaceInput } from './design.schema.js';

/**
 * Checks spaces about to be stored against the project's edition and method with the same rules
 * an evaluation applies (known space or building area type, the method's rules, room geometry for
 * openings, defined luminaire tags), so a bad key is refused when it is typed, not later.
 * `single` reports paths relative to the one space (`spaceType`), otherwise `spaces.N.spaceType`.
 */
export async function assertSpacesFitEdition(
  db: Database,
  projectId: string,
  spaces: SpaceInput[],
  single: boolean,
  newTypes: readonly LuminaireTypeInput[] = [],
): Promise<void> {
  const project = await projectSetup(db, projectId);
  if (!project?.edition_id || !project.method) return;
  const edition = await loadEditionData(db, project.edition_id);
  if (!edition) return;
  // Types created in the same import come first, so their problems keep the paths the request gave them.
  const newTags = new Set(newTypes.map((type) => type.tag));
  const types = [...newTypes, ...(await listLuminaireTypes(db, projectId)).filter((type) => !newTags.has(type.tag))];
  const outcome = validateDocument(
    {
      edition: project.edition_id,
      method: project.method,
      units: project.units,
      luminaireTypes: types.map(({ tag, description, inputWatts, use, exemptReason, basis, length, limitWatts }) => ({
        tag,
        description,
        inputWatts,
        use,
        exemptReason,
        basis,
        length,
        limitWatts,
      })),
      // The building area method's control space type is kept when the project uses the other method, unchecked until it is used.
      spaces: spaces.map((space, index) => ({
        ...space,
        ...(project.method === 'space-by-space' ? { controlSpaceType: undefined } : {}),
        id: `space-${index}`,
      })),
    },
    edition,
  );
  if (outcome.valid) return;
  const ownType = (path: string) => Number(/^luminaireTypes\.(\d+)\./.exec(path)?.[1] ?? Infinity) < newTypes.length;
  const details: ErrorDetail[] = outcome.problems
    .filter((problem) => problem.path.startsWith('spaces.') || ownType(problem.path))
    .map((problem) => ({ path: single ? problem.path.replace(/^spaces\.0\./, '') : problem.path, message: problem.message }));
  if (details.length > 0) throw new Refused('Some values do not fit the project’s code edition and method.', details);
}

/**
 * An exterior application must be one of the edition's own, and not the base site allowance (the
 * lighting zone adds that): an unknown key would make the project impossible to evaluate. An exempt
 * part needs its reason from the edition's list, and is at most the installed watts.
 */
export async function assertExteriorApplicationFitsEdition(
  db: Database,
  projectId: string,
  input: ExteriorApplicationInput,
): Promise<void> {
  const edition = await projectEdition(db, projectId);
  const application = edition.exteriorApplications.find((candidate) => candidate.key === input.key);
  if (!application) {
    throw new Refused('This exterior application is not one of the project’s code edition.', [
      { path: 'key', message: 'Choose an application from the edition’s list.' },
    ]);
  }
  if (application.isBaseSiteAllowance) {
    throw new Refused('The base site allowance comes with the lighting zone; it is not entered as an application.', [
      { path: 'key', message: 'Choose another application.' },
    ]);
  }
  const problems = exteriorExemptionProblems(input, edition);
  if (problems.length > 0) throw new Refused('The exempt lighting is not complete.', problems);
}

/** The unit of each exterior application of the project's edition (none before an edition is chosen). */
export async function exteriorUnitsOf(db: Database, projectId: string): Promise<ReadonlyMap<string, string>> {
  const project = await projectSetup(db, projectId);
  const edition = project?.edition_id ? await loadEditionData(db, project.edition_id) : undefined;
  return new Map((edition?.exteriorApplications ?? []).map((application) => [application.key, application.unit]));
}

async function projectEdition(db: Database, projectId: string): Promise<EditionData> {
  const project = await projectSetup(db, projectId);
  const edition = project?.edition_id ? await loadEditionData(db, project.edition_id) : undefined;
  if (!edition)
    throw new Refused('Choose the code edition in the set-up first.', [
      { path: 'edition', message: 'The project has no code edition yet.' },
    ]);
  return edition;
}

/** A control recorded on many spaces must be one of the edition's strategies, and its exception claim must hold as in one space's write. */
export async function assertControlFitsEdition(db: Database, projectId: string, control: SpaceInput['controls'][number]): Promise<void> {
  const edition = await projectEdition(db, projectId);
  if (!edition.controlStrategies.some((candidate) => candidate.key === control.strategy)) {
    throw new Refused('This control is not one of the project’s code edition.', [
      { path: 'control.strategy', message: 'Choose a control from the edition’s list.' },
    ]);
  }
  const problems = exceptionProblems(control);
  if (problems.length > 0)
    throw new Refused(
      'The exception claimed is not complete.',
      problems.map((problem) => ({ path: `control.${problem.path}`, message: problem.message })),
    );
}

/** Remembered import names must point at types the edition has. */
export async function assertAliasesFitEdition(
  db: Database,
  projectId: string,
  aliases: { spaceType: string | null; buildingAreaType: string | null }[],
): Promise<void> {
  const edition = await projectEdition(db, projectId);
  const spaceTypes = new Set(edition.spaceTypes.map((type) => type.key));
  const areaTypes = new Set(edition.buildingAreaTypes.map((type) => type.key));
  const details = aliases.flatMap((alias, index) => [
    ...(alias.spaceType !== null && !spaceTypes.has(alias.spaceType)
      ? [{ path: `aliases.${index}.spaceType`, message: 'Not a space type of the project’s edition.' }]
      : []),
    ...(alias.buildingAreaType !== null && !areaTypes.has(alias.buildingAreaType)
      ? [{ path: `aliases.${index}.buildingAreaType`, message: 'Not a building area type of the project’s edition.' }]
      : []),
    ...(alias.spaceType === null && alias.buildingAreaType === null
      ? [{ path: `aliases.${index}`, message: 'Match the name to a space type or a building area type.' }]
      : []),
  ]);
  if (details.length > 0) throw new Refused('Some matches do not fit the project’s code edition.', details);
}

/**
 * An additional-allowance claim: one of the edition's allowances, under the space-by-space method;
 * a retail display claim on a space whose type is the sales area (90.1 §9.6.2(b), IECC C405.3.2.2.1).
 */
export async function assertAllowanceFitsEdition(
  db: Database,
  projectId: string,
  input: { spaceId: string; allowance: string },
): Promise<void> {
  const edition = await projectEdition(db, projectId);
  const project = await projectSetup(db, projectId);
  if (project?.method !== 'space-by-space') {
    throw new Refused('Additional allowances are part of the space-by-space method.', [
      { path: 'allowance', message: 'Switch the project to the space-by-space method first.' },
    ]);
  }
  const allowance = edition.additionalAllowances.find((candidate) => candidate.key === input.allowance);
  if (!allowance) {
    throw new Refused('This allowance is not one of the project’s code edition.', [
      { path: 'allowance', message: 'Choose an allowance from the edition’s list.' },
    ]);
  }
  // The decorative allowance is for any space (90.1 §9.6.2(a)); only retail display needs a sales floor.
  if (allowance.kind !== 'retail-display') return;
  const spaceType = await spaceTypeOf(db, projectId, input.spaceId);
  if (spaceType !== undefined && spaceType !== salesAreaSpaceType) {
    throw new Refused('The display allowance is for sales floors.', [
      { path: 'spaceId', message: 'Choose a space whose type is the sales area.' },
    ]);
  }
}
