/** Anything holding GPU memory or listeners: geometries, materials, textures, render targets, batches, controls. */
export interface Disposable {
  dispose(): void;
}

/**
 * three.js frees nothing on its own, and removing an object from the scene keeps its buffers on the GPU. Every
 * resource is registered here where it is created and released together: per model when the model changes, per
 * engine on teardown.
 */
export class GpuResources {
  private readonly items = new Set<Disposable>();

  track<T extends Disposable>(item: T): T {
    this.items.add(item);
    return item;
  }

  /** Disposes one resource now, e.g. an outline replaced by the next selection. */
  release(item: Disposable): void {
    if (this.items.delete(item)) item.dispose();
  }

  disposeAll(): void {
    for (const item of this.items) item.dispose();
    this.items.clear();
  }

  get size(): number {
    return this.items.size;
  }
}
