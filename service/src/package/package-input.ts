import type { EvaluationResult } from '../../../contract/result.js';
import type { ReviewItem } from '../../../contract/review.js';
import type { EvaluationDocument } from '../compliance/document.js';
import type { ProjectDetail } from '../projects/projects.repository.js';

/** One submittal revision as the package's documents name it. */
export interface PackageRevisionStamp {
  /** 1 for the first package of the project, then 2, 3 … */
  number: number;
  /** SHA-256 of the canonical result, in hex (see `fingerprint.ts`). */
  fingerprint: string;
  madeAt: string;
  madeBy: string;
  /** A draft package: made before the design was accepted; every page says so. */
  draft: boolean;
}

/**
 * Everything the Word, Excel and PDF builders read: the project as set up, the frozen evaluation
 * document and result, the revision being made with those before it, and the review record of the
 * round once there is one. The builders are pure: same input, same documents.
 */
export interface PackageInput {
  project: ProjectDetail;
  document: EvaluationDocument;
  result: EvaluationResult;
  revision: PackageRevisionStamp;
  /** Earlier revisions, oldest first. */
  history: PackageRevisionStamp[];
  /** The check items of the last review round, with verdicts and threads; absent before any review. */
  review?: { round: number; items: ReviewItem[] };
}

/**
 * What the Word and Excel files add beyond the evaluation: the file name of the cut sheet on file
 * for a luminaire type, by its tag (a type without one is listed as having none on file).
 */
export interface CompliancePackageOptions {
  /** The cut sheet on file for a luminaire type, by tag: its file name. */
  cutSheets?: ReadonlyMap<string, string>;
  /** Word only: every table row built with docx's objects: slow on a large project; the reference the tests compare the fast path with. */
  tablesViaDocx?: boolean;
  /** Excel only: every table row written by exceljs: slow on a large project; the reference the tests compare the fast path with. */
  rowsViaExceljs?: boolean;
}

export type PackageFormat = 'docx' | 'xlsx' | 'pdf';
