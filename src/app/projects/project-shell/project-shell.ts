import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSidenav, MatSidenavModule } from '@angular/material/sidenav';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { errorMessage } from '../../core/api-error';
import { ROLE_LABELS } from '../../core/permissions';
import { Session } from '../../core/session';
import { ProjectContext } from '../project-context';
import { projectSections } from '../project-routes';

// Matches the Material "compact/medium" boundary; below it the section list slides over the page.
const NARROW_SCREEN = '(max-width: 839.98px)';

/** Frame of one project: its name, the sections the user's role may open, and the open section. */
@Component({
  selector: 'tl-project-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatSidenavModule, MatButtonModule, MatIconModule],
  templateUrl: './project-shell.html',
  styleUrl: './project-shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [ProjectContext],
})
export class ProjectShell {
  private readonly session = inject(Session);
  protected readonly context = inject(ProjectContext);
  private readonly sectionNav = viewChild(MatSidenav);

  protected readonly narrow = toSignal(
    inject(BreakpointObserver)
      .observe(NARROW_SCREEN)
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );

  protected readonly sections = computed(() =>
    projectSections.filter((section) => this.context.can(section.permission)),
  );

  protected readonly roleLabel = computed(() => {
    const role = this.context.role();
    if (role) return ROLE_LABELS[role];
    return this.session.isAdmin() ? 'Site admin' : '';
  });

  protected readonly loadError = computed(() => {
    const error = this.context.detail.error();
    return error ? errorMessage(error) : null;
  });

  protected openSectionNav(): void {
    void this.sectionNav()?.open();
  }

  protected closeNavOnNarrowScreen(): void {
    if (this.narrow()) void this.sectionNav()?.close();
  }
}
