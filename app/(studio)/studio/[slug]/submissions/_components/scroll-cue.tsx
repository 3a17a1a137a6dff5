"use client";

import { useEffect, useRef, useState, type ReactNode } from "react";

/**
 * A sideways-scrolling box that says so: when its content is wider than the box, a hint line
 * appears above it and a fade marks the edge that hides more columns, so a phone reader knows
 * Status and Last change are there.
 */
export function ScrollCue({
  children,
  className = "",
}: {
  children: ReactNode;
  className?: string;
}) {
  const box = useRef<HTMLDivElement>(null);
  const [overflow, setOverflow] = useState({ any: false, right: false, left: false });

  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const measure = () => {
      const hidden = el.scrollWidth - el.clientWidth;
      const next = { any: hidden > 1, left: el.scrollLeft > 1, right: el.scrollLeft < hidden - 1 };
      setOverflow((now) =>
        now.any === next.any && now.left === next.left && now.right === next.right ? now : next,
      );
    };
    measure();
    // The box changes size with the window; its content with every page of rows that arrives.
    const resized = new ResizeObserver(measure);
    resized.observe(el);
    const changed = new MutationObserver(() => {
      for (const child of el.children) resized.observe(child);
      measure();
    });
    changed.observe(el, { childList: true, subtree: true });
    for (const child of el.children) resized.observe(child);
    el.addEventListener("scroll", measure, { passive: true });
    return () => {
      resized.disconnect();
      changed.disconnect();
      el.removeEventListener("scroll", measure);
    };
  }, []);

  return (
    <div className="flex flex-col gap-1">
      {overflow.any ? (
        <p className="text-xs text-ink-soft" data-testid="scroll-hint">
          Scroll sideways for more columns <span aria-hidden="true">→</span>
        </p>
      ) : null}
      <div className="relative">
        <div
          ref={box}
          className={`overflow-x-auto ${className}`}
          data-testid="scroll-box"
          data-overflowing={overflow.any || undefined}
        >
          {children}
        </div>
        {overflow.left ? (
          <div
            aria-hidden="true"
            className="pointer-events-none absolute inset-y-0 left-0 w-6 rounded-l-md bg-linear-to-r from-ink/15 to-transparent"
          />
        ) : null}
        {overflow.right ? (
          <div
            aria-hidden="true"
            data-testid="scroll-fade"
            className="pointer-events-none absolute inset-y-0 right-0 w-6 rounded-r-md bg-linear-to-l from-ink/15 to-transparent"
          />
        ) : null}
      </div>
    </div>
  );
}
