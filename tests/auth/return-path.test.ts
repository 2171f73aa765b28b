import { describe, expect, it } from "vitest";
import { returnPathSchema } from "@/lib/validations/auth";

describe("the page to return to after signing in", () => {
  it("keeps a path on this site, with its query and fragment", () => {
    expect(returnPathSchema.parse("/trials/5/results?assessment=a1#anova")).toBe("/trials/5/results?assessment=a1#anova");
    expect(returnPathSchema.parse("/invite/abc")).toBe("/invite/abc");
  });

  it("sends every way off the site, and anything that is not a path, to the home page", () => {
    for (const crafted of ["//elsewhere.example/x", "/\\elsewhere.example", "/\\/elsewhere.example", "https://elsewhere.example/", "javascript:alert(1)", "/\telsewhere", "", undefined, 42, "/".repeat(2001)]) {
      expect(returnPathSchema.parse(crafted)).toBe("/");
    }
  });
});
