// A labelled progress bar; without a value it says the work is under way (indeterminate).
interface ProgressBarProps {
  label: string;
  /** 0–1, or null while the amount of work is unknown. */
  value: number | null;
}

export function ProgressBar({ label, value }: ProgressBarProps) {
  const percent = value === null ? null : Math.round(Math.min(1, Math.max(0, value)) * 100);
  return (
    <div className="space-y-1">
      <div className="flex justify-between text-xs text-ink-700">
        <span>{label}</span>
        {percent !== null && <span className="num">{percent} %</span>}
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent ?? undefined}
        className="h-2 overflow-hidden rounded-full bg-paper-2"
      >
        <div
          className={`h-full rounded-full bg-gold-500 ${percent === null ? "w-1/3 animate-pulse" : ""}`}
          style={percent === null ? undefined : { width: `${percent}%` }}
        />
      </div>
    </div>
  );
}
