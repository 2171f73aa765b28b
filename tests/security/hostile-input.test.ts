import { readdirSync, readFileSync } from "node:fs";
import net from "node:net";
import path from "node:path";
import { randomBytes, randomUUID } from "node:crypto";
import pg from "pg";
import { QueryTypes } from "sequelize";
import { createElement } from "react";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { renderPlotMapSvg } from "@/components/field/PlotMap";
import { buildResults } from "@/lib/analysis/build-results";
import { DEMO_PASSWORD } from "@/lib/demo/scenario";
import { qrSvg } from "@/lib/layout/qr";
import { renderStaticMarkup } from "@/lib/layout/static-markup";
import { meansChartSvg } from "@/lib/reports/means-svg";
import { MAX_JSON_BODY_BYTES } from "@/lib/security/request-body";
import { analysisOptionsSchema } from "@/lib/validations/analysis";
import { Assessment, DatasetVersion, Follow, Invitation, Membership, Photo, Plot, ReviewComment, ReviewRequest, Site, Trial, TrialSummary, Upload, User } from "@/models";
import { projectRoot } from "@/scripts/lib/environment";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { sampleMapProps } from "../layout/fixtures";
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
  await Follow.destroy({ where: { id: createdFollowIds } });
  await User.destroy({ where: { email: createdUserEmails } });
  await removeTrialFixtures();
  const sequelize = testDatabase();
  for (const trialId of createdTrialIds) await sequelize.query("DELETE FROM trials WHERE id = :trialId", { replacements: { trialId } });
  for (const siteId of createdSiteIds) await sequelize.query("DELETE FROM sites WHERE id = :siteId", { replacements: { siteId } });
  await testDatabase().close();
});

// ---------------------------------------------------------------------------------------------
// Request bodies past the limit
// ---------------------------------------------------------------------------------------------

const stamp = Date.now();
const createdFollowIds: string[] = [];
const createdUserEmails: string[] = [];
const createdTrialIds: string[] = [];
const createdSiteIds: string[] = [];

/** A session cookie to send by hand, for the bare-socket requests below. */
async function sessionCookie(email: string): Promise<string> {
  const base = testEnvironment().baseUrl;
  const csrf = await fetch(new URL("/api/auth/csrf", base));
  const csrfCookie = csrf.headers.getSetCookie().map((cookie) => cookie.split(";")[0]).join("; ");
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const answer = await fetch(new URL("/api/auth/callback/credentials", base), {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: csrfCookie },
    body: new URLSearchParams({ csrfToken, email, password: DEMO_PASSWORD, json: "true" }).toString(),
  });
  const session = answer.headers.getSetCookie().map((cookie) => cookie.split(";")[0]).find((cookie) => cookie.startsWith("next-auth.session-token="));
  if (!session) throw new Error(`could not sign in as ${email}`);
  return session;
}

/** Whether a whole HTTP/1.1 answer (head and body, by its length or its last chunk) has arrived. */
function wholeAnswer(received: Buffer): boolean {
  const text = received.toString("latin1");
  const headEnd = text.indexOf("\r\n\r\n");
  if (headEnd < 0) return false;
  const head = text.slice(0, headEnd).toLowerCase();
  const body = text.slice(headEnd + 4);
  const length = /\r\ncontent-length:\s*(\d+)/.exec(head);
  if (length) return body.length >= Number(length[1]);
  return /\r\ntransfer-encoding:\s*chunked/.test(head) && body.endsWith("0\r\n\r\n");
}

interface RawAnswer {
  status: number;
  text: string;
  elapsedMs: number;
  bodyBytesSent: number;
}

/**
 * HTTP/1.1 over a bare socket: fetch will not send a Content-Length its body does not match,
 * nor keep a body flowing while the answer comes back. `feed` writes body bytes until the
 * answer has arrived (its write then says false) or it runs out.
 */
function rawRequest(method: string, pathname: string, headers: Record<string, string>, feed: (write: (chunk: Buffer) => Promise<boolean>) => Promise<void>): Promise<RawAnswer> {
  const base = new URL(testEnvironment().baseUrl);
  return new Promise((resolve, reject) => {
    const started = Date.now();
    let received = Buffer.alloc(0);
    let bodyBytesSent = 0;
    let done = false;
    const socket = net.connect(Number(base.port), base.hostname);
    const finish = (error?: Error) => {
      if (done) return;
      done = true;
      clearTimeout(timer);
      socket.destroy();
      if (error) reject(error);
      else resolve({ status: Number(received.toString("latin1").slice(9, 12)), text: received.toString("latin1"), elapsedMs: Date.now() - started, bodyBytesSent });
    };
    const timer = setTimeout(() => finish(new Error(`${method} ${pathname}: no answer within 20 s`)), 20_000);
    socket.on("data", (chunk: Buffer) => {
      received = Buffer.concat([received, chunk]);
      if (wholeAnswer(received)) finish();
    });
    socket.on("close", () => finish(received.length > 0 ? undefined : new Error(`${method} ${pathname}: closed without an answer`)));
    socket.on("error", () => {});
    const write = (chunk: Buffer) =>
      new Promise<boolean>((written) => {
        if (done) return written(false);
        bodyBytesSent += chunk.length;
        if (socket.write(chunk)) written(true);
        else socket.once("drain", () => written(!done));
      });
    socket.on("connect", () => {
      const head = [`${method} ${pathname} HTTP/1.1`, `Host: ${base.host}`, ...Object.entries(headers).map(([name, value]) => `${name}: ${value}`), "", ""].join("\r\n");
      socket.write(head);
      feed(write).catch(() => {});
    });
  });
}

