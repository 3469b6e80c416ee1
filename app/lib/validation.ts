// Form and API validation helpers around zod: field → message maps for forms.
import type { z } from "zod";

export type FieldErrors = Record<string, string>;

export type FormResult<T> = { ok: true; data: T } | { ok: false; fieldErrors: FieldErrors; formError: string };

export function parseForm<S extends z.ZodType>(schema: S, form: FormData | Record<string, unknown>): FormResult<z.output<S>> {
  const input = form instanceof FormData ? Object.fromEntries(form) : form;
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
