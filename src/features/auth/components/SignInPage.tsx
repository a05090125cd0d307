import { useState } from "react";
import { useForm } from "react-hook-form";
import { Link, useNavigate, useSearchParams } from "react-router-dom";
import { inAppPath } from "@shared/auth/next-path";
import type { SignInInput } from "@shared/auth/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { useSignIn } from "../api/sign-in";
import { AuthCard } from "../../../components/AuthCard";
import { TextField } from "../../../components/form-fields";
import { applyServerErrors, lazyZodResolver } from "../../../lib/forms";

// The shared schema, and zod with it, arrive when the form is first checked (see lazyZodResolver).
const signInResolver = lazyZodResolver<SignInInput>(() => import("@shared/auth/schemas").then((m) => m.signInSchema));

export function SignInPage() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<SignInInput>({ resolver: signInResolver, defaultValues: { email: "", password: "" } });

  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signIn.mutateAsync(values);
      navigate(inAppPath(params.get("next")), { replace: true });
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["email", "password"]));
    }
  });

  return (
    <AuthCard title="Sign in" footer={<>New here? <Link className="font-semibold text-rust-600 underline" to="/sign-up">Start a channel</Link></>}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {formError && <Notice kind="error">{formError}</Notice>}
        <TextField label="E-mail" type="email" autoComplete="email" autoFocus {...form.register("email")} error={form.formState.errors.email?.message} />
        <TextField label="Password" type="password" autoComplete="current-password" {...form.register("password")} error={form.formState.errors.password?.message} />
        <Link className="-mt-2 self-end text-sm font-semibold text-rust-600 underline" to="/forgot-password">
          Forgot your password?
        </Link>
        <Button type="submit" busy={signIn.isPending}>
          Sign in
        </Button>
      </form>
    </AuthCard>
  );
}
