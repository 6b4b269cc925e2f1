import { ChangeDetectionStrategy, Component, ElementRef, inject, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { CautionsNotice } from './core/cautions-notice/cautions-notice';
import { RequestProgress } from './core/request-progress';
import { Session } from './core/session';
import { SIGN_IN_PATH } from './core/sign-in-redirect';

/** The app frame: skip link, top bar with the user's menu, request progress, page, cautions footer. */
@Component({
  selector: 'tl-root',
  imports: [
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    MatButtonModule,
    MatIconModule,
    MatMenuModule,
    MatProgressBarModule,
    CautionsNotice,
  ],
  templateUrl: './app.html',
  styleUrl: './app.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {
  private readonly router = inject(Router);
  protected readonly session = inject(Session);
  protected readonly progress = inject(RequestProgress);
  private readonly main = viewChild.required<ElementRef<HTMLElement>>('main');

  constructor() {
    // Public pages have no guard to load the session; the top bar still wants to know who is here.
    this.session.ensureLoaded().catch(() => this.session.markSignedOut());
  }

  protected skipToMain(event: Event): void {
    // A plain "#main" href would navigate to "/#main" because of <base href="/">.
    event.preventDefault();
    this.main().nativeElement.focus();
  }

  protected async signOut(): Promise<void> {
    await this.session.signOut().catch(() => undefined);
    await this.router.navigateByUrl(SIGN_IN_PATH);
  }
}
