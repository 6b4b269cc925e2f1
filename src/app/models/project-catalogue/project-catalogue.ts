import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { errorMessage } from '../../core/api-error';
import { CatalogueSection, catalogueUrl, ModelsApi } from '../models-api';

/** The header a catalogue CSV must have (server/catalogue/catalogue-csv.ts). */
const CSV_HEADER = 'name,series,depth_mm,width_mm,web_mm,flange_mm,root_radius_mm';

/**
 * The project's own rolled sections: models that give a section only by name are resolved with them (before the
 * built-in tables) from the next upload on.
 */
@Component({
  selector: 'tl-project-catalogue',
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './project-catalogue.html',
  styleUrl: './project-catalogue.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectCatalogue {
  private readonly api = inject(ModelsApi);

  readonly projectId = input.required<string>();
  readonly canUpload = input(false);

  protected readonly csvHeader = CSV_HEADER;
  protected readonly catalogue = httpResource<{ sections: CatalogueSection[] }>(() => catalogueUrl(this.projectId()));
  protected readonly sections = computed(() => (this.catalogue.hasValue() ? this.catalogue.value().sections : []));
  protected readonly busy = signal(false);
  protected readonly notice = signal<{ text: string; failed: boolean } | null>(null);

  protected uploadCatalogue(event: Event): void {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    this.busy.set(true);
    this.notice.set(null);
    this.api.uploadCatalogue(this.projectId(), file).subscribe({
      next: ({ sections }) => {
        this.busy.set(false);
        this.notice.set({ text: `${sections} section${sections === 1 ? '' : 's'} saved. They apply to models uploaded from now on.`, failed: false });
        this.catalogue.reload();
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.notice.set({ text: errorMessage(error), failed: true });
      },
    });
  }
}