const chunkFrame = (data: Buffer) => Buffer.concat([Buffer.from(`${data.length.toString(16)}\r\n`), data, Buffer.from("\r\n")]);

describe("request bodies past the limit", () => {
  const GIGABYTE = 1024 ** 3;

  it("a 1 GB Content-Length is refused at once with 413, on public and signed-in routes, and nothing is written", async () => {
    const cookie = await sessionCookie("researcher@hoebench.test");
    const before = await databaseDigest();
    const claims: [string, string, Record<string, string>][] = [
      ["sign-up", "/api/register", { "content-type": "application/json" }],
      ["password reset", "/api/password-reset", { "content-type": "application/json" }],
      ["invitation acceptance", "/api/invitations/accept", { "content-type": "application/json" }],
      ["sign-in", "/api/auth/callback/credentials", { "content-type": "application/x-www-form-urlencoded" }],
      ["a signed-in route", "/api/trials", { "content-type": "application/json", cookie }],
    ];
    for (const [label, pathname, headers] of claims) {
      const answer = await rawRequest("POST", pathname, { ...headers, "content-length": String(GIGABYTE) }, async (write) => {
        await write(Buffer.from('{"name": "'));
      });
      expect(answer.status, `${label}: ${answer.text.slice(0, 300)}`).toBe(413);
      expect(answer.text, label).toContain('"code":"PAYLOAD_TOO_LARGE"');
      // At once: not after waiting for (or timing out on) the gigabyte it was promised.
      expect(answer.elapsedMs, label).toBeLessThan(5000);
    }
    expect(await databaseDigest()).toEqual(before);
  });

  it("a body without a Content-Length stops being read once it passes the limit", async () => {
    const cookie = await sessionCookie("researcher@hoebench.test");
    const offered = 64 * 1024 * 1024;
    const block = Buffer.alloc(64 * 1024, "a");
    for (const [label, pathname, headers] of [
      ["sign-up", "/api/register", {}],
      ["a signed-in route", "/api/trials", { cookie }],
    ] as [string, string, Record<string, string>][]) {
      const answer = await rawRequest("POST", pathname, { ...headers, "content-type": "application/json", "transfer-encoding": "chunked" }, async (write) => {
        if (!(await write(chunkFrame(Buffer.from('{"name": "'))))) return;
        for (let sent = 0; sent < offered; sent += block.length) if (!(await write(chunkFrame(block)))) return;
        await write(Buffer.from("0\r\n\r\n"));
      });
      expect(answer.status, `${label}: ${answer.text.slice(0, 300)}`).toBe(413);
      expect(answer.text, label).toContain('"code":"PAYLOAD_TOO_LARGE"');
      // The answer came while most of the 64 MB offered was still unsent.
      expect(answer.bodyBytesSent, label).toBeLessThan(offered / 4);
    }
  });

  it("a 2 MB JSON body gets 413 with a plain message, and nothing is written", async () => {
    const researcher = await signedInAs("researcher@hoebench.test");
    const filler = "x".repeat(2 * 1024 * 1024);
    const before = await databaseDigest();
    const attempts: [TestClient, string, unknown][] = [
      [researcher, "/api/trials", { title: filler, crop: "Lettuce", season: "2027", siteId: randomUUID(), objective: "", plantingDate: null }],
      [new TestClient(), "/api/register", { name: filler, email: `big-${stamp}@hoebench.test`, password: "a-long-enough-password", confirmPassword: "a-long-enough-password" }],
      [new TestClient(), "/api/invitations/accept", { token: filler }],
    ];
    for (const [client, pathname, body] of attempts) {
      const response = await client.request(pathname, { method: "POST", json: body });
      expect(response.status, pathname).toBe(413);
      expect(await response.json(), pathname).toEqual({
        error: { code: "PAYLOAD_TOO_LARGE", message: "The request is larger than 1 MB, the most this app accepts in one request. Nothing was saved." },
      });
    }
    expect(await databaseDigest()).toEqual(before);
  });

  it("a body just under the limit is still read and checked as usual", async () => {
    const researcher = await signedInAs("researcher@hoebench.test");
    const body = JSON.stringify({ title: "x".repeat(MAX_JSON_BODY_BYTES - 200), crop: "Lettuce", season: "2027", siteId: randomUUID(), objective: "", plantingDate: null });
    expect(Buffer.byteLength(body)).toBeLessThanOrEqual(MAX_JSON_BODY_BYTES);
    const response = await researcher.request("/api/trials", { method: "POST", headers: { "content-type": "application/json" }, body });
    expect(response.status).toBe(422);
    expect((await response.json()).error.fields).toContainEqual({ path: "title", message: "Use at most 200 characters." });
  });
});

