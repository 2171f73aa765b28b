const LF = 10;
const CR = 13;
const QUOTE = 0x22;

/**
 * Counts the lines of a file's first part as its bytes pass, and tells whether the part can
 * be cut off at a line break: no quoted cell (a quote could hold a line break, so a byte count
 * of lines would not be papaparse's) and one kind of line break throughout, which is then the
 * kind papaparse guesses for the whole file.
 */
export class LineScan {
  /** Line breaks so far: the part's lines, when it ends with one. */
  lines = 0;
  private carriageReturns = 0;
  private pairs = 0;
  private quoted = false;
  private lastWasCarriageReturn = false;

  take(bytes: Uint8Array): void {
    if (this.quoted) return;
    if (bytes.indexOf(QUOTE) !== -1) {
      this.quoted = true;
      return;
    }
    // indexOf searches natively: about twice as fast as a loop over the bytes.
    for (let at = bytes.indexOf(LF); at !== -1; at = bytes.indexOf(LF, at + 1)) this.lines += 1;
    if (bytes.length > 0 && this.lastWasCarriageReturn && bytes[0] === LF) this.pairs += 1;
    if (bytes.indexOf(CR) !== -1) {
      for (let index = 0; index < bytes.length; index += 1) {
        if (bytes[index] !== CR) continue;
        this.carriageReturns += 1;
        if (bytes[index + 1] === LF) this.pairs += 1;
      }
    }
    if (bytes.length > 0) this.lastWasCarriageReturn = bytes[bytes.length - 1] === CR;
  }

  /** The part's one kind of line break, or null when it cannot be cut off safely. */
  newline(): "\n" | "\r\n" | null {
    if (this.quoted) return null;
    if (this.carriageReturns === 0) return "\n";
    return this.carriageReturns === this.pairs && this.pairs === this.lines ? "\r\n" : null;
  }
}
