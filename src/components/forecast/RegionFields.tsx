// The measured fields of a region assessment (group, magnetic metrics, recent flares).
import type { FieldErrors, UseFormRegister } from "react-hook-form";
import { MCINTOSH_CLASSES } from "@/lib/domain/mcintosh";
import { MOUNT_WILSON_CLASSES } from "@/lib/domain/mount-wilson";
import type { AssessmentInputValues } from "@/lib/schemas/assessment";
import { describedBy, Field } from "@/components/ui/Field";

interface Props {
  register: UseFormRegister<AssessmentInputValues & { notes?: string }>;
  errors: FieldErrors<AssessmentInputValues & { notes?: string }>;
  warnings: Record<string, string>;
  isRegionLocked: boolean;
  limbNote: string | null;
}

type Name = "areaMsh" | "spotCount" | "unsignedFluxMx" | "pilLengthMm" | "logR" | "meanShearDeg" | "freeEnergyProxy";

export function RegionFields({ register, errors, warnings, isRegionLocked, limbNote }: Props) {
  const number = (name: Name, label: string, hint?: string) => {
    const error = errors[name]?.message as string | undefined;
    const warning = warnings[name];
    return (
      <Field id={name} label={label} error={error} hint={warning ? <span className="text-gold-600">⚠ {warning}</span> : hint}>
        <input inputMode="decimal" autoComplete="off" className="field-input num" {...describedBy(name, error, !!(warning || hint))} {...register(name)} />
      </Field>
    );
  };
  const flare = (cls: "C" | "M" | "X") => {
    const error = errors.flares24h?.[cls]?.message as string | undefined;
    return (
      <Field id={`flares-${cls}`} label={`${cls}-class`} error={error}>
        <input inputMode="numeric" className="field-input num w-24" {...describedBy(`flares-${cls}`, error)} {...register(`flares24h.${cls}`)} />
      </Field>
    );
  };
  return (
    <div className="space-y-6">
      <fieldset className="card grid gap-4 sm:grid-cols-2">
        <legend className="px-1 text-sm font-semibold">Region</legend>
        <Field id="region" label="Office region number" error={errors.region?.message} hint="Letters, a dash and digits, e.g. HR-0412">
          <input className="field-input num uppercase" readOnly={isRegionLocked} {...describedBy("region", errors.region?.message, true)} {...register("region")} />
        </Field>
        <Field id="location" label="Location (heliographic)" error={errors.location?.message} hint={limbNote ? <span className="text-gold-600">⚠ {limbNote}</span> : "e.g. N12E34 or S05W61"}>
          <input className="field-input num uppercase" autoComplete="off" {...describedBy("location", errors.location?.message, true)} {...register("location")} />
        </Field>
        {number("areaMsh", "Area (MSH)", "Millionths of the solar hemisphere")}
        {number("spotCount", "Number of spots")}
        <Field id="mcintosh" label="McIntosh class" error={errors.mcintosh?.message} hint="Zpc, e.g. Dkc">
          <input className="field-input num" list="mcintosh-classes" autoComplete="off" {...describedBy("mcintosh", errors.mcintosh?.message, true)} {...register("mcintosh")} />
        </Field>
        <datalist id="mcintosh-classes">{MCINTOSH_CLASSES.map((c) => <option key={c} value={c} />)}</datalist>
        <Field id="mountWilson" label="Mount Wilson class" error={errors.mountWilson?.message}>
          <select className="field-input" {...describedBy("mountWilson", errors.mountWilson?.message)} {...register("mountWilson")}>
            <option value="">Choose…</option>
            {MOUNT_WILSON_CLASSES.map((c) => <option key={c} value={c}>{c}</option>)}
          </select>
        </Field>
      </fieldset>
      <fieldset className="card grid gap-4 sm:grid-cols-2">
        <legend className="px-1 text-sm font-semibold">Magnetic metrics (optional)</legend>
        {number("unsignedFluxMx", "Total unsigned flux (Mx)", "e.g. 2.1e22")}
        {number("pilLengthMm", "Polarity-inversion-line length (Mm)")}
        {number("logR", "Schrijver log R (log10 Mx)")}
        {number("meanShearDeg", "Mean shear angle (degrees)", "0–90")}
        {number("freeEnergyProxy", "Free-energy proxy (erg)")}
      </fieldset>
      <fieldset className="card">
        <legend className="px-1 text-sm font-semibold">Flares from this region in the last 24 h</legend>
        <div className="flex flex-wrap gap-4">{flare("C")}{flare("M")}{flare("X")}</div>
      </fieldset>
    </div>
  );
}
