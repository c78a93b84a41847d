import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { of } from 'rxjs';
import { ApiError } from '../../core/http/api-error';
import { CardRows } from '../../shared/card-rows';
import { mailStatusWords, OutboxApi, type OutboxEntry } from './outbox-api';

/**
 * Every message the app queued, newest first, and the text of the one chosen. For administrators:
 * in development the local mail server keeps the same messages under .data/mail/.
 */
@Component({
  selector: 'al-outbox-page',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, CardRows],
  template: `
    <header class="heading">
      <h1>Outbox</h1>
      <button mat-stroked-button type="button" (click)="list.reload()"><mat-icon>refresh</mat-icon>Refresh</button>
    </header>
    <p class="hint">
      The mail Allowlight sends: password links and notices. A message the mail server does not take is tried again, later each time; one
      that keeps failing shows as failed.
    </p>
    @if (list.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the outbox" />
    }
    @if (list.error(); as error) {
      <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ words(error) }}</p>
    }
    @if (list.hasValue()) {
      @if (list.value().length === 0) {
        <p>No mail has been sent yet.</p>
      } @else {
        <table alCardRows class="messages">
          <caption class="visually-hidden">
            Messages, newest first
          </caption>
          <thead>
            <tr>
              <th scope="col">Queued</th>
              <th scope="col">To</th>
              <th scope="col">Subject</th>
              <th scope="col">State</th>
            </tr>
          </thead>
          <tbody>
            @for (entry of list.value(); track entry.id) {
              <tr [class.chosen]="entry.id === chosenId()">
                <td>{{ entry.createdAt | date: 'd MMM y, HH:mm:ss' }}</td>
                <td>{{ entry.to.join(', ') }}</td>
                <td>
                  <button mat-button type="button" (click)="chosenId.set(entry.id)" [attr.aria-pressed]="entry.id === chosenId()">
                    {{ entry.subject }}
                  </button>
                </td>
                <td [class.failed]="entry.status === 'failed'">{{ status(entry) }}</td>
              </tr>
            }
          </tbody>
        </table>
      }
    }
    @if (message.value(); as shown) {
      <section class="message" aria-labelledby="message-heading">
        <h2 id="message-heading">{{ shown.subject }}</h2>
        <p class="detail">
          To {{ shown.to.join(', ') }} · {{ status(shown) }}
          @if (shown.sentAt) {
            · sent {{ shown.sentAt | date: 'd MMM y, HH:mm:ss' }}
          }
        </p>
        @if (shown.lastError) {
          <p class="detail">The mail server answered: {{ shown.lastError }}</p>
        }
        <pre class="text">{{ shown.text }}</pre>
      </section>
    }
  `,
  styles: `
    :host {
      display: block;
      max-width: 1100px;
    }
    .heading {
      display: flex;
      align-items: center;
      justify-content: space-between;
      gap: 12px;
      flex-wrap: wrap;
    }
    .heading h1 {
      font: var(--mat-sys-headline-medium);
      margin: 0;
    }
    .hint,
    .detail {
      color: var(--mat-sys-on-surface-variant);
    }
    .messages {
      width: 100%;
      border-collapse: collapse;
    }
    .messages th,
    .messages td {
      text-align: left;
      padding: 4px 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .messages button {
      text-align: left;
    }
    tr.chosen {
      background: var(--mat-sys-surface-container);
    }
    .failed {
      color: var(--mat-sys-error);
    }
    .failure {
      display: flex;
      align-items: center;
      gap: 8px;
      color: var(--mat-sys-error);
    }
    .message {
      margin-top: 16px;
      padding: 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
    }
    .message h2 {
      font: var(--mat-sys-title-large);
      margin: 0;
    }
    .text {
      white-space: pre-wrap;
      overflow-wrap: anywhere;
      font: var(--mat-sys-body-medium);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutboxPage {
  private readonly api = inject(OutboxApi);
  protected readonly chosenId = signal<string | null>(null);
  protected readonly list = rxResource({ stream: () => this.api.list() });
  protected readonly message = rxResource({
    params: () => this.chosenId(),
    stream: ({ params: id }) => (id ? this.api.message(id) : of(null)),
  });

  protected status(entry: OutboxEntry): string {
    return mailStatusWords(entry);
  }

  protected words(error: unknown): string {
    return error instanceof ApiError ? error.message : 'The outbox could not be loaded.';
  }
}
