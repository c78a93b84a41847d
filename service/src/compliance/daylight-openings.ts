import type { Skylight, WindowOpening } from './document.js';
import type { DaylightOpeningRules, OpeningRule } from './edition-data.js';
import { type Dec, dec } from './numbers.js';
import { type UnitSystem, areaToSquareFeet, areaWords } from './units.js';

/**
 * What an edition's glazing rules make of one opening: whether its daylight area calls for
 * control at all ('none' excluded), not in its primary sidelit part ('primary'), or not at all
 * ('all'); why, in words; and the values not recorded that the rules turn on.
 *
 * A blank value is read one way or the other as `blanksExcept` says: the evaluation reads the
 * design both ways and where the two readings disagree the control is "to verify", so a blank
 * never clears a requirement and never holds one up where it does not decide it.
 */
export interface OpeningVerdict {
  excludes: 'none' | 'primary' | 'all';
  words: string[];
  /** What is not recorded, in words, with what it would decide. */
  blanks: string[];
  /** The rules that were applied to this opening (for the result's unverified values). */
  applied: { what: string; rule: OpeningRule }[];
}

function cite(rule: OpeningRule): string {
  return `§${rule.section}`;
}

const worst = (a: OpeningVerdict['excludes'], b: OpeningVerdict['excludes']): OpeningVerdict['excludes'] =>
  a === 'all' || b === 'all' ? 'all' : a === 'primary' || b === 'primary' ? 'primary' : 'none';

/** A window's glazing area: width × (head − sill), from the floor where no sill is given. */
export function windowAreaFt2(window: WindowOpening, units: UnitSystem): Dec {
  return areaToSquareFeet(dec(window.width).times(dec(window.headHeight).minus(dec(window.sillHeight ?? '0'))), units);
}

export function windowVerdict(
  window: WindowOpening,
  index: number,
  rules: DaylightOpeningRules,
  units: UnitSystem,
  blanksExcept: boolean,
): OpeningVerdict {
  const name = `window ${index + 1} (${window.wall} wall)`;
  const verdict: OpeningVerdict = { excludes: 'none', words: [], blanks: [], applied: [] };
  const area = rules.windowMinimumAreaFt2;
  if (area) {
    verdict.applied.push({
      what: `Daylight zones: a window of less than ${areaWords(dec(area.ft2), units)} of glazing makes no sidelit zone`,
      rule: area,
    });
    const glazing = windowAreaFt2(window, units);
    if (glazing.lessThan(dec(area.ft2))) {
      verdict.excludes = 'all';
      verdict.words.push(
        `${name} has ${areaWords(glazing, units)} of glazing, less than ${areaWords(dec(area.ft2), units)}, so it makes no sidelit zone (${cite(area)})`,
      );
    }
  }
  const vt = rules.windowMinimumVt;
  if (vt) {
    verdict.applied.push({ what: `Daylight zones: a window of visible transmittance below ${vt.vt} makes no sidelit zone`, rule: vt });
    if (window.visibleTransmittance === undefined) {
      verdict.blanks.push(`the visible transmittance of ${name} is not recorded (below ${vt.vt} it makes no sidelit zone, ${cite(vt)})`);
      if (blanksExcept) verdict.excludes = 'all';
    } else if (dec(window.visibleTransmittance).lessThan(dec(vt.vt))) {
      verdict.excludes = 'all';
      verdict.words.push(
        `${name} has a visible transmittance of ${window.visibleTransmittance}, below ${vt.vt}, so it makes no sidelit zone (${cite(vt)})`,
      );
    }
  }
  const blocked = rules.blockedWindow;
  if (blocked) {
    const effect = blocked.excludes === 'primary' ? 'its primary sidelit area needs no control' : 'it makes no sidelit zone';
    verdict.applied.push({
      what:
        blocked.excludes === 'primary'
          ? 'Daylight exception: primary sidelit areas of windows blocked by an adjacent structure'
          : 'Daylight zones: a window blocked by an adjacent structure makes no sidelit zone',
      rule: blocked,
    });
    if (window.daylightBlocked === undefined) {
      verdict.blanks.push(
        `whether an adjacent structure blocks the daylight of ${name} is not recorded (if it does, ${effect}, ${cite(blocked)})`,
      );
      if (blanksExcept) verdict.excludes = worst(verdict.excludes, blocked.excludes);
    } else if (window.daylightBlocked) {
      verdict.excludes = worst(verdict.excludes, blocked.excludes);
      verdict.words.push(
        `${name} is blocked by an adjacent structure at least twice as high above it as its distance away, so ${effect} (${cite(blocked)})`,
      );
    }
  }
  return verdict;
}

export function skylightVerdict(skylight: Skylight, index: number, rules: DaylightOpeningRules, blanksExcept: boolean): OpeningVerdict {
  const name = `skylight ${index + 1}`;
  const verdict: OpeningVerdict = { excludes: 'none', words: [], blanks: [], applied: [] };
  const vt = rules.skylightMinimumVt;
  if (vt) {
    verdict.applied.push({ what: `Daylight exception: skylights of visible transmittance below ${vt.vt}`, rule: vt });
    if (skylight.visibleTransmittance === undefined) {
      verdict.blanks.push(
        `the visible transmittance of ${name} is not recorded (below ${vt.vt} its toplit area needs no control, ${cite(vt)})`,
      );
      if (blanksExcept) verdict.excludes = 'all';
    } else if (dec(skylight.visibleTransmittance).lessThan(dec(vt.vt))) {
      verdict.excludes = 'all';
      verdict.words.push(
        `${name} has a visible transmittance of ${skylight.visibleTransmittance}, below ${vt.vt}, so its toplit area needs no control (${cite(vt)})`,
      );
    }
  }
  const blocked = rules.blockedSkylight;
  if (blocked) {
    const hours = blocked.hours.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
    verdict.applied.push({
      what: `Daylight exception: skylights whose direct sunlight is blocked for more than ${hours} daytime hours a year`,
      rule: blocked,
    });
    if (skylight.daylightBlocked === undefined) {
      verdict.blanks.push(
        `whether nearby structures or natural objects block the direct sunlight of ${name} for more than ${hours} daytime hours a year is not recorded (if they do, its toplit area needs no control, ${cite(blocked)})`,
      );
      if (blanksExcept) verdict.excludes = 'all';
    } else if (skylight.daylightBlocked) {
      verdict.excludes = 'all';
      verdict.words.push(
        `nearby structures or natural objects block the direct sunlight of ${name} for more than ${hours} daytime hours a year, so its toplit area needs no control (${cite(blocked)})`,
      );
    }
  }
  return verdict;
}
