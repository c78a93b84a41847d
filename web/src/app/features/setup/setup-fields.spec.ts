import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { AmendmentView, EditionSummary } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { SetupFields } from './setup-fields';
import { setupForm, setupValue, showServerErrors, type SetupForm } from './setup-form';

const editions = [
  { id: 'iecc-2021', title: 'IECC 2021', publisher: 'ICC', year: 2021, dataVersion: 'test', methods: ['building-area', 'space-by-space'] },
  {
    id: 'ashrae-90.1-2019',
    title: 'ASHRAE/IES 90.1-2019',
    publisher: 'ASHRAE',
    year: 2019,
    dataVersion: 'test',
    methods: ['building-area', 'space-by-space'],
  },
] as EditionSummary[];
// The amendment reference/iecc-2021/amendments.json holds (Washington's WAC 51-11C-405024), and a second, invented one.
const amendments = [
  {
    key: 'washington-2021',
    title: "Washington State Energy Code 2021 (Washington's amendments to IECC 2021)",
    jurisdiction: 'Washington State',
    verified: true,
  },
  { key: 'alder-bay-2021', title: 'Alder Bay lighting amendments (invented)', jurisdiction: 'Town of Alder Bay', verified: true },
] as AmendmentView[];

describe('SetupFields: jurisdiction amendments', () => {
  let fixture: ComponentFixture<SetupFields>;
  let element: HTMLElement;
  let http: HttpTestingController;
  let form: SetupForm;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [SetupFields],
      providers: [provideZonelessChangeDetection(), provideHttpClient(withInterceptors([apiInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    form = setupForm();
    fixture = TestBed.createComponent(SetupFields);
    fixture.componentRef.setInput('form', form);
    fixture.componentRef.setInput('section', 'code');
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    http.expectOne('/api/code-editions').flush(editions);
    await fixture.whenStable();
  });

  async function chooseEdition(id: string, listed: AmendmentView[]): Promise<void> {
    form.controls.code.controls.edition.setValue(id as 'iecc-2021');
    await fixture.whenStable();
    http.expectOne(`/api/code-editions/${id}/amendments`).flush(listed);
    await fixture.whenStable();
  }

  const trigger = () => element.querySelector('mat-select[formcontrolname="amendments"] .mat-mdc-select-value')?.textContent?.trim();
  const placeholder = () =>
    element.querySelector('mat-select[formcontrolname="amendments"] .mat-mdc-select-placeholder')?.textContent?.trim();

  it('offers every amendment of the edition with its title and jurisdiction in words, "Model code only" when none is chosen', async () => {
    await chooseEdition('iecc-2021', amendments);
    expect(placeholder()).toBe('Model code only');
    element.querySelector<HTMLElement>('mat-select[formcontrolname="amendments"]')!.click();
    await fixture.whenStable();
    const options = Array.from(document.querySelectorAll<HTMLElement>('mat-option'));
    expect(options.map((option) => option.textContent?.replace(/\s+/g, ' ').trim())).toEqual([
      "Washington State Energy Code 2021 (Washington's amendments to IECC 2021) · Washington State",
      'Alder Bay lighting amendments (invented) · Town of Alder Bay',
    ]);
    options[0]!.click();
    options[1]!.click();
    await fixture.whenStable();
    expect(form.controls.code.controls.amendments.value).toEqual(['washington-2021', 'alder-bay-2021']);
    expect(trigger()).toBe(
      "Washington State Energy Code 2021 (Washington's amendments to IECC 2021); Alder Bay lighting amendments (invented)",
    );
    expect(setupValue(form).amendments).toEqual(['washington-2021', 'alder-bay-2021']);
  });

  it('drops the amendments the new edition lacks when the edition changes, and says so', async () => {
    await chooseEdition('iecc-2021', amendments);
    form.controls.code.controls.amendments.setValue(['washington-2021']);
    await chooseEdition('ashrae-90.1-2019', []);
    expect(form.controls.code.controls.amendments.value).toEqual([]);
    expect(form.controls.code.controls.amendments.dirty).toBe(true);
    expect(element.querySelector('[data-testid="dropped-amendments"]')?.textContent?.replace(/\s+/g, ' ').trim()).toBe(
      "info Dropped with the change of edition, which does not have it: Washington State Energy Code 2021 (Washington's amendments to IECC 2021).",
    );
    expect(element.querySelector('[data-testid="no-amendments"]')?.textContent).toContain('the model code applies');
  });

  it('drops and names them in the code section, whichever section of the same form was made first', async () => {
    // The Set-up page shows every section of one form: the others neither read the amendments nor drop them.
    fixture.destroy();
    const identity = TestBed.createComponent(SetupFields);
    identity.componentRef.setInput('form', form);
    identity.componentRef.setInput('section', 'identity');
    fixture = TestBed.createComponent(SetupFields);
    fixture.componentRef.setInput('form', form);
    fixture.componentRef.setInput('section', 'code');
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    await identity.whenStable();
    await chooseEdition('iecc-2021', amendments);
    form.controls.code.controls.amendments.setValue(['washington-2021']);
    await chooseEdition('ashrae-90.1-2019', []);
    await identity.whenStable();
    expect(element.querySelector('[data-testid="dropped-amendments"]')?.textContent).toContain('Washington State Energy Code 2021');
  });

  it('puts a refused amendment beside the field', async () => {
    await chooseEdition('iecc-2021', amendments);
    form.controls.code.controls.amendments.setValue(['washington-2021']);
    expect(showServerErrors(form, [{ path: 'amendments.0', message: 'Not an amendment of the project’s code edition.' }])).toEqual([]);
    await fixture.whenStable();
    expect(element.querySelector('.amendments mat-error')?.textContent?.trim()).toBe('Not an amendment of the project’s code edition.');
  });
});