// ---------------------------------------------------------------------------------------------
// Ids of other people's records
// ---------------------------------------------------------------------------------------------

interface Probe {
  method: string;
  /** The route file's address, for the coverage check. */
  template: string;
  url: string;
  body?: unknown;
}

describe("ids of other people's records (IDOR)", () => {
  let victim: TrialFixture;
  let probes: Probe[] = [];
  let records = { upload: "", photo: "", comment: "", invitation: "", follow: "" };

  beforeAll(async () => {
    // A real trial of researcher@ with one record of every kind, none shared with the probers.
    victim = await createTrialFixture({ ownerEmail: "researcher@hoebench.test" });
    const trialId = victim.trial.id;
    const assessmentId = victim.assessment.id;
    const ownerId = victim.owner.id;
    const uploadId = randomUUID();
    await Upload.create({
      id: uploadId, trialId, assessmentId, objectKey: `trials/${trialId}/assessments/${assessmentId}/uploads/${uploadId}.csv`, originalName: "density.csv",
      declaredSizeBytes: 100, sizeBytes: 100, sha256: "0".repeat(64), status: "checked", rowCount: 24, uploadedById: ownerId, versionId: null,
    });
    const photo = await Photo.create({
      trialId, plotId: victim.plots[0].id, assessmentId, objectKey: `trials/${trialId}/photos/${randomUUID()}`, thumbnailKey: `trials/${trialId}/photos/t-${randomUUID()}`,
      contentType: "image/jpeg", sizeBytes: 10, status: "stored", uploadedById: ownerId,
    });
    const comment = await ReviewComment.create({ trialId, assessmentId: null, parentId: null, authorId: ownerId, body: "Block 2 looks weedier than the rest." });
    await ReviewRequest.create({ trialId, requestedById: ownerId, message: "Please read the density results." });
    await TrialSummary.create({ trialId, editedText: "The owner's own words.", publishedText: null, generatedText: null, numbers: null, publishedAt: null, publishedById: null, updatedById: ownerId });
    const invitation = await Invitation.create({
      trialId, email: `invited-${stamp}@hoebench.test`, role: "technician", tokenHash: randomBytes(32).toString("hex"), invitedById: ownerId, expiresAt: new Date(Date.now() + 7 * 86_400_000),
    });
    const follow = await Follow.create({ userId: ownerId, kind: "crop", value: `idor-crop-${stamp}` });
    createdFollowIds.push(follow.id);
    records = { upload: uploadId, photo: photo.id, comment: comment.id, invitation: invitation.id, follow: follow.id };
    const technician = (await User.findOne({ where: { email: "technician@hoebench.test" } }))!;

    const t = `/api/trials/${trialId}`;
    probes = [
      { method: "GET", template: "/api/trials/[trialId]", url: t },
      { method: "PATCH", template: "/api/trials/[trialId]", url: t, body: { title: "Taken over", crop: "Lettuce", season: "2026", siteId: victim.trial.siteId, objective: "", plantingDate: null } },
      { method: "PUT", template: "/api/trials/[trialId]/design", url: `${t}/design`, body: { design: "rcbd", blocks: 4, plotLengthM: 6, plotWidthM: 1.5, harvestAreaM2: 4.5, quadratAreaM2: 0.25, serpentine: false, randomSeed: 7 } },
      { method: "GET", template: "/api/trials/[trialId]/treatments", url: `${t}/treatments` },
      { method: "PUT", template: "/api/trials/[trialId]/treatments", url: `${t}/treatments`, body: { treatments: [{ code: "T1", name: "Weedy check", category: "check", checkType: "weedy" }, { code: "T2", name: "Hoeing", category: "hand", checkType: null }] } },
      { method: "GET", template: "/api/trials/[trialId]/assessments", url: `${t}/assessments` },
      { method: "PUT", template: "/api/trials/[trialId]/assessments", url: `${t}/assessments`, body: { assessments: [{ name: "Weed density", variable: "weed-density", unit: "plants per quadrat", plannedDate: null, timingDays: null, timingReference: null, quadratsPerPlot: 2 }] } },
      { method: "GET", template: "/api/trials/[trialId]/assessments/[assessmentId]/sheet", url: `${t}/assessments/${assessmentId}/sheet?format=long` },
      { method: "GET", template: "/api/trials/[trialId]/team", url: `${t}/team` },
      // Adding oneself to the team is the takeover an outsider would try first.
      { method: "PUT", template: "/api/trials/[trialId]/team", url: `${t}/team`, body: { members: [{ userId: technician.id, role: "technician" }] } },
      { method: "GET", template: "/api/trials/[trialId]/plots", url: `${t}/plots` },
      { method: "GET", template: "/api/trials/[trialId]/map", url: `${t}/map` },
      { method: "POST", template: "/api/trials/[trialId]/randomize", url: `${t}/randomize`, body: { newSeed: true } },
      { method: "POST", template: "/api/trials/[trialId]/status", url: `${t}/status`, body: { status: "draft" } },
      { method: "GET", template: "/api/analysis/[trialId]/[assessmentId]", url: `/api/analysis/${trialId}/${assessmentId}` },
      { method: "POST", template: "/api/uploads", url: "/api/uploads", body: { trialId, assessmentId, fileName: "density.csv", sizeBytes: 100 } },
      { method: "POST", template: "/api/uploads/[uploadId]/check", url: `/api/uploads/${uploadId}/check` },
      { method: "POST", template: "/api/uploads/[uploadId]/commit", url: `/api/uploads/${uploadId}/commit`, body: { reason: "Corrected counts" } },
      { method: "POST", template: "/api/plot-entries", url: "/api/plot-entries", body: { trialId, assessmentId, plotNumber: victim.plots[0].number, values: [{ quadrat: 1, value: 3 }] } },
      { method: "POST", template: "/api/photos", url: "/api/photos", body: { trialId, plotNumber: victim.plots[0].number, assessmentId, contentType: "image/jpeg", sizeBytes: 10, thumbnailBytes: 10, caption: "" } },
      { method: "POST", template: "/api/photos/[photoId]/confirm", url: `/api/photos/${photo.id}/confirm` },
      { method: "GET", template: "/api/photos/[photoId]/[size]", url: `/api/photos/${photo.id}/thumbnail` },
      { method: "GET", template: "/api/photos/[photoId]/[size]", url: `/api/photos/${photo.id}/original` },
      { method: "POST", template: "/api/reviews/[trialId]/comments", url: `/api/reviews/${trialId}/comments`, body: { body: "Looks fine to me." } },
      { method: "PATCH", template: "/api/reviews/[trialId]/comments/[commentId]", url: `/api/reviews/${trialId}/comments/${comment.id}`, body: { resolved: true } },
      { method: "POST", template: "/api/reviews/[trialId]/request", url: `/api/reviews/${trialId}/request`, body: { message: "Please review." } },
      { method: "DELETE", template: "/api/reviews/[trialId]/request", url: `/api/reviews/${trialId}/request` },
      { method: "POST", template: "/api/reviews/[trialId]/approve", url: `/api/reviews/${trialId}/approve`, body: { note: "Approved." } },
      { method: "GET", template: "/api/summaries/[trialId]", url: `/api/summaries/${trialId}` },
      { method: "PUT", template: "/api/summaries/[trialId]", url: `/api/summaries/${trialId}`, body: { text: "Someone else's words." } },
      { method: "POST", template: "/api/summaries/[trialId]/publish", url: `/api/summaries/${trialId}/publish`, body: {} },
      { method: "GET", template: "/api/invitations", url: `/api/invitations?trialId=${trialId}` },
      { method: "POST", template: "/api/invitations", url: "/api/invitations", body: { trialId, email: `accomplice-${stamp}@hoebench.test`, role: "technician" } },
      { method: "DELETE", template: "/api/invitations/[invitationId]", url: `/api/invitations/${invitation.id}` },
      { method: "POST", template: "/api/invitations/[invitationId]/resend", url: `/api/invitations/${invitation.id}/resend` },
      { method: "DELETE", template: "/api/follows/[followId]", url: `/api/follows/${follow.id}` },
      { method: "GET", template: "/api/exports", url: `/api/exports?trialId=${trialId}&kind=raw` },
      { method: "GET", template: "/api/exports", url: `/api/exports?trialId=${trialId}&assessmentId=${assessmentId}&kind=plot` },
      { method: "GET", template: "/api/reports/[trialId]/export", url: `/api/reports/${trialId}/export?format=csv` },
      { method: "GET", template: "/api/reports/[trialId]/pdf", url: `/api/reports/${trialId}/pdf` },
      // Public, but only for published trials: this one is not.
      { method: "GET", template: "/api/library/[trialId]/data", url: `/api/library/${trialId}/data` },
      { method: "GET", template: "/api/library/[trialId]/report", url: `/api/library/${trialId}/report` },
    ];
  });

  it("are probed at every route that takes an id in its address", () => {
    const probed = new Set(probes.map((probe) => `${probe.method} ${probe.template}`));
    const withIds = endpoints().filter((endpoint) => endpoint.template.includes("[")).map((endpoint) => `${endpoint.method} ${endpoint.template}`);
    expect(withIds.length).toBeGreaterThan(20);
    expect(withIds.filter((route) => !probed.has(route))).toEqual([]);
  });

  for (const email of ["technician@hoebench.test", "reviewer@hoebench.test", "researcher2@hoebench.test", "grower@hoebench.test"]) {
    it(`are refused to ${email} (outside the trial) with 403 or 404, even with a valid body, and nothing is written`, async () => {
      const client = await signedInAs(email);
      const before = await databaseDigest();
      for (const probe of probes) {
        const response = await client.request(probe.url, { method: probe.method, ...(probe.body !== undefined ? { json: probe.body } : {}) });
        const text = await response.text();
        const label = `${email}: ${probe.method} ${probe.url} → ${response.status} ${text.slice(0, 200)}`;
        expect([403, 404], label).toContain(response.status);
        expect(text, label).not.toContain(victim.trial.title);
      }
      expect(await databaseDigest()).toEqual(before);
      // The records are still there, untouched.
      expect((await Upload.findByPk(records.upload))?.status).toBe("checked");
      expect((await ReviewComment.findByPk(records.comment))?.resolvedAt).toBeNull();
      expect((await Invitation.findByPk(records.invitation))?.revokedAt).toBeNull();
      expect(await Follow.findByPk(records.follow)).not.toBeNull();
      expect(await Membership.count({ where: { trialId: victim.trial.id } })).toBe(0);
    }, 120_000);
  }

  it("are refused when sent along with a trial the prober may use", async () => {
    const own = (await Trial.findOne({ where: { title: "Lettuce weed control: mulches, flame, cultivation and a solar weeding robot" } }))!;
    const ownPlot = (await Plot.findOne({ where: { trialId: own.id } }))!;
    const foreignAssessment = victim.assessment.id;
    const technician = await signedInAs("technician@hoebench.test");
    const reviewer = await signedInAs("reviewer@hoebench.test");
    const before = await databaseDigest();
    const mixed: [TestClient, Probe][] = [
      [technician, { method: "POST", template: "", url: "/api/uploads", body: { trialId: own.id, assessmentId: foreignAssessment, fileName: "density.csv", sizeBytes: 100 } }],
      [technician, { method: "POST", template: "", url: "/api/plot-entries", body: { trialId: own.id, assessmentId: foreignAssessment, plotNumber: ownPlot.number, values: [{ quadrat: 1, value: 3 }] } }],
      [technician, { method: "POST", template: "", url: "/api/photos", body: { trialId: own.id, plotNumber: ownPlot.number, assessmentId: foreignAssessment, contentType: "image/jpeg", sizeBytes: 10, thumbnailBytes: 10, caption: "" } }],
      [technician, { method: "GET", template: "", url: `/api/exports?trialId=${own.id}&assessmentId=${foreignAssessment}&kind=raw` }],
      [technician, { method: "GET", template: "", url: `/api/exports?trialId=${own.id}&assessmentId=${foreignAssessment}&kind=plot` }],
      [technician, { method: "GET", template: "", url: `/api/analysis/${own.id}/${foreignAssessment}` }],
      [technician, { method: "GET", template: "", url: `/api/trials/${own.id}/assessments/${foreignAssessment}/sheet` }],
      [reviewer, { method: "PATCH", template: "", url: `/api/reviews/${own.id}/comments/${records.comment}`, body: { resolved: true } }],
    ];
    for (const [client, probe] of mixed) {
      const response = await client.request(probe.url, { method: probe.method, ...(probe.body !== undefined ? { json: probe.body } : {}) });
      const text = await response.text();
      expect([403, 404], `${probe.method} ${probe.url} → ${response.status} ${text.slice(0, 200)}`).toContain(response.status);
    }
    // A comment names its assessment and the comment it answers in the body; lib/reviews refuses
    // another trial's as invalid input, which tells no more than a 404 would.
    for (const [body, message] of [
      [{ body: "A reply.", parentId: records.comment }, "The comment you reply to is not in this trial."],
      [{ body: "About that assessment.", assessmentId: foreignAssessment }, "That assessment is not part of this trial."],
    ] as const) {
      const response = await reviewer.request(`/api/reviews/${own.id}/comments`, { method: "POST", json: body });
      expect(response.status).toBe(422);
      expect((await response.json()).error.message).toBe(message);
    }
    expect(await databaseDigest()).toEqual(before);
  }, 60_000);
});

