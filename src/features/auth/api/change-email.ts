import type { EmailChangeAnswer, EmailChangeInput } from "@shared/auth/account";
import { api } from "../../../lib/api-client";
import { useAccountMutation } from "./account-mutation";

export const changeEmail = (input: EmailChangeInput) => api<EmailChangeAnswer>("/api/account/email", { method: "POST", body: input });

export const useChangeEmail = () => useAccountMutation(changeEmail);
