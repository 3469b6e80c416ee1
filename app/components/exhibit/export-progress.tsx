// Background exports in the browser: a click on a file that may be made in the background (many
// print panels) fetches it; a 202 answer gives `{ jobUrl }`, which is polled every second for its
// `progress` (0–1) until it gives the file's `url`, then the browser downloads it. Jobs live in a
// small store outside React so the menu can close and open without losing them. Without script
// the link still works: the JSON with `jobUrl` is shown and can be followed by hand.
import { useSyncExternalStore } from "react";

interface Job {
  id: string;
  title: string;
  progress: number;
  status: "starting" | "queued" | "running" | "done" | "failed";
  url: string | null;
  error: string | null;
}

let jobs: Job[] = [];
const listeners = new Set<() => void>();
const emit = () => listeners.forEach((l) => l());
const update = (id: string, patch: Partial<Job>) => {
  jobs = jobs.map((j) => (j.id === id ? { ...j, ...patch } : j));
  emit();
};

async function poll(id: string, jobUrl: string) {
  for (;;) {
    await new Promise((r) => setTimeout(r, 1000));
    const res = await fetch(jobUrl, { headers: { Accept: "application/json" } });
    if (!res.ok) return update(id, { status: "failed", error: `The export could not be followed (${res.status}).` });
    const body = (await res.json()) as { status: Job["status"]; progress: number; url: string | null; error: string | null };
    update(id, { status: body.status, progress: body.progress, url: body.url, error: body.error });
    if (body.status === "done" && body.url) {
      window.location.assign(body.url);
      return;
    }
    if (body.status === "failed") return;
  }
}

/** onClick for a link whose file may be made in the background. */
export function startBackgroundExport(event: React.MouseEvent<HTMLAnchorElement>) {
  const link = event.currentTarget;
  if (event.metaKey || event.ctrlKey || event.shiftKey) return;
  event.preventDefault();
  startBackgroundExportUrl(link.href, link.getAttribute("aria-label") ?? link.textContent ?? "Export");
}

/** Ask for a file that may be made in the background; its progress shows in <ExportJobs />. */
export function startBackgroundExportUrl(href: string, title: string) {
  const id = `${Date.now()}-${Math.random().toString(36).slice(2)}`;
  jobs = [...jobs, { id, title, progress: 0, status: "starting", url: null, error: null }];
  emit();
  void (async () => {
    try {
      const res = await fetch(href, { headers: { Accept: "application/json, application/pdf" } });
      if (res.status === 202) {
        const { jobUrl } = (await res.json()) as { jobUrl: string };
        update(id, { status: "queued" });
        await poll(id, jobUrl);
      } else if (res.ok) {
        update(id, { status: "done", progress: 1 });
        window.location.assign(href);
      } else {
        const body = (await res.json().catch(() => null)) as { message?: string } | null;
        update(id, { status: "failed", error: body?.message ?? `The export failed (${res.status}).` });
      }
    } catch {
      update(id, { status: "failed", error: "The server could not be reached." });
    }
  })();
}

function subscribe(l: () => void) {
  listeners.add(l);
  return () => listeners.delete(l);
}

/** The running and finished background exports, with their progress. */
export function ExportJobs() {
  const list = useSyncExternalStore(subscribe, () => jobs, () => jobs);
  if (list.length === 0) return null;
  return (
    <ul className="mt-3 space-y-2" aria-live="polite" data-testid="export-jobs">
      {list.map((j) => (
        <li key={j.id}>
          <span className="font-semibold text-ink">{j.title}</span>
          {j.status === "failed" ? (
            <p className="text-danger">{j.error}</p>
          ) : (
            <>
              <progress className="block w-full" max={1} value={j.progress} aria-label={`${j.title}: ${Math.round(j.progress * 100)} %`} />
              <p className="text-ink-soft">
                {j.status === "done" ? (
                  <>Ready{j.url ? <> — <a href={j.url}>download</a></> : null}</>
                ) : j.status === "starting" || j.status === "queued" ? (
                  "Waiting to start…"
                ) : (
                  `Making the file: ${Math.round(j.progress * 100)} %`
                )}
              </p>
            </>
          )}
        </li>
      ))}
    </ul>
  );
}
