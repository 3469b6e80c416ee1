// A trade word with its plain explanation: dotted underline, the explanation on hover, on keyboard
// focus or on a tap (phones), and the full list on the glossary page (/glossary).
import { useId, useState } from "react";
import { glossaryEntry } from "~/lib/glossary";

export function Term({ id, children }: { id: string; children?: React.ReactNode }) {
  const entry = glossaryEntry(id);
  const tipId = useId();
  const [open, setOpen] = useState(false);
  return (
    <span className="term">
      <button type="button" aria-describedby={tipId} aria-expanded={open} onClick={() => setOpen((o) => !o)} onBlur={() => setOpen(false)}>
        {children ?? entry.term}
      </button>
      <span role="tooltip" id={tipId}>
        <strong>{entry.term}</strong> — {entry.plain}. {entry.explanation} More in the Glossary (site menu).
      </span>
    </span>
  );
}