// ---------------------------------------------------------------------------------------------
// Markup in every text field reachable over HTTP
// ---------------------------------------------------------------------------------------------

/** One payload per field, so each check is about that field alone; without quotes React escapes exactly < and >. */
const markup = (field: string) => `<script>hb_${field}()</script>`;

function expectShownEscaped(html: string, field: string): void {
  expect(html, `${field}: the raw markup is in the page`).not.toContain(markup(field));
  expect(html, `${field}: the escaped text is not in the page`).toContain(`&lt;script&gt;hb_${field}()&lt;/script&gt;`);
}

async function pageHtml(client: TestClient, pathname: string): Promise<string> {
  const response = await client.request(pathname);
  expect(response.status, pathname).toBe(200);
  return response.text();
}

describe("markup in more text fields", () => {
  it("site, treatment and assessment names: stored as given, shown escaped on the trial page", async () => {
    const researcher = await signedInAs("researcher@hoebench.test");
    const site = await researcher.request("/api/sites", { method: "POST", json: { name: markup("site"), location: "Bed 3", region: "Test region" } });
    expect(site.status).toBe(201);
    const siteId = (await site.json()).id as string;
    createdSiteIds.push(siteId);
    const created = await researcher.request("/api/trials", { method: "POST", json: { title: `Markup trial ${stamp}`, crop: "Lettuce", season: "2027", siteId, objective: "", plantingDate: null } });
    expect(created.status).toBe(201);
    const trialId = (await created.json()).id as string;
    createdTrialIds.push(trialId);
    const treatments = await researcher.request(`/api/trials/${trialId}/treatments`, {
      method: "PUT",
      json: { treatments: [{ code: "T1", name: markup("treatment"), category: "check", checkType: "weedy" }, { code: "T2", name: "Hoeing", category: "hand", checkType: null }] },
    });
    expect(treatments.status).toBe(200);
    const assessments = await researcher.request(`/api/trials/${trialId}/assessments`, {
      method: "PUT",
      json: { assessments: [{ name: markup("assessment"), variable: "weed-density", unit: "plants per quadrat", plannedDate: null, timingDays: null, timingReference: null, quadratsPerPlot: 2 }] },
    });
    expect(assessments.status).toBe(200);

    expect((await Site.findByPk(siteId))?.name).toBe(markup("site"));
    expect((await Assessment.findOne({ where: { trialId } }))?.name).toBe(markup("assessment"));
    const [treatment] = await testDatabase().query<{ name: string }>("SELECT name FROM treatments WHERE trial_id = :trialId AND code = 'T1'", { replacements: { trialId }, type: QueryTypes.SELECT });
    expect(treatment.name).toBe(markup("treatment"));

    const html = await pageHtml(researcher, `/trials/${trialId}`);
    for (const field of ["site", "treatment", "assessment"]) expectShownEscaped(html, field);
  });

  it("a review comment, a summary edit, a photo caption and a species in an uploaded file: stored as given, shown escaped", async () => {
    const fixture = await createTrialFixture({ ownerEmail: "researcher@hoebench.test" });
    const trialId = fixture.trial.id;
    const researcher = await signedInAs("researcher@hoebench.test");

    const comment = await researcher.request(`/api/reviews/${trialId}/comments`, { method: "POST", json: { body: markup("comment") } });
    expect(comment.status).toBe(201);
    expect((await ReviewComment.findOne({ where: { trialId } }))?.body).toBe(markup("comment"));
    expectShownEscaped(await pageHtml(researcher, `/trials/${trialId}/review`), "comment");

    const summary = await researcher.request(`/api/summaries/${trialId}`, { method: "PUT", json: { text: `In short: ${markup("summary")}` } });
    expect(summary.status).toBe(200);
    expect((await TrialSummary.findOne({ where: { trialId } }))?.editedText).toBe(`In short: ${markup("summary")}`);
    expectShownEscaped(await pageHtml(researcher, `/trials/${trialId}/summary`), "summary");

    const jpeg = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46]);
    const plotNumber = fixture.plots[0].number;
    const started = await researcher.request("/api/photos", {
      method: "POST",
      json: { trialId, plotNumber, assessmentId: fixture.assessment.id, contentType: "image/jpeg", sizeBytes: jpeg.length, thumbnailBytes: jpeg.length, caption: markup("caption") },
    });
    expect(started.status).toBe(201);
    const { photoId, putUrl, thumbnailPutUrl } = await started.json();
    for (const url of [putUrl, thumbnailPutUrl]) expect((await fetch(url, { method: "PUT", headers: { "content-type": "image/jpeg" }, body: jpeg })).status).toBe(200);
    expect((await researcher.request(`/api/photos/${photoId}/confirm`, { method: "POST" })).status).toBe(200);
    expect((await Photo.findByPk(photoId))?.caption).toBe(markup("caption"));
    expectShownEscaped(await pageHtml(researcher, `/trials/${trialId}/plots/${plotNumber}`), "caption");

    const csv = ["plot,quadrat,species,value", ...fixture.plots.flatMap((plot) => [1, 2].map((quadrat) => `${plot.number},${quadrat},${markup("species")},${quadrat + 2}`))].join("\n");
    const bytes = Buffer.from(csv);
    const upload = await researcher.request("/api/uploads", { method: "POST", json: { trialId, assessmentId: fixture.assessment.id, fileName: "species.csv", sizeBytes: bytes.length } });
    expect(upload.status).toBe(201);
    const { uploadId, putUrl: csvPutUrl, contentType } = await upload.json();
    expect((await fetch(csvPutUrl, { method: "PUT", headers: { "content-type": contentType }, body: bytes })).status).toBe(200);
    const check = await researcher.request(`/api/uploads/${uploadId}/check`, { method: "POST" });
    const checked = await check.json();
    expect(checked.status, JSON.stringify(checked.problems)).toBe("checked");
    expect(checked.preview[0].species).toBe(markup("species"));
    expect((await researcher.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} })).status).toBe(201);
    expectShownEscaped(await pageHtml(researcher, `/trials/${trialId}/data/${fixture.assessment.id}/versions/1`), "species");
  }, 60_000);

  it("a name given at sign-up: stored as given, shown escaped to the admin", async () => {
    const email = `markup-${stamp}@hoebench.test`;
    createdUserEmails.push(email);
    const visitor = new TestClient({ "x-forwarded-for": `198.18.250.${stamp % 200}` });
    const registered = await visitor.request("/api/register", { method: "POST", json: { name: markup("name"), email, password: "a-long-enough-password", confirmPassword: "a-long-enough-password" } });
    expect(registered.status).toBe(201);
    expect((await User.findOne({ where: { email } }))?.name).toBe(markup("name"));
    expectShownEscaped(await pageHtml(await signedInAs("admin@hoebench.test"), "/admin/users"), "name");
  });
});

