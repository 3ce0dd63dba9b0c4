// The sign-in form: validates locally with the shared schema, then signs in through Auth.js.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { signInSchema, type SignInInput } from "@/lib/schemas/users";
import { signInToDesk } from "@/lib/ui/sign-in";
import { describedBy, Field } from "@/components/ui/Field";
import { FormAlert } from "@/components/ui/FormAlert";

interface Props {
  next: string;
  notice?: string | undefined;
}

export function SignInForm({ next, notice }: Props) {
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({ resolver: zodResolver(signInSchema) });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async ({ email, password }) => {
    setFailure(null);
    const outcome = await signInToDesk(email, password);
    if (outcome.ok) window.location.href = next;
    else setFailure(outcome.message);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Sign in">
      {notice && !failure && <FormAlert tone="info">{notice}</FormAlert>}
      {failure && <FormAlert tone="error">{failure}</FormAlert>}
      <Field id="email" label="E-mail address" error={errors.email?.message}>
        <input type="email" autoComplete="username" className="field-input" {...describedBy("email", errors.email?.message)} {...register("email")} />
      </Field>
      <Field id="password" label="Password" error={errors.password?.message}>
        <input type="password" autoComplete="current-password" className="field-input" {...describedBy("password", errors.password?.message)} {...register("password")} />
      </Field>
      <button type="submit" className="btn-primary w-full" disabled={isSubmitting}>
        {isSubmitting ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
