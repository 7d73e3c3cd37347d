import { useWatch } from "react-hook-form";
import { computeEpsilonA, type EpsilonAResult } from "../../../../shared/kinetics/epsilonA";
import { KineticsInputError } from "../../../../shared/kinetics/kineticsInputError";
import { formatNumber } from "../vessels/quantityFormat";
import { feedRecord } from "./rateModelFormValues";
import { useRateModelForm } from "./rateModelFormContext";

type Outcome = { ok: true; result: EpsilonAResult } | { ok: false; message: string };

function evaluate(...args: Parameters<typeof computeEpsilonA>): Outcome {
  try {
    return { ok: true, result: computeEpsilonA(...args) };
  } catch (error) {
    if (error instanceof KineticsInputError) return { ok: false, message: error.message };
    throw error;
  }
}

/** εA, δ and yA0 worked out while the engineer types, by the same function the server uses. */
export function EpsilonPanel() {
  const { control } = useRateModelForm();
  const [reaction, keySpecies, feed] = useWatch({ control, name: ["reaction", "keySpecies", "feed"] });
  const incomplete =
    [...reaction.reactants, ...reaction.products].some((p) => !p.species.trim()) ||
    feed.some((row) => !row.species.trim() || !Number.isFinite(row.moleFraction)) ||
    !keySpecies.trim();
  const outcome: Outcome = incomplete
    ? { ok: false, message: "name every species, choose the key species and give each feed fraction." }
    : evaluate(reaction, keySpecies.trim(), feedRecord(feed));
  return (
    <section aria-labelledby="rm-epsilon-title" className="rounded-md border-2 border-fen-700 bg-fen-50 px-4 py-3">
      <h3 id="rm-epsilon-title" className="font-bold">
        Volume change at full conversion
      </h3>
      <output aria-live="polite" className="block">
        {outcome.ok ? (
          <dl className="mt-1 grid grid-cols-[max-content_1fr] gap-x-4">
            <dt className="font-semibold">εA</dt>
            <dd className="text-lg font-bold">{formatNumber(outcome.result.epsilonA, 6)}</dd>
            <dt className="font-semibold">δ (gas moles per mole of A)</dt>
            <dd>{formatNumber(outcome.result.delta, 6)}</dd>
            <dt className="font-semibold">yA0 (mole fraction of A fed)</dt>
            <dd>{formatNumber(outcome.result.yA0, 6)}</dd>
          </dl>
        ) : (
          <p className="mt-1">
            <span className="font-semibold">εA cannot be worked out yet:</span> {outcome.message}
          </p>
        )}
      </output>
    </section>
  );
}
