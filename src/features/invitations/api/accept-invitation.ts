import { useMutation } from "@tanstack/react-query";
import type { AcceptInvitationInput } from "@shared/schemas/invitations";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";

/** Accepts an invitation with the token from its link: sets the password and the project membership. */
export function acceptInvitation(body: AcceptInvitationInput): Promise<{ email: string; projectId: string }> {
  return api.post(apiPaths.invitations.accept, body, { redirectOnUnauthorized: false });
}

export function useAcceptInvitation() {
  return useMutation({ mutationFn: acceptInvitation });
}
