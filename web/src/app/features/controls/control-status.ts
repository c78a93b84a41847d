import type { ControlExceptionReason, ControlLine, ControlStatus, RequirementCode } from '../../core/api/api-types';

export interface StatusView {
  icon: string;
  words: string;
  /** Still needs the engineer's attention: not met, or not decidable from the data. */
  outstanding: boolean;
}

const statusViews: Record<ControlStatus, StatusView> = {
  met: { icon: 'check_circle', words: 'Met', outstanding: false },
  'not-met': { icon: 'warning', words: 'Not met', outstanding: true },
  'exception-claimed': { icon: 'assignment_late', words: 'Exception claimed', outstanding: false },
  'to-verify': { icon: 'help', words: 'To verify', outstanding: true },
  'not-required': { icon: 'remove_circle_outline', words: 'Not required', outstanding: false },
};

export function statusView(status: ControlStatus): StatusView {
  return statusViews[status];
}

export function requirementWords(requirement: RequirementCode): string {
  if (requirement === 'required') return 'Required';
  if (requirement === 'not-required') return 'Not required';
  if (requirement === 'to-verify') return 'Requirement to verify';
  return `At least one of group ${requirement.slice('one-of:'.length)}`;
}

export function outstandingLines(lines: readonly ControlLine[]): ControlLine[] {
  return lines.filter((line) => statusView(line.status).outstanding);
}

export const exceptionReasonLabels: Record<ControlExceptionReason, string> = {
  'security-or-emergency-continuous': 'Security or emergency area that must stay lit continuously',
  'exit-stairway-ramp-passageway': 'Interior exit stairway, exit ramp or exit passageway',
  'egress-normally-off': 'Emergency egress lighting that is normally off',
  'continuous-operation': 'Lighting intended to operate continuously',
  'verified-not-required': 'Checked against the adopted code: not required here (say where)',
  other: 'Another exception (say which)',
};

/** The reasons one control may give: continuous operation frees lighting from the time switch only, as the service says. */
export function reasonsFor(strategy: string, offerChecked: boolean): ControlExceptionReason[] {
  return (Object.keys(exceptionReasonLabels) as ControlExceptionReason[]).filter(
    (reason) => (reason !== 'continuous-operation' || strategy === 'time-switch') && (reason !== 'verified-not-required' || offerChecked),
  );
}
