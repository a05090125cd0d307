import { useState } from "react";
import { useForm } from "react-hook-form";
import { Link } from "react-router-dom";
import type { PasswordResetRequest } from "@shared/auth/account";
import { AuthCard } from "../../../components/AuthCard";
import { Button } from "../../../components/Button";
import { TextField } from "../../../components/form-fields";
import { Notice } from "../../../components/Notice";
import { applyServerErrors, lazyZodResolver } from "../../../lib/forms";
import { useRequestPasswordReset } from "../api/password-reset";

const resolver = lazyZodResolver<PasswordResetRequest>(() => import("@shared/auth/account").then((m) => m.passwordResetRequestSchema));

/** "Forgot password": asks for a mailed link. The page says the same whether or not the address has an account. */
export function ForgotPasswordPage() {
  const request = useRequestPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<PasswordResetRequest>({ resolver, defaultValues: { email: "" } });

  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await request.mutateAsync(values);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["email"]));
    }
  });

  const back = (
    <Link className="font-semibold text-rust-600 underline" to="/sign-in">
      Back to sign in
    </Link>
  );

  if (request.isSuccess) {
    return (
      <AuthCard title="Check your mail" footer={back}>
        <Notice kind="success">{request.data.message}</Notice>
        <p className="mt-4 text-sm text-graphite-700">Nothing there after a few minutes? Look in the spam folder, or ask again with the address you signed up with.</p>
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Choose a new password" footer={back}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        <p className="text-sm text-graphite-700">Enter the address you sign in with. Kerf mails it a link to set a new password.</p>
        {formError && <Notice kind="error">{formError}</Notice>}
        <TextField label="E-mail" type="email" autoComplete="email" autoFocus {...form.register("email")} error={form.formState.errors.email?.message} />
        <Button type="submit" busy={request.isPending}>
          Mail me a link
        </Button>
      </form>
    </AuthCard>
  );
}
