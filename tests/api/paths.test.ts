/**
 * The web server's map of API v1 (lib/api/paths.ts), read from the operations list: which paths
 * exist, with which methods, resolved as the framework resolves its route files (a static segment
 * wins over a parameter: `/programs/batch` is not a program id).
 */
import { describe, expect, it } from "vitest";
import { apiPaths } from "../../lib/api/paths";
import { operations } from "../../lib/api/operations";

const match = apiPaths(operations);

describe("the API's paths", () => {
  it("knows every operation's path and method", () => {
    for (const op of operations) {
      const path = `/api/v1${op.path.replace(/\{[^}]+\}/g, "x_1")}`;
      expect(match(op.method.toUpperCase(), path), `${op.method} ${path}`).toEqual({ kind: "served" });
    }
  });

  it("lets HEAD through where GET is served, and OPTIONS everywhere", () => {
    expect(match("HEAD", "/api/v1/programs")).toEqual({ kind: "served" });
    expect(match("OPTIONS", "/api/v1/programs/batch")).toEqual({ kind: "served" });
    expect(match("HEAD", "/api/v1/programs/batch")).toEqual({
      kind: "method-not-allowed",
      allow: "OPTIONS, POST",
    });
  });

  it("names the methods a path takes when it is asked with another", () => {
    expect(match("DELETE", "/api/v1/programs/prg_1")).toEqual({
      kind: "method-not-allowed",
      allow: "GET, HEAD, OPTIONS, PATCH",
    });
    // the static route, not the program id: GET /programs/batch is not a program read
    expect(match("GET", "/api/v1/programs/batch")).toEqual({ kind: "method-not-allowed", allow: "OPTIONS, POST" });
    expect(match("PUT", "/api/v1/health")).toEqual({ kind: "method-not-allowed", allow: "GET, HEAD, OPTIONS" });
  });

  it("finds no operation at paths the API does not have", () => {
    for (const path of [
      "/api/v1/webhooks",
      "/api/v1/programs/prg_1/nothing",
      "/api/v1/programs/prg_1/release/again",
      "/api/v1/Programs",
      `/api/v1/${"a/".repeat(500)}b`,
      "/api/v1/%00",
    ])
      expect(match("GET", path), path).toEqual({ kind: "unknown" });
  });

  it("leaves other paths, and trailing or doubled slashes and dot segments, to the framework", () => {
    for (const path of [
      "/console",
      "/api/auth/session",
      "/api/v2/programs",
      "/api/v1",
      "/api/v1/",
      "/api/v1/programs/",
    ])
      expect(match("GET", path), path).toEqual({ kind: "other" });
  });

  it("reads the path as the framework routes it: undecoded, an escaped slash inside its segment", () => {
    expect(match("GET", "/api/v1/programs/a%2Fb")).toEqual({ kind: "served" });
    // `%62atch` reaches the program-id route (checked against the framework by hand), which takes no POST
    expect(match("POST", "/api/v1/programs/%62atch")).toEqual({
      kind: "method-not-allowed",
      allow: "GET, HEAD, OPTIONS, PATCH",
    });
  });
});
