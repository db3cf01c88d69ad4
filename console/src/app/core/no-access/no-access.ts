import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { type AreaPath, areaByPath } from '../areas';
import { rolesForArea } from '../auth/area-roles';
import { Session } from '../auth/session';
import { ROLE_LABELS } from '../auth/session-person';

/** Shown in place of an area the signed-in person's role may not open; `area` comes from route data. */
@Component({
  selector: 'clino-no-access',
  imports: [RouterLink, MatButtonModule, MatIconModule],
  templateUrl: './no-access.html',
  styleUrl: './no-access.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NoAccess {
  private readonly session = inject(Session);

  readonly area = input.required<AreaPath>();
  protected readonly label = computed(() => areaByPath(this.area()).label);
  /** "the Supervisor and Admin roles", from the console's mirror of the role matrix. */
  protected readonly openTo = computed(() => {
    const labels = (rolesForArea(this.area()) ?? []).map((role) => ROLE_LABELS[role]);
    const named = labels.length > 1 ? `${labels.slice(0, -1).join(', ')} and ${labels.at(-1)}` : labels.join('');
    return `the ${named} role${labels.length > 1 ? 's' : ''}`;
  });
  protected readonly yourRole = computed(() => {
    const role = this.session.role();
    return role === null ? 'no role' : ROLE_LABELS[role];
  });
}
