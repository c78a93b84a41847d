import type { ExteriorApplicationRecord, ExteriorApplicationResult, ExteriorResult } from '../../core/api/api-types';
import { allowanceStatus, type AllowanceStatus } from '../../shared/allowance-status';

export interface ExteriorLine {
  record: ExteriorApplicationRecord | null;
  result: ExteriorApplicationResult;
  marginW: string;
  /** Null for a tradable application: it has no status of its own, only the pool's. */
  status: AllowanceStatus | null;
}

export interface ExteriorGroups {
  /** Tradable applications share one pool, with the base site allowance behind it. */
  tradable: {
    lines: ExteriorLine[];
    allowanceW: string;
    installedW: string;
    marginW: string;
    baseSiteUsedW: string;
    status: AllowanceStatus;
  };
  /** Each nontradable application stands on its own allowance (and the base site allowance where the edition lets it). */
  nontradable: ExteriorLine[];
  baseSite: { allowanceW: string; remainingW: string; coversNontradable: boolean };
  /** installedW leaves out the exempt lighting, which exemptW reports. */
  total: { allowanceW: string; installedW: string; exemptW: string; marginW: string; status: AllowanceStatus };
}

/** Display arithmetic only, on the engine's exact strings; nothing computed here is sent back. */
const minus = (a: string, b: string) => String(Number(a) - Number(b));

/**
 * The site as a whole: its margin can be positive while one nontradable application is over its
 * own allowance (which nothing else may cover), so the words say that rather than "0 W over".
 */
function siteStatus(complies: boolean, marginW: string): AllowanceStatus {
  const status = allowanceStatus(complies, marginW);
  return !complies && Number(marginW) >= 0 ? { ...status, words: 'an application is over its own allowance' } : status;
}

export function exteriorGroups(exterior: ExteriorResult, records: readonly ExteriorApplicationRecord[]): ExteriorGroups {
  const byKey = new Map(records.map((record) => [record.key, record]));
  // The engine's margins count the base site allowance an application or the pool uses, so the
  // number beside "within allowance" is never negative.
  const line = (result: ExteriorApplicationResult): ExteriorLine => ({
    record: byKey.get(result.key) ?? null,
    result,
    marginW: result.tradable ? minus(result.allowanceW, result.installedW) : result.marginW,
    status: result.tradable ? null : allowanceStatus(result.withinAllowance, result.marginW),
  });
  const tradableLines = exterior.applications.filter((application) => application.tradable).map(line);
  const totalMargin = minus(exterior.allowanceW, exterior.installedW);
  return {
    tradable: {
      lines: tradableLines,
      allowanceW: exterior.tradable.allowanceW,
      installedW: exterior.tradable.installedW,
      marginW: exterior.tradable.marginW,
      baseSiteUsedW: exterior.tradable.baseSiteUsedW,
      status: allowanceStatus(exterior.tradable.complies, exterior.tradable.marginW),
    },
    nontradable: exterior.applications.filter((application) => !application.tradable).map(line),
    baseSite: {
      allowanceW: exterior.baseSiteAllowanceW,
      remainingW: exterior.baseSiteRemainingW,
      coversNontradable: exterior.baseSiteCoversNontradable,
    },
    total: {
      allowanceW: exterior.allowanceW,
      installedW: exterior.installedW,
      exemptW: exterior.exemptW,
      marginW: totalMargin,
      status: siteStatus(exterior.complies, totalMargin),
    },
  };
}

/** What a quantity counts, from the catalogue's rate unit. */
export function quantityUnit(rateUnit: string, units: 'ip' | 'si'): string {
  const ip = units === 'ip';
  switch (rateUnit) {
    case 'W/ft2':
    case 'W/ft²':
    case 'W/m²':
      return ip ? 'ft²' : 'm²';
    case 'W/ft':
    case 'W/m':
      return ip ? 'linear ft' : 'm';
    case 'W/location':
      return 'locations';
    case 'W/door':
      return 'doors';
    case 'W/device':
      return 'devices';
    case 'W/window':
      return 'windows';
    default:
      return 'count';
  }
}
