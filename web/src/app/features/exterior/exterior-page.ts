import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'al-exterior-page',
  template: '<h2>Exterior</h2>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ExteriorPage {}
