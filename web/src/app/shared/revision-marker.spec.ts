import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { RevisionMarker, revisionWords } from './revision-marker';

describe('RevisionMarker', () => {
  it('says how many items need revision in words, and shows nothing without any', async () => {
    expect(revisionWords(1)).toBe('1 item needs revision');
    expect(revisionWords(3)).toBe('3 items need revision');
    TestBed.configureTestingModule({ imports: [RevisionMarker], providers: [provideZonelessChangeDetection()] });
    const fixture = TestBed.createComponent(RevisionMarker);
    const element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    expect(element.textContent?.trim()).toBe('');
    fixture.componentRef.setInput('count', 2);
    await fixture.whenStable();
    expect(element.querySelector('.visually-hidden')?.textContent).toBe('2 items need revision');
  });
});
