import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'al-results-page',
  template: '<h2>Results</h2>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultsPage {}
