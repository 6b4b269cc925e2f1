import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog, MatDialogModule } from '@angular/material/dialog';
import { MatSlideToggleChange, MatSlideToggleModule } from '@angular/material/slide-toggle';
import { errorMessage } from '../../core/api-error';
import { NotificationSettings as Settings } from '../finding';
import { FindingsApi, NOTIFICATION_SETTINGS_URL } from '../findings-api';

const KINDS: readonly { key: keyof Settings; label: string; hint: string }[] = [
  { key: 'assigned', label: 'A finding is assigned to me', hint: 'One e-mail per assignment, also for several findings at once.' },
  { key: 'statusChanged', label: 'The status of my findings changes', hint: 'Findings assigned to you or raised by you.' },
  { key: 'mentioned', label: 'Someone mentions me in a comment', hint: 'Written as @ and your e-mail address or name.' },
];

/** The signed-in user's finding e-mails, each switched on or off at once. */
@Component({
  selector: 'tl-notification-settings',
  imports: [MatDialogModule, MatButtonModule, MatSlideToggleModule],
  templateUrl: './notification-settings.html',
  styleUrl: './notification-settings.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotificationSettings {
  private readonly api = inject(FindingsApi);

  protected readonly kinds = KINDS;
  protected readonly stored = httpResource<Settings>(() => NOTIFICATION_SETTINGS_URL);
  protected readonly saved = signal<Settings | null>(null);
  protected readonly settings = computed(() => this.saved() ?? (this.stored.hasValue() ? this.stored.value() : null));
  protected readonly notice = signal<{ text: string; failed: boolean } | null>(null);
  protected readonly loadError = computed(() => {
    const error = this.stored.error();
    return error ? errorMessage(error) : null;
  });

  protected switchKind(key: keyof Settings, change: MatSlideToggleChange): void {
    const current = this.settings();
    if (!current) return;
    const next = { ...current, [key]: change.checked };
    this.saved.set(next);
    this.notice.set(null);
    this.api.saveNotificationSettings(next).subscribe({
      next: (settings) => {
        this.saved.set(settings);
        this.notice.set({ text: 'Saved.', failed: false });
      },
      error: (error: unknown) => {
        this.saved.set(current);
        // The switch moved itself when clicked; the binding may not have seen the refused value, so put it back here.
        change.source.checked = current[key];
        this.notice.set({ text: errorMessage(error), failed: true });
      },
    });
  }
}

export function openNotificationSettings(dialog: MatDialog): void {
  dialog.open(NotificationSettings, { width: '480px' });
}
