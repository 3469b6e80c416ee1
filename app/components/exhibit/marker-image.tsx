// The image of a marker (or the exhibit's cover) in the composer: choose or drop a file, watch it
// upload (a real progress bar from XHR upload events: percentage and bytes, with Cancel), wait for
// the sizes to be made, then attach it with its alt text and credit. Uploads run several at once and
// live outside React (a small store), so they survive the page re-rendering after another save.
import { useEffect, useState, useSyncExternalStore } from "react";
import { Form, useRouteLoaderData } from "react-router";
import { IntentFields } from "~/components/exhibit/form-bits";
import { ACCEPT_ATTRIBUTE, ALT_HINT, ALT_MAX, CREDIT_HINT, CREDIT_MAX, fallbackSrc, IMAGE_FILES_HINT, lacksAlt, MAX_IMAGE_BYTES, srcSetOf, type ComposerImage, type ImageSize } from "~/lib/images";

type Phase = "uploading" | "processing" | "ready" | "failed" | "refused";
interface Upload {
  phase: Phase;
  name: string;
  loaded: number;
  total: number;
  assetId?: number;
  sizes?: ImageSize[];
  message?: string;
  abort?: () => void;
}

// ---------- the upload store (module level: one per browser tab) ----------

let uploads: Record<string, Upload> = {};
const listeners = new Set<() => void>();
const put = (key: string, u: Upload | null) => {
  const next = { ...uploads };
  if (u) next[key] = u;
  else delete next[key];
  uploads = next;
  for (const l of listeners) l();
};
const patch = (key: string, p: Partial<Upload>) => uploads[key] && put(key, { ...uploads[key], ...p });
const subscribe = (l: () => void) => (listeners.add(l), () => listeners.delete(l));

function useUpload(key: string): Upload | undefined {
  return useSyncExternalStore(subscribe, () => uploads[key], () => undefined);
}

function megabytes(n: number) {
  return `${(n / 1048576).toFixed(n < 10 * 1048576 ? 1 : 0)} MB`;
}

async function watch(key: string, assetId: number) {
  for (let wait = 700; uploads[key]?.assetId === assetId; wait = Math.min(wait * 1.4, 4000)) {
    const res = await fetch(`/api/assets/${assetId}`, { headers: { Accept: "application/json" } }).catch(() => null);
    const body = res?.ok ? ((await res.json()) as { status: string; sizes: ImageSize[]; error?: string }) : null;
    if (body?.status === "ready") return patch(key, { phase: "ready", sizes: body.sizes });
    if (body?.status === "failed") return patch(key, { phase: "failed", message: body.error });
    await new Promise((r) => setTimeout(r, wait));
  }
}

function start(key: string, file: File) {
  uploads[key]?.abort?.();
  if (file.size > MAX_IMAGE_BYTES) return put(key, { phase: "refused", name: file.name, loaded: 0, total: file.size, message: `The file is larger than ${megabytes(MAX_IMAGE_BYTES)}.` });
  const xhr = new XMLHttpRequest();
  put(key, { phase: "uploading", name: file.name, loaded: 0, total: file.size, abort: () => xhr.abort() });
  xhr.upload.onprogress = (e) => patch(key, { loaded: e.loaded, total: e.lengthComputable ? e.total : file.size });
  xhr.onload = () => {
    let body: { id?: number; error?: { message?: string } } = {};
    try {
      body = JSON.parse(xhr.responseText);
    } catch {
      /* not JSON: the message below */
    }
    if (xhr.status === 201 && body.id) {
      patch(key, { phase: "processing", assetId: body.id, loaded: uploads[key]?.total ?? file.size, abort: undefined });
      void watch(key, body.id);
    } else {
      patch(key, { phase: "refused", message: body.error?.message ?? `The upload failed (HTTP ${xhr.status}).`, abort: undefined });
    }
  };
  xhr.onerror = () => patch(key, { phase: "refused", message: "The connection was lost during the upload. Try again.", abort: undefined });
  xhr.onabort = () => put(key, null);
  xhr.open("POST", "/api/assets");
  xhr.setRequestHeader("Accept", "application/json");
  const form = new FormData();
  form.set("file", file);
  xhr.send(form);
}

