import type { UnitSystem } from '../core/api/api-types';

/**
 * Bare figures for table cells whose header carries the unit, rounded as format.ts rounds them:
 * watts to 1 W, power densities to 0.01, percentages to 0.1, areas to 1 ft² or 0.1 m²; the rated
 * input of one luminaire to 0.1 W, as schedules give it.
 */
const whole = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const hundredths = new Intl.NumberFormat('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const tenths = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const upToTenths = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1 });
const upToHundredths = new Intl.NumberFormat('en-US', { maximumFractionDigits: 2 });
const upToThousandths = new Intl.NumberFormat('en-US', { maximumFractionDigits: 3 });

function parsed(value: string | null | undefined): number | null {
  if (value === null || value === undefined || value === '') return null;
  const number = Number(value);
  return Number.isFinite(number) ? number : null;
}

function figure(format: Intl.NumberFormat) {
  return (value: string | null | undefined): string => {
    const number = parsed(value);
    return number === null ? '—' : format.format(number);
  };
}

export const wattsFigure = figure(whole);
export const densityFigure = figure(hundredths);
export const percentFigure = figure(tenths);
export const ratedWattsFigure = figure(tenths);
export const quantityFigure = figure(upToHundredths);
/** An exterior allowance rate (W per ft², m, location…): tables print them to 0.001, and SI conversions run longer. */
export const rateFigure = figure(upToThousandths);

export function areaFigure(value: string | null | undefined, units: UnitSystem): string {
  return figure(units === 'ip' ? whole : upToTenths)(value);
}
