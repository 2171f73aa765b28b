// Every R fixture names the script that really writes it (helpers.R write_fixture records the
// running script), so a reader can rerun it: the script exists and writes that fixture.
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { fixtureDirectory, loadFixture } from "./fixture-runner";

const root = path.resolve(__dirname, "../..");

describe("R fixture provenance", () => {
  for (const file of readdirSync(fixtureDirectory).filter((name) => name.endsWith(".json"))) {
    const name = file.replace(/\.json$/, "");
    it(`${file} names an existing generator that writes it`, () => {
      const match = /^(scripts\/r\/[\w-]+\.R) with R version /.exec(loadFixture(name).generated_by ?? "");
      expect(match, `${file}: generated_by`).not.toBeNull();
      const script = path.join(root, match![1]);
      expect(existsSync(script), `${match![1]} exists`).toBe(true);
      expect(readFileSync(script, "utf8")).toContain(`write_fixture("${name}"`);
    });
  }
});
