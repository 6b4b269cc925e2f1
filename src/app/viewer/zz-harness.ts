import { ChangeDetectionStrategy, Component, inject, provideZonelessChangeDetection, provideAppInitializer, signal } from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { bootstrapApplication } from '@angular/platform-browser';
import { ViewerWorkspace } from './viewer-workspace';
import type { ViewerMember } from './viewer-member';

@Component({
  selector: 'tl-root',
  imports: [ViewerWorkspace],
  template: `<tl-viewer-workspace style="height: 100vh" [glb]="glb" [members]="members()" />`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Harness {
  protected readonly glb = '/m/frame-5000-v1.glb';
  protected readonly members = signal<ViewerMember[]>([]);
  constructor() {
    fetch('/m/frame-5000-v1.ids.json').then((r) => r.json()).then((ids: string[]) =>
      this.members.set(ids.map((globalId, i) => ({
        globalId, tag: `M-${i}`, section: ['IPE 300', 'IPE 400', 'HEA 240'][i % 3], storey: `Level ${Math.floor(i / 128) + 1}`,
        utilisationRatio: i % 17 === 0 ? null : ((i * 37) % 115) / 100, status: 'pass',
      }))));
  }
}

bootstrapApplication(Harness, { providers: [provideZonelessChangeDetection(), provideAppInitializer(() => { inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined'); })] });
