"use client";
import dynamic from "next/dynamic";
import { useEffect, useRef, useState } from "react";
import type { JointStageProps } from "./joint-stage";

// Konva needs the DOM: the stage module is loaded in the browser only.
const JointStage = dynamic(() => import("./joint-stage"), {
  ssr: false,
  loading: () => <p className="p-4 text-table text-ink-500">Loading the drawing…</p>,
});

/** Sizes the stage to its box and mounts it client-side. */
export function JointCanvas(props: Omit<JointStageProps, "width" | "height"> & { minHeight?: number }) {
  const box = useRef<HTMLDivElement>(null);
  const [size, setSize] = useState<{ w: number; h: number } | null>(null);
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const measure = () =>
      setSize({
        w: Math.max(200, Math.floor(el.clientWidth)),
        h: Math.max(240, Math.floor(el.clientHeight)),
      });
    measure();
    const ro = new ResizeObserver(measure);
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  return (
    <div
      ref={box}
      data-testid="joint-canvas"
      className="relative h-full w-full overflow-hidden bg-white"
      style={{ minHeight: props.minHeight ?? 420 }}
    >
      {size && <JointStage {...props} width={size.w} height={size.h} />}
    </div>
  );
}
