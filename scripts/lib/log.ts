export function say(message: string): void {
  process.stdout.write(`[hoebench] ${message}\n`);
}
