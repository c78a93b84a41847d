import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'al-setup-page',
  template: '<h2>Set-up</h2>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupPage {}
