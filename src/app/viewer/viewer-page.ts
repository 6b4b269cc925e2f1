import { httpResource } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  linkedSignal,
  resource,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { FINDING_LIMITS } from '../../../server/findings/finding-fields';
import { STANDARD_LABELS } from '../../../server/reports/report-format';
import { type CheckRun, checksUrl, runUrl } from '../checks/checks-api';
import { errorMessage } from '../core/api-error';
import { type FindingDetail, findingReference } from '../findings/finding';
import { FindingsApi, findingUrl } from '../findings/findings-api';
import { modelsUrl, revisionUrl, type RevisionView } from '../models/models-api';
import { ProjectContext } from '../projects/project-context';
import { MemberPanel } from './member-panel';
import { askForViewText } from './save-view-dialog';
import { ViewerApi, viewpointsUrl } from './viewer-api';
import {
  base64OfBytes,
  finishedRunsOn,
  type RunColours,
  revisionToOpen,
  runToShow,
  type SavedViewpointView,
  savedViewpointRequest,
  viewerMembers,
  viewpointOfFinding,
  viewpointOfSaved,
} from './viewer-page-data';
import { ViewerWorkspace } from './viewer-workspace';
import { type ViewerViewpoint, ViewpointError } from './viewpoint';

/** The outcome of the last save, shown above the view. */
interface Notice {
  text: string;
  failed: boolean;
  link?: string[];
  linkText?: string;
}

/**
 * The project's 3D view: one revision's model coloured by one of its finished check runs, the clicked member's
 * results beside it, and views saved or raised as findings. Links open it on a member (`?run=&member=`) or on a
 * finding's view (`?viewpoint=<findingId>`).
 */
