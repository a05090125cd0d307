import { useState } from "react";
import { useForm } from "react-hook-form";
import { Link, useNavigate } from "react-router-dom";
import type { SignUpInput } from "@shared/auth/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { useSignUp } from "../api/sign-up";
import { AuthCard } from "../../../components/AuthCard";
import { TextField } from "../../../components/form-fields";
import { applyServerErrors, lazyZodResolver } from "../../../lib/forms";

const fields = ["name", "email", "password", "channelName"] as const;

// The shared schema, and zod with it, arrive when the form is first checked (see lazyZodResolver).
const signUpResolver = lazyZodResolver<SignUpInput>(() => import("@shared/auth/schemas").then((m) => m.signUpSchema));

export function SignUpPage() {
  const navigate = useNavigate();
  const signUp = useSignUp();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<SignUpInput>({ resolver: signUpResolver, defaultValues: { name: "", email: "", password: "", channelName: "" } });
  const errors = form.formState.errors;

  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      const me = await signUp.mutateAsync(values);
      const channel = me.memberships[0];
      navigate(channel ? `/c/${channel.channelId}/home` : "/", { replace: true });
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, fields));
    }
  });

  return (
    <AuthCard title="Start a channel" footer={<>Already have an account? <Link className="font-semibold text-rust-600 underline" to="/sign-in">Sign in</Link></>}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {formError && <Notice kind="error">{formError}</Notice>}
        <TextField label="Your name" autoComplete="name" autoFocus {...form.register("name")} error={errors.name?.message} />
        <TextField label="E-mail" type="email" autoComplete="email" {...form.register("email")} error={errors.email?.message} />
        <TextField label="Password" type="password" autoComplete="new-password" hint="At least 10 characters." {...form.register("password")} error={errors.password?.message} />
        <TextField label="Channel name" hint="You'll be its owner; invite the rest of the team next." {...form.register("channelName")} error={errors.channelName?.message} />
        <Button type="submit" busy={signUp.isPending}>
          Create account and channel
        </Button>
      </form>
    </AuthCard>
  );
}
