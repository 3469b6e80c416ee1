// Helpers for the chart-edition integration tests: multipart uploads, fixtures, a chart steward, and
// putting the seeded latest shared edition back after a test changed it.
import { readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { ChartEdition } from "../../db/models/index.ts";
import { makeLatest, type EditionActor } from "../../server/editions.server.ts";
import { createUser, makeSteward } from "./db.ts";

const here = path.dirname(fileURLToPath(import.meta.url));

export const SEEDED_CURRENT = "ics-2024-12";
export const SEEDED_RETIRED = "ics-2023-09";

export function fixture(name: string): string {
  return readFileSync(path.join(here, "../fixtures/editions", name), "utf8");
}

export interface UploadFile {
  name: string;
  content: string | Uint8Array;
  type?: string;
}

/** A multipart/form-data POST, as a browser sends the import form. */
export function multipartRequest(url: string, fields: Record<string, string>, files: Record<string, UploadFile> = {}, opts: { cookie?: string } = {}) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  for (const [k, f] of Object.entries(files)) form.append(k, new File([f.content as BlobPart], f.name, { type: f.type ?? "text/plain" }));
  const headers = new Headers({ "x-eonscale-client-ip": "203.0.113.20" });
  if (opts.cookie) headers.set("Cookie", opts.cookie);
  return new Request(new URL(url, "http://test.local"), { method: "POST", headers, body: form });
}

export const TEST_META = {
  label: "Test edition",
  source: "Test fixture derived from ICS 2024/12 (tests/fixtures/editions/README.md); not a real chart edition.",
  licence: "CC BY 4.0 (derived from ICS chart data)",
};

/** A new chart steward (in no organisation), as an actor for the edition functions. */
export async function newSteward(): Promise<{ user: Awaited<ReturnType<typeof createUser>>; actor: EditionActor }> {
  const user = await createUser();
  await makeSteward(user.id);
  return { user, actor: { id: user.id, subject: { roles: [], steward: true, userId: user.id, organisationId: null } } };
}

/** Make the seeded edition the latest shared one again if a test changed it. */
export async function restoreSeededLatest(actor: EditionActor) {
  const latest = await ChartEdition.findOne({ where: { status: "current", organisationId: null } });
  if (latest?.slug !== SEEDED_CURRENT) await makeLatest(SEEDED_CURRENT, actor);
}
