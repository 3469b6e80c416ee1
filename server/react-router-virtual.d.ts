// The server build React Router's Vite plugin provides (routes, entry, assets manifest).
declare module "virtual:react-router/server-build" {
  import type { ServerBuild } from "react-router";
  const build: ServerBuild;
  export = build;
}
