import { DecimalPipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { SECTION_FAMILY_LABELS } from '../../../../server/engine/section-family';
import { PROFILE_SOURCE_LABELS, sectionDimensionsOf } from '../../../../server/ifc/model-read-result';
import { flagLabel } from '../../checks/flag-labels';
import { errorMessage } from '../../core/api-error';
import { MemberRecord, revisionUrl } from '../models-api';
import { MEMBER_STATUS_LABELS, SECTION_FLAG_NOTES } from '../model-words';
import { dimensionRows, governingText, stationRows } from './section-dimension-rows';

/** Everything read of one member: identity, section of any family (and along a tapered one), material, axis and flags. */
@Component({
  selector: 'tl-member-detail',
  imports: [DecimalPipe, MatButtonModule, MatIconModule],
  templateUrl: './member-detail.html',
  styleUrl: './member-detail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MemberDetail {
  readonly projectId = input.required<string>();
  readonly revisionId = input.required<string>();
  readonly globalId = input.required<string>();
  readonly closed = output<void>();

  protected readonly statusLabels = MEMBER_STATUS_LABELS;
  protected readonly familyLabels = SECTION_FAMILY_LABELS;
  protected readonly sourceLabels = PROFILE_SOURCE_LABELS;

  protected readonly detail = httpResource<{ member: MemberRecord }>(
    () => `${revisionUrl(this.projectId(), this.revisionId())}/members/${encodeURIComponent(this.globalId())}`,
  );
  protected readonly member = computed(() => (this.detail.hasValue() ? this.detail.value().member : null));
  private readonly profile = computed(() => this.member()?.profile ?? null);
  protected readonly dimensions = computed(() => {
    const profile = this.profile();
    return profile ? dimensionRows(sectionDimensionsOf(profile)) : [];
  });
  protected readonly stations = computed(() => {
    const profile = this.profile();
    return profile ? stationRows(profile) : [];
  });
  protected readonly governing = computed(() => {
    const profile = this.profile();
    return profile ? governingText(profile) : null;
  });
  protected readonly flags = computed(() => (this.member()?.flags ?? []).map((code) => ({ code, label: flagLabel(code), note: SECTION_FLAG_NOTES[code] ?? null })));
  protected readonly loadError = computed(() => {
    const error = this.detail.error();
    return error ? errorMessage(error) : null;
  });

  protected pointText(point: readonly number[]): string {
    return point.map((v) => Math.round(v).toLocaleString('en')).join(', ');
  }

  protected close(): void {
    this.closed.emit();
  }
}
