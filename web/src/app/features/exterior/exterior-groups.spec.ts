import type { ExteriorApplicationResult, ExteriorResult } from '../../core/api/api-types';
import { exteriorGroups, quantityUnit } from './exterior-groups';

function application(overrides: Partial<ExteriorApplicationResult>): ExteriorApplicationResult {
  return {
    key: 'parking-lots-and-drives',
    label: 'Parking lots and drives',
    tradable: true,
    unit: 'W/ft²',
    quantity: '12000',
    // IECC 2021 Table C405.5.2(2), via PNNL building-energy-standards-data: parking lots and drives, zone 2, 0.04 W/ft²
    rate: '0.04',
    allowanceW: '480',
    installedW: '440',
    exemptW: '0',
    exemption: null,
    baseSiteUsedW: '0',
    marginW: '40',
    withinAllowance: true,
    controls: [],
    section: 'C405.5.2',
    ...overrides,
  };
}

// The installed watts and quantities are invented; the rates and the base site allowance are sourced beside them.
const exterior: ExteriorResult = {
  lightingZone: '2',
  section: 'C405.5.2',
  // IECC 2021 Table C405.5.2(2), via PNNL building-energy-standards-data: base site allowance, zone 2, 400 W
  baseSiteAllowanceW: '400',
  allowanceW: '1000',
  installedW: '1100',
  exemptW: '0',
  complies: false,
  tradable: { allowanceW: '480', installedW: '560', baseSiteUsedW: '80', marginW: '0', complies: true },
  baseSiteRemainingW: '320',
  baseSiteCoversNontradable: false,
  applications: [
    application({ installedW: '560', marginW: '-80', withinAllowance: true }),
    application({
      key: 'building-facades',
      label: 'Building facades',
      tradable: false,
      quantity: '1600',
      // IECC 2021 Table C405.5.2(2), via PNNL building-energy-standards-data: building facades, zone 2, 0.075 W/ft²
      rate: '0.075',
      allowanceW: '120',
      installedW: '540',
      marginW: '-420',
      withinAllowance: false,
    }),
  ],
};

describe('exterior grouping', () => {
  it('pools the tradable applications, the base site allowance covering their excess', () => {
    const groups = exteriorGroups(exterior, []);
    expect(groups.tradable.lines.map((line) => line.result.key)).toEqual(['parking-lots-and-drives']);
    expect(groups.tradable.lines[0]!.status).toBeNull();
    // 480 W allowed + 80 W of the base site allowance − 560 W installed: 0 W, and the words agree.
    expect(groups.tradable.marginW).toBe('0');
    expect(groups.tradable.status).toMatchObject({ label: 'Within allowance', words: '0 W to spare' });
  });

  it('holds each nontradable application to its own allowance', () => {
    const groups = exteriorGroups(exterior, []);
    expect(groups.nontradable).toHaveLength(1);
    expect(groups.nontradable[0]!.marginW).toBe('-420');
    expect(groups.nontradable[0]!.status).toMatchObject({ label: 'Over allowance', words: '420 W over' });
  });

  it('totals allowance, installed and margin for the site', () => {
    const groups = exteriorGroups(exterior, []);
    expect(groups.total).toMatchObject({ allowanceW: '1000', installedW: '1100', marginW: '-100' });
    expect(groups.total.status).toMatchObject({ label: 'Over allowance', words: '100 W over' });
    expect(groups.baseSite).toEqual({ allowanceW: '400', remainingW: '320', coversNontradable: false });
  });

  it('says an application is over when the site total has watts to spare but one nontradable line has not', () => {
    const groups = exteriorGroups({ ...exterior, allowanceW: '1200', installedW: '1100' }, []);
    expect(groups.total.status).toMatchObject({ label: 'Over allowance', words: 'an application is over its own allowance' });
  });

  it('names what a quantity counts from the rate unit', () => {
    expect(quantityUnit('W/ft2', 'ip')).toBe('ft²');
    expect(quantityUnit('W/ft', 'ip')).toBe('linear ft');
    expect(quantityUnit('W/m²', 'si')).toBe('m²');
    expect(quantityUnit('W/location', 'ip')).toBe('locations');
  });
});
