/**
 * Progress of the start, test and benchmark scripts. On stderr: stdout is kept for what a
 * command answers with (the test summary line, a benchmark's JSON), which must come last.
 */
export function say(message: string): void {
  process.stderr.write(`[hoebench] ${message}\n`);
}
