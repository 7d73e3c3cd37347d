import { useEffect, useMemo, useRef, useState } from "react";
import { useForm } from "react-hook-form";
import { useQuery } from "@tanstack/react-query";
import { ApiError } from "../api/client";
import { Button } from "../components/Button";
import { Caution } from "../components/Caution";
import { Notice } from "../components/Notice";
import { PageIntro } from "../components/PageIntro";
import { KINETICS_CHECK_NOTICE } from "../../../shared/kinetics/checkTrace";
import { KineticsInputError } from "../../../shared/kinetics/kineticsInputError";
import type { ParsedTrace } from "../../../shared/kinetics/traceCsvParser";
import { rateModelListQueryOptions } from "../features/rateModels/queries";
import { useSession } from "../features/session/useSession";
import { AnalysisCharts } from "../features/kinetics/AnalysisCharts";
import { DEMO_ANALYSIS, MANUAL_MODEL, analysisResolver, applyVersion, type AnalysisFormValues, type AnalysisSetup } from "../features/kinetics/analysisForm";
import { ConditionFields } from "../features/kinetics/ConditionFields";
import { ModelFields } from "../features/kinetics/ModelFields";
import { OrderTable } from "../features/kinetics/OrderTable";
import { ProgressBar } from "../features/kinetics/ProgressBar";
import { RunOptions } from "../features/kinetics/RunOptions";
import { analyseInBrowser, analyseOnServer, type AnalysisOutcome } from "../features/kinetics/runAnalysis";
import { TraceInput, type LoadedTrace } from "../features/kinetics/TraceInput";
import { TraceProblems } from "../features/kinetics/TraceProblems";
import { TraceUploadError } from "../features/kinetics/uploadTrace";
import { VerdictPanel } from "../features/kinetics/VerdictPanel";

interface Shown {
  outcome: AnalysisOutcome;
  trace: ParsedTrace;
  order: number;
}

type Failure = { message: string; problems?: TraceUploadError["problems"]; totalProblems?: number };

function describeFailure(error: unknown): Failure {
  if (error instanceof KineticsInputError) return { message: `${error.message} (input: ${error.field})` };
  if (error instanceof TraceUploadError) return { message: error.message, problems: error.problems, totalProblems: error.totalProblems };
  if (error instanceof ApiError) return { message: error.message };
  return { message: "Something unexpected went wrong while checking the trace. Try again." };
}

/** Checks a batch's volume trace against a rate model: verdict, reasons, plots and orders compared. */
export default function KineticsAnalysis() {
  const { user } = useSession();
  const mayType = Boolean(user?.roles.some((r) => r === "engineer" || r === "quality"));
  const versions = useQuery(rateModelListQueryOptions());
  const approved = useMemo(() => (versions.data ?? []).filter((v) => v.status === "approved"), [versions.data]);
  const form = useForm<AnalysisFormValues, unknown, AnalysisSetup>({ resolver: analysisResolver, defaultValues: DEMO_ANALYSIS });
  const [loaded, setLoaded] = useState<LoadedTrace | null>(null);
  const [shown, setShown] = useState<Shown | null>(null);
  const [running, setRunning] = useState<{ stage: string; fraction: number | null } | null>(null);
  const [failure, setFailure] = useState<Failure | null>(null);
  const verdictHeading = useRef<HTMLHeadingElement>(null);

  // A new verdict takes the keyboard focus, so the result is read out and scrolled into view.
  useEffect(() => {
    if (shown) verdictHeading.current?.focus();
  }, [shown]);

  // Someone who may not type a model in starts from the first approved version.
  useEffect(() => {
    if (!mayType && approved.length > 0 && form.getValues("modelSource") === MANUAL_MODEL) applyVersion(form, approved[0]);
  }, [mayType, approved, form]);

  const blocked = !mayType && approved.length === 0;
  const onSubmit = form.handleSubmit(async (setup) => {
    setFailure(null);
    if (!loaded) {
      setFailure({ message: "Choose, paste or load a trace first (step 1)." });
      return;
    }
    setShown(null);
    try {
      if (setup.runWhere === "browser") {
        setRunning({ stage: "Checking the trace in this browser…", fraction: null });
        // Let the status paint before the work holds the page.
        await new Promise((resolve) => setTimeout(resolve, 30));
        setShown({ outcome: analyseInBrowser(setup, loaded.trace), trace: loaded.trace, order: setup.model.order });
      } else {
        const outcome = await analyseOnServer(setup, loaded.trace, loaded.file, loaded.fileName, (stage, fraction) =>
          setRunning({ stage: fraction >= 1 ? `${stage}: done, waiting for the answer…` : stage, fraction }),
        );
        setShown({ outcome, trace: loaded.trace, order: setup.model.order });
      }
    } catch (error) {
      setFailure(describeFailure(error));
    } finally {
      setRunning(null);
    }
  });

  const orders = shown?.outcome.orders;
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Kinetics analysis">
        <p>
          Check a batch's volume trace against a rate model at the batch's conditions. The check runs
          with the same kinetics library as the server; nothing here is saved to the batch record.
        </p>
      </PageIntro>
      {!shown && (
        <Caution title="Caution: this check is an aid to review">
          <p>{KINETICS_CHECK_NOTICE}</p>
        </Caution>
      )}
      <TraceInput
        loaded={loaded}
        onLoaded={(next) => {
          setLoaded(next);
          setShown(null);
        }}
      />
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
        <ModelFields form={form} approved={approved} mayType={mayType} />
        {versions.error && <Notice tone="error">The approved rate models could not be loaded; {mayType ? "you can still type a model in." : "try again in a moment."}</Notice>}
        <ConditionFields form={form} />
        <RunOptions form={form} />
        <div className="flex flex-col gap-3">
          {blocked && <Notice>No rate model has been approved yet, so there is nothing to check against.</Notice>}
          <Button type="submit" className="self-start" busy={running !== null} disabled={blocked}>
            Check the trace
          </Button>
          <div aria-live="polite">
            {running && (running.fraction === null ? <p role="status">{running.stage}</p> : <ProgressBar label={running.stage} fraction={running.fraction} />)}
          </div>
          <div aria-live="assertive">
            {failure && (failure.problems && failure.problems.length > 0 ? <TraceProblems problems={failure.problems} total={failure.totalProblems ?? failure.problems.length} /> : <Notice tone="error">{failure.message}</Notice>)}
          </div>
        </div>
      </form>
      {shown && (
        <div className="flex flex-col gap-6">
          <VerdictPanel ref={verdictHeading} outcome={shown.outcome} />
          {orders && "error" in orders && <Notice>{orders.error}</Notice>}
          {orders && "trials" in orders && <OrderTable trials={orders.trials} chosen={orders.chosen} V0={shown.outcome.V0} />}
          <AnalysisCharts trace={shown.trace} outcome={shown.outcome} order={shown.order} />
        </div>
      )}
    </div>
  );
}
