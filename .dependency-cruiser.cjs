// The layers of Eonscale, written as rules (run by `npm run lint:deps`, part of `npm test`).
// DEVELOPERS.md ("Layers") explains each rule and draws the graph.
/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: "lib-is-pure",
      comment:
        "app/lib runs in the browser and on the server: no React, no server or db code, no Node built-ins, no network or database packages.",
      severity: "error",
      from: { path: "^app/lib/" },
      to: { path: "^(app/(routes|components|root|entry)|server|db|fakes|tests)" },
    },
    {
      name: "lib-imports-only-pure-packages",
      comment: "app/lib may use only pure npm packages (no React, no Node, no I/O).",
      severity: "error",
      from: { path: "^app/lib/" },
      to: {
        dependencyTypes: ["npm", "npm-dev", "npm-peer", "npm-optional", "core"],
        pathNot: "node_modules/(zod|@tmcw/togeojson|@xmldom/xmldom|n3|canonicalize|simplify-js|csv-stringify/dist/esm|@sindresorhus/transliterate)/",
      },
    },
    {
      name: "components-no-server-or-db",
      comment: "Components render; data comes from loaders. They never import server/, db/ or *.server modules.",
      severity: "error",
      from: { path: "^app/components/" },
      to: { path: ["^server/", "^db/", "\\.server\\.tsx?$"] },
    },
    {
      name: "routes-no-models",
      comment: "Routes call server functions (server/*.server.ts); they never query db/ themselves.",
      severity: "error",
      from: { path: "^app/routes" },
      to: { path: "^db/" },
    },
    {
      name: "app-never-imports-fakes",
      comment: "fakes/ holds local stand-ins for hosted services; only the local start scripts and tests use them.",
      severity: "error",
      from: { path: "^(app|server|db)/" },
      to: { path: "^fakes/" },
    },
    {
      name: "db-no-server",
      comment: "db/ (models, migrations, seeders) knows nothing of the web server; it receives its Sequelize instance.",
      severity: "error",
      from: { path: "^db/" },
      to: { path: ["^server/", "^app/(routes|components)/"] },
    },
    {
      name: "server-no-ui",
      comment: "Server modules never import route modules or components.",
      severity: "error",
      from: { path: "^server/" },
      to: { path: ["^app/routes/", "^app/components/", "^app/root\\.tsx$"] },
    },
    {
      name: "nothing-imports-tests",
      severity: "error",
      from: { pathNot: "^tests/" },
      to: { path: "^tests/" },
    },
    {
      name: "no-circular",
      comment: "Cycles make the module graph order-dependent.",
      severity: "error",
      from: {},
      to: { circular: true, viaOnly: { dependencyTypesNot: ["type-only"] } },
    },
  ],
  options: {
    doNotFollow: { path: "node_modules" },
    exclude: { path: ["^build", "^\\.react-router/", "^db/data/ics/source/"] },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: "tsconfig.json" },
    combinedDependencies: false,
    enhancedResolveOptions: {
      exportsFields: ["exports"],
      conditionNames: ["import", "require", "node", "default", "types"],
      extensions: [".ts", ".tsx", ".js", ".mjs", ".cjs", ".json"],
    },
    reporterOptions: { text: { highlightFocused: true } },
  },
};
