// Marker texts are short Markdown written by designers: rendered with marked, then sanitised
// (sanitize-html) to a small set of inline and block tags. Used on the server and in exports.
import { marked } from "marked";
import sanitizeHtml from "sanitize-html";

const ALLOWED = {
  allowedTags: ["p", "em", "strong", "a", "ul", "ol", "li", "br", "sup", "sub", "code", "blockquote"],
  allowedAttributes: { a: ["href", "title"] },
  allowedSchemes: ["https", "http", "mailto"],
  transformTags: { a: sanitizeHtml.simpleTransform("a", { rel: "noopener noreferrer" }) },
};

export function renderMarkdown(text: string): string {
  if (!text.trim()) return "";
  return sanitizeHtml(marked.parse(text, { async: false, gfm: true, breaks: false }) as string, ALLOWED).trim();
}
