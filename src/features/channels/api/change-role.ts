import type { Role } from "@shared/access/roles";
import { api } from "../../../lib/api-client";
import { base, useMembersMutation } from "./members-mutation";

export const useChangeRole = (channelId: string) =>
  useMembersMutation(channelId, ({ userId, role }: { userId: string; role: Role }) =>
    api(`${base(channelId)}/members/${userId}`, { method: "PATCH", body: { role } }),
  );
