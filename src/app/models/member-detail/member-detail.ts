import { DecimalPipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { flagLabel } from '../../checks/flag-labels';
import { errorMessage } from '../../core/api-error';
import { MemberRecord, revisionUrl } from '../models-api';
import { MEMBER_STATUS_LABELS, mmText } from '../model-words';

/** Everything read of one member: identity, section with both flanges, material, axis and flags. */
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
  protected readonly flagLabel = flagLabel;
  protected readonly mmText = mmText;

  protected readonly detail = httpResource<{ member: MemberRecord }>(
    () => `${revisionUrl(this.projectId(), this.revisionId())}/members/${encodeURIComponent(this.globalId())}`,
  );
  protected readonly member = computed(() => (this.detail.hasValue() ? this.detail.value().member : null));
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