@Component({
  selector: 'tl-viewer-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatMenuModule, MatSelectModule, MemberPanel, ViewerWorkspace],
  templateUrl: './viewer-page.html',
  styleUrl: './viewer-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ViewerPage {
  protected readonly context = inject(ProjectContext);
  private readonly api = inject(ViewerApi);
  private readonly findingsApi = inject(FindingsApi);
  private readonly dialog = inject(MatDialog);

  /** Query parameters. */
  readonly run = input<string | undefined>();
  readonly member = input<string | undefined>();
  readonly viewpoint = input<string | undefined>();

  private readonly workspace = viewChild.required(ViewerWorkspace);
  protected readonly projectId = this.context.projectId;
  protected readonly canCreateFindings = computed(() => this.context.can('finding.create'));

  protected readonly revisionsResource = httpResource<{ revisions: RevisionView[] }>(() => modelsUrl(this.projectId()));
  // A boolean signal, so the runs are not asked again when the project answer replaces the session's permissions.
  private readonly canReadChecks = computed(() => this.context.can('check.read'));
  protected readonly runsResource = httpResource<{ runs: CheckRun[] }>(() => (this.canReadChecks() ? checksUrl(this.projectId()) : undefined));
  private readonly findingResource = httpResource<FindingDetail>(() => {
    const findingId = this.viewpoint();
    return findingId ? findingUrl(this.projectId(), findingId) : undefined;
  });
  protected readonly savedViewsResource = httpResource<{ viewpoints: SavedViewpointView[] }>(() => viewpointsUrl(this.projectId()));

  protected readonly savedViews = computed(() => (this.savedViewsResource.hasValue() ? this.savedViewsResource.value().viewpoints : []));
  protected readonly revisions = computed(() => (this.revisionsResource.hasValue() ? this.revisionsResource.value().revisions : []));
  protected readonly readyRevisions = computed(() => this.revisions().filter((revision) => revision.status === 'ready'));
  private readonly runs = computed(() => (this.runsResource.hasValue() ? this.runsResource.value().runs : []));
  private readonly linkedFinding = computed(() => (this.findingResource.hasValue() ? this.findingResource.value().finding : null));
  private readonly linkedRunId = computed(() => this.run() ?? this.linkedFinding()?.runId ?? null);

  /** Runs and the linked finding can name another revision than the newest; waiting for them saves loading two models. */
  private readonly linksSettled = computed(() => !this.runsResource.isLoading() && !this.findingResource.isLoading());
  protected readonly revisionId = linkedSignal(() =>
    this.linksSettled() ? (revisionToOpen(this.revisions(), this.runs(), this.linkedRunId())?.id ?? null) : null,
  );
  protected readonly revision = computed(() => this.revisions().find((revision) => revision.id === this.revisionId()) ?? null);
  protected readonly runsOnRevision = computed(() => finishedRunsOn(this.runs(), this.revisionId()));
  protected readonly runId = linkedSignal(() => runToShow(this.runs(), this.revisionId(), this.linkedRunId())?.id ?? null);

  protected readonly standardLabels = STANDARD_LABELS;
  protected readonly snapshotName = computed(() => `taulens-revision-${this.revision()?.number ?? 'none'}-3d-view`);
  protected readonly glb = computed(() => {
    const revisionId = this.revisionId();
    return revisionId === null ? null : `${revisionUrl(this.projectId(), revisionId)}/geometry.glb`;
  });
  private readonly coloursResource = httpResource<RunColours>(() => {
    const runId = this.runId();
    return runId === null ? undefined : `${runUrl(this.projectId(), runId)}/colours`;
  });
  private readonly labelsResource = resource({
    params: () => {
      const revisionId = this.revisionId();
      return revisionId === null ? undefined : { projectId: this.projectId(), revisionId };
    },
    loader: ({ params }) => this.api.memberLabels(params.projectId, params.revisionId),
  });
  protected readonly members = computed(() =>
    viewerMembers(
      this.labelsResource.hasValue() ? this.labelsResource.value() : [],
      this.runId() !== null && this.coloursResource.hasValue() ? this.coloursResource.value() : null,
    ),
  );
  private readonly membersById = computed(() => new Map(this.members().map((member) => [member.globalId, member])));

  protected readonly selection = signal<readonly string[]>([]);
  /** Closing the panel keeps the selection in the view. */
  private readonly panelClosed = signal(false);
  protected readonly panelMember = computed(() => {
    const [globalId, ...others] = this.selection();
    if (globalId === undefined || others.length > 0 || this.panelClosed()) return null;
    return { globalId, member: this.membersById().get(globalId) ?? null };
  });
  protected readonly selectionName = computed(() => {
    const ids = this.selection();
    if (ids.length !== 1) return `${ids.length} members`;
    return this.membersById().get(ids[0])?.tag ?? ids[0];
  });
  /** The revision whose model is drawn now; viewpoints wait for it. */
  protected readonly loadedRevisionId = signal<string | null>(null);
  private readonly appliedFindingId = signal<string | null>(null);

  protected readonly loadError = computed(() => {
    const error = this.revisionsResource.error() ?? this.runsResource.error() ?? this.coloursResource.error() ?? this.labelsResource.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly findingError = computed(() => {
    const error = this.findingResource.error();
    return error ? `The finding's view could not be opened: ${errorMessage(error)}` : null;
  });
  protected readonly notice = signal<Notice | null>(null);
  protected readonly saving = signal(false);

  constructor() {
    effect(() => {
      const finding = this.linkedFinding();
      const loaded = this.loadedRevisionId();
      if (finding === null || loaded === null || loaded !== this.revisionId() || untracked(this.appliedFindingId) === finding.id) return;
      this.appliedFindingId.set(finding.id);
      untracked(() => this.applyView(viewpointOfFinding(finding), `${findingReference(finding.number)}'s view`));
    });
  }

  protected showSelection(globalIds: readonly string[]): void {
    this.selection.set(globalIds);
    this.panelClosed.set(false);
  }

  protected closePanel(): void {
    this.panelClosed.set(true);
  }

  protected chooseRevision(revisionId: string): void {
    this.loadedRevisionId.set(null);
    this.revisionId.set(revisionId);
  }

  protected modelShown(): void {
    this.loadedRevisionId.set(this.revisionId());
  }

  protected openSavedView(saved: SavedViewpointView): void {
    this.applyView(viewpointOfSaved(saved), `The view "${saved.name}"`);
  }

  protected saveView(): void {
    askForViewText(this.dialog, { purpose: 'viewpoint', selection: this.selectionName() }).subscribe((text) => {
      const viewpoint = this.workspace().viewpoint();
      if (text === undefined || !viewpoint?.camera) return;
      const ids = this.members().map((member) => member.globalId);
      this.saving.set(true);
      this.api.saveViewpoint(this.projectId(), savedViewpointRequest(text.name, { ...viewpoint, camera: viewpoint.camera }, ids)).subscribe({
        next: ({ viewpoint: saved }) => {
          this.saving.set(false);
          this.savedViewsResource.reload();
          this.notice.set({ text: `View "${saved.name}" saved; reopen it from Saved views.`, failed: false });
        },
        error: (error: unknown) => this.failSave('The view was not saved', error),
      });
    });
  }

  protected createFinding(): void {
    const memberGlobalIds = [...this.selection()];
    if (memberGlobalIds.length === 0) return;
    askForViewText(this.dialog, { purpose: 'finding', selection: this.selectionName() }).subscribe((text) => {
      if (text !== undefined) void this.raiseFinding(memberGlobalIds, text.name, text.note);
    });
  }

  private async raiseFinding(memberGlobalIds: string[], title: string, description: string): Promise<void> {
    this.saving.set(true);
    const viewpoint = this.workspace().viewpoint() ?? undefined;
    let snapshotPng: string | undefined;
    let pictureLeftOut = false;
    try {
      const png = await this.workspace().snapshotPng();
      if (png && png.size <= FINDING_LIMITS.snapshotBytes) snapshotPng = base64OfBytes(new Uint8Array(await png.arrayBuffer()));
      else pictureLeftOut = true;
    } catch {
      // A finding without its picture still says what is wrong; the notice says the picture is missing.
      pictureLeftOut = true;
    }
    this.findingsApi.create(this.projectId(), { title, description, memberGlobalIds, viewpoint, snapshotPng }).subscribe({
      next: ({ finding }) => {
        this.saving.set(false);
        const reference = findingReference(finding.number);
        this.notice.set({
          text: `Finding ${reference} created${pictureLeftOut ? ' without a picture of the view (it could not be attached)' : ''}.`,
          failed: false,
          link: ['/projects', this.projectId(), 'findings', finding.id],
          linkText: `Open ${reference}`,
        });
      },
      error: (error: unknown) => this.failSave('The finding was not created', error),
    });
  }

  private applyView(viewpoint: ViewerViewpoint, what: string): void {
    try {
      this.workspace().applyViewpoint(viewpoint);
      this.notice.set(null);
    } catch (error) {
      if (!(error instanceof ViewpointError)) throw error;
      this.notice.set({ text: `${what} could not be shown: ${error.message}`, failed: true });
    }
  }

  private failSave(what: string, error: unknown): void {
    this.saving.set(false);
    this.notice.set({ text: `${what}: ${errorMessage(error)}`, failed: true });
  }
}
