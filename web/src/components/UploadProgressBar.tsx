/** An upload's progress as a bar with the percentage in words beside it. */
export function UploadProgressBar({ sent, total, label }: { sent: number; total: number; label: string }) {
  const percent = total > 0 ? Math.min(100, Math.round((sent / total) * 100)) : 0;
  return (
    <div className="flex flex-col gap-1">
      <div className="flex justify-between gap-3 font-semibold">
        <span>{label}</span>
        <span aria-hidden="true">{percent} %</span>
      </div>
      <progress value={percent} max={100} aria-label={label} className="h-4 w-full overflow-hidden rounded-sm accent-fen-700">
        {percent} %
      </progress>
    </div>
  );
}
