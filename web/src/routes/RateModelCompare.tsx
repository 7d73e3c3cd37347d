import { useQuery } from "@tanstack/react-query";
import { useParams, useSearchParams } from "react-router";
import { Breadcrumb } from "../components/Breadcrumb";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { SelectInput } from "../components/SelectInput";
import { CompareTable } from "../features/rateModels/CompareTable";
import { rateModelVersionsQueryOptions } from "../features/rateModels/queries";
import { compareFacts, rateModelFacts } from "../features/rateModels/rateModelFacts";
import type { RateModelVersionView } from "../../../shared/schemas/rateModels";

const describe = (v: RateModelVersionView) => `Version ${v.version} (${v.status})`;

/** Two versions of one rate model side by side, each differing value marked in words. */
export default function RateModelCompare() {
  const { modelId = "" } = useParams();
  const [params, setParams] = useSearchParams();
  const versions = useQuery(rateModelVersionsQueryOptions(modelId));
  const list = versions.data ?? [];
  const right = list.find((v) => v.id === params.get("right")) ?? list[0];
  const left = list.find((v) => v.id === params.get("left")) ?? list.find((v) => right && v.version < right.version) ?? list[1] ?? list[0];
  const code = list[0]?.code ?? "Rate model";

  const choose = (side: "left" | "right", id: string) => {
    const next = new URLSearchParams(params);
    next.set(side, id);
    if (left && side === "right") next.set("left", left.id);
    if (right && side === "left") next.set("right", right.id);
    setParams(next, { replace: true });
  };

  return (
    <div className="flex flex-col gap-6">
      <Breadcrumb crumbs={[{ to: "/rate-models", label: "Rate models" }, ...(right ? [{ to: `/rate-models/versions/${right.id}`, label: `${code} version ${right.version}` }] : []), { label: "Compare" }]} />
      <PageIntro title={`Compare versions of ${code}`}>
        <p>Choose two versions. Rows whose values differ are marked “Differs”.</p>
      </PageIntro>
      <QueryState isPending={versions.isPending} error={versions.error} onRetry={() => void versions.refetch()} what="the versions">
        {left && right && (
          <>
            <div className="flex flex-wrap gap-6">
              {(["left", "right"] as const).map((side) => {
                const chosen = side === "left" ? left : right;
                return (
                  <div key={side} className="flex flex-col gap-1">
                    <label htmlFor={`compare-${side}`} className="font-semibold">
                      {side === "left" ? "First version" : "Second version"}
                    </label>
                    <SelectInput id={`compare-${side}`} value={chosen.id} onChange={(event) => choose(side, event.target.value)}>
                      {list.map((v) => (
                        <option key={v.id} value={v.id}>
                          {describe(v)}
                        </option>
                      ))}
                    </SelectInput>
                  </div>
                );
              })}
            </div>
            <CompareTable
              caption={`${code}: ${describe(left)} compared with ${describe(right)}`}
              leftTitle={describe(left)}
              rightTitle={describe(right)}
              rows={compareFacts(rateModelFacts(left), rateModelFacts(right))}
            />
          </>
        )}
      </QueryState>
    </div>
  );
}
