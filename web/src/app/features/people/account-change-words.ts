import type { AccountChange } from '../../../../../contract/accounts';

const roleWords: Record<string, string> = { engineer: 'engineer', reviewer: 'reviewer', contractor: 'contractor' };

/** The account a sentence names: its name and address, or words when the account is gone. */
function who(change: AccountChange): string {
  return change.account ? `${change.account.name} (${change.account.email})` : 'a person whose account is gone';
}

/** "the account of Noor Castellanos (…)", or "an account since gone". */
function accountOf(change: AccountChange): string {
  return change.account ? `the account of ${who(change)}` : 'an account since gone';
}

/**
 * One change to an account as a sentence: "Ada Brook made Noor Castellanos (noor@…) an
 * administrator". Never a field name or an id.
 */
export function accountChangeWords(change: AccountChange): string {
  const actor = change.by?.name || 'Someone';
  const account = who(change);
  const theirs = accountOf(change);
  switch (change.action) {
    case 'create':
      return `${actor} made an account for ${account}${change.after?.isAdmin ? ', as an administrator' : ''}`;
    case 'accept-invitation': {
      const project = change.projectName ? ` to the project “${change.projectName}”` : '';
      const role = change.after?.role ? ` as ${roleWords[change.after.role] ?? 'a member'}` : '';
      return `${account} made an account by accepting an invitation${project}${role}`;
    }
    case 'update': {
      const parts: string[] = [];
      const before = change.before ?? {};
      const after = change.after ?? {};
      if (after.isAdmin !== undefined && after.isAdmin !== before.isAdmin)
        parts.push(after.isAdmin ? `made ${account} an administrator` : `removed ${account} as an administrator`);
      if (after.disabled !== undefined && after.disabled !== before.disabled)
        parts.push(after.disabled ? `disabled ${theirs}` : `enabled ${theirs} again`);
      return parts.length ? `${actor} ${parts.join(' and ')}` : `${actor} saved ${theirs} without a change`;
    }
    default:
      return `${actor} changed ${theirs}`;
  }
}
