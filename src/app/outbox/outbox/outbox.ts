import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { ApiError, errorMessage } from '../../core/api-error';
import { splitLinks } from '../text-with-links';

/** `GET /api/dev/outbox` */
export interface OutboxMessage {
  id: string;
  from?: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
}

/**
 * Development only: the e-mails the built-in SMTP server caught, so invitations and reset links
 * can be followed without a mail account. Site admins only, like the server route: the mails hold other users' links.
 */
@Component({
  selector: 'tl-outbox',
  imports: [DatePipe, MatButtonModule, MatIconModule],
  templateUrl: './outbox.html',
  styleUrl: './outbox.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Outbox {
  protected readonly outbox = httpResource<{ messages: OutboxMessage[] }>(() => '/api/dev/outbox');

  // Only the plain-text body is shown: links become anchors, nothing from the mail becomes markup.
  protected readonly messages = computed(() =>
    (this.outbox.hasValue() ? this.outbox.value().messages : []).map((message) => ({
      ...message,
      parts: splitLinks(message.text),
    })),
  );
  protected readonly problem = computed(() => {
    const error = this.outbox.error();
    if (!error) return null;
    if (error instanceof ApiError && error.status === 404) {
      return 'The outbox exists only while the server runs its development mail server (FAKE_SMTP).';
    }
    return errorMessage(error);
  });
}
