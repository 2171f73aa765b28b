import { existsSync } from "node:fs";
import { say } from "./log";
import { run } from "./shell";

let updated = false;

/** Installs Debian packages when `probePath` is missing; a no-op on a machine that has them. */
export function ensureDebianPackages(probePath: string, packages: string[]): void {
  if (existsSync(probePath)) return;
  say(`installing Debian packages: ${packages.join(" ")}`);
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  const sudo = process.getuid?.() === 0 ? [] : ["sudo"];
  const apt = (args: string[]) =>
    sudo.length ? run("sudo", ["apt-get", ...args], { env }) : run("apt-get", args, { env });
  if (!updated) {
    apt(["update", "-q"]);
    updated = true;
  }
  apt(["install", "-y", "-q", ...packages]);
  if (!existsSync(probePath)) throw new Error(`installed ${packages.join(" ")} but ${probePath} is still missing`);
}
