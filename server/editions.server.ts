// Chart editions on the server, one module per seam (server/editions/):
//   viewer.server.ts  who is looking and which editions they may see (shared / the organisation's own)
//   reads.server.ts   summaries, intervals, the organisation's current edition, the public JSON, the log
//   http.server.ts    ETags, 304s and cache headers for exports and the public API
//   import.server.ts  upload → preview → confirm (re-validated), saving a draft
//   status.server.ts  make latest (stewards), current for an organisation, retire, discard
// This file only gathers them for callers that want one import.
export * from "./editions/viewer.server.ts";
export * from "./editions/reads.server.ts";
export * from "./editions/http.server.ts";
export * from "./editions/import.server.ts";
export * from "./editions/status.server.ts";
