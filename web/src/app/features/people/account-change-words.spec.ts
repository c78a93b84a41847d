import type { AccountChange } from '../../../../../contract/accounts';
import { accountChangeWords } from './account-change-words';

const base: Omit<AccountChange, 'action' | 'before' | 'after'> = {
  id: '7',
  at: '2026-03-02T10:15:00Z',
  by: { id: 'a1', name: 'Ada Brook' },
  account: { id: 'u2', name: 'Noor Castellanos', email: 'noor@alderbay.example' },
};

describe('a change to an account in words', () => {
  it('tells making an account, and one made by an invitation', () => {
    expect(accountChangeWords({ ...base, action: 'create', before: null, after: { isAdmin: false } })).toBe(
      'Ada Brook made an account for Noor Castellanos (noor@alderbay.example)',
    );
    expect(accountChangeWords({ ...base, action: 'create', before: null, after: { isAdmin: true } })).toBe(
      'Ada Brook made an account for Noor Castellanos (noor@alderbay.example), as an administrator',
    );
    expect(
      accountChangeWords({
        ...base,
        by: { id: 'u2', name: 'Noor Castellanos' },
        action: 'accept-invitation',
        before: null,
        after: { role: 'reviewer' },
        projectName: 'Tidewater Pavilion',
      }),
    ).toBe(
      'Noor Castellanos (noor@alderbay.example) made an account by accepting an invitation to the project “Tidewater Pavilion” as reviewer',
    );
  });

  it('tells administrator and disabled changes, one or both', () => {
    const update = (before: AccountChange['before'], after: AccountChange['after']) =>
      accountChangeWords({ ...base, action: 'update', before, after });
    expect(update({ isAdmin: false, disabled: false }, { isAdmin: true, disabled: false })).toBe(
      'Ada Brook made Noor Castellanos (noor@alderbay.example) an administrator',
    );
    expect(update({ isAdmin: true, disabled: false }, { isAdmin: false, disabled: false })).toBe(
      'Ada Brook removed Noor Castellanos (noor@alderbay.example) as an administrator',
    );
    expect(update({ isAdmin: true, disabled: false }, { isAdmin: false, disabled: true })).toBe(
      'Ada Brook removed Noor Castellanos (noor@alderbay.example) as an administrator and disabled the account of Noor Castellanos (noor@alderbay.example)',
    );
    expect(update({ isAdmin: false, disabled: true }, { isAdmin: false, disabled: false })).toBe(
      'Ada Brook enabled the account of Noor Castellanos (noor@alderbay.example) again',
    );
  });

  it('says so when the people are gone, and never shows an id', () => {
    const words = accountChangeWords({
      ...base,
      by: null,
      account: null,
      action: 'update',
      before: { disabled: false },
      after: { disabled: true },
    });
    expect(words).toBe('Someone disabled an account since gone');
    expect(words).not.toMatch(/u2|a1|isAdmin|disabled:/);
  });
});
