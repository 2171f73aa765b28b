/**
 * `npm run --silent bench:load`: a realistic mix against the production server and the demo
 * data: sign-in, trial pages, the results API, a 2,000-row CSV upload (register, presigned
 * PUT, check, commit), and the public library search, from 50 concurrent clients for 60 s.
 * Starts its own stack (test slot 7), cleans up, and prints one JSON object on the last line
 * (contract: benchmarks.md).
 */
import { writeFileSync } from "node:fs";
import os from "node:os";

process.env.HOEBENCH_TEST_SLOT = process.env.HOEBENCH_TEST_SLOT ?? "7";

const CLIENTS = Number(process.env.BENCH_CLIENTS ?? 50);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 60);
// Each client is a person: after an answer comes back they look at it before the next action.
// One second on average (0.5–1.5 s) is far quicker than people read a page; 0 hammers the server.
const THINK_MS = Number(process.env.BENCH_THINK_MS ?? 1000);
const log = (message: string) => process.stderr.write(`[bench:load] ${message}\n`);

type RouteName = "sign-in" | "trial list" | "trial page" | "results api" | "library search" | "csv upload";
const mix: [RouteName, number][] = [
  ["sign-in", 5],
  ["trial list", 15],
  ["trial page", 20],
  ["results api", 35],
  ["library search", 20],
  ["csv upload", 5],
];

const percentile = (sorted: number[], p: number) => (sorted.length ? Math.round(sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] * 10) / 10 : 0);

