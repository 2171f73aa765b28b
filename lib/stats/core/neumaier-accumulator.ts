/**
 * Running compensated sum (Neumaier) for loops that cannot build an array
 * first, e.g. sums of squared deviations over cells of a design.
 *
 * Reference: Neumaier, A. (1974) ZAMM 54:39-51.
 *
 * @example
 * const sum = new NeumaierAccumulator();
 * sum.add(1e16); sum.add(1); sum.add(-1e16);
 * sum.value() // 1
 */
export class NeumaierAccumulator {
  private sum = 0;
  private correction = 0;

  add(value: number): void {
    const total = this.sum + value;
    if (Math.abs(this.sum) >= Math.abs(value)) this.correction += this.sum - total + value;
    else this.correction += value - total + this.sum;
    this.sum = total;
  }

  value(): number {
    return this.sum + this.correction;
  }
}
