import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { type AreaPath, areaByPath } from '../../core/areas';

/** Placeholder page for an area that is on its way; `area` comes from the route's data. */
@Component({
  selector: 'clino-area-coming',
  imports: [MatIconModule],
  templateUrl: './area-coming.html',
  styleUrl: './area-coming.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AreaComing {
  readonly area = input.required<AreaPath>();
  protected readonly info = computed(() => areaByPath(this.area()));
}
