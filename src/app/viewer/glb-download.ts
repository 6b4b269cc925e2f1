/** The model file could not be fetched or read; the message says which, in words for the user. */
export class ModelLoadError extends Error {
  override readonly name = 'ModelLoadError';
}

export interface LoadProgress {
  phase: 'download' | 'build';
  /** 0–1, or null when the size is not known. */
  fraction: number | null;
}

/** Fetches a .glb with the session cookie, reporting progress when the server sends a length. */
export async function downloadGlb(url: string, onProgress?: (progress: LoadProgress) => void): Promise<ArrayBuffer> {
  let response: Response;
  try {
    response = await fetch(url, { credentials: 'same-origin' });
  } catch {
    throw new ModelLoadError('The model file could not be fetched: the server did not answer.');
  }
  if (!response.ok) throw new ModelLoadError(`The model file could not be fetched (HTTP ${response.status}).`);
  const total = Number(response.headers.get('content-length')) || 0;
  if (response.body === null || total === 0) {
    onProgress?.({ phase: 'download', fraction: null });
    return response.arrayBuffer();
  }
  const bytes = new Uint8Array(total);
  const reader = response.body.getReader();
  let received = 0;
  for (let chunk = await reader.read(); !chunk.done; chunk = await reader.read()) {
    if (received + chunk.value.length > total) {
      await reader.cancel();
      throw new ModelLoadError('The model file was longer than the server announced; try loading it again.');
    }
    bytes.set(chunk.value, received);
    received += chunk.value.length;
    onProgress?.({ phase: 'download', fraction: received / total });
  }
  if (received !== total) throw new ModelLoadError('The model file arrived incomplete; try loading it again.');
  return bytes.buffer;
}
