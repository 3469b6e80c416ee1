import { type RouteConfig, index, layout, prefix, route } from "@react-router/dev/routes";

export default [
  index("routes/home.tsx"),
  route("login", "routes/login.tsx"),
  route("logout", "routes/logout.tsx"),
  route("forgot-password", "routes/forgot-password.tsx"),
  route("reset-password/:token", "routes/reset-password.tsx"),
  route("invite/:token", "routes/invite.tsx"),
  route("studio", "routes/studio/layout.tsx", [
    index("routes/studio/home.tsx"),
    route("team", "routes/studio/team.tsx"),
    route("account", "routes/studio/account.tsx"),
    route("switch-organisation", "routes/studio/switch-organisation.tsx"),
    route("editions", "routes/studio/editions.tsx"),
    route("editions/import", "routes/studio/editions.import.tsx"),
    route("library", "routes/studio/library.tsx"),
    route("library/new", "routes/studio/library.new.tsx"),
    route("library/decay", "routes/studio/library.decay.tsx"),
    route("library/:id", "routes/studio/library.$id.tsx"),
    route("exhibits", "routes/studio/exhibits.tsx"),
    route("exhibits/new", "routes/studio/exhibits.new.tsx"),
    route("exhibits/:slug", "routes/studio/exhibits.$slug.tsx"),
    route("exhibits/:slug/schedule.csv", "routes/studio/exhibits.$slug.schedule-csv.ts"),
    route("exhibits/:slug/points.geojson", "routes/studio/exhibits.$slug.points-geojson.ts"),
  ]),
  // Chart editions and the glossary: readable by everyone (drafts only by editors and admins).
  layout("routes/editions.layout.tsx", [
    route("editions", "routes/editions.index.tsx"),
    route("editions/compare", "routes/editions.compare.tsx"),
    route("editions/:slug", "routes/editions.$slug.tsx"),
    route("glossary", "routes/glossary.tsx"),
  ]),
  route("editions/:slug/intervals.csv", "routes/editions.$slug.csv.tsx"),
  route("editions/:slug/intervals.json", "routes/editions.$slug.json.tsx"),
  ...prefix("api", [
    route("scale", "routes/api.scale.ts"),
    route("timescales", "routes/api.timescales.ts"),
    route("timescales/:slug", "routes/api.timescales.$slug.ts"),
    route("events", "routes/api.events.ts"),
    route("assets", "routes/api.assets.ts"),
    route("assets/:id", "routes/api.assets.$id.ts"),
  ]),
  // Images: stable URLs; drafts for the organisation only, published ones for everyone.
  route("media/:assetId/:file", "routes/media.$assetId.$file.ts"),
  route("*", "routes/not-found.tsx"),
] satisfies RouteConfig;
