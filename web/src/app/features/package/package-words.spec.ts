import { describe, expect, it } from 'vitest';
import { changeWords, controlStatusWords, fingerprintGroups, makeWords, revisionName, verdictChange } from './package-words';

describe('package words', () => {
  it('names the make button by what it will make', () => {
    expect(makeWords('draft')).toMatchObject({ label: 'Make a draft package', final: false });
    expect(makeWords('in-review').final).toBe(false);
    expect(makeWords('accepted')).toMatchObject({ label: 'Make the final package and issue the design', final: true });
    expect(makeWords('issued').final).toBe(true);
  });

  it('tells changes in words, never keys', () => {
    expect(changeWords({ field: 'installedW', label: 'Installed (W)', from: '4800', to: '5600.125' })).toBe(
      'Installed (W): 4,800 → 5,600.13',
    );
    expect(changeWords({ field: 'withinAllowance', label: 'Within its allowance', from: 'yes', to: 'no' })).toBe(
      'Within its allowance: yes → no',
    );
    expect(controlStatusWords('to-verify')).toBe('to verify');
    expect(controlStatusWords(null)).toBe('not listed');
    expect(verdictChange({ from: 'complies', to: 'does-not-comply' })).toBe(
      'The design complies in the earlier revision and does not comply in the later one.',
    );
    expect(revisionName({ revision: 2, draft: true })).toBe('Revision 2 (draft)');
    expect(fingerprintGroups('0123456789abcdef01')).toBe('01234567 89abcdef 01');
  });
});