async function main(): Promise<void> {
  const { bringUp, startFakes, buildApp, serveApp } = await import("./lib/stack");
  const { stopChildren, shutdown } = await import("./lib/processes");
  const { portsFor } = await import("./lib/environment");
  const { commandCpuSeconds, groupCpuSeconds, machineTicks } = await import("./lib/process-cpu");
  const env = await bringUp("test");
  Object.assign(process.env, env);
  await startFakes("test", env);
  buildApp(env);
  // Served as `npm start` serves it, one worker per core.
  const server = await serveApp("test", env, { workers: Number(process.env.HOEBENCH_APP_WORKERS) || Math.min(4, os.availableParallelism()) });
  const base = `http://127.0.0.1:${portsFor("test").app}`;

  const { QueryTypes } = await import("sequelize");
  const { db } = await import("@/lib/db/sequelize");
  const { Assessment, Plot, Site, Treatment, Trial, User } = await import("@/models");
  const sequelize = db();
  const researcher = (await User.findOne({ where: { email: "researcher@hoebench.test" } }))!;
  const trials = await sequelize.query<{ id: string }>("SELECT id FROM trials WHERE owner_id = :owner AND status <> 'draft'", { replacements: { owner: researcher.id }, type: QueryTypes.SELECT });
  const analysed = await sequelize.query<{ trialId: string; id: string }>(
    `SELECT a.trial_id AS "trialId", a.id FROM assessments a JOIN trials t ON t.id = a.trial_id
      WHERE t.owner_id = :owner AND EXISTS (SELECT 1 FROM dataset_versions v WHERE v.assessment_id = a.id)`,
    { replacements: { owner: researcher.id }, type: QueryTypes.SELECT },
  );

  // A 500-plot trial whose assessment takes the 2,000-row file (4 quadrats a plot).
  const site = await Site.create({ name: "Load site", location: "Load", region: "Load", latitude: null, longitude: null, createdById: researcher.id });
  const trial = await Trial.create({ title: "Load trial", crop: "Lettuce", season: "2026", siteId: site.id, design: "rcbd", blocks: 20, plotLengthM: 6, plotWidthM: 1.5, harvestAreaM2: 4.5, quadratAreaM2: 0.25, plantingDate: null, randomSeed: 1, status: "active", ownerId: researcher.id });
  const treatments = await Treatment.bulkCreate(Array.from({ length: 25 }, (_, index) => ({ trialId: trial.id, position: index + 1, code: `T${index + 1}`, name: `Method ${index + 1}`, category: "hand" as const, checkType: null, labourHoursPerHa: null, materialCostPerHa: null, equipmentCost: null, equipmentLifeYears: null, equipmentHaPerYear: null })));
  await Plot.bulkCreate(Array.from({ length: 500 }, (_, index) => ({ trialId: trial.id, number: (Math.floor(index / 25) + 1) * 100 + (index % 25) + 1, block: Math.floor(index / 25) + 1, position: (index % 25) + 1, row: Math.floor(index / 25) + 1, column: (index % 25) + 1, walkOrder: index + 1, treatmentId: treatments[index % 25].id })));
  const assessment = await Assessment.create({ trialId: trial.id, position: 1, name: "Weed density", variable: "weed-density", unit: "plants per quadrat", plannedDate: null, timingDays: null, timingReference: null, quadratsPerPlot: 4, plausibleMin: 0, plausibleMax: 500 });
  const lines = ["plot,quadrat,species,value"];
  for (let block = 1; block <= 20; block += 1) for (let position = 1; position <= 25; position += 1) for (let quadrat = 1; quadrat <= 4; quadrat += 1) lines.push(`${block * 100 + position},${quadrat},,${(block * position + quadrat) % 30}`);
  const file = Buffer.from(lines.join("\n"));

  async function signIn(): Promise<string> {
    const jar = new Map<string, string>();
    const remember = (response: Response) => {
      for (const header of response.headers.getSetCookie()) {
        const [pair] = header.split(";");
        jar.set(pair.slice(0, pair.indexOf("=")), pair.slice(pair.indexOf("=") + 1));
      }
    };
    const csrf = await fetch(`${base}/api/auth/csrf`);
    remember(csrf);
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const answer = await fetch(`${base}/api/auth/callback/credentials`, {
      method: "POST",
      redirect: "manual",
      headers: { "content-type": "application/x-www-form-urlencoded", cookie: [...jar].map(([k, v]) => `${k}=${v}`).join("; ") },
      body: new URLSearchParams({ csrfToken, email: "researcher@hoebench.test", password: "hoebench-demo", json: "true" }).toString(),
    });
    remember(answer);
    await answer.arrayBuffer();
    if (![...jar.keys()].some((name) => name.endsWith("session-token"))) throw new Error("sign-in failed");
    return [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  }

  // BENCH_ONLY=<route name> drives one route alone, to see what each costs.
  const only = process.env.BENCH_ONLY as RouteName | undefined;
  const pick = (random: number): RouteName => {
    if (only) return only;
    const total = mix.reduce((sum, [, weight]) => sum + weight, 0);
    let point = random * total;
    for (const [name, weight] of mix) if ((point -= weight) < 0) return name;
    return mix[0][0];
  };
  const any = <T,>(list: T[]) => list[Math.floor(Math.random() * list.length)];

  async function once(route: RouteName, cookie: string): Promise<number> {
    const get = async (url: string) => {
      const response = await fetch(url, { headers: { cookie } });
      await response.arrayBuffer();
      return response.status;
    };
    switch (route) {
      case "sign-in":
        await signIn();
        return 200;
      case "trial list":
        return get(`${base}/trials`);
      case "trial page":
        return get(`${base}/trials/${any(trials).id}`);
      case "results api": {
        const target = any(analysed);
        return get(`${base}/api/analysis/${target.trialId}/${target.id}?transform=${any(["none", "sqrt"])}&method=${any(["lsd", "tukey"])}&alpha=0.05`);
      }
      case "library search":
        return get(`${base}/api/library?${any(["crop=Onion", "method=mulch", "q=hoe", "season=2025", ""])}`);
      case "csv upload": {
        const started = await fetch(`${base}/api/uploads`, { method: "POST", headers: { cookie, "content-type": "application/json" }, body: JSON.stringify({ trialId: trial.id, assessmentId: assessment.id, fileName: "load.csv", sizeBytes: file.byteLength }) });
        if (started.status !== 201) return started.status;
        const { uploadId, putUrl, contentType } = (await started.json()) as { uploadId: string; putUrl: string; contentType: string };
        const put = await fetch(putUrl, { method: "PUT", headers: { "content-type": contentType }, body: file });
        await put.arrayBuffer();
        if (!put.ok) return put.status;
        const check = await fetch(`${base}/api/uploads/${uploadId}/check`, { method: "POST", headers: { cookie } });
        await check.arrayBuffer();
        if (!check.ok) return check.status;
        const commit = await fetch(`${base}/api/uploads/${uploadId}/commit`, { method: "POST", headers: { cookie, "content-type": "application/json" }, body: "{}" });
        await commit.arrayBuffer();
        return commit.status;
      }
    }
  }

  log(`signing in ${CLIENTS} clients`);
  const cookies = await Promise.all(Array.from({ length: CLIENTS }, () => signIn()));
  const times = new Map<RouteName, number[]>(mix.map(([name]) => [name, []]));
  let errors = 0;
  let non2xx = 0;
  let requests = 0;
  // Untimed warm-up: each route a few times, so every app worker has loaded its code before the clock starts.
  for (const [route] of mix) for (let round = 0; round < 4; round += 1) if (!only || route === only) await once(route, cookies[0]);
  const deadline = Date.now() + SECONDS * 1000;
  log(`${CLIENTS} clients for ${SECONDS} s`);
  const started = performance.now();
  // BENCH_TRACE=<file> keeps every request's route, start and duration, to find what slows the others.
  const trace: [RouteName, number, number][] | undefined = process.env.BENCH_TRACE ? [] : undefined;
  const serverCpuBefore = groupCpuSeconds(server.pid!);
  const databaseCpuBefore = commandCpuSeconds("postgres");
  const machineBefore = machineTicks();
  await Promise.all(
    cookies.map(async (cookie) => {
      // People do not all click at the same instant: each starts after a first look of its own.
      if (THINK_MS > 0) await new Promise((resolve) => setTimeout(resolve, THINK_MS * 1.5 * Math.random()));
      while (Date.now() < deadline) {
        const route = pick(Math.random());
        const begin = performance.now();
        try {
          const status = await once(route, cookie);
          if (status < 200 || status >= 300) non2xx += 1;
        } catch {
          errors += 1;
        }
        times.get(route)!.push(performance.now() - begin);
        trace?.push([route, Math.round(begin - started), Math.round(performance.now() - begin)]);
        requests += 1;
        if (THINK_MS > 0) await new Promise((resolve) => setTimeout(resolve, THINK_MS * (0.5 + Math.random())));
      }
    }),
  );
  const elapsed = (performance.now() - started) / 1000;
  if (trace) writeFileSync(process.env.BENCH_TRACE!, JSON.stringify(trace));
  const perRequest = (seconds: number) => ((seconds * 1000) / requests).toFixed(2);
  const machineAfter = machineTicks();
  log(`machine busy ${(((machineAfter.busy - machineBefore.busy) / (machineAfter.total - machineBefore.total)) * 100).toFixed(0)}% of ${os.availableParallelism()} cores; this driver used ${(process.cpuUsage().user / 1e6 + process.cpuUsage().system / 1e6).toFixed(1)} s of CPU in all`);
  log(`CPU per request: app ${perRequest(groupCpuSeconds(server.pid!) - serverCpuBefore)} ms, PostgreSQL ${perRequest(commandCpuSeconds("postgres") - databaseCpuBefore)} ms (${requests} requests)`);
  await sequelize.query("DELETE FROM trials WHERE id = :id", { replacements: { id: trial.id } });
  await sequelize.query("DELETE FROM sites WHERE id = :id", { replacements: { id: site.id } });
  await sequelize.close();
  const serverStopped = new Promise((resolve) => server.once("exit", resolve));
  stopChildren();
  // Let the app finish shutting down (and write any profile it was asked for) before the database goes.
  await Promise.race([serverStopped, new Promise((resolve) => setTimeout(resolve, 10_000))]);
  const routes = Object.fromEntries(
    [...times].map(([name, list]) => {
      const sorted = [...list].sort((a, b) => a - b);
      return [name, { p50Ms: percentile(sorted, 50), p95Ms: percentile(sorted, 95), p99Ms: percentile(sorted, 99), requests: list.length }];
    }),
  );
  // Last, after whatever clean-up prints.
  shutdown(0, JSON.stringify({ requestsPerSecond: Math.round((requests / elapsed) * 10) / 10, errors, non2xx, clients: CLIENTS, seconds: SECONDS, thinkTimeMs: THINK_MS, routes }));
}

main().catch((error: Error) => {
  process.stderr.write(`[bench:load] ${error.stack ?? error.message}\n`);
  process.exit(1);
});
