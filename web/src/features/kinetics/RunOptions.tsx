import type { UseFormReturn } from "react-hook-form";
import type { AnalysisFormValues, AnalysisSetup } from "./analysisForm";

type Form = UseFormReturn<AnalysisFormValues, unknown, AnalysisSetup>;

const choice = "flex min-h-11 items-center gap-3 rounded-md px-2 hover:bg-ink-50";
const box = "h-5 w-5 accent-fen-700";

/** Where the check runs, and whether every order is compared as well. */
export function RunOptions({ form }: { form: Form }) {
  const { register } = form;
  return (
    <section aria-labelledby="kin-run-title" className="flex flex-col gap-3 rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="kin-run-title" className="text-xl font-bold">
        4. Run the check
      </h2>
      <fieldset className="flex flex-col gap-1">
        <legend className="font-semibold">Where to work it out</legend>
        <label className={choice}>
          <input type="radio" value="browser" className={box} {...register("runWhere")} />
          In this browser (nothing is sent)
        </label>
        <label className={choice}>
          <input type="radio" value="server" className={box} {...register("runWhere")} />
          On the Isobatch server (the file is uploaded, nothing is stored)
        </label>
      </fieldset>
      <label className={choice}>
        <input type="checkbox" className={box} {...register("compareOrders")} />
        Also compare orders 0, ½, 1, 1½, 2 and a fitted n (needs yA0)
      </label>
    </section>
  );
}
