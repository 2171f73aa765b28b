/**
 * `npm run --silent bench:stats` — median milliseconds per complete analysis
 * (ANOVA, all pairwise LSD and Tukey p-values, letters, Shapiro-Wilk,
 * Levene, via analyzeTrial) on synthetic trials from a seeded generator,
 * in process after warm-up. Contract: benchmarks.md; the last stdout line is
 * {"rcbd_12x6_full": ms, "rcbd_missing_12x6_full": ms, "combined_40x12x4": ms}.
 * With Rscript on the PATH it also times R doing the same work, for comparison.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { analyzeTrial, type TrialOptionsInput } from "../lib/stats";

type Row = Record<string, string | number | null>;

function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let value = state;
    value = Math.imul(value ^ (value >>> 15), value | 1);
    value ^= value + Math.imul(value ^ (value >>> 7), value | 61);
    return ((value ^ (value >>> 14)) >>> 0) / 4294967296;
  };
}

function normal(random: () => number): number {
  return Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
}

function rcbdRows(treatments: number, blocks: number, seed: number, lost = 0): Row[] {
  const random = seededRandom(seed);
  const effects = Array.from({ length: treatments }, () => 5 * normal(random));
  const rows: Row[] = [];
  for (let block = 1; block <= blocks; block++) {
    const blockEffect = 3 * normal(random);
    for (let treatment = 1; treatment <= treatments; treatment++) {
      const y = 100 + effects[treatment - 1] + blockEffect + 4 * normal(random);
      rows.push({ treatment: `T${treatment}`, block: `B${block}`, y: Math.round(y * 100) / 100 });
    }
  }
  for (let index = 0; index < lost; index++) rows[Math.floor((index + 0.5) * (rows.length / lost))].y = null;
  return rows;
}

function combinedRows(treatments: number, sites: number, blocks: number, seed: number): Row[] {
  const random = seededRandom(seed);
  const effects = Array.from({ length: treatments }, () => 0.4 * normal(random));
  const rows: Row[] = [];
  for (let site = 1; site <= sites; site++) {
    const siteEffect = normal(random);
    for (let block = 1; block <= blocks; block++) {
      const blockEffect = 0.3 * normal(random);
      for (let treatment = 1; treatment <= treatments; treatment++) {
        const y = 5 + siteEffect + blockEffect + effects[treatment - 1] + 0.2 * normal(random) + 0.35 * normal(random);
        rows.push({ treatment: `T${treatment}`, block: `B${block}`, site: `S${site}`, y: Math.round(y * 1000) / 1000 });
      }
    }
  }
  return rows;
}

function medianMilliseconds(rows: Row[], options: TrialOptionsInput, minimumRuns: number, budgetMs: number): number {
  for (let warm = 0; warm < Math.max(5, minimumRuns / 5); warm++) analyzeTrial(rows, options);
  const times: number[] = [];
  const start = performance.now();
  while (times.length < minimumRuns || (performance.now() - start < budgetMs && times.length < 2000)) {
    const begin = performance.now();
    analyzeTrial(rows, options);
    times.push(performance.now() - begin);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

function timeR(cases: Array<{ name: string; rows: Row[]; formula: string; siteTest: boolean }>): void {
  const check = spawnSync("Rscript", ["-e", "suppressPackageStartupMessages({library(emmeans); library(car)}); cat('ok')"], { encoding: "utf8" });
  if (check.stdout !== "ok") {
    console.log("R comparison skipped (Rscript with emmeans and car not available).");
    return;
  }
  const directory = mkdtempSync(path.join(os.tmpdir(), "hoebench-bench-"));
  for (const benchCase of cases) {
    const file = path.join(directory, `${benchCase.name}.csv`);
    const columns = Object.keys(benchCase.rows[0]);
    writeFileSync(file, [columns.join(","), ...benchCase.rows.map((row) => columns.map((column) => row[column] ?? "NA").join(","))].join("\n"));
    const script = `
      suppressPackageStartupMessages({library(emmeans); library(car)})
      d <- read.csv("${file}", colClasses = c(y = "numeric"), stringsAsFactors = TRUE); d <- na.omit(d)
      run <- function() {
        fit <- lm(${benchCase.formula}, data = d); a <- anova(fit)
        emm <- emmeans(fit, ~treatment); p1 <- summary(pairs(emm, adjust = "none")); p2 <- summary(pairs(emm, adjust = "tukey"))
        s <- shapiro.test(residuals(fit)); l <- leveneTest(y ~ treatment, data = d, center = median)
      }
      run(); n <- 0; times <- c(); start <- Sys.time()
      while (n < 3 || (as.numeric(Sys.time() - start, units = "secs") < 10 && n < 50)) {
        t0 <- Sys.time(); run(); times <- c(times, as.numeric(Sys.time() - t0, units = "secs") * 1000); n <- n + 1 }
      cat(median(times))`;
    const result = spawnSync("Rscript", ["-e", script], { encoding: "utf8", timeout: 300_000 });
    const milliseconds = Number(result.stdout.trim());
    console.log(`R (lm + anova + emmeans pairs none/tukey + shapiro.test + leveneTest), ${benchCase.name}: ${Number.isFinite(milliseconds) ? milliseconds.toFixed(1) : "failed"} ms median`);
  }
}

function main(): void {
  const rcbd = rcbdRows(12, 6, 20240501);
  const rcbdMissing = rcbdRows(12, 6, 20240502, 3);
  // combined_40x12x4 is 40 sites × 12 treatments × 4 blocks (issue 3); combinedRows takes (treatments, sites, blocks).
  const combined = combinedRows(12, 40, 4, 20240503);
  const rcbdOptions: TrialOptionsInput = { design: "rcbd", response: "y", treatment: "treatment", block: "block" };
  const combinedOptions: TrialOptionsInput = { ...rcbdOptions, site: "site" };
  console.error("synthetic data: rcbd 12 treatments x 6 blocks (72 plots); the same with 3 lost plots; combined 40 sites x 12 treatments x 4 blocks (1920 plots)");
  const results = {
    rcbd_12x6_full: medianMilliseconds(rcbd, rcbdOptions, 200, 3000),
    rcbd_missing_12x6_full: medianMilliseconds(rcbdMissing, rcbdOptions, 200, 3000),
    combined_40x12x4: medianMilliseconds(combined, combinedOptions, 20, 5000),
  };
  if (!process.argv.includes("--no-r")) {
    timeR([
      { name: "rcbd_12x6_full", rows: rcbd, formula: "y ~ block + treatment", siteTest: false },
      { name: "rcbd_missing_12x6_full", rows: rcbdMissing, formula: "y ~ block + treatment", siteTest: false },
      { name: "combined_40x12x4", rows: combined, formula: "terms(y ~ site + site:block + treatment + site:treatment, keep.order = TRUE)", siteTest: true },
    ]);
  }
  const rounded = Object.fromEntries(Object.entries(results).map(([key, value]) => [key, Math.round(value * 1000) / 1000]));
  console.log(JSON.stringify(rounded));
}

main();
