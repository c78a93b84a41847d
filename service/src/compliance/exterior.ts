import { type ControlRequirement, resolveControls } from './controls.js';
import type { EvaluationDocument, ExteriorApplicationEntry } from './document.js';
import type { EditionData, ExteriorApplication } from './edition-data.js';
import { strategyKeys } from './edition-data.js';
import { exteriorExemptions } from '../../../contract/editions.js';
import { type Dec, ZERO, dec, min, reported, sum, text } from './numbers.js';
import type { ExteriorApplicationResult, ExteriorResult } from './result.js';
import { type UnitSystem, areaToSquareFeet, densityFromPerSquareFoot, lengthToFeet, linearDensityFromPerFoot } from './units.js';

function quantityInTableUnits(application: ExteriorApplication, quantity: Dec, units: UnitSystem): Dec {
  if (application.unit === 'W/ft2') return areaToSquareFeet(quantity, units);
  if (application.unit === 'W/ft') return lengthToFeet(quantity, units);
  return quantity;
}

function rateInDocumentUnits(application: ExteriorApplication, rate: Dec, units: UnitSystem): { rate: Dec; unit: string } {
  if (application.unit === 'W/ft2') return { rate: densityFromPerSquareFoot(rate, units), unit: units === 'ip' ? 'W/ft²' : 'W/m²' };
  if (application.unit === 'W/ft') return { rate: linearDensityFromPerFoot(rate, units), unit: units === 'ip' ? 'W/ft' : 'W/m' };
  return { rate, unit: application.unit };
}

/** The reason, words and section of an application's exempt part (the edition family's list, from memory). */
function exemptionOf(entry: ExteriorApplicationEntry, edition: EditionData): ExteriorApplicationResult['exemption'] {
  if (entry.exemptReason === undefined) return null;
  const listed = exteriorExemptions[edition.family].find((exemption) => exemption.reason === entry.exemptReason)!;
  // Every family's list is from memory until a reference table replaces it.
  return { reason: listed.reason, label: listed.label, note: entry.exemptNote ?? '', section: listed.section, verified: false };
}

/**
 * Exterior allowance: the base site allowance, tradable applications pooled, nontradable ones
 * each only for itself. The base site allowance covers tradable excess; it covers nontradable
 * excess only where the edition's data says it may.
 */
export function evaluateExterior(
  exterior: NonNullable<EvaluationDocument['exterior']>,
  edition: EditionData,
  units: UnitSystem,
): ExteriorResult {
  const zone = exterior.lightingZone;
  const section = edition.sections['exteriorAllowance'] ?? '';
  const catalogue = new Map(edition.exteriorApplications.map((application) => [application.key, application]));
  const base = edition.exteriorApplications.find((application) => application.isBaseSiteAllowance);
  const baseSiteW = dec(base?.allowanceByZone[zone] ?? '0');

  const priced = exterior.applications.map((entry) => {
    const application = catalogue.get(entry.key)!;
    const tableRate = dec(application.allowanceByZone[zone] ?? '0');
    const quantity = dec(entry.quantity);
    const allowance = tableRate.times(quantityInTableUnits(application, quantity, units));
    // Exempt lighting is reported but left out of what the allowance must cover.
    const exempt = entry.exemptReason === undefined ? ZERO : dec(entry.exemptWatts ?? '0');
    return { entry, application, tableRate, quantity, allowance, exempt, installed: dec(entry.installedWatts).minus(exempt) };
  });

  const tradable = priced.filter((line) => line.application.tradable);
  const tradableAllowance = sum(tradable.map((line) => line.allowance));
  const tradableInstalled = sum(tradable.map((line) => line.installed));
  const tradableExcess = tradableInstalled.minus(tradableAllowance);
  const tradableBaseUsed = tradableExcess.greaterThan(0) ? min(tradableExcess, baseSiteW) : ZERO;
  const tradableComplies = tradableExcess.lessThanOrEqualTo(baseSiteW);
  let baseRemaining = baseSiteW.minus(tradableBaseUsed);

  const applications: ExteriorApplicationResult[] = priced.map((line) => {
    let baseUsed = ZERO;
    let within: boolean;
    if (line.application.tradable) {
      within = tradableComplies;
    } else {
      const excess = line.installed.minus(line.allowance);
      if (excess.greaterThan(0) && edition.rules.baseSiteCoversNontradable) {
        baseUsed = min(excess, baseRemaining);
        baseRemaining = baseRemaining.minus(baseUsed);
      }
      within = excess.minus(baseUsed).lessThanOrEqualTo(0);
    }
    const requirements: ControlRequirement[] = strategyKeys
      .filter((strategy) => line.application.controls[strategy] !== undefined)
      .map((strategy) => ({
        strategy,
        requirement: line.application.controls[strategy]!,
        why: `${line.application.label} exterior lighting`,
      }));
    const shown = rateInDocumentUnits(line.application, line.tableRate, units);
    return {
      key: line.application.key,
      label: line.application.label,
      tradable: line.application.tradable,
      unit: shown.unit,
      quantity: text(line.quantity),
      rate: reported.density(shown.rate),
      allowanceW: reported.watts(line.allowance),
      installedW: reported.watts(line.installed),
      exemptW: reported.watts(line.exempt),
      exemption: exemptionOf(line.entry, edition),
      baseSiteUsedW: reported.watts(baseUsed),
      marginW: reported.watts(line.allowance.plus(baseUsed).minus(line.installed)),
      withinAllowance: within,
      controls: resolveControls(requirements, line.entry.controls, edition, undefined, units),
      section,
    };
  });

  const allowance = baseSiteW.plus(sum(priced.map((line) => line.allowance)));
  const installed = sum(priced.map((line) => line.installed));
  return {
    lightingZone: zone,
    section,
    baseSiteAllowanceW: reported.watts(baseSiteW),
    allowanceW: reported.watts(allowance),
    installedW: reported.watts(installed),
    exemptW: reported.watts(sum(priced.map((line) => line.exempt))),
    complies: applications.every((application) => application.withinAllowance) && tradableComplies,
    tradable: {
      allowanceW: reported.watts(tradableAllowance),
      installedW: reported.watts(tradableInstalled),
      baseSiteUsedW: reported.watts(tradableBaseUsed),
      marginW: reported.watts(tradableAllowance.plus(tradableBaseUsed).minus(tradableInstalled)),
      complies: tradableComplies,
    },
    baseSiteRemainingW: reported.watts(baseRemaining),
    baseSiteCoversNontradable: edition.rules.baseSiteCoversNontradable,
    applications,
  };
}
