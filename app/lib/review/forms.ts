// The review page's forms as one discriminated union on `intent` (decisions, comments, resolving).
import { z } from "zod";
import { RevisionSchema } from "../exhibit/forms";

export const MAX_COMMENT_LENGTH = 4000;

const optionalId = (what: string) =>
  z.preprocess((v) => (v === "" || v == null ? null : v), z.coerce.number({ error: `The ${what} is not a number.` }).int().positive({ error: `Choose a ${what}.` }).nullable());

const commentText = (field: string, required: string) =>
  z
    .string({ error: required })
    .trim()
    .min(1, { error: required })
    .max(MAX_COMMENT_LENGTH, { error: `The ${field} is too long: keep it under ${MAX_COMMENT_LENGTH.toLocaleString("en-GB")} characters.` });

export const ReviewCommandSchema = z.discriminatedUnion(
  "intent",
  [
    z.object({ intent: z.literal("approve"), revision: RevisionSchema, comment: z.string().trim().max(MAX_COMMENT_LENGTH, { error: `The comment is too long: keep it under ${MAX_COMMENT_LENGTH.toLocaleString("en-GB")} characters.` }).default("") }),
    z.object({ intent: z.literal("request-changes"), revision: RevisionSchema, comment: commentText("comment", "Say what needs to change: a comment is required when asking for changes.") }),
    z.object({ intent: z.literal("comment"), body: commentText("comment", "Write the comment."), markerId: optionalId("marker"), parentId: optionalId("comment to reply to") }),
    z.object({ intent: z.literal("resolve-comment"), commentId: z.coerce.number({ error: "Missing comment." }).int().positive({ error: "Missing comment." }) }),
  ],
  { error: "Unknown action." },
);

export type ReviewCommand = z.output<typeof ReviewCommandSchema>;

/** `?from=N&to=M` or `to=published` of the compare page. */
export const CompareQuerySchema = z.object({
  from: z.coerce.number({ error: "from must be a revision number." }).int().positive({ error: "from must be a revision number." }),
  to: z.union([z.literal("published"), z.coerce.number().int().positive()], { error: "to must be a revision number or “published”." }),
});
