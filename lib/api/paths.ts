/**
 * Which API v1 path a request reaches, and with which methods, read from the operations list
 * (the same list the route files and the OpenAPI document come from). The web server uses it to
 * answer a path nothing serves with 404 and a method the path does not take with 405 and `Allow`,
 * both as problem+json, where the framework would answer an HTML page or an empty body.
 */
import { API_PREFIX, type Operation } from "./operation";

/** What a request to `/api/v1/…` reaches. */
export type PathMatch =
  | { kind: "served" }
  | { kind: "method-not-allowed"; allow: string }
  /** a path under API v1 that no operation has */
  | { kind: "unknown" }
  /** not under API v1, or a form the framework settles itself (a trailing or doubled slash, dot segments) */
  | { kind: "other" };

interface Template {
  /** each segment: the literal text, or null for a parameter such as `{id}` */
  segments: (string | null)[];
  methods: Set<string>;
}

/** Static segments win over parameters, segment by segment from the left, as the framework routes them. */
function moreSpecific(a: Template, b: Template): number {
  for (let i = 0; i < a.segments.length; i++) {
    const staticA = a.segments[i] !== null;
    const staticB = b.segments[i] !== null;
    if (staticA !== staticB) return staticA ? -1 : 1;
  }
  return 0;
}

/** The methods a path answers, as the framework lists them in `Allow` (HEAD with GET; OPTIONS always). */
function allowOf(methods: Set<string>): string {
  const all = new Set(methods);
  if (all.has("GET")) all.add("HEAD");
  all.add("OPTIONS");
  return [...all].sort().join(", ");
}

export function apiPaths(operations: Pick<Operation, "method" | "path">[]) {
  const byPath = new Map<string, Template>();
  for (const op of operations) {
    const template = byPath.get(op.path) ?? {
      segments: op.path
        .split("/")
        .slice(1)
        .map((s) => (/^\{.+\}$/.test(s) ? null : s)),
      methods: new Set<string>(),
    };
    template.methods.add(op.method.toUpperCase());
    byPath.set(op.path, template);
  }
  const templates = [...byPath.values()].sort(moreSpecific);

  /** `path` is the request's path without its query; `method` upper case. */
  return function match(method: string, path: string): PathMatch {
    if (path !== API_PREFIX && !path.startsWith(`${API_PREFIX}/`)) return { kind: "other" };
    const rest = path.slice(API_PREFIX.length);
    if (rest === "") return { kind: "other" };
    // raw, as the framework routes: an escaped slash (%2F) stays inside its segment, and `%62atch` is not `batch`
    const segments = rest.split("/").slice(1);
    // a trailing or doubled slash, `/./` and `/../` are the framework's to settle (it redirects or normalises them)
    if (segments.some((segment) => segment === "" || segment === "." || segment === "..")) return { kind: "other" };
    const template = templates.find(
      (t) => t.segments.length === segments.length && t.segments.every((s, i) => s === null || s === segments[i]),
    );
    if (!template) return { kind: "unknown" };
    const served =
      template.methods.has(method) || method === "OPTIONS" || (method === "HEAD" && template.methods.has("GET"));
    return served ? { kind: "served" } : { kind: "method-not-allowed", allow: allowOf(template.methods) };
  };
}
