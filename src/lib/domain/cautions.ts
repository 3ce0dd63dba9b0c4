// The cautions every bulletin and alert carries (product brief: guidance, not storm warnings;
// operators' own procedures and reliability standards; national warnings take precedence).
export const BULLETIN_CAUTIONS: readonly string[] = [
  "A flare probability is guidance, not a geomagnetic storm warning: X-rays from a flare reach Earth in about eight minutes and can black out HF radio on the dayside, while storms from any accompanying eruption arrive one to three days later, if at all.",
  "Operators act under their own procedures and applicable reliability standards; this guidance does not replace them.",
  "This office's guidance does not replace national space-weather warnings; where they differ, follow the national warning.",
];

export const ALERT_CAUTION =
  "This alert reports a flare probability crossing your threshold. It is guidance, not a storm warning: act under your own procedures and applicable reliability standards, and follow national space-weather warnings where they apply.";
