/** Submittal packages as the service answers them and the web app reads them. */
import type { ControlStatus, Verdict } from './result.js';

export const packageFormats = ['docx', 'xlsx', 'pdf'] as const;
export type PackageFormat = (typeof packageFormats)[number];

/** Words for each file of a package, as people read them. */
export const packageFormatLabels: Record<PackageFormat, string> = { docx: 'Word', xlsx: 'Excel', pdf: 'PDF' };

/** `POST /api/projects/:id/packages`. */
export interface MadePackage {
  id: string;
  revision: number;
  /** A draft: made before the design was accepted; every page says so. */
  draft: boolean;
  fingerprint: string;
  files: { format: PackageFormat; url: string }[];
}

/** The steps of making a package, in order, with the progress (0–100) each starts at. */
export const packageSteps = ['evaluate', 'docx', 'xlsx', 'pdf', 'store'] as const;
export type PackageStep = (typeof packageSteps)[number];
export const packageStepStart: Record<PackageStep, number> = { evaluate: 0, docx: 10, xlsx: 50, pdf: 70, store: 90 };

/** Each step in words, as the progress bar says it. */
export const packageStepLabels: Record<PackageStep, string> = {
  evaluate: 'Evaluating the design',
  docx: 'Building the Word file',
  xlsx: 'Building the Excel file',
  pdf: 'Building the PDF',
  store: 'Storing the files',
};

export const packageJobStates = ['queued', 'running', 'done', 'failed'] as const;
export type PackageJobState = (typeof packageJobStates)[number];

/**
 * A background job making a large project's package: `POST /api/projects/:id/packages` answers
 * 202 with it (or with the job already queued or running for the project), and
 * `GET /api/projects/:id/packages/jobs/:jobId` follows it.
 */
export interface PackageJob {
  id: string;
  state: PackageJobState;
  /** 0–100. */
  progress: number;
  /** The step under way; null while queued. */
  step: PackageStep | null;
  /** The package made, once done. */
  package?: MadePackage;
  /** Why it failed, in words, once failed. */
  error?: string;
}

export interface PackageJobAnswer {
  job: PackageJob;
}

/** One revision of `GET /api/projects/:id/packages`, oldest first. */
export interface PackageRevision {
  id: string;
  revision: number;
  draft: boolean;
  /** The design revision the package was made of. */
  designRevision: number;
  fingerprint: string;
  madeAt: string;
  /** Null when the person's account no longer exists. */
  madeBy: string | null;
  files: { format: PackageFormat; size: number; sha256: string; url: string }[];
}

export interface PackageRevisionList {
  revisions: PackageRevision[];
}

/** One figure or word that differs between two revisions. */
export interface ValueChange {
  field: string;
  /** The figure's name in words, for people. */
  label: string;
  from: string | null;
  to: string | null;
}

export interface SpaceMention {
  id: string;
  name: string;
  level: string | null;
}

export interface ControlChange {
  spaceId: string;
  spaceName: string;
  /** The control in words, as the result names it. */
  control: string;
  /** Null where the control was not listed for the space in that revision. */
  from: ControlStatus | null;
  to: ControlStatus | null;
}

/** What changed from one revision's result to another's. */
export interface RevisionComparison {
  verdict: { from: Verdict; to: Verdict } | null;
  /** The building's figures: interior and exterior allowance, installed, margin. */
  totals: ValueChange[];
  spaces: {
    added: SpaceMention[];
    removed: SpaceMention[];
    changed: (SpaceMention & { changes: ValueChange[] })[];
  };
  controls: ControlChange[];
  exterior: { key: string; label: string; change: 'added' | 'removed' | 'changed'; changes: ValueChange[] }[];
}

/** `GET /api/projects/:id/packages/compare?from=&to=`. */
export interface PackageComparison extends RevisionComparison {
  from: { id: string; revision: number; draft: boolean; fingerprint: string };
  to: { id: string; revision: number; draft: boolean; fingerprint: string };
}
