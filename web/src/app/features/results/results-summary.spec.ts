import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { ResultsSummary, unmetControls } from './results-summary';
import { controlLine, evaluation } from './results-fixture';
import { verdictReasons } from './verdict-reasons';

describe('ResultsSummary', () => {
  let fixture: ComponentFixture<ResultsSummary>;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [ResultsSummary], providers: [provideZonelessChangeDetection(), provideRouter([])] });
    fixture = TestBed.createComponent(ResultsSummary);
    fixture.componentRef.setInput('result', evaluation());
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  const text = (selector: string) => element.querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';

  it('shows the totals rounded for display: watts to 1 W, margin to 0.1 %', () => {
    const figures = text('.figures');
    expect(figures).toContain('1,500 W');
    expect(figures).toContain('1,330 W');
    expect(figures).toContain('25 W');
    expect(figures).toContain('170 W · 11.3 %');
  });

  it('gives the verdict in an icon and words, with each reason listed', () => {
    const verdict = element.querySelector('.verdict')!;
    expect(verdict.querySelector('mat-icon')?.textContent).toBe('warning');
    expect(verdict.textContent).toContain('Does not comply: 1 reason');
    expect(text('.reasons')).toContain('Interior controls not met');
    expect(text('.reasons')).toContain('Storage: Light-reduction control (C405.2.3)');
    expect(text('.figures')).toContain('Within allowance, 170 W (11.3 %) to spare');
  });

  it('lists each unmet control requirement with a link to its space on the Controls page', () => {
    const items = Array.from(element.querySelectorAll('.unmet li'));
    expect(items).toHaveLength(1);
    expect(items[0]!.textContent).toContain('Not met');
    const link = items[0]!.querySelector('a')!;
    expect(link.textContent).toContain('Storage: Light-reduction control');
    expect(link.getAttribute('href')).toContain('controls?space=s2');
    expect(unmetControls(evaluation()).map((item) => item.key)).toEqual(['s2:light-reduction']);
  });

  it('lists a design failing only on exterior controls as that, each application linked to the Exterior page', async () => {
    // Invented result: the interior passes; one exterior application has its daylight shutoff not met.
    const result = evaluation();
    result.interior.spaces[1] = { ...result.interior.spaces[1]!, controls: [] };
    result.exterior = {
      lightingZone: '2',
      section: 'C405.5.2',
      baseSiteAllowanceW: '400',
      allowanceW: '900',
      installedW: '600',
      exemptW: '0',
      complies: true,
      tradable: { allowanceW: '500', installedW: '600', baseSiteUsedW: '100', marginW: '0', complies: true },
      baseSiteRemainingW: '300',
      baseSiteCoversNontradable: true,
      applications: [
        {
          key: 'parking',
          label: 'Parking lots and drives',
          tradable: true,
          unit: 'W/ft²',
          quantity: '10000',
          rate: '0.05',
          allowanceW: '500',
          installedW: '600',
          exemptW: '0',
          exemption: null,
          baseSiteUsedW: '100',
          marginW: '0',
          withinAllowance: true,
          controls: [
            controlLine({
              strategy: 'exterior-daylight-off',
              label: 'Exterior daylight shutoff',
              status: 'not-met',
              met: false,
              section: 'C405.2.7.1',
            }),
          ],
          section: 'C405.5.2',
        },
      ],
    };
    fixture.componentRef.setInput('result', result);
    await fixture.whenStable();
    expect(text('.verdict')).toContain('Does not comply: 1 reason');
    expect(text('.verdict')).not.toContain('0 control requirements');
    const reasons = Array.from(element.querySelectorAll('.reasons > li'));
    expect(reasons.map((reason) => reason.getAttribute('data-kind'))).toEqual(['exterior-controls']);
    expect(reasons[0]!.textContent).toContain('Parking lots and drives: Exterior daylight shutoff not met (C405.2.7.1)');
    expect(reasons[0]!.querySelector('ul a')?.getAttribute('href')).toContain('/exterior');
    expect(verdictReasons(result).map((reason) => reason.kind)).toEqual(['exterior-controls']);
  });

  it('lists every reason: interior power with the spaces over, interior controls, the exterior pool and an application over', () => {
    // Invented result: every kind of failure at once.
    const result = evaluation();
    result.interior = { ...result.interior, complies: false, marginW: '-40' };
    result.exterior = {
      lightingZone: '3',
      section: 'C405.5.2',
      baseSiteAllowanceW: '0',
      allowanceW: '600',
      installedW: '900',
      exemptW: '0',
      complies: false,
      tradable: { allowanceW: '500', installedW: '700', baseSiteUsedW: '0', marginW: '-200', complies: false },
      baseSiteRemainingW: '0',
      baseSiteCoversNontradable: false,
      applications: [
        {
          key: 'facades',
          label: 'Building facades',
          tradable: false,
          unit: 'W/ft²',
          quantity: '1000',
          rate: '0.1',
          allowanceW: '100',
          installedW: '200',
          exemptW: '0',
          exemption: null,
          baseSiteUsedW: '0',
          marginW: '-100',
          withinAllowance: false,
          controls: [],
          section: 'C405.5.2',
        },
      ],
    };
    const reasons = verdictReasons(result);
    expect(reasons.map((reason) => reason.kind)).toEqual(['interior-power', 'interior-controls', 'exterior-power']);
    expect(reasons[0]!.items.map((item) => [item.text, item.link])).toEqual([
      ['Storage: 30 W over its allowance', { page: 'spaces', query: { space: 's2' } }],
    ]);
    expect(reasons[2]!.items.map((item) => item.text)).toEqual([
      'Tradable applications together: 200 W over their pooled allowance',
      'Building facades: 100 W over its own allowance',
    ]);
  });

  it('holds the verdict back for a space without luminaires, linked to it, with both ways out', async () => {
    const result = evaluation();
    result.verdict = 'incomplete';
    result.complies = false;
    result.controlsComply = true;
    result.interior.spaces = [
      result.interior.spaces[0]!,
      {
        ...result.interior.spaces[1]!,
        controls: [],
        lighting: 'none-entered',
        installedW: '0',
        marginW: '500',
        marginPct: '100',
        withinAllowance: true,
      },
    ];
    result.openItems = { spacesWithoutLuminaires: 1, controlsToVerify: 0 };
    fixture.componentRef.setInput('result', result);
    fixture.componentRef.setInput('canEdit', true);
    await fixture.whenStable();
    expect(text('.verdict')).toContain('Design incomplete');
    expect(text('.verdict')).not.toContain('Complies');
    const item = element.querySelector('.open-items li')!;
    expect(item.querySelector('a')?.getAttribute('href')).toContain('spaces?space=s2');
    expect(item.textContent).toContain('Enter luminaires');
    const confirmed: string[] = [];
    fixture.componentInstance.confirmUnlit.subscribe((id) => confirmed.push(id));
    Array.from(item.querySelectorAll('button'))
      .find((button) => button.textContent?.includes('Confirm unlit'))!
      .click();
    expect(confirmed).toEqual(['s2']);
  });

  it('lists each control still to verify, linked to the space on the Controls page', async () => {
    const result = evaluation();
    result.verdict = 'incomplete';
    result.complies = false;
    result.controlsComply = true;
    const open = {
      ...result.interior.spaces[0]!.controls[0]!,
      status: 'to-verify' as const,
      met: null,
      label: 'Occupant sensor control',
      reason: 'To verify: whether the room is enclosed is not recorded.',
    };
    result.interior.spaces = [{ ...result.interior.spaces[0]!, controls: [open] }];
    result.openItems = { spacesWithoutLuminaires: 0, controlsToVerify: 1 };
    fixture.componentRef.setInput('result', result);
    await fixture.whenStable();
    expect(text('.verdict')).toContain('Design incomplete: no verdict yet (1 control to verify)');
    const item = element.querySelector('[data-testid="open-controls"] li')!;
    expect(item.querySelector('a')?.getAttribute('href')).toContain('controls?space=s1');
    expect(item.textContent).toContain('Occupant sensor control');
    expect(item.textContent).toContain('whether the room is enclosed is not recorded');
  });

  it('shows each level with its status, the excess in watts where over', () => {
    const rows = Array.from(element.querySelectorAll('.levels tbody tr')).map((row) => row.textContent?.replace(/\s+/g, ' '));
    expect(rows[0]!).toContain('Within allowance, 200 W to spare');
    expect(rows[1]!).toContain('Over allowance, 30 W over');
  });

  it('lists the unverified values with their badge and short citation, the note on demand in the project units', async () => {
    expect(text('.unverified')).toContain('Invented value');
    expect(text('.unverified')).toContain('Source: IECC 2021 Section C405.9.9 — not yet checked against the printed code');
    const badge = element.querySelector('.unverified al-verify-badge .badge')!;
    expect(badge.getAttribute('aria-label')).toBe(
      'Verify: IECC 2021 Section C405.9.9 — not yet checked against the printed code. An invented note about 5,000 ft² zones.',
    );
    fixture.componentRef.setInput('result', { ...evaluation(), units: 'si' });
    await fixture.whenStable();
    // 5,000 ft² × 0.09290304 m²/ft² (exact) = 464.5 m².
    expect(element.querySelector('.unverified al-verify-badge .badge')!.getAttribute('aria-label')).toContain(
      'An invented note about 464.5 m² zones.',
    );
  });

  it('withholds the verdict while results are being recomputed', async () => {
    fixture.componentRef.setInput('updating', true);
    await fixture.whenStable();
    const verdict = text('.verdict');
    expect(verdict).toContain('Verdict withheld: results are being recomputed');
    expect(verdict).not.toContain('Does not comply');
    expect(element.textContent).not.toContain('Within allowance');
    expect(element.textContent).not.toContain('Over allowance');
  });
});
