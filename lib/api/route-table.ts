import { API_ROUTES } from "./routes";

// Which methods an /api path answers, from the documented route list (the OpenAPI test keeps
// that list and the route files equal). The proxy uses it to answer an unknown path with a
// 404 envelope and a wrong method with a 405 envelope and `Allow`, as Next.js alone answers
// both with an empty body.

interface Entry {
  segments: string[];
  methods: Set<string>;
}

const isParam = (segment: string) => segment.startsWith("{") && segment.endsWith("}");

const table: Entry[] = [];
for (const route of API_ROUTES) {
  const segments = route.path.split("/").filter(Boolean);
  let entry = table.find((e) => e.segments.join("/") === segments.join("/"));
  if (!entry) table.push((entry = { segments, methods: new Set() }));
  entry.methods.add(route.method.toUpperCase());
}

// Next.js prefers a literal segment to a dynamic one at each level, left to right.
const rank = (e: Entry) => e.segments.map((s) => (isParam(s) ? "1" : "0")).join("");

/** The methods the route at `pathname` takes (with HEAD beside GET, and OPTIONS), or null when no route is there. */
export function allowedMethods(pathname: string): string[] | null {
  const parts = pathname.split("/").filter(Boolean);
  const matches = table.filter((e) => e.segments.length === parts.length && e.segments.every((s, i) => isParam(s) || s === parts[i]));
  if (matches.length === 0) return null;
  const best = matches.sort((a, b) => rank(a).localeCompare(rank(b)))[0];
  const methods = new Set(best.methods);
  if (methods.has("GET")) methods.add("HEAD");
  methods.add("OPTIONS");
  return [...methods].sort();
}
