import type { ControlStatus, ProjectState, Verdict } from '../../core/api/api-types';
import type { PackageRevision, ValueChange } from '../../../../../contract/package';

/** What the make button does in the project's state, in words. */
export function makeWords(state: ProjectState): { label: string; explanation: string; final: boolean } {
  switch (state) {
    case 'accepted':
      return {
        label: 'Make the final package and issue the design',
        explanation: 'The design is accepted: its package is final, and making it issues the design.',
        final: true,
      };
    case 'issued':
      return {
        label: 'Make the final package again',
        explanation: 'The design is issued: a package made now is a final one of the same design.',
        final: true,
      };
    default:
      return {
        label: 'Make a draft package',
        explanation: 'Until the design is accepted, a package is a draft: every page says “DRAFT — not for permit”.',
        final: false,
      };
  }
}

const verdictWords: Record<Verdict, string> = {
  complies: 'complies',
  'does-not-comply': 'does not comply',
  incomplete: 'is incomplete (items to verify)',
};

export function verdictChange(change: { from: Verdict; to: Verdict }): string {
  return `The design ${verdictWords[change.from]} in the earlier revision and ${verdictWords[change.to]} in the later one.`;
}

const controlWords: Record<ControlStatus, string> = {
  met: 'met',
  'not-met': 'not met',
  'exception-claimed': 'exception claimed',
  'to-verify': 'to verify',
  'not-required': 'not required',
};

export function controlStatusWords(status: ControlStatus | null): string {
  return status === null ? 'not listed' : controlWords[status];
}

const grouped = new Intl.NumberFormat('en-US', { maximumFractionDigits: 2 });

/** A changed figure for reading: a decimal grouped and rounded to two places, yes/no and words as they are. */
export function changeValue(value: string | null): string {
  if (value === null) return '—';
  return /^-?\d+(\.\d+)?$/.test(value) ? grouped.format(Number(value)) : value;
}

export function changeWords(change: ValueChange): string {
  return `${change.label}: ${changeValue(change.from)} → ${changeValue(change.to)}`;
}

/** A revision as the lists name it: "Revision 3 (final)". */
export function revisionName(revision: Pick<PackageRevision, 'revision' | 'draft'>): string {
  return `Revision ${revision.revision} (${revision.draft ? 'draft' : 'final'})`;
}

/** The fingerprint as printed, in groups of eight so a person can read it against a page. */
export function fingerprintGroups(fingerprint: string): string {
  return fingerprint.replace(/(.{8})(?=.)/g, '$1 ');
}
