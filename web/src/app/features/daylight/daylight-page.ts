import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'al-daylight-page',
  template: '<h2>Daylight</h2>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DaylightPage {}
