import { useId, useState } from "react";
import { useNavigation } from "react-router";

export function Field({
  label,
  name,
  error,
  hint,
  ...input
}: { label: string; name: string; error?: string; hint?: string } & React.InputHTMLAttributes<HTMLInputElement>) {
  const id = useId();
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className="mb-4">
      <label htmlFor={id} className="mb-1 block text-sm font-semibold">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="mb-1 font-sans text-sm text-ink-soft">
          {hint}
        </p>
      ) : null}
      <input id={id} name={name} className="field" aria-invalid={error ? true : undefined} aria-describedby={describedBy} {...input} />
      {error ? (
        <p id={`${id}-error`} className="mt-1 font-sans text-sm text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export function FormMessage({ kind = "error", children }: { kind?: "error" | "success" | "info"; children: React.ReactNode }) {
  if (!children) return null;
  const styles = {
    error: "border-danger bg-red-50 text-danger",
    success: "border-ok bg-green-50 text-ok",
    info: "border-slate-river-500 bg-slate-river-100 text-slate-river-700",
  }[kind];
  return (
    <div role={kind === "error" ? "alert" : "status"} className={`mb-4 rounded border-l-4 p-3 font-sans text-sm ${styles}`}>
      {children}
    </div>
  );
}

/** A unit picker beside a number field (ages: a, ka, Ma, Ga; lengths: mm … mi). */
export function UnitSelect({ name, label, units, ...rest }: { name: string; label: string; units: readonly string[]; value?: string; defaultValue?: string; onChange?: (v: string) => void }) {
  const { onChange, ...props } = rest;
  return (
    <div className="mb-4">
      <label htmlFor={name} className="mb-1 block text-sm font-semibold">{label}</label>
      <select id={name} name={name} className="field w-24" {...props} onChange={onChange ? (e) => onChange(e.target.value) : undefined}>
        {units.map((u) => <option key={u} value={u}>{u}</option>)}
      </select>
    </div>
  );
}

export interface Notice {
  kind: "error" | "success" | "info";
  message: string;
}

/**
 * The notice a redirect left for this page ("Added 22 boundaries."). It goes as soon as the next
 * form is sent, so a success never stands beside a later error: one current message at a time.
 */
export function FlashNotice({ notice }: { notice: Notice | null | undefined }) {
  const navigation = useNavigation();
  const [dismissed, setDismissed] = useState<Notice | null>(null);
  // Derived during render (React's "adjusting state when a prop changes"), not in an effect.
  if (navigation.state === "submitting" && notice && dismissed !== notice) setDismissed(notice);
  if (!notice || dismissed === notice) return null;
  return <FormMessage kind={notice.kind}>{notice.message}</FormMessage>;
}
