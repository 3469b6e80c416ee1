// Eonscale timescale domain: chart editions and their intervals. Pure; runs in the browser and
// on the server (no DB, no React, no Node-only APIs).

export * from "./types";
export { check, type CheckOptions } from "./check";
export * from "./compare";
export { intervalsAt, chainAt, baseOf, type Boundary } from "./lookup";
export { applyCorrections, CorrectionError } from "./corrections";
export { inChartOrder, chartOrderIndex } from "./order";
export { CSV_COLUMNS, exportCsv, parseCsv, readCsv, writeCsv, type CsvParseResult, type CsvRecord, type ImportOptions } from "./csv";
export { exportJson, parseJson } from "./json";
export { parseTurtle, type TurtleParseResult, type TurtleMeta, type TurtleExclusion, type TurtleOptions } from "./turtle";
export { intervalSchema, validateInterval } from "./schema";
export { round9, sameMa } from "./numbers";