// ---------------------------------------------------------------------------------------------
// File names and file shapes
// ---------------------------------------------------------------------------------------------

describe("file names with path tricks", () => {
  let fixture: TrialFixture;
  let researcher: TestClient;

  beforeAll(async () => {
    fixture = await createTrialFixture({ ownerEmail: "researcher@hoebench.test" });
    researcher = await signedInAs("researcher@hoebench.test");
  });

  it("never reach an upload's storage key, and the name kept for people is cleaned", async () => {
    const trialId = fixture.trial.id;
    const assessmentId = fixture.assessment.id;
    const names: [string, string][] = [
      ["../../etc/passwd.csv", "passwd.csv"],
      ["..\\..\\windows\\system32\\counts.csv", "counts.csv"],
      ["/var/lib/postgresql/data.csv", "data.csv"],
      ["density\u0000.exe.csv", "density_.exe.csv"],
      [".hidden.csv", "hidden.csv"],
      ["%2e%2e%2fsecret.csv", "_2e_2e_2fsecret.csv"],
      ["<img src=x onerror=alert(1)>.csv", "_img src_x onerror_alert(1)_.csv"],
    ];
    for (const [fileName, kept] of names) {
      const response = await researcher.request("/api/uploads", { method: "POST", json: { trialId, assessmentId, fileName, sizeBytes: 100 } });
      expect(response.status, JSON.stringify(fileName)).toBe(201);
      const { uploadId, putUrl } = await response.json();
      const stored = (await Upload.findByPk(uploadId))!;
      expect(stored.originalName, JSON.stringify(fileName)).toBe(kept);
      expect(stored.objectKey).toBe(`trials/${trialId}/assessments/${assessmentId}/uploads/${uploadId}.csv`);
      expect(decodeURIComponent(new URL(putUrl).pathname).endsWith(`/${stored.objectKey}`)).toBe(true);
    }

    const before = await Upload.count({ where: { trialId } });
    const long = await researcher.request("/api/uploads", { method: "POST", json: { trialId, assessmentId, fileName: `${"../".repeat(100)}x.csv`, sizeBytes: 100 } });
    expect(long.status).toBe(422);
    expect((await long.json()).error.fields).toContainEqual({ path: "fileName", message: "The file name is too long (200 characters at most)." });
    expect(await Upload.count({ where: { trialId } })).toBe(before);
  });

  it("photos take no file name at all: their keys are made by the server", async () => {
    const trialId = fixture.trial.id;
    const photo = { trialId, plotNumber: fixture.plots[0].number, assessmentId: null, contentType: "image/jpeg", sizeBytes: 10, thumbnailBytes: 10, caption: "" };
    const before = await Photo.count({ where: { trialId } });
    for (const fileName of ["../../etc/passwd.jpg", "..\\..\\boot.ini.jpg", `photo\u0000.jpg`]) {
      const refused = await researcher.request("/api/photos", { method: "POST", json: { ...photo, fileName } });
      expect(refused.status, JSON.stringify(fileName)).toBe(422);
    }
    expect(await Photo.count({ where: { trialId } })).toBe(before);

    const started = await researcher.request("/api/photos", { method: "POST", json: photo });
    expect(started.status).toBe(201);
    const { photoId, putUrl, thumbnailPutUrl } = await started.json();
    const stored = (await Photo.findByPk(photoId))!;
    expect(stored.objectKey).toBe(`trials/${trialId}/photos/${photoId}`);
    expect(stored.thumbnailKey).toBe(`trials/${trialId}/photos/${photoId}-thumbnail.jpg`);
    expect(decodeURIComponent(new URL(putUrl).pathname).endsWith(`/${stored.objectKey}`)).toBe(true);
    expect(decodeURIComponent(new URL(thumbnailPutUrl).pathname).endsWith(`/${stored.thumbnailKey}`)).toBe(true);
  });
});

