import { describe, expect, it } from "vitest";
import { assertLoopbackDatabase } from "@/lib/db/loopback";
import { testEnvironment } from "../support/environment";

describe("test database guard", () => {
  it("accepts loopback databases", () => {
    expect(() => assertLoopbackDatabase("postgres://postgres@127.0.0.1:54329/hoebench_test")).not.toThrow();
    expect(() => assertLoopbackDatabase("postgres://u@localhost/x")).not.toThrow();
    expect(() => assertLoopbackDatabase("postgres://u@[::1]:5432/x")).not.toThrow();
  });

  it("refuses any other host", () => {
    expect(() => assertLoopbackDatabase("postgres://u@db.example.test/x")).toThrow(/refusing to run tests against a database on db.example.test/);
    expect(() => assertLoopbackDatabase("postgres://u@10.0.0.5/x")).toThrow(/only loopback/);
    expect(() => assertLoopbackDatabase("not a url")).toThrow(/not a valid URL/);
  });

  it("is what the suites' own environment goes through", () => {
    const saved = process.env.DATABASE_URL;
    process.env.DATABASE_URL = "postgres://postgres@192.168.1.20:5432/hoebench_test";
    try {
      expect(() => testEnvironment()).toThrow(/refusing/);
    } finally {
      process.env.DATABASE_URL = saved;
    }
  });
});
