// Form and API validation helpers around zod: field → message maps for forms.
import type { z } from "zod";

export type FieldErrors = Record<string, string>;

export type FormResult<T> = { ok: true; data: T } | { ok: false; fieldErrors: FieldErrors; formError: string };

// Control characters: C0 except tab, line feed and carriage return, DEL, and C1. A NUL cannot be
// stored by PostgreSQL and the others are invisible or break exports, so they are refused (never
// stripped: nothing is silently altered) with the field named.
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const CONTROL_CHARACTERS = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;
export const CONTROL_CHARACTER_REASON = "contains a control character (such as NUL); remove it and try again.";

export function hasNoControlCharacters(text: string): boolean {
  return !CONTROL_CHARACTERS.test(text);
}

/** The first text value (nested objects and arrays searched) holding a control character, as a path. */
export function controlCharacterPath(value: unknown, path: string[] = [], depth = 0): string | null {
  if (typeof value === "string") return CONTROL_CHARACTERS.test(value) ? path.join(".") || "_form" : null;
  if (depth > 64 || value === null || typeof value !== "object") return null;
  for (const [k, v] of Object.entries(value)) {
    if (typeof k === "string" && CONTROL_CHARACTERS.test(k)) return [...path, k.replace(CONTROL_CHARACTERS, "?")].join(".");
    const found = controlCharacterPath(v, [...path, k], depth + 1);
    if (found) return found;
  }
  return null;
}

/** A field error for the first control character in a form or JSON body, or null. */
export function controlCharacterError(input: unknown): FormResult<never> | null {
  const field = controlCharacterPath(input);
  if (!field) return null;
  const message = `${field === "_form" ? "The form" : field} ${CONTROL_CHARACTER_REASON}`;
  return { ok: false, fieldErrors: { [field]: message }, formError: `Check the form: ${message}` };
}

export function parseForm<S extends z.ZodType>(schema: S, form: FormData | Record<string, unknown>): FormResult<z.output<S>> {
  const input = form instanceof FormData ? Object.fromEntries(form) : form;
  const refused = controlCharacterError(input);
  if (refused) return refused;
  const result = schema.safeParse(input);
  if (result.success) return { ok: true, data: result.data };
  const fieldErrors: FieldErrors = {};
  for (const issue of result.error.issues) {
    const key = issue.path.join(".") || "_form";
    fieldErrors[key] ??= issue.message;
  }
  const first = Object.entries(fieldErrors)[0];
  return { ok: false, fieldErrors, formError: first ? `Check the form: ${first[1]}` : "Check the form." };
}

/** The message a server's error answer carries ({ message } or short text), or null. */
export function messageOf(data: unknown): string | null {
  if (data && typeof data === "object" && "message" in data && typeof (data as { message: unknown }).message === "string") {
    return (data as { message: string }).message;
  }
  return typeof data === "string" && data.length < 500 ? data : null;
}
