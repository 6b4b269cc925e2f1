import { DOCUMENT, Injectable, inject } from '@angular/core';

/** Saves a blob as a file through the browser's download, the one place the viewer touches object URLs. */
@Injectable({ providedIn: 'root' })
export class BlobDownload {
  private readonly document = inject(DOCUMENT);

  save(blob: Blob, fileName: string): void {
    const url = URL.createObjectURL(blob);
    try {
      const link = this.document.createElement('a');
      link.href = url;
      link.download = fileName;
      link.click();
    } finally {
      // The click has started the download by now; the URL is no longer needed.
      URL.revokeObjectURL(url);
    }
  }
}
