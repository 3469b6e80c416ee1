// Loaded with `node --import`: records the URL of every ES module the process resolves, one per
// line, in the file named by EONSCALE_MODULE_LOG (tests/e2e/module-graph.test.ts reads it).
import { register } from "node:module";

register(new URL("./record-modules-hooks.mjs", import.meta.url));
