import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'al-controls-page',
  template: '<h2>Controls</h2>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ControlsPage {}
