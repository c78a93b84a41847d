export type * from './edition-data.js';
export { citationOf, cleanNote, editionName, referenceOf, type Citation, type CitationInput, type CitationLayer } from './citation.js';
export { strategyKeys } from './edition-data.js';
export {
  controlExceptionReasons,
  evaluationDocumentSchema,
  validateDocument,
  type DocumentProblem,
  type EvaluationDocument,
  type EvaluationDocumentInput,
  type ValidationOutcome,
} from './document.js';
export { evaluate, defaultWorkPlaneFt, sectionKeys, standingCautions } from './evaluate.js';
export type * from './result.js';
export { formatLpd, formatPercent, formatWatts } from './format.js';
export { daylightAreas, rectangularRoomCavityRatio, roomCavityRatio, zoneRectangles, type RoomPlan, type ZoneKind } from './geometry.js';
export { unitWattage } from './installed.js';
export {
  areaFromSquareFeet,
  areaToSquareFeet,
  densityFromPerSquareFoot,
  lengthFromFeet,
  lengthToFeet,
  metresPerFoot,
  squareMetresPerSquareFoot,
  type UnitSystem,
} from './units.js';
