import { afterAll, describe, expect, it } from "vitest";
import { Trial } from "@/models";
import { testDatabase } from "../support/database";
import { TestClient } from "../support/http";

describe("the technical report from the library", () => {
  it("is a PDF anyone can read for a published trial, and 404 for any other", async () => {
    testDatabase();
    const published = (await Trial.findOne({ where: { status: "published" } }))!;
    const active = (await Trial.findOne({ where: { status: "active" } }))!;
    const visitor = new TestClient();
    const report = await visitor.request(`/api/library/${published.id}/report`);
    expect(report.status).toBe(200);
    expect(report.headers.get("content-type")).toBe("application/pdf");
    expect(Buffer.from(await report.arrayBuffer()).subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect((await visitor.request(`/api/library/${active.id}/report`)).status).toBe(404);
  }, 60_000);
});

afterAll(async () => {
  await testDatabase().close();
});
