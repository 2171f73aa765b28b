// The analyze command's failure contract (analysis-cli.md): one-line reason on stderr, non-zero exit,
// nothing on stdout. Also checks lost plots (empty / NA) are dropped and labels stay text.
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeTrial, StatsInputError } from "@/lib/stats";
import { loadFixture } from "./fixture-runner";
import { expectClose } from "./helpers";

const root = path.resolve(__dirname, "../..");
const tsx = path.join(root, "node_modules/.bin/tsx");
const directory = mkdtempSync(path.join(os.tmpdir(), "hoebench-cli-"));

function run(csv: string, args: string[]) {
  const file = path.join(directory, `input-${Math.random().toString(36).slice(2)}.csv`);
  writeFileSync(file, csv);
  const result = spawnSync(tsx, [path.join(root, "scripts/analyze.ts"), file, ...args], { cwd: root, encoding: "utf8" });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

const good = "trt,blk,y\nA,1,3.1\nA,2,2.9\nB,1,4.2\nB,2,4.8\nC,1,5.0\nC,2,5.6\n";

function expectFailure(outcome: ReturnType<typeof run>, pattern: RegExp) {
  expect(outcome.status).not.toBe(0);
  expect(outcome.stdout).toBe("");
  expect(outcome.stderr.trim().split("\n")).toHaveLength(1);
  expect(outcome.stderr).toMatch(pattern);
}

describe("analyze CLI bad input", () => {
  it("unknown column", () => expectFailure(run(good, ["--design", "crd", "--response", "yield", "--treatment", "trt"]), /column "yield"/));
  it("fewer than two treatments", () =>
    expectFailure(run("trt,y\nA,1\nA,2\nA,3\n", ["--design", "crd", "--response", "y", "--treatment", "trt"]), /at least two treatments/));
  it("no residual degrees of freedom", () =>
    expectFailure(run("trt,y\nA,1\nB,2\n", ["--design", "crd", "--response", "y", "--treatment", "trt"]), /residual degrees of freedom/));
  it("non-numeric response with its row number", () =>
    expectFailure(run("trt,y\nA,1\nA,2\nB,abc\nB,3\n", ["--design", "crd", "--response", "y", "--treatment", "trt"]), /"abc".*row 3/));
  it("negative value under sqrt", () =>
    expectFailure(run("trt,y\nA,1\nA,-2\nB,4\nB,3\n", ["--design", "crd", "--response", "y", "--treatment", "trt", "--transform", "sqrt"]), /sqrt transform requires values >= 0/));
  it("rcbd without a block column", () => expectFailure(run(good, ["--design", "rcbd", "--response", "y", "--treatment", "trt"]), /rcbd requires --block/));
  it("unknown design", () => expectFailure(run(good, ["--design", "split", "--response", "y", "--treatment", "trt"]), /--design/));
  it("succeeds with lost plots (empty and NA dropped) and numeric-looking labels kept as text", () => {
    const outcome = run("trt,blk,y\n025,1,3.1\n025,2,\n50,1,4.2\n50,2,NA\n100,1,5.0\n100,2,5.6\n025,3,3.3\n50,3,4.0\n100,3,5.1\n", [
      "--design", "rcbd", "--response", "y", "--treatment", "trt", "--block", "blk",
    ]);
    expect(outcome.status).toBe(0);
    const result = JSON.parse(outcome.stdout);
    expect(result.n).toBe(7);
    expect(result.means.map((line: any) => line.treatment)).toEqual(["025", "50", "100"]);
    expect(result.lsd).toBeNull();
  });
});

describe("analyzeTrial option validation (same rules as the CLI)", () => {
  // R: anova(lm(y ~ t)) on these rows (scripts/r/option-validation.R, tests/fixtures/stats/option_validation.json).
  const reference = loadFixture("option_validation");
  const rows: Array<{ t: string; y: number }> = reference.t.map((t: string, index: number) => ({ t, y: reference.y[index] }));
  it("rejects invalid options with StatsInputError", () => {
    expect(() => analyzeTrial(rows, { design: "crd", response: "y", treatment: "t", alpha: 0.7 })).toThrow(StatsInputError);
    expect(() => analyzeTrial(rows, { design: "latin", response: "y", treatment: "t" })).toThrow(/latin square requires --row and --column/);
    expect(() => analyzeTrial(rows, { design: "crd", response: "y", treatment: "t", reference: "A" })).toThrow(/requires both --reference and --margin/);
  });
  it("accepts numbers as well as decimal strings", () => {
    const fromNumbers = analyzeTrial(rows, { design: "crd", response: "y", treatment: "t" });
    const fromText = analyzeTrial(rows.map((row) => ({ t: row.t, y: String(row.y) })), { design: "crd", response: "y", treatment: "t" });
    expect(fromText.anova).toEqual(fromNumbers.anova);
    // R anova(lm(y ~ t)): df 1 and 2, SS 6.25 and 2.5, MS 6.25 and 1.25, F 5, p 0.154845745271483
    const [treatment, residual] = fromNumbers.anova!;
    expect([treatment.df, residual.df]).toEqual(reference.df);
    expectClose(treatment.ss, reference.ss[0], 1e-14, 0, "R anova(lm(y ~ t)) Sum Sq t");
    expectClose(residual.ss, reference.ss[1], 1e-14, 0, "R anova(lm(y ~ t)) Sum Sq Residuals");
    expectClose(treatment.ms, reference.ms[0], 1e-14, 0, "R anova(lm(y ~ t)) Mean Sq t");
    expectClose(residual.ms, reference.ms[1], 1e-14, 0, "R anova(lm(y ~ t)) Mean Sq Residuals");
    expectClose(treatment.f as number, reference.f, 1e-14, 0, "R anova(lm(y ~ t)) F value");
    expectClose(treatment.p as number, reference.p, 1e-12, 0, "R anova(lm(y ~ t)) Pr(>F)");
  });
});
