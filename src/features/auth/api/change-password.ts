import type { PasswordChangeInput, SignedOutAnswer } from "@shared/auth/account";
import { api } from "../../../lib/api-client";
import { useAccountMutation } from "./account-mutation";

export const changePassword = (input: PasswordChangeInput) => api<SignedOutAnswer>("/api/account/password", { method: "POST", body: input });

export const useChangePassword = () => useAccountMutation(changePassword);
