import { httpResource } from '@angular/common/http';
import { computed, inject, Injectable } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { ActivatedRoute } from '@angular/router';
import { map } from 'rxjs';
import { ProjectAction } from '../core/permissions';
import { Session } from '../core/session';
import { ProjectDetail } from './project';

/**
 * The open project, shared by the project shell and the pages inside it. Provided by the shell, so
 * it lives as long as the user stays in one project.
 */
@Injectable()
export class ProjectContext {
  private readonly session = inject(Session);
  private readonly route = inject(ActivatedRoute);

  readonly projectId = toSignal(this.route.paramMap.pipe(map((params) => params.get('projectId') ?? '')), {
    initialValue: '',
  });

  readonly detail = httpResource<ProjectDetail>(() => {
    const id = this.projectId();
    return id ? `/api/projects/${encodeURIComponent(id)}` : undefined;
  });

  readonly project = computed(() => (this.detail.hasValue() ? this.detail.value().project : null));
  readonly role = computed(() => (this.detail.hasValue() ? this.detail.value().role : null));
  private readonly permissions = computed(() => (this.detail.hasValue() ? this.detail.value().permissions : []));

  /** What the project answer allows (role and archived state), falling back to the session while it loads. */
  can(action: ProjectAction): boolean {
    if (this.detail.hasValue()) return this.permissions().includes(action);
    return this.session.can(this.projectId(), action);
  }

  /** Reloads the project and the session after a change to the project or its members. */
  reload(): void {
    this.detail.reload();
    void this.session.refresh().catch(() => undefined);
  }
}
