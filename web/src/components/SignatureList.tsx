import type { SignatureView } from "../../../shared/schemas/common";
import { MEANING_WORDS } from "../features/signatures/meaningWords";
import { formatLocal, formatUtc } from "../features/signatures/signatureTime";

export interface SignatureListProps {
  signatures: SignatureView[];
  /** Said when there are none, e.g. "Not signed yet." */
  emptyMessage?: string;
}

/** The electronic signatures on a record: who, what it means, when (UTC and local), and whether it still matches. */
export function SignatureList({ signatures, emptyMessage = "No signatures yet." }: SignatureListProps) {
  if (signatures.length === 0) return <p className="text-ink-600">{emptyMessage}</p>;
  return (
    <ul className="flex flex-col gap-3">
      {signatures.map((signature) => (
        <li
          key={signature.id}
          className={`rounded-md border-2 bg-white px-4 py-3 ${
            signature.matchesContent ? "border-ink-200" : "border-alarm-800"
          }`}
        >
          <p className="flex flex-wrap items-baseline gap-x-3">
            <span className="text-lg font-bold">{signature.signerName}</span>
            <span className="font-semibold text-fen-800">{MEANING_WORDS[signature.meaning] ?? signature.meaning}</span>
          </p>
          <dl className="mt-1 grid gap-x-4 sm:grid-cols-[max-content_1fr]">
            <dt className="font-semibold">Signed (UTC)</dt>
            <dd>
              <time dateTime={signature.signedAt}>{formatUtc(signature.signedAt)}</time>
            </dd>
            <dt className="font-semibold">Local time</dt>
            <dd>{formatLocal(signature.signedAt)}</dd>
            {signature.comment && (
              <>
                <dt className="font-semibold">Comment</dt>
                <dd className="whitespace-pre-wrap">{signature.comment}</dd>
              </>
            )}
          </dl>
          {!signature.matchesContent && (
            <p className="mt-2 flex items-center gap-2 font-bold text-alarm-800">
              <span aria-hidden="true" className="inline-flex h-6 w-6 items-center justify-center rounded-sm bg-alarm-800 text-white">
                ✕
              </span>
              Changed since signing: the record no longer matches what was signed.
            </p>
          )}
        </li>
      ))}
    </ul>
  );
}
