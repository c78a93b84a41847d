/**
 * What an evaluation returns: the types come from the one schema in `contract/result.ts`, which
 * the web app reads too. Every number is an exact decimal string; round only for display.
 */
export type {
  AdditionalAllowanceLine,
  AdditionalAllowanceResult,
  ControlLine,
  ControlStatus,
  DaylightResult,
  EvaluationResult,
  ExemptLine,
  ExteriorApplicationResult,
  ExteriorResult,
  InteriorResult,
  LevelResult,
  LuminaireLine,
  SpaceResult,
  UnverifiedValue,
  ZoneRectangleResult,
} from '../../../contract/result.js';
