type TypedColumn = Int32Array | Float64Array;

/**
 * A column of numbers that grows as a file is read: a typed array doubled when full. Writing a
 * value is a store, where pushing onto a long JavaScript array costs several times more and
 * leaves the collector a large array to move each time it grows.
 */
export class ColumnBuilder<Column extends TypedColumn> {
  private data: Column;
  length = 0;

  constructor(private readonly make: (length: number) => Column) {
    this.data = make(1024);
  }

  push(value: number): void {
    if (this.length === this.data.length) {
      const larger = this.make(this.data.length * 2);
      larger.set(this.data);
      this.data = larger;
    }
    this.data[this.length++] = value;
  }

  /** The values so far (a view: later pushes may or may not show in it). */
  view(): Column {
    return this.data.subarray(0, this.length) as Column;
  }
}

export const intColumn = () => new ColumnBuilder((length) => new Int32Array(length));
export const floatColumn = () => new ColumnBuilder((length) => new Float64Array(length));
