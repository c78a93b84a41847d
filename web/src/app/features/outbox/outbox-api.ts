import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { MailStatus, OutboxEntry, OutboxMessage } from '../../../../../contract/accounts';

export type { OutboxEntry, OutboxMessage };

/** The administrator's view of the mail the app queued. */
@Injectable({ providedIn: 'root' })
export class OutboxApi {
  private readonly http = inject(HttpClient);

  list(): Observable<OutboxEntry[]> {
    return this.http.get<OutboxEntry[]>('/api/admin/outbox');
  }

  message(id: string): Observable<OutboxMessage> {
    return this.http.get<OutboxMessage>(`/api/admin/outbox/${encodeURIComponent(id)}`);
  }
}

const statusWords: Record<MailStatus, string> = { queued: 'Waiting to send', sent: 'Sent', failed: 'Failed' };

/** The state of one message in words, with what the mail server said when it did not take it. */
export function mailStatusWords(entry: OutboxEntry): string {
  if (entry.status === 'queued' && entry.attempts > 0)
    return `Waiting to send (tried ${entry.attempts} time${entry.attempts === 1 ? '' : 's'})`;
  if (entry.status === 'failed') return `Failed after ${entry.attempts} attempt${entry.attempts === 1 ? '' : 's'}`;
  return statusWords[entry.status];
}
