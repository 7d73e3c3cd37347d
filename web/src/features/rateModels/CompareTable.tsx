import type { ComparedFact } from "./rateModelFacts";

export interface CompareTableProps {
  caption: string;
  leftTitle: string;
  rightTitle: string;
  rows: ComparedFact[];
}

/** Two versions' values side by side; a differing row gets a "Differs" label, a bar and bold text. */
export function CompareTable({ caption, leftTitle, rightTitle, rows }: CompareTableProps) {
  const changed = rows.filter((row) => row.differs).length;
  return (
    <div className="flex flex-col gap-3">
      <p aria-live="polite" className="font-semibold">
        {changed === 0 ? "The two versions hold the same values." : `${changed} ${changed === 1 ? "value differs" : "values differ"}.`}
      </p>
      <div className="relative overflow-x-auto rounded-md border-2 border-ink-200 bg-white">
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-ink-100">
            <tr>
              <th scope="col" className="border-b-2 border-ink-300 px-3 py-2">Value</th>
              <th scope="col" className="border-b-2 border-ink-300 px-3 py-2">{leftTitle}</th>
              <th scope="col" className="border-b-2 border-ink-300 px-3 py-2">{rightTitle}</th>
              <th scope="col" className="border-b-2 border-ink-300 px-3 py-2">Difference</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.key} className={`border-b border-ink-200 last:border-b-0 ${row.differs ? "bg-caution-50" : ""}`}>
                <th scope="row" className={`px-3 py-2 text-left align-top ${row.differs ? "border-l-8 border-l-caution-500 font-bold" : "border-l-8 border-l-transparent font-semibold"}`}>
                  {row.label}
                  <span className="block text-[0.85rem] font-normal text-ink-600">{row.group}</span>
                </th>
                <td className={`px-3 py-2 align-top whitespace-pre-wrap ${row.differs ? "font-bold" : ""}`}>{row.left}</td>
                <td className={`px-3 py-2 align-top whitespace-pre-wrap ${row.differs ? "font-bold" : ""}`}>{row.right}</td>
                <td className="px-3 py-2 align-top">
                  {row.differs ? (
                    <span className="inline-block rounded-sm border border-caution-500 bg-white px-2 text-[0.85rem] font-bold whitespace-nowrap text-caution-800">
                      ≠ Differs
                    </span>
                  ) : (
                    <span className="text-ink-600">Same</span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
