/// <reference lib="dom" />
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';
import { expect } from 'vitest';

/** Evaluated through the browser's debugging protocol, so the app's own Content-Security-Policy stays in force. */
const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

interface Violation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[] }[];
}

/**
 * axe-core's WCAG 2.1 A/AA rules on the page as it stands; answers its serious and critical
 * findings in words. Colours measured mid-transition (a label fading into a new state or colour
 * scheme) are neither state's: every finite animation and transition ends first, while a spinner's
 * endless one is left to run.
 */
export async function seriousViolations(page: Page): Promise<string[]> {
  await page.evaluate(() =>
    Promise.all(
      document
        .getAnimations()
        .filter((animation) => animation.effect?.getComputedTiming().iterations !== Infinity)
        .map((animation) => animation.finished.catch(() => undefined)),
    ),
  );
  await page.evaluate(axeSource);
  const violations = await page.evaluate(async () => {
    const axe = (
      window as unknown as { axe: { run(context: Document, options: object): Promise<{ violations: Violation[]; passes: unknown[] }> } }
    ).axe;
    const result = await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } });
    return { violations: result.violations, passed: result.passes.length };
  });
  // The rules ran on real content (a blank page would pass every rule by having nothing to check).
  expect(violations.passed).toBeGreaterThan(5);
  return violations.violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map(
      (violation) =>
        `${violation.id} (${violation.impact}): ${violation.help} — ${violation.nodes
          .slice(0, 3)
          .map((node) => node.target.join(' '))
          .join('; ')}`,
    );
}
