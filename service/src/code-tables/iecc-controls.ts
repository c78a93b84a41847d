import type { RequirementCode, StrategyKey } from '../compliance/edition-data.js';

/** The inputs of the IECC 2021 C405.2.1 rules that one space type carries as data. */
export interface IeccRuleInputs {
  occupantSensorListed: boolean;
  fullAutoOnAllowed: boolean;
  sensorFunction: 'general' | 'warehouse' | 'open-office' | 'corridor' | 'parking-garage';
  lightReductionExemptItem: string | null;
}

export interface DerivedCell {
  requirement: RequirementCode;
  why: string;
}

/**
 * The control map shown for an IECC space type, derived from its rule inputs: listed spaces need
 * an occupant sensor (C405.2.1); elsewhere a time switch (C405.2.2) or an occupant sensor, and the
 * engine applies the 300 ft² enclosed-space rule by area. Space-specific functions add partial OFF.
 */
export function deriveIeccControls(
  inputs: IeccRuleInputs,
  daylight: { sidelighting: RequirementCode; toplighting: RequirementCode },
): Partial<Record<StrategyKey, DerivedCell>> {
  const cells: Partial<Record<StrategyKey, DerivedCell>> = {};
  if (inputs.occupantSensorListed) {
    cells['occupant-sensor'] = { requirement: 'required', why: 'listed in C405.2.1' };
    cells['time-switch'] = {
      requirement: 'not-required',
      why: 'an occupant sensor is required instead (C405.2.2 applies where there is none)',
    };
  } else {
    const group = 'one-of:OCCUPANT-SENSOR-OR-TIME-SWITCH';
    cells['occupant-sensor'] = {
      requirement: group,
      why: 'not listed in C405.2.1: required only in an enclosed space at or below the small-space area',
    };
    cells['time-switch'] = { requirement: group, why: 'C405.2.2 applies to spaces without occupant sensors' };
  }
  const specificFunction = inputs.sensorFunction !== 'general';
  cells['automatic-partial-off'] = specificFunction
    ? { requirement: 'required', why: `the ${inputs.sensorFunction} occupant-sensor function reduces lighting when unoccupied` }
    : { requirement: 'not-required', why: 'no space-specific reduction function' };
  cells['automatic-full-off'] =
    inputs.occupantSensorListed && !specificFunction
      ? { requirement: 'required', why: 'C405.2.1.1 item 1: off within the time-out after occupants leave' }
      : {
          requirement: 'not-required',
          why: specificFunction ? 'the space-specific function applies instead of C405.2.1.1' : 'not listed in C405.2.1',
        };
  cells['light-reduction'] = inputs.lightReductionExemptItem
    ? { requirement: 'not-required', why: `C405.2.3 exception: ${inputs.lightReductionExemptItem}` }
    : {
        requirement: 'required',
        why: 'C405.2.3, unless the area has one small luminaire or a low installed density (checked by the engine)',
      };
  cells['daylight-sidelighting'] = { requirement: daylight.sidelighting, why: "the source dataset's mapping of C405.2.4" };
  cells['daylight-toplighting'] = { requirement: daylight.toplighting, why: "the source dataset's mapping of C405.2.4" };
  return cells;
}
