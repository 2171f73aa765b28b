/**
 * Items handed from one producer to one consumer that reads them as an async iterable, in
 * order; the producer never waits (a file's pieces are bounded by the upload limit).
 */
export class ChunkQueue<T> implements AsyncIterable<T> {
  private readonly items: T[] = [];
  private ended = false;
  private failure: Error | null = null;
  private wake: (() => void) | null = null;

  push(item: T): void {
    this.items.push(item);
    this.wake?.();
  }

  end(): void {
    this.ended = true;
    this.wake?.();
  }

  fail(error: Error): void {
    this.failure = error;
    this.wake?.();
  }

  async *[Symbol.asyncIterator](): AsyncGenerator<T> {
    let next = 0;
    for (;;) {
      if (this.failure) throw this.failure;
      if (next < this.items.length) {
        const item = this.items[next];
        // Read items are let go, so a large file is not held twice.
        this.items[next] = undefined as T;
        next += 1;
        yield item;
        continue;
      }
      if (this.ended) return;
      await new Promise<void>((resolve) => (this.wake = resolve));
      this.wake = null;
    }
  }
}
