import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { ControlLine, ProvidedControl } from '../../core/api/api-types';
import { troffer, type SpecSpace } from '../../../testing/demo-building';
import { evaluated, lineOf, spaceOf } from '../../../testing/evaluate';
import { controlForm, providedControl, replaceControl } from './control-form';
import { ControlLineCard } from './control-line-card';
import { statusView } from './control-status';

// Invented demo spaces under the calculation tests' IECC 2021 edition (test/calc/fixtures.ts), each giving a control
// line the state a case needs. A storage room is listed for occupant sensors (IECC 2021 C405.2.1, zmVault transcription);
// a library reading area is not, and at 200 ft² it needs them only if it is enclosed (C405.2.1 item 12, at most 300 ft²),
// which is not recorded. A reading room without occupant sensors needs a time switch (C405.2.2).
const dimmer: ProvidedControl = { strategy: 'light-reduction', provided: true, device: 'Invented dimmer', reductionPercent: '50' };
const store = (id: string, controls: SpecSpace['controls']): SpecSpace => ({
  id,
  name: `Store ${id}`,
  spaceType: 'storage',
  area: '500',
  luminaires: [{ tag: 'A', count: '6' }],
  controls,
});
const result = evaluated({
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  luminaireTypes: [troffer],
  spaces: [
    store('met', [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '15', autoOn: 'manual' }]),
    store('not-met', []),
    store('exception-claimed', [
      { strategy: 'occupant-sensor', provided: false, exceptionReason: 'other', exceptionNote: 'Invented note' },
    ]),
    { id: 'to-verify', name: 'Study room', spaceType: 'library-reading', area: '200', luminaires: [{ tag: 'A', count: '4' }] },
    {
      id: 'reading',
      name: 'Reading room',
      spaceType: 'library-reading',
      area: '1000',
      luminaires: [{ tag: 'A', count: '20' }],
      controls: [dimmer],
    },
  ],
});
/** The occupant-sensor line of the store or study room named by its state. */
const sensorLine = (status: 'met' | 'not-met' | 'exception-claimed' | 'to-verify') => lineOf(spaceOf(result, status), 'occupant-sensor');
const timeSwitchLine = lineOf(spaceOf(result, 'reading'), 'time-switch');
const reductionLine = lineOf(spaceOf(result, 'reading'), 'light-reduction');

describe('ControlLineCard', () => {
  let fixture: ComponentFixture<ControlLineCard>;
  let element: HTMLElement;
  let saved: (ProvidedControl | null)[];

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [ControlLineCard], providers: [provideZonelessChangeDetection()] });
    fixture = TestBed.createComponent(ControlLineCard);
    element = fixture.nativeElement as HTMLElement;
    saved = [];
    fixture.componentInstance.save.subscribe((value) => saved.push(value));
  });

  async function show(status: 'met' | 'not-met' | 'exception-claimed' | 'to-verify', canEdit = false): Promise<void> {
    expect(sensorLine(status).status).toBe(status);
    fixture.componentRef.setInput('line', sensorLine(status));
    fixture.componentRef.setInput('canEdit', canEdit);
    await fixture.whenStable();
  }

  it.each([
    ['met', 'check_circle', 'Met'],
    ['not-met', 'warning', 'Not met'],
    ['exception-claimed', 'assignment_late', 'Exception claimed'],
    ['to-verify', 'help', 'To verify'],
  ] as const)('shows %s as an icon and words, never colour alone', async (status, icon, words) => {
    await show(status);
    expect(element.querySelector('.status mat-icon')?.textContent?.trim()).toBe(icon);
    expect(element.querySelector('.status .words')?.textContent?.trim()).toBe(words);
  });

  it('highlights an outstanding requirement and carries the verify badge when the source is unverified', async () => {
    await show('to-verify');
    expect(sensorLine('to-verify').verified).toBe(false);
    expect(element.querySelector('.line')?.classList).toContain('outstanding');
    expect(element.querySelector('al-verify-badge')).not.toBeNull();
    expect(statusView('not-met').outstanding).toBe(true);
    expect(statusView('exception-claimed').outstanding).toBe(false);
  });

  it('says how far a recorded light-reduction control reduces the lighting, and offers the field when editing', async () => {
    expect(reductionLine.status).toBe('met');
    fixture.componentRef.setInput('line', reductionLine);
    fixture.componentRef.setInput('provided', dimmer);
    fixture.componentRef.setInput('canEdit', true);
    await fixture.whenStable();
    expect(element.querySelector('.recorded')?.textContent?.trim()).toBe('buildProvided: Invented dimmer; reduces by 50 %');
    element.querySelector<HTMLButtonElement>('button')!.click();
    await fixture.whenStable();
    const field = element.querySelector<HTMLInputElement>('input[formcontrolname="reductionPercent"]')!;
    expect(field.value).toBe('50');
  });

  it('offers no edit button to someone who only reads', async () => {
    await show('not-met', false);
    expect(element.querySelector('button')).toBeNull();
  });

  it('does not save an "other" exception without a note, and says why beside the field', async () => {
    await show('not-met', true);
    element.querySelector<HTMLButtonElement>('button')!.click();
    await fixture.whenStable();
    const form = (fixture.componentInstance as unknown as { form: ReturnType<typeof controlForm> }).form;
    form.controls.mode.setValue('exception');
    form.controls.exceptionReason.setValue('other');
    await fixture.whenStable();
    element.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
    expect(saved).toEqual([]);
    expect(Array.from(element.querySelectorAll('mat-error')).map((error) => error.textContent?.trim())).toContain(
      'Say which exception is claimed.',
    );

    form.controls.exceptionNote.setValue('Invented note for the test');
    element.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
    expect(saved).toEqual([
      { strategy: 'occupant-sensor', provided: false, exceptionReason: 'other', exceptionNote: 'Invented note for the test' },
    ]);
  });
});

