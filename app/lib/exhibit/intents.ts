// The composer's forms as one discriminated union on `intent`: each form posts its intent, the
// revision it was based on and its own fields. The route parses once with this schema and hands the
// typed command to the server (server/exhibits/composer.server.ts).
import { z } from "zod";
import {
  BoundaryMarkersSchema,
  CustomMarkerSchema,
  EventMarkerSchema,
  InsetFormSchema,
  LengthMediumSchema,
  MarkerTextSchema,
  RevisionSchema,
  SettingsSchema,
} from "./forms";
import { AcknowledgeWarningSchema } from "./acknowledgements";
import { ImageWordsSchema, MarkerImageSchema, RemoveImageSchema } from "../images";

const intent = <const I extends string>(name: I) => ({ intent: z.literal(name), revision: RevisionSchema });

const idField = (message: string) => z.coerce.number({ error: message }).int({ error: message }).positive({ error: message });

export const COMPOSER_INTENTS = [
  "settings",
  "add-boundaries",
  "add-event",
  "add-custom",
  "edit-marker",
  "remove-marker",
  "add-inset",
  "remove-inset",
  "replace-route",
  "repin",
  "set-marker-image",
  "set-cover-image",
  "remove-image",
  "submit-for-review",
  "publish",
  "acknowledge-warning",
  "combine-markers",
] as const;
export type ComposerIntent = (typeof COMPOSER_INTENTS)[number];

const COMBINE_TWO = "Choose at least two markers of the same age to combine.";
/** Marker ids as the combine form posts them: "137,140". */
const MarkerIdsSchema = z.string({ error: COMBINE_TWO }).transform((v, ctx) => {
  const parts = v.split(",").map((x) => x.trim()).filter(Boolean);
  const ids = parts.map(Number);
  const fail = (message: string) => {
    ctx.addIssue({ code: "custom", message });
    return z.NEVER;
  };
  if (ids.length < 2 || ids.some((n) => !Number.isSafeInteger(n) || n <= 0)) return fail(COMBINE_TWO);
  if (ids.length > 100) return fail("Combine at most 100 markers at once.");
  if (new Set(ids).size !== ids.length) return fail("A marker is named twice; choose each marker once.");
  return ids;
});

export const NO_ROUTE_FILE = "Upload the new route as a GeoJSON or GPX file.";

const SettingsIntent = z.discriminatedUnion(
  "mediumKind",
  [
    SettingsSchema.safeExtend({ ...intent("settings"), mediumKind: z.literal("length"), ...LengthMediumSchema.shape }),
    SettingsSchema.safeExtend({ ...intent("settings"), mediumKind: z.literal("route") }),
  ],
  { error: "The settings form lost its medium kind; reload the page." },
);

export const ComposerCommandSchema = z.discriminatedUnion(
  "intent",
  [
    SettingsIntent,
    BoundaryMarkersSchema.safeExtend(intent("add-boundaries")),
    EventMarkerSchema.safeExtend(intent("add-event")),
    CustomMarkerSchema.safeExtend(intent("add-custom")),
    MarkerTextSchema.safeExtend(intent("edit-marker")),
    z.object({ ...intent("remove-marker"), markerId: idField("Missing marker.") }),
    InsetFormSchema.safeExtend(intent("add-inset")),
    z.object({ ...intent("remove-inset"), insetId: z.preprocess((v) => (typeof v === "string" ? v.replace(/^inset-/, "") : v), idField("Missing inset.")) }),
    z.object({ ...intent("replace-route"), routeFile: z.instanceof(File, { error: NO_ROUTE_FILE }).refine((f) => f.size > 0, { error: NO_ROUTE_FILE }) }),
    z.object(intent("repin")),
    MarkerImageSchema.safeExtend(intent("set-marker-image")),
    ImageWordsSchema.safeExtend(intent("set-cover-image")),
    RemoveImageSchema.safeExtend(intent("remove-image")),
    z.object(intent("submit-for-review")),
    z.object(intent("publish")),
    AcknowledgeWarningSchema.safeExtend(intent("acknowledge-warning")),
    z.object({ ...intent("combine-markers"), markerIds: MarkerIdsSchema }),
  ],
  { error: "Unknown action." },
);

export type ComposerCommand = z.output<typeof ComposerCommandSchema>;
