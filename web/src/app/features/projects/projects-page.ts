import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatChipsModule } from '@angular/material/chips';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { catchError, map, of, startWith } from 'rxjs';
import { ApiError } from '../../core/http/api-error';
import { ProjectApi, type ProjectSummary } from './project-api';
import { stateLabels } from './project-states';

type ListState = { status: 'loading' } | { status: 'ready'; projects: ProjectSummary[] } | { status: 'failed'; message: string };


@Component({
  selector: 'al-projects-page',
  imports: [DatePipe, MatCardModule, MatChipsModule, MatIconModule, MatProgressBarModule],
  templateUrl: './projects-page.html',
  styleUrl: './projects-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectsPage {
  protected readonly stateLabels = stateLabels;
  protected readonly list = toSignal(
    inject(ProjectApi)
      .list()
      .pipe(
        map((projects): ListState => ({ status: 'ready', projects })),
        catchError((error: unknown) =>
          of<ListState>({ status: 'failed', message: error instanceof ApiError ? error.message : 'The projects could not be loaded.' }),
        ),
        startWith<ListState>({ status: 'loading' }),
      ),
    { requireSync: true },
  );
}
