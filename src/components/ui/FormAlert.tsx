// A form-level message (error or success) in a live region so screen readers announce it.
interface FormAlertProps {
  tone: "error" | "success" | "info";
  children: React.ReactNode;
}

const TONES = {
  error: "border-warn-700/40 bg-warn-100 text-warn-700",
  success: "border-calm-600/40 bg-calm-100 text-calm-600",
  info: "border-ink-700/30 bg-ink-100 text-ink-900",
};

export function FormAlert({ tone, children }: FormAlertProps) {
  return (
    <div role={tone === "error" ? "alert" : "status"} className={`rounded-md border px-3 py-2 text-sm ${TONES[tone]}`}>
      {children}
    </div>
  );
}