describe("a CSV with 100,000 columns", () => {
  it("goes through the real upload (start, presigned PUT, check), is refused with the too-many-columns message, and nothing is recorded", async () => {
    const fixture = await createTrialFixture({ ownerEmail: "researcher@hoebench.test" });
    const researcher = await signedInAs("researcher@hoebench.test");
    const columns = 100_000;
    const header = ["plot", "quadrat", "value", ...Array.from({ length: columns - 3 }, (_, index) => `extra${index}`)].join(",");
    const bytes = Buffer.from(`${header}\n101,1,3${",".repeat(columns - 3)}\n`);
    const started = await researcher.request("/api/uploads", { method: "POST", json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, fileName: "wide.csv", sizeBytes: bytes.length } });
    expect(started.status).toBe(201);
    const { uploadId, putUrl, contentType } = await started.json();
    expect((await fetch(putUrl, { method: "PUT", headers: { "content-type": contentType }, body: bytes })).status).toBe(200);

    const check = await researcher.request(`/api/uploads/${uploadId}/check`, { method: "POST" });
    expect(check.status).toBe(200);
    const checked = await check.json();
    expect(checked.status).toBe("refused");
    expect(checked.problems).toContainEqual({
      severity: "error",
      code: "too-many-columns",
      row: 1,
      message: "The header has 100000 columns; a data file has at most 60. Use the data sheet template.",
    });
    expect(checked.preview).toEqual([]);

    const commit = await researcher.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} });
    expect(commit.status).toBe(409);
    expect(await DatasetVersion.count({ where: { assessmentId: fixture.assessment.id } })).toBe(0);
    const [values] = await testDatabase().query("SELECT count(*)::int AS count FROM observations WHERE assessment_id = :assessmentId", { replacements: { assessmentId: fixture.assessment.id }, type: QueryTypes.SELECT });
    expect(values).toEqual({ count: 0 });
  }, 60_000);
});

