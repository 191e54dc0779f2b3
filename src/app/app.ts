import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { RouterOutlet } from '@angular/router';
import { MatIconRegistry } from '@angular/material/icon';

@Component({
  selector: 'sc-root',
  imports: [RouterOutlet],
  template: '<router-outlet />',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {
  constructor() {
    // Material Symbols come from @fontsource; tell mat-icon which ligature class to use.
    inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined');
  }
}
