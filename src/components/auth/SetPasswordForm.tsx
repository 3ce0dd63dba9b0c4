// Sets the password of an invited account from the signed link; rules shown before typing.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { acceptInvitationSchema, PASSWORD_RULES, type AcceptInvitationInput } from "@/lib/schemas/users";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { describedBy, Field } from "@/components/ui/Field";
import { FormAlert } from "@/components/ui/FormAlert";

export function SetPasswordForm({ token, email }: { token: string; email: string }) {
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<AcceptInvitationInput>({ resolver: zodResolver(acceptInvitationSchema), defaultValues: { token } });
  const { errors, isSubmitting } = formState;
  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      await fetchJson("/api/invitations/accept", { method: "POST", json: values });
      window.location.href = "/sign-in?passwordSet=1";
    } catch (err) {
      if (err instanceof ApiError) for (const [f, m] of Object.entries(err.fields)) if (f !== "token") setError(f as keyof AcceptInvitationInput, { message: m });
      setFailure((err as Error).message);
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Set your password">
      {failure && <FormAlert tone="error">{failure}</FormAlert>}
      <input type="hidden" {...register("token")} />
      <input type="email" autoComplete="username" value={email} readOnly hidden />
      <Field id="password" label="New password" error={errors.password?.message} hint={<span>{PASSWORD_RULES.join(" · ")}</span>}>
        <input type="password" autoComplete="new-password" className="field-input" {...describedBy("password", errors.password?.message, true)} {...register("password")} />
      </Field>
      <Field id="confirm" label="Repeat the password" error={errors.confirm?.message}>
        <input type="password" autoComplete="new-password" className="field-input" {...describedBy("confirm", errors.confirm?.message)} {...register("confirm")} />
      </Field>
      <button type="submit" className="btn-primary w-full" disabled={isSubmitting}>{isSubmitting ? "Saving…" : "Set password"}</button>
    </form>
  );
}