async function retry(key: string, assetId: number) {
  patch(key, { phase: "processing", message: undefined });
  const form = new FormData();
  form.set("intent", "retry");
  await fetch(`/api/assets/${assetId}`, { method: "POST", body: form }).catch(() => null);
  void watch(key, assetId);
}

// ---------- the pieces ----------

function Picture({ sizes, alt, className }: { sizes: ImageSize[]; alt: string; className?: string }) {
  const src = fallbackSrc(sizes);
  if (!src) return null;
  const avif = srcSetOf(sizes, "avif");
  return (
    <picture>
      {avif ? <source type="image/avif" srcSet={avif} sizes="16rem" /> : null}
      <source type="image/webp" srcSet={srcSetOf(sizes, "webp")} sizes="16rem" />
      <img src={src} srcSet={srcSetOf(sizes, "jpeg")} sizes="16rem" alt={alt} loading="lazy" className={className ?? "mt-2 max-h-40 w-64 rounded border border-rule object-contain"} />
    </picture>
  );
}

function Progress({ u, onCancel }: { u: Upload; onCancel: () => void }) {
  const pct = u.total ? Math.min(100, Math.round((u.loaded / u.total) * 100)) : 0;
  return (
    <div className="mt-2 w-64 text-xs" data-upload-phase={u.phase}>
      <div className="flex items-center justify-between gap-2">
        <span className="truncate">{u.name}</span>
        {u.phase === "uploading" ? <button type="button" className="btn-quiet" onClick={onCancel}>Cancel</button> : null}
      </div>
      <progress className="block w-full" max={100} value={pct} aria-label={`Upload of ${u.name}`} />
      <p aria-live="polite">
        {u.phase === "uploading" ? `${pct} % · ${megabytes(u.loaded)} of ${megabytes(u.total)}` : "100 % uploaded · preparing the sizes…"}
      </p>
    </div>
  );
}

function WordsForm({ target, assetId, revision, alt, credit, label }: { target: string; assetId: number; revision: number; alt: string; credit: string; label: string }) {
  const cover = target === "cover";
  return (
    <Form method="post" className="mt-2 w-64 space-y-2 text-xs">
      <IntentFields intent={cover ? "set-cover-image" : "set-marker-image"} revision={revision} />
      {cover ? null : <input type="hidden" name="markerId" value={target} />}
      <input type="hidden" name="assetId" value={assetId} />
      <label className="block font-semibold">
        Alt text <span className="font-normal">(up to {ALT_MAX} characters; needed before review)</span>
        <textarea name="alt" defaultValue={alt} maxLength={ALT_MAX} rows={2} className="field" />
      </label>
      <p className="text-ink-soft">{ALT_HINT}</p>
      <label className="block font-semibold">
        Credit and licence
        <input name="credit" defaultValue={credit} maxLength={CREDIT_MAX} className="field" />
      </label>
      <p className="text-ink-soft">{CREDIT_HINT}</p>
      <button type="submit" className="btn-quiet">{label}</button>
    </Form>
  );
}

/**
 * Choose a file or drop one on it. `compact`: one short line (a marker row of the composer's table,
 * where the table's introduction gives the file types once), `name` saying whose image it is to
 * screen readers; otherwise a box with the file types.
 */
function Chooser({ target, label, compact = false, name }: { target: string; label: string; compact?: boolean; name?: string }) {
  const [over, setOver] = useState(false);
  const box = compact ? "mt-1 inline-block px-2 py-1" : "mt-2 block w-64 p-2 text-center";
  return (
    <label
      className={`${box} cursor-pointer rounded border border-dashed text-xs ${over ? "border-slate-river-700 bg-sandstone-50" : "border-rule"}`}
      onDragOver={(e) => (e.preventDefault(), setOver(true))}
      onDragLeave={() => setOver(false)}
      onDrop={(e) => {
        e.preventDefault();
        setOver(false);
        const file = e.dataTransfer.files[0];
        if (file) start(target, file);
      }}
    >
      {compact ? <span aria-hidden="true">+ </span> : null}
      {label}
      {name ? <span className="sr-only"> for {name}</span> : null}
      {compact ? null : <span className="text-ink-soft"> ({IMAGE_FILES_HINT})</span>}
      <input
        type="file"
        accept={ACCEPT_ATTRIBUTE}
        className="sr-only"
        data-image-input={target}
        onChange={(e) => {
          const file = e.currentTarget.files?.[0];
          if (file) start(target, file);
          e.currentTarget.value = "";
        }}
      />
    </label>
  );
}

