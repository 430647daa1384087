import { ChangeDetectionStrategy, Component } from '@angular/core';
import { Shell } from './core/layout/shell/shell';

@Component({
  selector: 'cc-root',
  imports: [Shell],
  templateUrl: './app.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {}
