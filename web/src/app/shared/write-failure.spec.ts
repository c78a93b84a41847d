import { ApplicationRef, provideZonelessChangeDetection, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { FormControl } from '@angular/forms';
import { Subject } from 'rxjs';
import { ApiError } from '../core/http/api-error';
import { WriteFailure } from './write-failure';

describe('WriteFailure.save', () => {
  let failure: WriteFailure;
  let request: Subject<{ id: string }>;
  const saving = signal(false);
  let form: FormControl<string>;
  let log: string[];

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection()] });
    failure = TestBed.inject(WriteFailure);
    request = new Subject();
    saving.set(false);
    form = new FormControl('12 ft', { nonNullable: true });
    form.markAsDirty();
    log = [];
  });

  afterEach(() => document.querySelector('.cdk-overlay-container')?.replaceChildren());

  function snackBarText(): Promise<string> {
    return TestBed.inject(ApplicationRef)
      .whenStable()
      .then(() => document.querySelector('.mat-mdc-snack-bar-container')?.textContent ?? '');
  }

  function start(steps: Partial<Parameters<WriteFailure['save']>[1]> = {}) {
    failure.save(request, {
      saving,
      form,
      saved: (record) => log.push(`saved ${record.id} ${saving() ? 'while saving' : 'after saving'} ${form.dirty ? 'dirty' : 'pristine'}`),
      reload: () => log.push('reload'),
      ...steps,
    });
  }

  it('is saving while the request is out, then marks the form pristine and hands over the stored record', () => {
    start();
    expect(saving()).toBe(true);
    request.next({ id: 's1' });
    expect(log).toEqual(['saved s1 after saving pristine']);
  });

  it('puts a 400 beside the fields when the editor can, and says nothing else', async () => {
    start({ invalid: (error) => log.push(`invalid ${error.details[0]?.path}`) });
    request.error(new ApiError(400, 'validation', 'The space was not saved.', [{ path: 'area', message: 'Must be greater than zero.' }]));
    expect(saving()).toBe(false);
    expect(form.dirty).toBe(true);
    expect(log).toEqual(['invalid area']);
    expect(await snackBarText()).toBe('');
  });

  it('answers a 400 in words when the editor has no fields for it', async () => {
    start();
    request.error(new ApiError(400, 'validation', 'The space was not saved.', [{ path: 'area', message: 'Must be greater than zero.' }]));
    expect(await snackBarText()).toContain('The space was not saved.');
  });

  it('leaves a refusal the editor knows to the editor, and reports the others', async () => {
    start({ refused: (error) => error.status === 409 && error.details.some((detail) => detail.path === 'tag') });
    request.error(new ApiError(409, 'duplicate', 'Another type has the tag A1.', [{ path: 'tag', message: 'Taken.' }]));
    expect(await snackBarText()).toBe('');
  });

  it('offers to reload after a stale write, and reloads when asked', async () => {
    start();
    request.error(new ApiError(409, 'conflict', 'Someone changed this space since you opened it.'));
    expect(saving()).toBe(false);
    expect(await snackBarText()).toContain('Someone changed this space since you opened it.');
    const reload = Array.from(document.querySelectorAll<HTMLButtonElement>('.mat-mdc-snack-bar-container button')).find((button) =>
      button.textContent?.includes('Reload'),
    );
    reload!.click();
    expect(log).toEqual(['reload']);
  });
});
