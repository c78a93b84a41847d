import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { PackageComparison, PackageRevision } from '../../../../../contract/package';
import type { ProjectDetail } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ProjectStore } from '../workspace/project-store';
import { PackagePage } from './package-page';

// An invented project and its revisions.
const project = {
  id: 'p1',
  name: 'Harbour Pavilion',
  state: 'draft',
  role: 'engineer',
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  version: 4,
  members: [],
  archivedAt: null,
} as unknown as ProjectDetail;

const revision = (number: number, draft: boolean): PackageRevision => ({
  id: `r${number}`,
  revision: number,
  draft,
  designRevision: 1,
  fingerprint: String(number).repeat(64),
  madeAt: '2026-03-02T10:15:00Z',
  madeBy: 'Ines Halvorsen',
  files: (['docx', 'xlsx', 'pdf'] as const).map((format) => ({
    format,
    size: 20_480,
    sha256: 'f'.repeat(64),
    url: `/api/projects/p1/packages/r${number}/files/${format}`,
  })),
});

describe('PackagePage', () => {
  let fixture: ComponentFixture<PackagePage>;
  let http: HttpTestingController;
  let store: ProjectStore;
  let element: HTMLElement;

  async function open(role: string, state: string, revisions: PackageRevision[]) {
    TestBed.configureTestingModule({
      imports: [PackagePage],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        ProjectStore,
      ],
    });
    store = TestBed.inject(ProjectStore);
    store.seed({ project: { ...project, role, state } as ProjectDetail });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(PackagePage);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    http.expectOne('/api/projects/p1/packages').flush({ revisions });
    await fixture.whenStable();
  }

  afterEach(() => http.verify());

  it('offers the engineer a draft package, and lists revisions newest first with their downloads', async () => {
    await open('engineer', 'draft', [revision(1, true), revision(2, false)]);
    expect(element.querySelector('[data-testid="make-package"]')?.textContent).toContain('Make a draft package');
    const listed = Array.from(element.querySelectorAll('[data-testid="package-revision"] strong')).map((node) => node.textContent?.trim());
    expect(listed).toEqual(['Revision 2 (final)', 'Revision 1 (draft)']);
    const links = Array.from(element.querySelectorAll<HTMLAnchorElement>('[data-testid="package-revision"]:first-child a'));
    expect(links.map((link) => link.textContent?.replace(/\s+/g, ' ').trim())).toEqual([
      'download Word (20 KB) , Revision 2 (final)',
      'download Excel (20 KB) , Revision 2 (final)',
      'download PDF (20 KB) , Revision 2 (final)',
    ]);
    expect(links[2]!.getAttribute('href')).toBe('/api/projects/p1/packages/r2/files/pdf');
  });

  it('names the final package of an accepted design, makes it, and reads the project again', async () => {
    await open('engineer', 'accepted', []);
    const button = element.querySelector<HTMLButtonElement>('[data-testid="make-package"]')!;
    expect(button.textContent).toContain('Make the final package and issue the design');
    button.click();
    await fixture.whenStable();
    http
      .expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/packages')
      .flush({ id: 'r1', revision: 1, draft: false, fingerprint: '1'.repeat(64), files: [] });
    http.expectOne('/api/projects/p1/packages').flush({ revisions: [revision(1, false)] });
    http.expectOne('/api/projects/p1').flush({ ...project, state: 'issued' });
    await fixture.whenStable();
    expect(store.project()?.state).toBe('issued');
  });

  it('gives the contractor no make button', async () => {
    await open('contractor', 'issued', [revision(3, false)]);
    expect(element.querySelector('[data-testid="make-package"]')).toBeNull();
    expect(element.textContent).toContain('drafts stay with the design team');
  });

  it('compares the two latest revisions in words', async () => {
    await open('engineer', 'draft', [revision(1, false), revision(2, true)]);
    const compare = Array.from(element.querySelectorAll('button')).find((button) => button.textContent?.includes('Compare'))!;
    compare.click();
    await fixture.whenStable();
    const request = http.expectOne((candidate) => candidate.url === '/api/projects/p1/packages/compare');
    expect([request.request.params.get('from'), request.request.params.get('to')]).toEqual(['r1', 'r2']);
    const comparison: PackageComparison = {
      from: { id: 'r1', revision: 1, draft: false, fingerprint: '1'.repeat(64) },
      to: { id: 'r2', revision: 2, draft: true, fingerprint: '2'.repeat(64) },
      verdict: { from: 'complies', to: 'does-not-comply' },
      totals: [{ field: 'interior.installedW', label: 'Interior installed (W)', from: '4800', to: '5600' }],
      spaces: {
        added: [],
        removed: [],
        changed: [{ id: 's1', name: 'Exam 1', level: null, changes: [{ field: 'area', label: 'Floor area', from: '120', to: '150' }] }],
      },
      controls: [{ spaceId: 's1', spaceName: 'Exam 1', control: 'Occupant sensing', from: 'met', to: 'not-met' }],
      exterior: [],
    };
    request.flush(comparison);
    await fixture.whenStable();
    const shown = element.querySelector('[data-testid="package-comparison"]')!.textContent!.replace(/\s+/g, ' ');
    expect(shown).toContain('The design complies in the earlier revision and does not comply in the later one.');
    const row = Array.from(element.querySelectorAll('.totals tbody tr')).map((tr) =>
      Array.from(tr.children).map((cell) => cell.textContent?.trim()),
    );
    expect(row).toEqual([['Interior installed (W)', '4,800', '5,600']]);
    expect(shown).toContain('Exam 1: Floor area: 120 → 150');
    expect(shown).toContain('Exam 1, Occupant sensing: met → not met');
    expect(shown).not.toMatch(/interior\.installedW|not-met/);
  });

  /** The next read of the job, once the page's timer asks for it. */
  async function nextJobRead() {
    let request: ReturnType<HttpTestingController['expectOne']> | undefined;
    await vi.waitFor(() => (request = http.expectOne('/api/projects/p1/packages/jobs/j1')), { timeout: 5000, interval: 50 });
    return request!;
  }

  it("follows a large project's package job with a progress bar in words, then shows the revision made", async () => {
    await open('engineer', 'draft', []);
    element.querySelector<HTMLButtonElement>('[data-testid="make-package"]')!.click();
    await fixture.whenStable();
    http
      .expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/packages')
      .flush({ job: { id: 'j1', state: 'queued', progress: 0, step: null } }, { status: 202, statusText: 'Accepted' });
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="package-progress-words"]')?.textContent).toContain('Waiting for the server to start — 0 %');

    (await nextJobRead()).flush({ job: { id: 'j1', state: 'running', progress: 10, step: 'docx' } });
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="package-progress-words"]')?.textContent?.trim()).toBe('Building the Word file — 10 %');
    const bar = element.querySelector('[data-testid="package-progress"]')!;
    expect(bar.getAttribute('aria-valuenow')).toBe('10');
    expect(bar.getAttribute('aria-label')).toBe('Building the Word file — 10 %');

    (await nextJobRead()).flush({ job: { id: 'j1', state: 'running', progress: 50, step: 'xlsx' } });
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="package-progress-words"]')?.textContent?.trim()).toBe('Building the Excel file — 50 %');

    (await nextJobRead()).flush({
      job: {
        id: 'j1',
        state: 'done',
        progress: 100,
        step: null,
        package: { id: 'r1', revision: 1, draft: true, fingerprint: '1'.repeat(64), files: [] },
      },
    });
    http.expectOne('/api/projects/p1/packages').flush({ revisions: [revision(1, true)] });
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="package-progress"]')).toBeNull();
    expect(element.querySelector('[data-testid="package-revision"] strong')?.textContent?.trim()).toBe('Revision 1 (draft)');
    expect(element.querySelector<HTMLButtonElement>('[data-testid="make-package"]')!.disabled).toBe(false);
  });

  it('says in words why a package job failed, and lets the engineer try again', async () => {
    await open('engineer', 'draft', []);
    element.querySelector<HTMLButtonElement>('[data-testid="make-package"]')!.click();
    await fixture.whenStable();
    http
      .expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/packages')
      .flush({ job: { id: 'j1', state: 'running', progress: 70, step: 'pdf' } }, { status: 202, statusText: 'Accepted' });
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="package-progress-words"]')?.textContent?.trim()).toBe('Building the PDF — 70 %');
    (await nextJobRead()).flush({
      job: {
        id: 'j1',
        state: 'failed',
        progress: 90,
        step: 'store',
        error: 'The file store cannot be reached. Try again in a few minutes.',
      },
    });
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="package-progress"]')).toBeNull();
    expect(element.querySelector('[data-testid="package-failure"]')?.textContent).toContain('The file store cannot be reached.');
    expect(element.querySelector<HTMLButtonElement>('[data-testid="make-package"]')!.disabled).toBe(false);
  });
});
