// The URL pattern of every route module in app/routes.ts, keyed by its file under app/routes/
// ("studio/team.tsx" → "/studio/team"): the standing suites (guards, bad input) walk it.
import type { RouteConfigEntry } from "@react-router/dev/routes";
import routes from "../../app/routes.ts";

export function routePaths(): Map<string, string> {
  const paths = new Map<string, string>();
  (function walk(entries: RouteConfigEntry[], prefix: string) {
    for (const e of entries) {
      const path = e.index ? prefix : e.path ? `${prefix}/${e.path}` : prefix;
      paths.set(e.file.replace(/^routes\//, ""), path.replace(/\/+/g, "/") || "/");
      if (e.children) walk(e.children, path);
    }
  })(routes, "");
  return paths;
}
