// Two small hooks for work the page can put off: loading or redrawing what is off screen.
import { useEffect, useState, type RefObject } from "react";
import { flushSync } from "react-dom";

export interface InViewOptions {
  /** How near the viewport counts as in view (CSS margin: "300px" starts a little before it shows). */
  margin?: string;
  /** Stay true after the first time (for code to load once it is about to be seen). */
  once?: boolean;
}

/**
 * Whether the element is in or near the viewport, from an IntersectionObserver. False on the server and
 * until the first report; printing counts as in view (the sheet shows everything), and a browser
 * without IntersectionObserver sees everything at once.
 */
export function useInView(ref: RefObject<Element | null>, { margin = "300px", once = false }: InViewOptions = {}): boolean {
  const [inView, setInView] = useState(false);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    if (typeof IntersectionObserver === "undefined") return setInView(true);
    let done = false;
    const observer = new IntersectionObserver(
      (entries) => {
        const now = entries.some((e) => e.isIntersecting);
        if (done) return;
        setInView(now);
        if (now && once) {
          done = true;
          observer.disconnect();
        }
      },
      { rootMargin: margin },
    );
    observer.observe(el);
    // before the print snapshot, not after it: render at once
    const printing = () => flushSync(() => setInView(true));
    window.addEventListener("beforeprint", printing);
    return () => {
      observer.disconnect();
      window.removeEventListener("beforeprint", printing);
    };
  }, [ref, margin, once]);
  return inView;
}

/**
 * The value while `follow` is true; while it is false, the value it last followed (the first value to
 * begin with). For a costly view of the figures that should redraw only when they have settled.
 */
export function useHeldValue<T>(value: T, follow: boolean): T {
  const [held, setHeld] = useState(value);
  // state derived from props: React re-renders this component at once, before its children
  if (follow && held !== value) setHeld(value);
  return follow ? value : held;
}
