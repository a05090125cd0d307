import { type ReactNode, Suspense, useId } from "react";
import { Loading } from "../States";

/**
 * The frame every chart sits in: one picture for assistive technology (its name, and a description
 * that says in words what the chart shows), and a quiet "Drawing the chart…" while the chart library,
 * loaded only by pages that draw charts, arrives. The chart itself is presentational inside it; the
 * figures stay readable by keyboard in the table a page shows beside it.
 */
export function ChartFrame({ name, description, height, children }: { name: string; description: string; height: number; children: ReactNode }) {
  const descId = useId();
  return (
    <div role="img" aria-label={name} aria-describedby={descId} className="w-full max-w-2xl" style={{ height }}>
      <Suspense fallback={<Loading label="Drawing the chart…" />}>{children}</Suspense>
      <p id={descId} className="sr-only">
        {description}
      </p>
    </div>
  );
}
