/** Pending "hold the response" timers, tracked so shutdown can end them instead of waiting them out. */
export class Holds {
  private readonly pending = new Map<NodeJS.Timeout, () => void>();

  /** Resolves true after `ms`, or false if the stand-in closes first. */
  wait(ms: number): Promise<boolean> {
    return new Promise((resolve) => {
      const timer = setTimeout(() => {
        this.pending.delete(timer);
        resolve(true);
      }, ms);
      this.pending.set(timer, () => resolve(false));
    });
  }

  releaseAll(): void {
    for (const [timer, cancel] of this.pending) {
      clearTimeout(timer);
      cancel();
    }
    this.pending.clear();
  }
}
