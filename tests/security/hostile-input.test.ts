import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { randomUUID } from "node:crypto";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Assessment, Photo, Plot, Site, Trial, User } from "@/models";
import { projectRoot } from "@/scripts/lib/environment";
import { testDatabase } from "../support/database";
import { testEnvironment } from "../support/environment";
import { TestClient, signedInAs } from "../support/http";

interface Endpoint {
  template: string;
  method: string;
}

// Public on purpose: each says why in its publicRoute(). The sign-in machinery is next-auth's.
const publicPrefixes = ["/api/health", "/api/register", "/api/auth/", "/api/library", "/api/password-reset", "/api/invitations/accept"];
// Written by reads or by the throttles themselves, so they are left out of "nothing was written".
const volatileTables = new Set(["rate_limit_hits", "job_runs", "schema_migrations"]);

function endpoints(): Endpoint[] {
  const found: Endpoint[] = [];
  const walk = (folder: string) => {
    for (const entry of readdirSync(folder, { withFileTypes: true })) {
      const full = path.join(folder, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name === "route.ts") {
        const source = readFileSync(full, "utf8");
        const template = `/${path.relative(path.join(projectRoot, "app"), path.dirname(full)).split(path.sep).join("/")}`;
        for (const match of source.matchAll(/export const (GET|POST|PUT|PATCH|DELETE)\b/g)) found.push({ template, method: match[1] });
      }
    }
  };
  walk(path.join(projectRoot, "app/api"));
  return found.filter((endpoint) => !endpoint.template.startsWith("/api/auth/"));
}

const isPublic = (template: string) => publicPrefixes.some((prefix) => template.startsWith(prefix));

async function databaseDigest(): Promise<Record<string, string>> {
  const client = new pg.Client({ connectionString: testEnvironment().databaseUrl });
  await client.connect();
  try {
    const tables = (await client.query<{ name: string }>("SELECT tablename AS name FROM pg_tables WHERE schemaname = 'public' ORDER BY 1")).rows.filter((table) => !volatileTables.has(table.name));
    const digest: Record<string, string> = {};
    for (const { name } of tables) {
      const result = await client.query<{ digest: string | null; count: number }>(`SELECT md5(string_agg(t::text, '|' ORDER BY t::text)) AS digest, count(*)::int AS count FROM "${name}" t`);
      digest[name] = `${result.rows[0].count}:${result.rows[0].digest}`;
    }
    return digest;
  } finally {
    await client.end();
  }
}

const huge = "x".repeat(2_000_000);
const hostileBodies: [string, string][] = [
  ["an array", "[]"],
  ["a bare string", '"hello"'],
  ["a number", "42"],
  ["null", "null"],
  ["broken JSON", '{"title": '],
  ["a prototype-pollution attempt", '{"__proto__": {"isAdmin": true}, "constructor": {"prototype": {"x": 1}}}'],
  ["unexpected fields only", '{"unexpected": "<script>alert(1)</script>", "drop": "1; DROP TABLE users; --"}'],
  ["wrong types everywhere", '{"trialId": 12, "assessmentId": [], "values": "lots", "name": {"$ne": null}, "email": true, "reason": 5}'],
  ["a 2 MB string", JSON.stringify({ title: huge, name: huge, reason: huge, caption: huge })],
];
const hostileParams = ["00000000-0000-0000-0000-000000000000", "..%2F..%2Fetc%2Fpasswd", "1%20OR%201%3D1", "%3Cscript%3E"];

let ids: Record<string, string> = {};

function fill(template: string, values: Record<string, string>): string {
  return template.replace(/\[(\.\.\.)?(\w+)\]/g, (_, __, name: string) => values[name] ?? randomUUID());
}

beforeAll(async () => {
  testDatabase();
  const trial = (await Trial.findOne({ where: { title: "Lettuce weed control: mulches, flame, cultivation and a solar weeding robot" } }))!;
  const assessment = (await Assessment.findOne({ where: { trialId: trial.id } }))!;
  const plot = (await Plot.findOne({ where: { trialId: trial.id } }))!;
  const owner = (await User.findByPk(trial.ownerId))!;
  const photo = await Photo.create({
    trialId: trial.id, plotId: plot.id, assessmentId: null, objectKey: `trials/${trial.id}/photos/${randomUUID()}`, thumbnailKey: `trials/${trial.id}/photos/t-${randomUUID()}`,
    contentType: "image/jpeg", sizeBytes: 10, status: "stored", uploadedById: owner.id,
  });
  ids = { trialId: trial.id, assessmentId: assessment.id, photoId: photo.id, size: "thumbnail", uploadId: randomUUID(), commentId: randomUUID(), followId: randomUUID(), invitationId: randomUUID() };
});

