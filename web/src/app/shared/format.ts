import type { UnitSystem } from '../core/api/api-types';

/**
 * Display rounding only (the data stays exact decimal strings): watts to 1 W, power densities to
 * 0.01, margins to 0.1 %, areas to 1 ft² or 0.1 m².
 */
const watts = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const density = new Intl.NumberFormat('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const percent = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const areaIp = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const areaSi = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1 });
const length = new Intl.NumberFormat('en-US', { maximumFractionDigits: 2 });

function numeric(value: string | null | undefined): number | null {
  if (value === null || value === undefined || value === '') return null;
  const parsed = Number(value);
  return Number.isFinite(parsed) ? parsed : null;
}

export function formatWatts(value: string | null | undefined): string {
  const parsed = numeric(value);
  return parsed === null ? '—' : `${watts.format(parsed)} W`;
}

export function formatDensity(value: string | null | undefined, units: UnitSystem): string {
  const parsed = numeric(value);
  return parsed === null ? '—' : `${density.format(parsed)} ${units === 'ip' ? 'W/ft²' : 'W/m²'}`;
}

export function formatPercent(value: string | null | undefined): string {
  const parsed = numeric(value);
  return parsed === null ? '—' : `${percent.format(parsed)} %`;
}

export function formatArea(value: string | null | undefined, units: UnitSystem): string {
  const parsed = numeric(value);
  if (parsed === null) return '—';
  return units === 'ip' ? `${areaIp.format(parsed)} ft²` : `${areaSi.format(parsed)} m²`;
}

export function formatLength(value: string | null | undefined, units: UnitSystem): string {
  const parsed = numeric(value);
  return parsed === null ? '—' : `${length.format(parsed)} ${units === 'ip' ? 'ft' : 'm'}`;
}

export function unitLabels(units: UnitSystem): { length: string; area: string; density: string } {
  return units === 'ip' ? { length: 'ft', area: 'ft²', density: 'W/ft²' } : { length: 'm', area: 'm²', density: 'W/m²' };
}

// ---------------------------------------------------------------- bare figures

/**
 * Bare figures for table cells whose header carries the unit, rounded as the words above:
 * watts to 1 W, power densities to 0.01, percentages to 0.1, areas to 1 ft² or 0.1 m²; the rated
 * input of one luminaire to 0.1 W, as schedules give it.
 */
const whole = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const hundredths = new Intl.NumberFormat('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const tenths = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const upToTenths = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1 });
const upToHundredths = new Intl.NumberFormat('en-US', { maximumFractionDigits: 2 });
const upToThousandths = new Intl.NumberFormat('en-US', { maximumFractionDigits: 3 });

function figure(format: Intl.NumberFormat) {
  return (value: string | null | undefined): string => {
    const number = numeric(value);
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
