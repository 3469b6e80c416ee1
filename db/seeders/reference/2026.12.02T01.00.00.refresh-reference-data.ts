// Reference data corrected after the first seeding (chart boundary kinds GSSP/GSSA, the 2023/09
// Sakmarian base, the library corrections with their sources): seeders run once per database, so
// this one runs the three reference seeders again on databases seeded before the corrections.
// All three are idempotent (rows matched by slug / edition and name, updated in place, ids kept);
// on a new database it changes nothing.
import type { Migration } from "../../migrator.ts";
import { up as editions } from "./2026.12.01T01.00.00.ics-editions.ts";
import { up as datedEvents } from "./2026.12.01T02.00.00.dated-events.ts";
import { up as decaySystems } from "./2026.12.01T02.00.01.decay-systems.ts";

export const up: Migration = async (context) => {
  await editions(context);
  await datedEvents(context);
  await decaySystems(context);
};

export const down: Migration = async () => {
  // Nothing to undo: the corrected rows stay (the earlier seeders' own down removes them).
};
