// Response compression (the `compression` middleware), and one repair to how it meets React
// Router's streamed responses.
//
// @react-router/node writes a streamed page or .data response chunk by chunk; after a write the
// socket cannot take at once it waits with `res.once("drain", f)` and then `res.off("drain", f)`.
// compression() sends `res.on("drain")` on to its zlib stream (res.once goes through res.on) but
// leaves res.off and res.removeListener on the response itself, so every such wait left one
// listener on the zlib stream until the response ended — Node warned "MaxListenersExceededWarning:
// 11 drain listeners added to [BrotliCompress]" on pages of a few hundred kilobytes, and a large
// page sent to a slow phone collected one per wait (expressjs/compression issue 135).
//
// drainWaits() keeps those one-off waits in a list of its own, behind a single "drain" listener per
// response that compression() may forward wherever it likes; res.off removes from the list.
import compression from "compression";
import type { RequestHandler, Response } from "express";

type Listener = (...args: unknown[]) => void;

/** One "drain" listener per response for every res.once("drain") wait; res.off / removeListener take a wait back. */
export function drainWaits(): RequestHandler {
  return (_req, res, next) => {
    const waits = new Set<Listener>();
    let forwarding = false;
    const { once, off, removeListener } = res;
    const release = () => {
      const now = [...waits];
      waits.clear();
      for (const f of now) f();
    };
    res.once = function (this: Response, event: string | symbol, listener: Listener) {
      if (event !== "drain") return once.call(this, event, listener);
      if (!forwarding) {
        forwarding = true;
        this.on("drain", release);
      }
      waits.add(listener);
      return this;
    } as Response["once"];
    const takeBack = (original: typeof off) =>
      function (this: Response, event: string | symbol, listener: Listener) {
        if (event === "drain" && waits.delete(listener)) return this;
        return original.call(this, event, listener);
      } as Response["off"];
    res.off = takeBack(off);
    res.removeListener = takeBack(removeListener);
    next();
  };
}

/** compression(), then drainWaits() over it (the order matters: drainWaits' single listener goes through compression's res.on). */
export function compressedResponses(): RequestHandler[] {
  return [compression(), drainWaits()];
}
