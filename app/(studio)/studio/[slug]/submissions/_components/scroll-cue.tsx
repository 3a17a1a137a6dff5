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
      setOverflow({
        any: hidden > 1,
        left: el.scrollLeft > 1,
        right: el.scrollLeft < hidden - 1,
      });
    };
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(el);
    if (el.firstElementChild) observer.observe(el.firstElementChild);
    el.addEventListener("scroll", measure, { passive: true });
    return () => {
      observer.disconnect();
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