describe('ControlLineCard exceptions', () => {
  let fixture: ComponentFixture<ControlLineCard>;
  let element: HTMLElement;
  let saved: (ProvidedControl | null)[];

  async function edit(line: ControlLine): Promise<ReturnType<typeof controlForm>> {
    TestBed.configureTestingModule({ imports: [ControlLineCard], providers: [provideZonelessChangeDetection()] });
    fixture = TestBed.createComponent(ControlLineCard);
    element = fixture.nativeElement as HTMLElement;
    saved = [];
    fixture.componentInstance.save.subscribe((value) => saved.push(value));
    fixture.componentRef.setInput('line', line);
    fixture.componentRef.setInput('canEdit', true);
    await fixture.whenStable();
    element.querySelector<HTMLButtonElement>('button')!.click();
    await fixture.whenStable();
    const form = (fixture.componentInstance as unknown as { form: ReturnType<typeof controlForm> }).form;
    form.controls.mode.setValue('exception');
    await fixture.whenStable();
    return form;
  }

  async function offered(): Promise<string[]> {
    element.querySelector<HTMLElement>('mat-select')!.click();
    await fixture.whenStable();
    const options = Array.from(document.querySelectorAll('mat-option')).map((option) => option.textContent?.trim() ?? '');
    document.querySelector<HTMLElement>('.cdk-overlay-backdrop')?.click();
    await fixture.whenStable();
    return options;
  }

  const errors = () => Array.from(element.querySelectorAll('mat-error')).map((error) => error.textContent?.trim());
  const submit = async () => {
    element.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
  };

  it('offers continuous operation for the time switch only, and every general exception in words', async () => {
    expect([timeSwitchLine.status, sensorLine('not-met').status]).toEqual(['not-met', 'not-met']);
    await edit(timeSwitchLine);
    expect(await offered()).toEqual([
      'Security or emergency area that must stay lit continuously',
      'Interior exit stairway, exit ramp or exit passageway',
      'Emergency egress lighting that is normally off',
      'Lighting intended to operate continuously',
      'Another exception (say which)',
    ]);
    TestBed.resetTestingModule();
    await edit(sensorLine('not-met'));
    expect(await offered()).not.toContain('Lighting intended to operate continuously');
  });

  it('offers "checked against the adopted code" for a requirement to verify, and then needs the note saying where', async () => {
    expect(sensorLine('to-verify').requirement).toBe('to-verify');
    const form = await edit(sensorLine('to-verify'));
    expect(await offered()).toContain('Checked against the adopted code: not required here (say where)');
    form.controls.exceptionReason.setValue('verified-not-required');
    await submit();
    expect(saved).toEqual([]);
    expect(errors()).toContain('Say where in the adopted code it was checked.');
    form.controls.exceptionNote.setValue('Invented: city amendment 12-3, checked on the adopted text');
    await submit();
    expect(saved).toEqual([
      {
        strategy: 'occupant-sensor',
        provided: false,
        exceptionReason: 'verified-not-required',
        exceptionNote: 'Invented: city amendment 12-3, checked on the adopted text',
      },
    ]);
  });

  it('does not offer it where the requirement is stated', async () => {
    expect(sensorLine('not-met').requirement).toBe('required');
    await edit(sensorLine('not-met'));
    expect(await offered()).not.toContain('Checked against the adopted code: not required here (say where)');
  });

  it('stays open on a refusal and shows the service’s message beside the field it names', async () => {
    const form = await edit(timeSwitchLine);
    form.controls.exceptionReason.setValue('continuous-operation');
    await submit();
    expect(saved).toEqual([{ strategy: 'time-switch', provided: false, exceptionReason: 'continuous-operation' }]);
    fixture.componentInstance.refused([{ path: 'exceptionNote', message: 'Invented refusal for the test.' }], 'Some values do not fit.');
    await fixture.whenStable();
    expect(element.querySelector('form.editor')).not.toBeNull();
    const note = Array.from(element.querySelectorAll('mat-form-field')).find(
      (field) => field.querySelector('mat-label')?.textContent?.trim() === 'Note',
    )!;
    expect(note.querySelector('mat-error')?.textContent?.trim()).toBe('Invented refusal for the test.');
    fixture.componentInstance.refused([], 'The space could not be saved.');
    await fixture.whenStable();
    expect(element.querySelector('.refusal')?.textContent).toContain('The space could not be saved.');
    fixture.componentInstance.saved();
    await fixture.whenStable();
    expect(element.querySelector('form.editor')).toBeNull();
  });
});

