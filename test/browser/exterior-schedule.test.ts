import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import { closeBrowserSuite, openBrowserSuite, signInToDemo, type BrowserSuite } from '../support/browser-suite.js';

let suite: BrowserSuite;
let projectUrl = '';

beforeAll(async () => {
  suite = await openBrowserSuite();
  suite.browser.page.setDefaultTimeout(30_000);
  projectUrl = await signInToDemo(suite, 'engineer@alderbay.example', inject('demoPassword'));
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await suite.browser.screenshot(`failed-exterior-schedule-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(async () => {
  await closeBrowserSuite(suite);
});

describe('the project’s exterior schedule', { timeout: 120_000 }, () => {
  it('opens on the saved schedule, shows what a weaker setback would fail, and keeps what the engineer saves', async () => {
    const { page } = suite.browser;
    await page.goto(`${projectUrl}/exterior`);
    const schedule = page.getByTestId('exterior-schedule');
    // The demo's saved schedule (schema/seeds/02_demo_project.ts): set back 23:00–06:00 by 50 %.
    await schedule.getByTestId('schedule-saved').getByText('The project’s schedule, saved').waitFor();
    await expect.poll(() => schedule.getByLabel('Setback from').inputValue()).toBe('23:00');
    const checks = schedule.getByTestId('schedule-checks');
    await checks
      .getByRole('row')
      .filter({ hasText: 'Parking lots and drives' })
      .filter({ hasText: 'Night setback' })
      .getByText('Met', { exact: true })
      .waitFor();

    // IECC 2021 C405.2.7.3 asks for at least 30 % (reference/iecc-2021/control-strategies.json).
    await schedule.getByLabel('Reduction (%)').fill('20');
    await schedule.getByRole('button', { name: 'Show this schedule' }).click();
    const parking = checks.getByRole('row').filter({ hasText: 'Parking lots and drives' }).filter({ hasText: 'Night setback' });
    await parking.getByText('Not met', { exact: true }).waitFor();
    await parking.getByText('asks for at least 30 %').waitFor();
    await schedule.scrollIntoViewIfNeeded();
    await suite.browser.screenshot('exterior-schedule-checks');

    await schedule.getByLabel('Reduction (%)').fill('40');
    await schedule.getByRole('button', { name: 'Save as the project’s schedule' }).click();
    await schedule.getByText('Saved as the project’s schedule.').waitFor();
    await page.reload();
    await schedule.getByTestId('schedule-saved').getByText('The project’s schedule, saved').waitFor();
    await expect.poll(() => schedule.getByLabel('Reduction (%)').inputValue()).toBe('40');
    await parking.getByText('Met', { exact: true }).waitFor();
    await parking.getByText('by 40 %').waitFor();
  });
});
