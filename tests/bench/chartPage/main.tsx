import { useEffect } from "react";
import { createRoot } from "react-dom/client";
import { TraceChart } from "../../../web/src/components/TraceChart";
import { benchTrace, type BenchTrace } from "./benchTrace";

declare global {
  interface Window {
    /** Set once the chart has drawn and the browser has shown the frame. */
    chartBench?: { points: number; mountToPaintMs: number; inkedPixels: number };
  }
}

/** Canvas pixels that are not blank, so the bench can tell a drawn chart from an empty box. */
function inkedPixels(): number {
  let inked = 0;
  for (const canvas of document.querySelectorAll("canvas")) {
    const pixels = canvas.getContext("2d")?.getImageData(0, 0, canvas.width, canvas.height).data;
    for (let i = 3; pixels && i < pixels.length; i += 4) if (pixels[i] !== 0) inked++;
  }
  return inked;
}

function Bench({ trace, startedAt }: { trace: BenchTrace; startedAt: number }) {
  // A parent's effect runs after its children's, so the plot exists here. uPlot draws in a
  // microtask queued by its constructor; the next frame then shows it, and the task after
  // that frame's callback runs once the frame has been handed to the compositor.
  useEffect(() => {
    queueMicrotask(() =>
      requestAnimationFrame(() =>
        setTimeout(() => {
          const mountToPaintMs = performance.now() - startedAt;
          window.chartBench = { points: trace.t.length, mountToPaintMs, inkedPixels: inkedPixels() };
        }, 0),
      ),
    );
  }, [trace, startedAt]);
  return <TraceChart t={trace.t} V={trace.V} predicted={trace.predicted} label="Logged volume against the model" />;
}

const points = Number(new URLSearchParams(location.search).get("points") ?? "0");
const trace = benchTrace(points);
const root = document.getElementById("root");
if (!root) throw new Error("The bench page has no #root element.");
// Timing starts after the data exists: it covers React, the chart's own data shaping and uPlot.
const startedAt = performance.now();
createRoot(root).render(<Bench trace={trace} startedAt={startedAt} />);