describe('control form rules', () => {
  it('needs a reason for an exception, and rejects a negative time-out', () => {
    const form = controlForm(undefined, () => 'occupant-sensor');
    form.controls.mode.setValue('exception');
    expect(form.controls.exceptionReason.hasError('required')).toBe(true);
    form.controls.mode.setValue('provided');
    expect(form.valid).toBe(true);
    form.controls.timeoutMinutes.setValue('-5');
    expect(form.controls.timeoutMinutes.hasError('negative')).toBe(true);
    form.controls.timeoutMinutes.setValue('15');
    expect(form.valid).toBe(true);
  });

  it('reads how far a partial-OFF or light-reduction control reduces the lighting, from 0 to 100 %', () => {
    const form = controlForm({ strategy: 'light-reduction', provided: true, reductionPercent: '50' }, () => 'light-reduction');
    expect(form.controls.reductionPercent.value).toBe('50');
    // The service's range for a share of the lighting power (compliance/bounds.ts ranges.percent).
    form.controls.reductionPercent.setValue('-1');
    expect(form.controls.reductionPercent.errors).toEqual({ quantity: 'Must not be negative. Enter a number from 0 to 100.' });
    form.controls.reductionPercent.setValue('100.5');
    expect(form.controls.reductionPercent.errors).toEqual({ quantity: 'Out of range. Enter a number from 0 to 100.' });
    form.controls.reductionPercent.setValue(' 80 ');
    expect(form.valid).toBe(true);
    expect(providedControl('light-reduction', form.getRawValue())).toEqual({
      strategy: 'light-reduction',
      provided: true,
      reductionPercent: '80',
    });
    // A strategy whose check does not read it gets none.
    expect(providedControl('time-switch', form.getRawValue())).toEqual({ strategy: 'time-switch', provided: true });
  });

  it('refuses continuous operation for any control but the time switch, as the service does', () => {
    let strategy = 'time-switch';
    const form = controlForm({ strategy, provided: false, exceptionReason: 'continuous-operation' }, () => strategy);
    expect(form.valid).toBe(true);
    strategy = 'occupant-sensor';
    form.updateValueAndValidity();
    expect(form.controls.exceptionReason.errors).toEqual({
      timeSwitchOnly: 'Continuous operation frees lighting from the time switch only.',
    });
  });

  it('sends only what was recorded, and replaces just that strategy', () => {
    const form = controlForm(undefined, () => 'occupant-sensor');
    form.patchValue({ mode: 'provided', device: ' Invented sensor ', timeoutMinutes: '15', autoOn: 'partial' });
    const next = providedControl('occupant-sensor', form.getRawValue());
    expect(next).toEqual({
      strategy: 'occupant-sensor',
      provided: true,
      device: 'Invented sensor',
      timeoutMinutes: '15',
      autoOn: 'partial',
    });
    const others: ProvidedControl[] = [
      { strategy: 'time-switch', provided: true },
      { strategy: 'occupant-sensor', provided: false },
    ];
    expect(replaceControl(others, 'occupant-sensor', next)).toEqual([{ strategy: 'time-switch', provided: true }, next]);
    expect(replaceControl(others, 'occupant-sensor', null)).toEqual([{ strategy: 'time-switch', provided: true }]);
  });
});
