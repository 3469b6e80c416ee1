// The width of an element in CSS pixels, kept up to date as the page resizes; drawings use it so
// that their text is drawn at its true size (11 px stays 11 px on a phone) instead of being shrunk
// with the whole picture. Before the first measurement (server rendering) it is `fallback`.
import { useLayoutEffect, useRef, useState } from "react";

const useIsoLayoutEffect = typeof window === "undefined" ? () => undefined : useLayoutEffect;

export function useWidth<T extends HTMLElement>(fallback: number): [React.RefObject<T | null>, number] {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(fallback);
  useIsoLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    const measure = () => setWidth(Math.max(280, Math.floor(el.clientWidth)));
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return [ref, width];
}
