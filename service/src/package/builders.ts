/** The package's document builders, as the package service calls them. */
export { buildCompliancePackage } from './compliance-package.js';
export { buildComplianceWorkbook } from './compliance-workbook.js';
