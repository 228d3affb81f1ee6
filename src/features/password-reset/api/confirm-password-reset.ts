import { useMutation } from "@tanstack/react-query";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";

/** Sets a new password with the token of a reset link (one use, 72 hours). */
export function confirmPasswordReset(body: { token: string; password: string }): Promise<{ message: string }> {
  return api.post(apiPaths.passwordReset.confirm, body, { redirectOnUnauthorized: false });
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
