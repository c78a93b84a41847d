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
