import { useMemo, type ReactNode } from "react";
import type uPlot from "uplot";
import { UPlotChart } from "../../components/charts/UPlotChart";
import { thinForPlot, type PlotColumn } from "../../components/charts/thinForPlot";
import type { ParsedTrace } from "../../../../shared/kinetics/traceCsvParser";
import { formatNumber } from "../vessels/quantityFormat";
import type { AnalysisOutcome } from "./runAnalysis";

const OBSERVED = "#4a5a63";
const MODEL = "#0e5c63";
const FITTED = "#7a4600";

type Column = ArrayLike<number | null>;

/** A plain column for uPlot, scaled when asked; a missing or non-finite value becomes a gap (null). */
function column(values: Column, scale = 1): PlotColumn {
  const out: PlotColumn = new Array(values.length);
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    out[i] = v === null || !Number.isFinite(v) ? null : v * scale;
  }
  return out;
}

/** slope·x at each x: a straight line through the origin. */
const throughOrigin = (x: Column, slope: number | null): PlotColumn => column(x, 1).map((v) => (v === null || slope === null ? null : v * slope));

function Figure({ title, caption, children }: { title: string; caption: ReactNode; children: ReactNode }) {
  return (
    <figure className="flex flex-col gap-2 rounded-lg border-2 border-ink-200 bg-white p-4">
      <h3 className="text-lg font-bold">{title}</h3>
      {children}
      <figcaption className="text-[0.9rem] text-ink-700">{caption}</figcaption>
    </figure>
  );
}

/** The y quantity of the integral-method straight line for each order. */
function linearisedLabel(order: number): string {
  if (order === 0) return "(cA0/εA)·ln(V/V0), mol/L";
  if (order === 1) return "−ln(1 − XA)";
  if (order === 2) return "(1 + εA)·XA/(1 − XA) + εA·ln(1 − XA)";
  return "τ(XA)·cA0^(1−n)";
}

const thinNote = (stride: number) => (stride > 1 ? ` Drawn from every ${stride}th point.` : "");

/** Observed against predicted volume, the linearised plot with its fitted line, and the residuals. */
export function AnalysisCharts({ trace, outcome, order }: { trace: ParsedTrace; outcome: AnalysisOutcome; order: number }) {
  const volume = useMemo(() => {
    const minutes = column(trace.t, 1 / 60);
    const predicted = outcome.predicted.length === trace.t.length ? column(outcome.predicted) : new Array<null>(trace.t.length).fill(null);
    return thinForPlot([minutes, column(trace.V), predicted]);
  }, [trace, outcome]);

  const linear = useMemo(() => {
    const lin = outcome.linearised;
    if (!lin || lin.x.length === 0) return null;
    return thinForPlot([column(lin.x, 1 / 60), column(lin.y), throughOrigin(lin.x, lin.slope), throughOrigin(lin.x, lin.modelSlope)]);
  }, [outcome]);

  const residual = useMemo(() => {
    if (outcome.residuals.length === 0 || outcome.residuals.length !== outcome.residualTimes.length) return null;
    return thinForPlot([column(outcome.residualTimes, 1 / 60), column(outcome.residuals, 1000)]);
  }, [outcome]);

  const line = (label: string, stroke: string, width = 2, dash?: number[]): uPlot.Series => ({ label, stroke, width, dash, points: { show: false } });

  return (
    <div className="flex flex-col gap-4">
      <Figure
        title="Observed and predicted volume"
        caption={`${trace.t.length.toLocaleString("en-GB")} observed points against the model at k = ${formatNumber(outcome.kModel, 5)} ${outcome.kUnit}.${thinNote(volume.stride)}`}
      >
        <UPlotChart label="Gas volume against time: observed and predicted by the model" xLabel="Time (min)" yLabel="Volume (L)" data={volume.columns as unknown as uPlot.AlignedData} series={[line("Observed", OBSERVED, 1), line("Model", MODEL, 2.5)]} />
      </Figure>
      {linear && (
        <Figure
          title={`Linearised plot, order ${formatNumber(order, 4)}`}
          caption={`The integral quantity against time is a straight line through the origin when the order fits; fitted slope ${formatNumber(outcome.linearised?.slope, 5)}, model slope ${formatNumber(outcome.linearised?.modelSlope, 5)} (per s).${thinNote(linear.stride)}`}
        >
          <UPlotChart label="Linearised integral quantity against time with the fitted and model lines" xLabel="Time (min)" yLabel={linearisedLabel(order)} data={linear.columns as unknown as uPlot.AlignedData} series={[line("Observed", OBSERVED, 1), line("Fitted line", FITTED, 2), line("Model line", MODEL, 2, [8, 6])]} />
        </Figure>
      )}
      {residual && (
        <Figure title="Residuals of the fit" caption={`Observed minus fitted volume, mL; residual RMS ${formatNumber((outcome.residualRms ?? Number.NaN) * 1000, 4)} mL.${thinNote(residual.stride)}`}>
          <UPlotChart label="Residuals of the fitted volume against time" xLabel="Time (min)" yLabel="Residual (mL)" data={residual.columns as unknown as uPlot.AlignedData} series={[line("Residual", OBSERVED, 1)]} height={240} />
        </Figure>
      )}
    </div>
  );
}
