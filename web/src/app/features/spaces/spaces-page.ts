import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'al-spaces-page',
  template: '<h2>Spaces</h2>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpacesPage {}
