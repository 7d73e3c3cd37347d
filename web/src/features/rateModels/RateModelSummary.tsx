import type { RateModelVersionView } from "../../../../shared/schemas/rateModels";
import { rateModelFacts, type Fact } from "./rateModelFacts";

const GROUPS: Fact["group"][] = ["Reaction", "Rate law", "Acceptance limits", "Notes"];

/** A rate-model version's content and derived values, grouped, read-only. */
export function RateModelSummary({ version }: { version: RateModelVersionView }) {
  const facts = rateModelFacts(version);
  return (
    <div className="flex flex-col gap-4">
      {GROUPS.map((group) => (
        <section key={group} aria-label={group} className="rounded-lg border-2 border-ink-200 bg-white p-5">
          <h3 className="text-lg font-bold">{group}</h3>
          <dl className="mt-2 grid gap-x-6 gap-y-1 sm:grid-cols-[minmax(12rem,max-content)_1fr]">
            {facts
              .filter((fact) => fact.group === group)
              .map((fact) => (
                <div key={fact.key} className="contents">
                  <dt className="font-semibold">{fact.label}</dt>
                  <dd className="whitespace-pre-wrap">{fact.value}</dd>
                </div>
              ))}
          </dl>
        </section>
      ))}
    </div>
  );
}
