// Small pieces every composer form uses.
import { useNavigation } from "react-router";

/** The hidden fields every composer form posts: which command, and the revision the page showed. */
export function IntentFields({ intent, revision }: { intent: string; revision: number }) {
  return (
    <>
      <input type="hidden" name="intent" value={intent} />
      <input type="hidden" name="revision" value={revision} />
    </>
  );
}

export function Labelled({ label, error, children }: { label: string; error?: string; children: React.ReactNode }) {
  return (
    <label className="block">
      <span className="mb-1 block font-semibold">{label}</span>
      {children}
      {error ? <span className="mt-1 block text-danger">{error}</span> : null}
    </label>
  );
}

export function SubmitButton({ label }: { label: string }) {
  const busy = useNavigation().state === "submitting";
  return <button type="submit" className="btn" disabled={busy}>{busy ? "Saving…" : label}</button>;
}

/** A field's error message for one form of the page: only the form that was posted shows its errors. */
export type FieldError = (intent: string, field: string) => string | undefined;
