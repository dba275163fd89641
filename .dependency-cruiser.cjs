/*
 * The layering rules of DEVELOPERS.md ("Layers"), checked on every `npm run lint`:
 *   lib/physics (pure) ← lib/contracts and the pure areas ← db/ ← server lib (auth, api, mail,
 *   storage, settings) ← app/;  components/ sit beside app/ and never reach the server layers.
 * A violation fails `npm test`; fix the import, never this file, to land.
 */
const SERVER_LIB = "^lib/(api|auth|mail|storage|settings)/";
const UI = "^(app|components)/";

/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: "physics-is-pure",
      comment: "lib/physics imports nothing of the app: only itself and its numeric packages.",
      severity: "error",
      from: { path: "^lib/physics/" },
      to: { pathNot: ["^lib/physics/", "^node_modules/(zod|odex|ml-matrix)/", "^types/odex"] },
    },
    {
      name: "contracts-are-pure",
      comment: "lib/contracts is the layer below the data layer: no db/, no server code, no Next or React.",
      severity: "error",
      from: { path: "^lib/contracts/" },
      to: { path: ["^db/", "^workers/", UI, SERVER_LIB, "^lib/query/", "^node_modules/(next|react|react-dom|drizzle-orm|pg|pg-boss)/"] },
    },
    {
      name: "pure-areas-stay-pure",
      comment:
        "Computations beside the physics (analysis, fit, planner, materials, model, workbench, lab-run kinds…): no server, db or UI.",
      severity: "error",
      from: {
        path: [
          "^lib/(analysis|api-docs|csv|fit|materials|text|planner|measurements|model|workbench)/",
          "^lib/lab-runs/(kinds|encoding|export|engine|compute-now|open-in-workbench)",
        ],
      },
      to: { path: ["^db/", "^workers/", UI, SERVER_LIB, "^lib/query/", "^node_modules/(next|react|react-dom|drizzle-orm|pg|pg-boss)/"] },
    },
    {
      name: "db-speaks-the-domain",
      comment: "db/ never reaches the route layer, authorization, the client or the UI (the seed script is an entry point).",
      severity: "error",
      from: { path: "^db/", pathNot: "^db/seed\\.ts$" },
      to: { path: ["^app/", "^components/", "^lib/(api|auth|query)/", "^node_modules/next/"] },
    },
    {
      name: "components-never-reach-the-server",
      comment: "Components use lib/query and the contracts; the database and the server layers are for route handlers and pages.",
      severity: "error",
      from: { path: "^components/" },
      to: { path: ["^db/", "^lib/(api|mail|storage|settings)/", "^lib/auth/(?!actions)", "^app/"] },
    },
    {
      name: "lib-never-reaches-up",
      comment: "Nothing in lib/ imports a page, a route handler or a component.",
      severity: "error",
      from: { path: "^lib/" },
      to: { path: UI },
    },
    {
      name: "workers-stay-thin",
      comment: "Workers import the computation and the data layer, never pages or components.",
      severity: "error",
      from: { path: "^workers/" },
      to: { path: [UI, "^lib/(api|auth|query)/"] },
    },
    {
      name: "no-cycles",
      comment: "Modules form no import cycle.",
      severity: "error",
      from: {},
      to: { circular: true },
    },
  ],
  options: {
    doNotFollow: { path: "node_modules" },
    exclude: { path: ["^\\.next", "^node_modules", "^dist/", "^test-results/"] },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: "tsconfig.json" },
    enhancedResolveOptions: { exportsFields: ["exports"], conditionNames: ["import", "require", "node", "default"] },
  },
};
