"use client";

import { type RefObject, useEffect, useState } from "react";

/**
 * Whether `content` is wider than the space `box`'s parent gives it, kept current as the
 * window turns or the content changes. Measured against the parent, not the box, so the answer
 * does not depend on whether the box already scrolls.
 */
export function useOverflowsParent(
  box: RefObject<HTMLElement | null>,
  content: RefObject<HTMLElement | null>,
): boolean {
  const [overflows, setOverflows] = useState(false);
  useEffect(() => {
    const parent = box.current?.parentElement;
    const inner = content.current;
    if (!parent || !inner) return;
    const measure = () => {
      setOverflows(inner.scrollWidth > parent.clientWidth + 1);
    };
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(parent);
    observer.observe(inner);
    return () => observer.disconnect();
  }, [box, content]);
  return overflows;
}