describe("every route handler", () => {
  const all = endpoints();

  it("is found: the suite covers the API", () => {
    expect(all.length).toBeGreaterThan(30);
  });

  it("answers 401 to signed-out requests unless it is public by design", async () => {
    const client = new TestClient();
    for (const endpoint of all.filter((entry) => !isPublic(entry.template))) {
      const response = await client.request(fill(endpoint.template, ids), { method: endpoint.method, headers: { "content-type": "application/json" }, body: endpoint.method === "GET" ? undefined : "{}" });
      expect(response.status, `${endpoint.method} ${endpoint.template}`).toBe(401);
      expect((await response.json()).error.code).toBe("UNAUTHENTICATED");
    }
  });

  it("answers hostile bodies and ids with a clear 4xx and writes nothing", async () => {
    const client = await signedInAs("researcher@hoebench.test");
    const before = await databaseDigest();
    for (const endpoint of all) {
      const label = `${endpoint.method} ${endpoint.template}`;
      if (endpoint.method !== "GET") {
        for (const [name, body] of hostileBodies) {
          const response = await client.request(fill(endpoint.template, ids), { method: endpoint.method, headers: { "content-type": "application/json" }, body });
          expect(response.status, `${label} with ${name}`).toBeGreaterThanOrEqual(400);
          expect(response.status, `${label} with ${name}`).toBeLessThan(500);
          const text = await response.text();
          expect(text, `${label} with ${name}`).not.toContain("<script>");
          expect(text.length, `${label} with ${name}: the answer is short`).toBeLessThan(20_000);
        }
      }
      if (endpoint.template.includes("[")) {
        for (const bad of hostileParams) {
          const url = endpoint.template.replace(/\[(\.\.\.)?(\w+)\]/g, (_, __, name: string) => (name === "size" ? "thumbnail" : bad));
          const response = await client.request(url, { method: endpoint.method, headers: { "content-type": "application/json" }, body: endpoint.method === "GET" ? undefined : "{}" });
          expect(response.status, `${label} with id ${bad}`).toBeGreaterThanOrEqual(400);
          expect(response.status, `${label} with id ${bad}`).toBeLessThan(500);
        }
      }
    }
    expect(await databaseDigest()).toEqual(before);
  }, 300_000);

  it("never serves another researcher's or a grower's request for this trial's resources", async () => {
    const trialScoped = all.filter((endpoint) => /\[(trialId|assessmentId|photoId)\]/.test(endpoint.template) && !isPublic(endpoint.template));
    const before = await databaseDigest();
    for (const email of ["researcher2@hoebench.test", "grower@hoebench.test"]) {
      const client = await signedInAs(email);
      for (const endpoint of trialScoped) {
        const response = await client.request(fill(endpoint.template, ids), { method: endpoint.method, headers: { "content-type": "application/json" }, body: endpoint.method === "GET" ? undefined : "{}" });
        // 422 where the (empty) body is checked before access: it says nothing about the trial either.
        expect([403, 404, 422], `${email}: ${endpoint.method} ${endpoint.template}`).toContain(response.status);
      }
      for (const [method, url, body] of [
        ["GET", `/api/exports?trialId=${ids.trialId}&kind=raw`, undefined],
        ["POST", "/api/uploads", JSON.stringify({ trialId: ids.trialId, assessmentId: ids.assessmentId, fileName: "x.csv", sizeBytes: 10 })],
        ["POST", "/api/plot-entries", JSON.stringify({ trialId: ids.trialId, assessmentId: ids.assessmentId, plotNumber: 101, values: [{ quadrat: 1, value: 1 }] })],
        ["POST", "/api/photos", JSON.stringify({ trialId: ids.trialId, plotNumber: 101, assessmentId: null, contentType: "image/jpeg", sizeBytes: 10, thumbnailBytes: 10 })],
      ] as const) {
        const response = await client.request(url, { method, headers: { "content-type": "application/json" }, body });
        expect([403, 404], `${email}: ${method} ${url}`).toContain(response.status);
      }
    }
    expect(await databaseDigest()).toEqual(before);
  }, 120_000);
});

describe("text with markup", () => {
  it("is stored as given and shown escaped", async () => {
    const client = await signedInAs("researcher@hoebench.test");
    const site = (await Site.findOne())!;
    const title = `<img src=x onerror=alert(1)> Lettuce & "quotes" ${Date.now()}`;
    const created = await client.request("/api/trials", { method: "POST", json: { title, crop: "<b>Lettuce</b>", season: "2027", siteId: site.id, objective: "<script>alert('x')</script>", plantingDate: null } });
    expect(created.status).toBe(201);
    const stored = await Trial.findOne({ where: { title } });
    expect(stored?.objective).toBe("<script>alert('x')</script>");
    const page = await client.request(`/trials/${stored!.id}`);
    const html = await page.text();
    expect(html).not.toContain("<img src=x onerror=alert(1)>");
    expect(html).not.toContain("<script>alert('x')</script>");
    expect(html).toContain("&lt;img src=x onerror=alert(1)&gt;");
    await stored!.destroy();
  });
});

afterAll(async () => {
  await Photo.destroy({ where: { id: ids.photoId } });
  await testDatabase().close();
});
