import { spawnSync, type SpawnSyncOptions } from "node:child_process";

export function run(command: string, args: string[], options: SpawnSyncOptions = {}): string {
  const result = spawnSync(command, args, { encoding: "utf8", ...options });
  if (result.status !== 0) {
    const output = `${result.stdout ?? ""}${result.stderr ?? ""}`.trim();
    throw new Error(`${command} ${args.join(" ")} failed (exit ${result.status}): ${output}`);
  }
  return String(result.stdout ?? "");
}

export function succeeds(command: string, args: string[]): boolean {
  return spawnSync(command, args, { stdio: "ignore" }).status === 0;
}

export function commandExists(command: string): boolean {
  return succeeds("sh", ["-c", `command -v ${command}`]);
}
