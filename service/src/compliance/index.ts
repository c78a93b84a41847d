export type * from './edition-data.js';
export { evaluationDocumentSchema, validateDocument, type EvaluationDocument, type EvaluationDocumentInput } from './document.js';
export { evaluate } from './evaluate.js';
export type * from './result.js';
export { formatLpd, formatPercent, formatWatts } from './format.js';
export { daylightAreas, rectangularRoomCavityRatio, roomCavityRatio } from './geometry.js';
export { areaFromSquareFeet, areaToSquareFeet, lengthFromFeet, lengthToFeet, metresPerFoot, squareMetresPerSquareFoot } from './units.js';