interface LoaderImages {
  images?: { cover: ComposerImage | null; markers: Record<string, ComposerImage> };
}

/** The image control of one target: a marker id (`name`: the marker's number and label, for screen readers), or "cover". */
export function ImageControl({ target, revision, canEdit, name }: { target: string; revision: number; canEdit: boolean; name?: string }) {
  const data = useRouteLoaderData("routes/studio/exhibits.$slug") as LoaderImages | undefined;
  const image = (target === "cover" ? data?.images?.cover : data?.images?.markers[target]) ?? null;
  const u = useUpload(target);
  // Once the attached image is the uploaded one, the upload is done with.
  useEffect(() => {
    if (u?.assetId && image?.assetId === u.assetId) put(target, null);
  }, [u?.assetId, image?.assetId, target]);
  const pending = u && !(u.assetId && image?.assetId === u.assetId) ? u : null;

  return (
    <div className="mt-2" data-image-target={target}>
      {image ? (
        <figure>
          {image.status === "ready" ? <Picture sizes={image.sizes} alt={image.alt} /> : <p className="text-xs text-ink-soft">{image.status === "failed" ? `Image failed: ${image.error}` : "Image: preparing the sizes…"}</p>}
          <figcaption className="mt-1 text-xs">
            {lacksAlt(image) ? <span className="font-semibold text-danger">No alt text yet — the review checks will fail. </span> : null}
            {image.credit ? <span className="text-ink-soft">{image.credit}</span> : null}
          </figcaption>
        </figure>
      ) : null}
      {!canEdit ? null : pending ? (
        <>
          {pending.phase === "uploading" || pending.phase === "processing" ? <Progress u={pending} onCancel={() => pending.abort?.()} /> : null}
          {pending.phase === "ready" && pending.assetId ? (
            <>
              <Picture sizes={pending.sizes ?? []} alt="" />
              <WordsForm target={target} assetId={pending.assetId} revision={revision} alt={image?.alt ?? ""} credit={image?.credit ?? ""} label={image ? "Replace the image" : "Attach the image"} />
              <button type="button" className="btn-quiet text-xs" onClick={() => put(target, null)}>Discard this upload</button>
            </>
          ) : null}
          {pending.phase === "failed" ? (
            <p className="mt-2 w-64 text-xs text-danger" role="alert">
              {pending.message ?? "Preparing the image failed."}{" "}
              {pending.assetId ? <button type="button" className="btn-quiet" onClick={() => retry(target, pending.assetId!)}>Try again</button> : null}
            </p>
          ) : null}
          {pending.phase === "refused" ? (
            <p className="mt-2 w-64 text-xs text-danger" role="alert">
              {pending.name}: {pending.message} <button type="button" className="btn-quiet" onClick={() => put(target, null)}>Dismiss</button>
            </p>
          ) : null}
        </>
      ) : (
        <>
          {image ? (
            <details className="text-xs">
              <summary className="cursor-pointer">Image words, replace or remove</summary>
              <WordsForm target={target} assetId={image.assetId} revision={revision} alt={image.alt} credit={image.credit} label="Save the words" />
              <Chooser target={target} label="Choose or drop a new image" />
              <Form method="post" className="mt-2">
                <IntentFields intent="remove-image" revision={revision} />
                <input type="hidden" name="markerId" value={target} />
                <button type="submit" className="btn-quiet text-danger">Remove the image</button>
              </Form>
            </details>
          ) : (
            target === "cover" ? <Chooser target={target} label="Choose or drop a cover image" /> : <Chooser target={target} label="Add an image" compact name={name} />
          )}
        </>
      )}
    </div>
  );
}

/** The exhibit's cover image, as a section of the composer. */
export function CoverImageSection({ revision, canEdit }: { revision: number; canEdit: boolean }) {
  return (
    <section className="card mt-6" aria-labelledby="cover-h">
      <h2 id="cover-h" className="text-xl">Cover image</h2>
      <p className="mt-1 font-sans text-sm text-ink-soft">Shown at the top of the visitor page and on printed material.</p>
      <ImageControl target="cover" revision={revision} canEdit={canEdit} />
    </section>
  );
}
