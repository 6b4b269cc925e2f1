/** What the benchmark's page is asked to do and what it answers; shared by the page and the Node runner. */

export interface RunRequest {
  url: string;
  /** JSON list of the model's member GlobalIds. */
  idsUrl: string;
  frames: number;
  recolours: number;
}

export interface RunResult {
  load_ms: number;
  drawCalls: number;
  triangles: number;
  frame_ms: number;
  /** The CPU part of a frame: issuing it, without waiting for the GPU. */
  submit_ms: number;
  recolour_ms: number;
  recolourAndFrame_ms: number;
  programs: number;
}

export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}
