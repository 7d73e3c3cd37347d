/** A file's SHA-256 written out in full, breakable on narrow screens, for checking against the original. */
export function Sha256Line({ sha256 }: { sha256: string }) {
  return (
    <span className="font-mono text-[0.85rem] break-all">
      <span className="font-sans font-semibold">SHA-256 </span>
      {sha256}
    </span>
  );
}
