import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { RouterLink } from '@angular/router';
import type { ProblemLine } from './problem-words';

/** Problems that say the same about the same field, with every space or item they name. */
interface ProblemGroup {
  field: string | null;
  message: string;
  lines: ProblemLine[];
}

/**
 * Problems the service reported, each in words and linked to the page (and space) where it is
 * fixed. The same problem on many spaces reads once, followed by each space.
 */
@Component({
  selector: 'al-problem-list',
  imports: [RouterLink],
  template: `
    <ul class="problems">
      @for (group of groups(); track $index) {
        <li>
          @if (group.lines[0]!.subject === null && group.lines[0]!.link; as link) {
            <a [routerLink]="['..', link.page]" [queryParams]="link.query ?? null">{{ group.field ?? 'Set-up' }}</a>:
          } @else if (group.field) {
            <span class="field">{{ group.field }}:</span>
          }
          {{ group.message }}
          @if (group.lines[0]!.subject !== null) {
            <span class="subjects">
              @for (line of group.lines; track $index) {
                @if (line.link; as link) {
                  <a [routerLink]="['..', link.page]" [queryParams]="link.query ?? null">{{ line.subject }}</a>
                } @else {
                  <span>{{ line.subject }}</span>
                }
              }
            </span>
          }
        </li>
      }
    </ul>
  `,
  styles: `
    .problems {
      margin: 0;
      padding-left: 20px;
    }
    li {
      margin: 6px 0;
    }
    .field {
      font-weight: 500;
    }
    .subjects {
      display: flex;
      flex-wrap: wrap;
      gap: 2px 14px;
      margin-top: 2px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProblemList {
  readonly problems = input.required<readonly ProblemLine[]>();

  protected readonly groups = computed(() => {
    const groups = new Map<string, ProblemGroup>();
    this.problems().forEach((line, index) => {
      // Only problems about named items gather; a set-up field's problem stands alone.
      const key = line.subject === null ? `alone\u0000${index}` : `${line.field ?? ''}\u0000${line.message}`;
      const group = groups.get(key) ?? { field: line.field, message: line.message, lines: [] };
      group.lines.push(line);
      groups.set(key, group);
    });
    return [...groups.values()];
  });
}
