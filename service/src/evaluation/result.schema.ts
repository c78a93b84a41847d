/** The served result schema lives in the contract both the service and the web app read. */
export { evaluationResultSchema } from '../../../contract/result.js';
