/** At most `size` tasks at once in this process; the rest wait their turn in order. */
export class Semaphore {
  private active = 0;
  private waiting: (() => void)[] = [];

  constructor(readonly size: number) {}

  async run<T>(task: () => Promise<T>): Promise<T> {
    if (this.active >= this.size) await new Promise<void>((resolve) => this.waiting.push(resolve));
    else this.active++;
    try {
      return await task();
    } finally {
      const next = this.waiting.shift();
      if (next) next();
      else this.active--;
    }
  }
}
