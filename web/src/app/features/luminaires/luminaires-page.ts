import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'al-luminaires-page',
  template: '<h2>Luminaires</h2>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LuminairesPage {}
