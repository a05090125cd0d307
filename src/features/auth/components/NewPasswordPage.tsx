import { useState } from "react";
import { useForm } from "react-hook-form";
import { Link, useParams } from "react-router-dom";
import { AuthCard } from "../../../components/AuthCard";
import { Button } from "../../../components/Button";
import { TextField } from "../../../components/form-fields";
import { Notice } from "../../../components/Notice";
import { applyServerErrors, lazyZodResolver } from "../../../lib/forms";
import { useResetPassword } from "../api/password-reset";

interface NewPasswordForm {
  password: string;
  repeat: string;
}

const resolver = lazyZodResolver<NewPasswordForm>(() =>
  Promise.all([import("zod"), import("@shared/auth/schemas")]).then(([{ z }, m]) =>
    z.object({ password: m.passwordSchema, repeat: z.string() }).refine((v) => v.password === v.repeat, { path: ["repeat"], message: "The two passwords differ." }),
  ),
);

/** Where the mailed link lands: a new password, after which the account is signed out everywhere. */
export function NewPasswordPage() {
  const { token = "" } = useParams();
  const reset = useResetPassword();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<NewPasswordForm>({ resolver, defaultValues: { password: "", repeat: "" } });

  const onSubmit = form.handleSubmit(async ({ password }) => {
    setFormError(null);
    try {
      await reset.mutateAsync({ token, password });
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["password"]));
    }
  });

  const signIn = (
    <Link className="font-semibold text-rust-600 underline" to="/sign-in">
      Sign in
    </Link>
  );

  if (reset.isSuccess) {
    return (
      <AuthCard title="Password changed" footer={signIn}>
        <Notice kind="success">Your new password is set. Every browser that was signed in to your account has been signed out; sign in again with the new password.</Notice>
      </AuthCard>
    );
  }
  return (
    <AuthCard
      title="Set a new password"
      footer={
        <Link className="font-semibold text-rust-600 underline" to="/forgot-password">
          Ask for a new link
        </Link>
      }
    >
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {formError && <Notice kind="error">{formError}</Notice>}
        <TextField label="New password" type="password" autoComplete="new-password" autoFocus hint="At least 10 characters." {...form.register("password")} error={form.formState.errors.password?.message} />
        <TextField label="New password again" type="password" autoComplete="new-password" {...form.register("repeat")} error={form.formState.errors.repeat?.message} />
        <Button type="submit" busy={reset.isPending}>
          Set password
        </Button>
      </form>
    </AuthCard>
  );
}
