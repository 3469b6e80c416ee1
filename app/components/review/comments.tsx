// Review comments: threads on the exhibit or on one marker, replies, and "resolve" for designers.
import { Form } from "react-router";
import type { ReviewComment as CommentItem } from "~/lib/review/types";


const when = (iso: string) => <span className="whitespace-nowrap">{iso.slice(0, 16).replace("T", " ")} UTC</span>;

function Comment({ c, canComment, canResolve }: { c: CommentItem; canComment: boolean; canResolve: boolean }) {
  return (
    <li className={`card ${c.resolved ? "opacity-80" : ""}`} data-testid="comment">
      <p className="text-ink-soft">
        <strong className="text-ink">{c.author}</strong> on {c.markerLabel ? <>marker “{c.markerLabel}”</> : "the exhibit"} · revision {c.revision} · {when(c.at)}
        {c.resolved ? <> · <span className="font-semibold text-ok">Resolved</span> by {c.resolved.by}</> : null}
      </p>
      <p className="mt-1 whitespace-pre-wrap">{c.body}</p>
      {c.replies.length ? (
        <ul className="mt-2 space-y-2 border-l-2 border-rule pl-3">
          {c.replies.map((r) => (
            <li key={r.id}><p className="text-ink-soft"><strong className="text-ink">{r.author}</strong> · {when(r.at)}</p><p className="whitespace-pre-wrap">{r.body}</p></li>
          ))}
        </ul>
      ) : null}
      <div className="mt-2 flex flex-wrap items-end gap-2">
        {canComment && !c.resolved ? (
          <Form method="post" className="flex flex-wrap items-end gap-2">
            <input type="hidden" name="intent" value="comment" />
            <input type="hidden" name="parentId" value={c.id} />
            <label className="sr-only" htmlFor={`reply-${c.id}`}>Reply to {c.author}</label>
            <input id={`reply-${c.id}`} name="body" className="field w-64" placeholder="Reply" />
            <button type="submit" className="btn-quiet">Reply</button>
          </Form>
        ) : null}
        {canResolve && !c.resolved ? (
          <Form method="post">
            <input type="hidden" name="intent" value="resolve-comment" />
            <input type="hidden" name="commentId" value={c.id} />
            <button type="submit" className="btn-quiet">Mark resolved</button>
          </Form>
        ) : null}
      </div>
    </li>
  );
}

export function Comments({ comments, markers, canComment, canResolve, error }: { comments: CommentItem[]; markers: { id: string; number: number; label: string }[]; canComment: boolean; canResolve: boolean; error?: string }) {
  const open = comments.filter((c) => !c.resolved).length;
  return (
    <div className="font-sans text-sm">
      <p className="text-ink-soft">{comments.length ? `${open} open, ${comments.length - open} resolved. Comments stay across revisions.` : "No comments yet."}</p>
      <ul className="mt-3 space-y-3">{comments.map((c) => <Comment key={c.id} c={c} canComment={canComment} canResolve={canResolve} />)}</ul>
      {canComment ? (
        <Form method="post" className="card mt-4">
          <input type="hidden" name="intent" value="comment" />
          <label htmlFor="comment-marker" className="mb-1 block font-semibold">About</label>
          <select id="comment-marker" name="markerId" className="field mb-3 max-w-full">
            <option value="">the whole exhibit</option>
            {markers.map((m) => <option key={m.id} value={m.id}>{m.number}. {m.label}</option>)}
          </select>
          <label htmlFor="comment-body" className="mb-1 block font-semibold">Comment</label>
          <textarea id="comment-body" name="body" rows={3} className="field w-full" aria-invalid={error ? true : undefined} aria-describedby={error ? "comment-error" : undefined} />
          {error ? <p id="comment-error" className="mt-1 text-danger">{error}</p> : null}
          <button type="submit" className="btn mt-2">Add comment</button>
        </Form>
      ) : null}
    </div>
  );
}