// ---------------------------------------------------------------------------------------------
// Markup built by hand for dangerouslySetInnerHTML
// ---------------------------------------------------------------------------------------------

describe("markup built by hand for dangerouslySetInnerHTML", () => {
  // Closes the element it lands in, opens a script, and tries to break out of an attribute.
  const hostile = `</text><script>alert(1)</script><text x="1" onload="alert(2)`;
  const escapedHostile = "&lt;/text&gt;&lt;script&gt;alert(1)&lt;/script&gt;&lt;text x=&quot;1&quot; onload=&quot;alert(2)";
  const tagCount = (markupText: string) => markupText.match(/<[a-zA-Z]/g)?.length ?? 0;

  function sampleResults() {
    const rows = [];
    for (let block = 1; block <= 4; block++) {
      for (let position = 1; position <= 3; position++) {
        rows.push({ plotNumber: block * 100 + position, treatment: `T${position}`, block: String(block), row: String(block), column: String(position), response: position * 10 + block + (position === 2 ? 0.3 : -0.2) * block });
      }
    }
    return buildResults({
      trial: { id: "t", design: "rcbd", status: "active" },
      assessment: { id: "a", name: "Weed density", variable: "weed-density", unit: "plants/m²", timingDays: 28 },
      dataVersion: 1,
      rows,
      treatments: [{ code: "T1", name: "Weedy check", checkType: "weedy" }, { code: "T2", name: "Hoe", checkType: null }, { code: "T3", name: "Mulch", checkType: null }],
      options: analysisOptionsSchema.parse({ control: "T1" }),
    });
  }

  it("the report's means chart escapes treatment names, letters and the unit", () => {
    const results = sampleResults();
    const withText = (treatment: string, letters: string, unit: string) =>
      meansChartSvg({ ...results, assessment: { ...results.assessment, unit }, means: results.means.map((mean) => ({ ...mean, treatment, letters })) });
    const svg = withText(hostile, hostile, hostile);
    expect(svg).not.toContain("<script");
    expect(svg).not.toContain('onload="');
    expect(svg.split(escapedHostile).length - 1).toBe(results.means.length * 2 + 1);
    // Exactly the elements a chart of plain names has: nothing was injected.
    expect(tagCount(svg)).toBe(tagCount(withText("T1", "a", "plants/m²")));
  });

  it("the static markup renderer escapes text and attribute values", () => {
    const out = renderStaticMarkup(createElement("svg", { "aria-label": hostile }, createElement("title", null, hostile), createElement("text", { x: 1 }, hostile)));
    expect(out).toBe(`<svg aria-label="${escapedHostile}"><title>${escapedHostile}</title><text x="1">${escapedHostile}</text></svg>`);
  });

  it("the plot map escapes the trial title and every treatment's code and name", () => {
    const plain = sampleMapProps();
    const svg = renderPlotMapSvg({
      ...plain,
      title: hostile,
      treatments: plain.treatments.map((treatment) => ({ ...treatment, code: hostile, name: hostile })),
      plots: plain.plots.map((plot) => ({ ...plot, treatmentCode: hostile })),
    });
    expect(svg).not.toContain("<script");
    expect(svg).not.toContain('onload="');
    expect(svg).toContain(escapedHostile);
    const sameLength = "x".repeat(hostile.length);
    const plainSvg = renderPlotMapSvg({
      ...plain,
      title: sameLength,
      treatments: plain.treatments.map((treatment) => ({ ...treatment, code: sameLength, name: sameLength })),
      plots: plain.plots.map((plot) => ({ ...plot, treatmentCode: sameLength })),
    });
    expect(tagCount(svg)).toBe(tagCount(plainSvg));
  });

  it("stake-label QR codes carry none of the text they encode", async () => {
    const svg = await qrSvg(`http://127.0.0.1:3000/trials/x/plots/101?${hostile}`);
    expect(svg.startsWith("<svg")).toBe(true);
    expect(svg).not.toContain("script");
    expect(svg).not.toContain("alert");
  });
});
