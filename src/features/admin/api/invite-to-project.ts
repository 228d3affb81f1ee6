import { useMutation } from "@tanstack/react-query";
import type { CreateInvitationInput, InvitationDto } from "@shared/schemas/invitations";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";

/** E-mails a one-time link that makes the recipient a member of the project with the role once they accept. */
export function inviteToProject(projectId: string, input: CreateInvitationInput): Promise<InvitationDto> {
  return api.post<InvitationDto>(apiPaths.projects.invitations(projectId), input);
}

export function useInviteToProject() {
  return useMutation({
    mutationFn: ({ projectId, input }: { projectId: string; input: CreateInvitationInput }) =>
      inviteToProject(projectId, input),
  });
}
