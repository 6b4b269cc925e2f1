import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { ProjectAction } from '../../core/permissions';
import { ProjectContext } from '../project-context';

export interface PlannedAction {
  label: string;
  icon: string;
  permission: ProjectAction;
}

/** Stands in for a project section whose feature has not been built yet. */
@Component({
  selector: 'tl-section-placeholder',
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './section-placeholder.html',
  styleUrl: './section-placeholder.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SectionPlaceholder {
  private readonly context = inject(ProjectContext);

  // Route data, bound as inputs.
  readonly heading = input.required<string>();
  readonly summary = input.required<string>();
  readonly plannedActions = input<PlannedAction[]>([]);

  protected readonly allowedActions = computed(() =>
    this.plannedActions().filter((action) => this.context.can(action.permission)),
  );
}
